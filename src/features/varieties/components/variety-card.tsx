import { useState } from 'react';
import { Info, Pencil, Sprout, TriangleAlert } from 'lucide-react';
import type { DisplayUnit } from '#shared/schemas/gardens';
import { DTM_FROM_WORDS, RATING_WORDS, TRAIT_WORDS } from '#shared/schemas/varieties';
import type { VarietyDto } from '#shared/schemas/varieties';
import { formatDegreeDays as degreeDays } from '#shared/thermal/units';
import { Button } from '@/components/ui/button';
import { ConfirmDelete } from '@/components/ui/confirm-delete';
import { Loading } from '@/components/ui/loading';
import { useVariety } from '@/features/varieties/api/get-variety';
import { useDeleteVariety } from '@/features/varieties/api/delete-variety';
import { VarietyForm } from '@/features/varieties/components/variety-form';
import { targetWords } from '@/features/varieties/components/target-words';

const rating = (n: number | null) => (n === null ? '—' : `${RATING_WORDS[n]} (${n} of 5)`);
const cm = (n: number | null) => (n === null ? '—' : `${n} cm`);

function Target({ gardenId, id, units }: { gardenId: number; id: number; units: DisplayUnit }) {
  const v = useVariety(gardenId, id);
  if (v.isPending) return <Loading label="Working out the degree-day target…" />;
  if (v.isError) return <p className="text-clay">{v.error.message}</p>;
  const t = v.data.gddTarget!;
  return (
    <div className="rounded-md bg-paper-sunk p-3">
      <p className="font-semibold">
        Degree-day target: {t.valueC === null ? 'not known yet' : `${degreeDays(t.valueC, units)} from ${t.countsFrom === 'transplant' ? 'transplanting' : 'sowing'}`}
        {t.basis === 'override' && ' (set by a grower)'}
        {t.stale && ' (your own target is set aside)'}
      </p>
      {t.p10C !== null && t.p90C !== null && (
        <p className="text-sm">Past years ranged {degreeDays(t.p10C, units)} to {degreeDays(t.p90C, units)} (10th–90th percentile).</p>
      )}
      <p className="text-sm text-loam-soft">{t.explanation}</p>
    </div>
  );
}

export function VarietyCard({ gardenId, variety: v, units, canEdit }: { gardenId: number; variety: VarietyDto; units: DisplayUnit; canEdit: boolean }) {
  const [showTarget, setShowTarget] = useState(false);
  const [editing, setEditing] = useState(false);
  const remove = useDeleteVariety(gardenId, v.id);
  if (editing) return <VarietyForm gardenId={gardenId} variety={v} units={units} onSaved={() => setEditing(false)} onCancel={() => setEditing(false)} />;
  const facts: [string, string][] = [
    ['Days to maturity', v.dtmDays === null ? '—' : `${v.dtmDays} days ${DTM_FROM_WORDS[v.dtmFrom]}`],
    ['Days to emergence', v.emergenceDaysMin === null && v.emergenceDaysMax === null ? '—' : `${v.emergenceDaysMin ?? '?'}–${v.emergenceDaysMax ?? '?'} days`],
    ['Bolt tolerance', rating(v.boltTolerance)],
    ['Heat tolerance', rating(v.heatTolerance)],
    ['Sowing depth', cm(v.sowDepthCm)],
    ['Spacing', cm(v.spacingCm)],
    ['Thin to', cm(v.thinSpacingCm)],
    ['Sun', v.sunHours === null ? '—' : `${v.sunHours} h a day`],
    ['Water', v.waterCmPerWeek === null ? '—' : `${v.waterCmPerWeek} cm a week`],
    ['Container-friendly', v.containerFriendly ? 'Yes' : 'No'],
    ...(v.gddTargetOverrideC !== null ? [['Your degree-day target', targetWords(v, units)] as [string, string]] : []),
  ];
  return (
    <article className="flex flex-col gap-3 rounded-lg border border-line bg-paper-raised p-4">
      <header>
        <h2 className="text-lg font-bold">{v.name}</h2>
        <p className="text-loam-soft">{v.crop.name} · {v.crop.season === 'cool' ? 'cool-season' : 'warm-season'}</p>
        {v.traits.length > 0 && (
          <ul className="mt-1 flex flex-wrap gap-1" aria-label="Traits">
            {v.traits.map((t) => (
              <li key={t} className="rounded-full border border-line px-2 text-sm">{TRAIT_WORDS[t]}</li>
            ))}
          </ul>
        )}
      </header>
      <dl className="grid grid-cols-[auto_1fr] gap-x-3 text-sm">
        {facts.map(([k, val]) => (
          <div key={k} className="contents">
            <dt className="text-loam-soft">{k}</dt>
            <dd>{val}</dd>
          </div>
        ))}
      </dl>
      {v.guidance.map((g) => (
        <p
          key={g.trait}
          className={`flex gap-2 rounded-md border-l-4 px-3 py-2 text-sm ${g.tone === 'caution' ? 'border-ember bg-ember-tint' : 'border-frost bg-frost-tint'}`}
        >
          {g.tone === 'caution' ? <TriangleAlert className="size-4 shrink-0" aria-hidden="true" /> : <Info className="size-4 shrink-0" aria-hidden="true" />}
          <span>
            <span className="font-semibold">{g.tone === 'caution' ? 'Caution: ' : 'Note: '}</span>
            {g.text}
          </span>
        </p>
      ))}
      {v.notes && <p className="text-sm">{v.notes}</p>}
      {showTarget ? (
        <Target gardenId={gardenId} id={v.id} units={units} />
      ) : (
        <Button variant="quiet" onClick={() => setShowTarget(true)} className="self-start">
          <Sprout className="size-5" aria-hidden="true" /> Show degree-day target
        </Button>
      )}
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
