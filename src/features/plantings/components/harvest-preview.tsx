import { Flower2, Sprout } from 'lucide-react';
import type { PlantingMethod } from '#shared/schemas/plantings';
import { countOf } from '#shared/format/count-words';
import { formatDayMonth, formatDayWindow, formatDegreeDays } from '@/lib/format';
import { usePlantingPreview } from '@/features/plantings/api/get-planting-preview';

function windowWords(m: { p10: string | null; p50: string | null; p90: string | null; kind: string; note: string }): string {
  if (!m.p50) return m.note || 'No harvest window yet.';
  if (m.kind === 'observed') return `Its degree-day target would already be reached: ${formatDayMonth(m.p50)}.`;
  if (m.kind === 'forecast') return `The forecast reaches its degree-day target on ${formatDayMonth(m.p50)}.`;
  return `Likely ready ${formatDayWindow(m.p10 ?? m.p50, m.p90 ?? m.p50)} (middle estimate ${formatDayMonth(m.p50)}), from this garden’s past seasons.`;
}

/**
 * What the planting would do before it is saved: its harvest window from the same computation as
 * a saved planting's progress, and a warning in words when the garden's past seasons brought
 * bolting weather into the harvest of a crop started that day.
 */
export function HarvestPreview({ gardenId, varietyId, method, sownOn, transplantedOn }: { gardenId: number; varietyId: number | null; method: PlantingMethod; sownOn: string | null; transplantedOn: string | null }) {
  const start = method === 'direct-sow' ? sownOn : transplantedOn;
  const params = varietyId && start ? { varietyId, method, sownOn, transplantedOn } : null;
  const preview = usePlantingPreview(gardenId, params);
  if (!params) {
    return (
      <p className="text-sm text-loam-soft" aria-live="polite">
        Choose a variety and its {method === 'direct-sow' ? 'sowing' : 'transplant'} date to see when it is likely ready.
      </p>
    );
  }
  if (preview.isError) {
    return (
      <p className="text-sm text-loam-soft" role="status">
        The harvest preview could not be worked out ({preview.error.message}); the planting can still be saved.
      </p>
    );
  }
  if (!preview.data) {
    return (
      <p className="text-sm text-loam-soft" role="status">
        Working out the harvest window…
      </p>
    );
  }
  const p = preview.data;
  return (
    <section aria-labelledby="harvest-preview" aria-busy={preview.isFetching} className="flex flex-col gap-2 rounded-md border border-line bg-paper-sunk p-3">
      <h3 id="harvest-preview" className="font-semibold">
        <Sprout className="mr-1 inline size-4" aria-hidden="true" />
        Expected harvest
      </h3>
      <p aria-live="polite">{windowWords(p.maturity)}</p>
      {p.target !== null && <p className="text-sm text-loam-soft">Target: {formatDegreeDays(p.target, p.unit)}. {p.targetNote}</p>}
      {p.boltSeason && !p.boltSeason.warning && (
        <p className="text-sm">
          Bolt risk at harvest was high in {Math.round(p.boltSeason.highShare * p.boltSeason.years)} of the last {countOf(p.boltSeason.years, 'season')} here for this start date.
        </p>
      )}
      {p.boltSeason?.warning && (
        <p className="flex gap-2 border-l-4 border-ember pl-2" role="status">
          <Flower2 className="mt-0.5 size-4 shrink-0 text-ember" aria-hidden="true" />
          <span>{p.boltSeason.warning}</span>
        </p>
      )}
    </section>
  );
}
