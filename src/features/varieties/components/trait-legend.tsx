import { Info, TriangleAlert } from 'lucide-react';
import { TRAIT_WORDS } from '#shared/schemas/varieties';
import type { VarietyDto } from '#shared/schemas/varieties';
import type { TraitGuidance } from '#shared/crops/guidance';

/** Each trait's guidance once for the whole page, in the order the varieties first carry them. */
export function guidanceOnPage(varieties: VarietyDto[]): TraitGuidance[] {
  const seen = new Map<string, TraitGuidance>();
  for (const v of varieties) for (const g of v.guidance) if (!seen.has(g.trait)) seen.set(g.trait, g);
  return [...seen.values()];
}

function Guidance({ g }: { g: TraitGuidance }) {
  const Icon = g.tone === 'caution' ? TriangleAlert : Info;
  return (
    <li className={`flex gap-2 rounded-md border-l-4 px-3 py-2 text-sm ${g.tone === 'caution' ? 'border-ember bg-ember-tint' : 'border-frost bg-frost-tint'}`}>
      <Icon className="mt-0.5 size-4 shrink-0" aria-hidden="true" />
      <span>
        <span className="font-semibold">{g.tone === 'caution' ? 'Caution: ' : ''}</span>
        {g.text}
      </span>
    </li>
  );
}

/**
 * What the trait tags on the cards mean. Handling cautions (treated seed) stay in view; the
 * plain notes fold away, since a grower reads them once.
 */
export function TraitLegend({ varieties }: { varieties: VarietyDto[] }) {
  const all = guidanceOnPage(varieties);
  if (!all.length) return null;
  const cautions = all.filter((g) => g.tone === 'caution');
  const notes = all.filter((g) => g.tone !== 'caution');
  return (
    <section aria-label="What the trait tags mean" className="flex flex-col gap-2">
      {cautions.length > 0 && <ul className="flex flex-col gap-2">{cautions.map((g) => <Guidance key={g.trait} g={g} />)}</ul>}
      {notes.length > 0 && (
        <details className="rounded-md border border-line bg-paper-raised px-3">
          <summary className="min-h-11 cursor-pointer content-center font-semibold">
            What the tags mean: {notes.map((g) => TRAIT_WORDS[g.trait]).join(', ')}
          </summary>
          <ul className="flex flex-col gap-2 pb-3">{notes.map((g) => <Guidance key={g.trait} g={g} />)}</ul>
        </details>
      )}
    </section>
  );
}
