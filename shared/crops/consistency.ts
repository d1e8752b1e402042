/**
 * Crop parameters that only make sense together. Each value may be in range on its own and the
 * set still be nonsense (an upper threshold below the base, a germination minimum above the
 * maximum), so the rule runs over the merged values a garden would use: shared defaults, its
 * stored overrides and the change at hand. The server refuses such a change; the override form
 * runs the same rule before sending.
 */
import { formatTemp } from '../thermal/units';
import type { CropParamKey, CropParamValues } from './params';

type TemperatureKey =
  | 'baseC'
  | 'upperC'
  | 'germMinC'
  | 'germOptC'
  | 'germMaxC'
  | 'vernalizationMinC'
  | 'vernalizationMaxC'
  | 'blossomDropWatchC'
  | 'blossomDropWarningC'
  | 'blossomDropNightBelowC'
  | 'blossomDropNightAboveC';

/** How each figure reads inside a sentence (the form labels are headings, not phrases). */
const PHRASES: Record<TemperatureKey, string> = {
  baseC: 'the base temperature',
  upperC: 'the upper threshold',
  germMinC: 'the minimum germination soil temperature',
  germOptC: 'the optimum germination soil temperature',
  germMaxC: 'the maximum germination soil temperature',
  vernalizationMinC: 'the coldest daily mean that counts for vernalization',
  vernalizationMaxC: 'the warmest daily mean that counts for vernalization',
  blossomDropWatchC: 'the blossom-drop watch high',
  blossomDropWarningC: 'the blossom-drop warning high',
  blossomDropNightBelowC: 'the cool-night limit for blossom drop',
  blossomDropNightAboveC: 'the warm-night limit for blossom drop',
};

interface Order {
  low: TemperatureKey;
  high: TemperatureKey;
  /** True when the two may not be equal. */
  strict: boolean;
  applies?: (v: CropParamValues) => boolean;
}

const ORDERS: readonly Order[] = [
  { low: 'baseC', high: 'upperC', strict: true },
  { low: 'germMinC', high: 'germOptC', strict: false },
  { low: 'germOptC', high: 'germMaxC', strict: false },
  // With an optimum set, the two checks above already order minimum and maximum.
  { low: 'germMinC', high: 'germMaxC', strict: false, applies: (v) => v.germOptC === null },
  { low: 'vernalizationMinC', high: 'vernalizationMaxC', strict: true },
  { low: 'blossomDropWatchC', high: 'blossomDropWarningC', strict: false },
  { low: 'blossomDropNightBelowC', high: 'blossomDropNightAboveC', strict: true },
];

const capitalised = (s: string) => s[0].toUpperCase() + s.slice(1);

function orderMessage(o: Order, low: number, high: number, units: 'C' | 'F'): string {
  const relation = o.strict ? 'must be above' : 'must not be below';
  return `${capitalised(PHRASES[o.high])} (${formatTemp(high, units)}) ${relation} ${PHRASES[o.low]} (${formatTemp(low, units)}).`;
}

/**
 * Every field taking part in an inconsistency, each with a plain sentence (temperatures in the
 * garden's display unit). Both fields of a broken pair are named, since either may be the wrong one.
 */
export function paramProblems(values: CropParamValues, units: 'C' | 'F' = 'C'): Partial<Record<CropParamKey, string>> {
  const problems: Partial<Record<CropParamKey, string>> = {};
  const add = (key: CropParamKey, message: string) => {
    problems[key] = problems[key] ? `${problems[key]} ${message}` : message;
  };
  if (values.baseC === null) add('baseC', 'Degree days need a base temperature: set one, or use the shared default.');
  for (const o of ORDERS) {
    const low = values[o.low];
    const high = values[o.high];
    if (low === null || high === null || (o.applies && !o.applies(values))) continue;
    if (o.strict ? high > low : high >= low) continue;
    const message = orderMessage(o, low, high, units);
    add(o.low, message);
    add(o.high, message);
  }
  return problems;
}
