/**
 * What a variety's traits mean for the grower. Plain trade knowledge; where handling can hurt
 * someone (treated seed) the text defers to the supplier's label and local advisers.
 */
import type { VarietyTrait } from '../schemas/varieties';

export interface TraitGuidance {
  trait: VarietyTrait;
  tone: 'info' | 'caution';
  text: string;
}

const GUIDANCE: Partial<Record<VarietyTrait, Omit<TraitGuidance, 'trait'>>> = {
  'f1-hybrid': {
    tone: 'info',
    text: 'F1 hybrid: seed saved from these plants does not come true to type. Buy fresh seed to grow the same variety again.',
  },
  'open-pollinated': {
    tone: 'info',
    text: 'Open-pollinated: seed can be saved and comes true if the plants were kept apart from other varieties of the same crop.',
  },
  treated: {
    tone: 'caution',
    text: 'Treated seed: wear gloves when handling it, keep it away from children, animals and food or feed, do not eat or sprout it, and follow the label on the packet for storage and disposal. Ask a local adviser if unsure.',
  },
  pelleted: {
    tone: 'info',
    text: 'Pelleted seed: the coating makes single seeds easy to place, so sow at the final spacing and skip most thinning. Keep the soil evenly moist until emergence; pellets need water to split.',
  },
  organic: { tone: 'info', text: 'Organic: produced under organic certification; check the packet for the certifier.' },
  heirloom: { tone: 'info', text: 'Heirloom: an older open-pollinated variety; saved seed comes true when kept from crossing.' },
};

export function traitGuidance(traits: readonly VarietyTrait[]): TraitGuidance[] {
  return traits.flatMap((trait) => {
    const g = GUIDANCE[trait];
    return g ? [{ trait, ...g }] : [];
  });
}
