import { useState } from 'react';
import { Pencil, TriangleAlert } from 'lucide-react';
import { basisWords } from '#shared/crops/basis';
import type { DisplayUnit } from '#shared/schemas/gardens';
import { DTM_FROM_WORDS, RATING_WORDS, TRAIT_WORDS } from '#shared/schemas/varieties';
import type { GddTargetDto, VarietyDto } from '#shared/schemas/varieties';
import { degreeDaysIn } from '#shared/thermal/units';
import { unitSystemOf } from '#shared/units/measures';
import { formatDegreeDays } from '@/lib/format';
import { Button } from '@/components/ui/button';
import { ConfirmDelete } from '@/components/ui/confirm-delete';
import { useDeleteVariety } from '@/features/varieties/api/delete-variety';
import { VarietyForm } from '@/features/varieties/components/variety-form';
import { CalibrationPanel } from '@/features/varieties/components/calibration-panel';
import { showMeasure } from '@/features/varieties/utils/variety-measures';

const ratingWord = (n: number | null) => (n === null ? 'not known' : RATING_WORDS[n]);
const ratingFull = (n: number | null) => (n === null ? '—' : `${RATING_WORDS[n]} (${n} of 5)`);
const degreeDays = (cDays: number, units: DisplayUnit) => formatDegreeDays(degreeDaysIn(cDays, units), units);

/** One short line on where the target comes from; the full account is under "More". */
function basisLine(v: VarietyDto, t: GddTargetDto, units: DisplayUnit): string {
  if (t.basis === 'override') return v.gddTargetBasis ? `Set by a grower, at ${basisWords(v.gddTargetBasis, units)}.` : 'Set by a grower.';
  if (t.basis === 'none') return t.explanation;
  const from = `Worked out from the packet’s ${v.dtmDays} days in this garden’s past weather.`;
  return t.stale ? `Your own target is set aside: the crop now counts differently. ${from}` : from;
}

function TargetSummary({ v, units }: { v: VarietyDto; units: DisplayUnit }) {
  const t = v.gddTarget;
  if (!t) return null;
  const from = t.countsFrom === 'transplant' ? 'from transplanting' : 'from sowing';
  return (
    <div className="rounded-md bg-paper-sunk px-3 py-2">
      <p className="font-semibold">
        Degree-day target: {t.valueC === null ? 'not known yet' : `${degreeDays(t.valueC, units)} ${from}`}
      </p>
      <p className="text-sm text-loam-soft">{basisLine(v, t, units)}</p>
    </div>
  );
}

export function VarietyCard({ gardenId, variety: v, units, canEdit }: { gardenId: number; variety: VarietyDto; units: DisplayUnit; canEdit: boolean }) {
  const [editing, setEditing] = useState(false);
  const remove = useDeleteVariety(gardenId, v.id);
  if (editing) return <VarietyForm gardenId={gardenId} variety={v} units={units} onSaved={() => setEditing(false)} onCancel={() => setEditing(false)} />;
  const system = unitSystemOf(units);
  const cautions = new Set(v.guidance.filter((g) => g.tone === 'caution').map((g) => g.trait));
  const t = v.gddTarget;
  const more: [string, string][] = [
    ['Days to emergence', v.emergenceDaysMin === null && v.emergenceDaysMax === null ? '—' : `${v.emergenceDaysMin ?? '?'}–${v.emergenceDaysMax ?? '?'} days`],
    ['Bolt tolerance', ratingFull(v.boltTolerance)],
    ['Heat tolerance', ratingFull(v.heatTolerance)],
    ['Sowing depth', showMeasure('sowDepthCm', v.sowDepthCm, system)],
    ['Spacing', showMeasure('spacingCm', v.spacingCm, system)],
    ['Thin to', showMeasure('thinSpacingCm', v.thinSpacingCm, system)],
    ['Sun', v.sunHours === null ? '—' : `${v.sunHours} h a day`],
    ['Water', showMeasure('waterCmPerWeek', v.waterCmPerWeek, system)],
    ['Container-friendly', v.containerFriendly ? 'Yes' : 'No'],
    ...(t && t.basis !== 'none' ? [['How the target was found', t.explanation] as [string, string]] : []),
    ...(t && t.p10C !== null && t.p90C !== null ? [['Past years ranged', `${degreeDays(t.p10C, units)} to ${degreeDays(t.p90C, units)} (10th–90th percentile)`] as [string, string]] : []),
  ];
  return (
    <article className="flex flex-col gap-2 rounded-lg border border-line bg-paper-raised p-4" aria-label={v.name}>
      <header>
        <h2 className="text-lg font-bold">{v.name}</h2>
        <p className="text-loam-soft">{v.crop.name} · {v.crop.season === 'cool' ? 'cool-season' : 'warm-season'}</p>
      </header>
      <TargetSummary v={v} units={units} />
      <p className="text-sm">
        <span className="font-semibold">{v.dtmDays === null ? 'Days to maturity not known' : `${v.dtmDays} days ${DTM_FROM_WORDS[v.dtmFrom]}`}</span>
        {' · '}Bolt tolerance {ratingWord(v.boltTolerance).toLowerCase()}
        {' · '}Heat tolerance {ratingWord(v.heatTolerance).toLowerCase()}
      </p>
      {v.traits.length > 0 && (
        <ul className="flex flex-wrap gap-1" aria-label="Traits">
          {v.traits.map((trait) => (
            <li key={trait} className={`inline-flex items-center gap-1 rounded-full border px-2 text-sm ${cautions.has(trait) ? 'border-ember bg-ember-tint' : 'border-line'}`}>
              {cautions.has(trait) && <TriangleAlert className="size-3.5" aria-hidden="true" />}
              {TRAIT_WORDS[trait]}
              {cautions.has(trait) && <span className="sr-only"> (handle with care: see the trait notes at the top of the page)</span>}
            </li>
          ))}
        </ul>
      )}
      <details className="text-sm">
        <summary className="min-h-11 cursor-pointer content-center font-semibold">More about {v.name}</summary>
        <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 pb-2">
          {more.map(([k, val]) => (
            <div key={k} className="contents">
              <dt className="text-loam-soft">{k}</dt>
              <dd>{val}</dd>
            </div>
          ))}
        </dl>
        {v.notes && <p>{v.notes}</p>}
        <CalibrationPanel gardenId={gardenId} varietyId={v.id} varietyName={v.name} canEdit={canEdit} />
      </details>
      {canEdit && (
        <div className="flex flex-wrap gap-2 border-t border-line pt-3">
          <Button variant="quiet" aria-label={`Edit variety ${v.name}`} onClick={() => setEditing(true)}>
            <Pencil className="size-5" aria-hidden="true" /> Edit
          </Button>
          <ConfirmDelete
            label={`Delete variety ${v.name}`}
            question={`Delete the variety “${v.name}”?`}
            consequence="Its packet facts, traits and notes are removed for good. A variety with plantings or seed lots on record cannot be deleted until those are deleted."
            confirmLabel="Delete variety"
            onConfirm={() => remove.mutate()}
            pending={remove.isPending}
            error={remove.error}
          />
        </div>
      )}
    </article>
  );
}
