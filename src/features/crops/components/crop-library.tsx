import { useState } from 'react';
import { ChevronRight, Pencil, SlidersHorizontal, Undo2 } from 'lucide-react';
import { basisWords } from '#shared/crops/basis';
import { CONFIDENCE_WORDS, PARAM_GROUPS } from '#shared/crops/params';
import type { Confidence } from '#shared/crops/params';
import type { CropDto, CropParamDto } from '#shared/schemas/crops';
import type { DisplayUnit } from '#shared/schemas/gardens';
import { cToF, cDaysToFDays } from '#shared/thermal/units';
import { Button } from '@/components/ui/button';
import { FieldError } from '@/components/ui/text-field';
import { useUpdateCropOverrides } from '@/features/crops/api/update-crop-overrides';
import { ParamOverrideForm } from '@/features/crops/components/param-override-form';
import { ENUM_WORDS } from '@/features/crops/components/param-words';
import { countOf } from '#shared/format/count-words';
import { sourceInPlainWords } from '#shared/crops/source-words';

const round1 = (n: number) => String(Math.round(n * 10) / 10);

/** Every figure with its unit, temperatures in the garden's display unit. */
export function formatParam(p: Pick<CropParamDto, 'value' | 'unit' | 'kind'>, units: DisplayUnit): string {
  if (p.value === null) return 'Not set';
  if (p.kind === 'boolean') return p.value ? 'Yes' : 'No';
  if (p.kind === 'enum') return ENUM_WORDS[String(p.value)] ?? String(p.value);
  const n = Number(p.value);
  switch (p.unit) {
    case 'C':
      return units === 'F' ? `${round1(cToF(n))} °F` : `${round1(n)} °C`;
    case 'C-days':
      return units === 'F' ? `${round1(cDaysToFDays(n))} °F-days` : `${round1(n)} °C-days`;
    case 'h':
      return `${round1(n)} h`;
    case 'cm':
      return `${round1(n)} cm`;
    default:
      return `${round1(n)} ${p.unit}`;
  }
}

function ConfidenceWord({ confidence }: { confidence: Confidence }) {
  return <abbr title={CONFIDENCE_WORDS[confidence]}>{CONFIDENCE_WORDS[confidence].split(':')[0]}</abbr>;
}

/** A degree-day figure only means something in the method it was counted with. */
function DegreeDayBasisNote({ p, units }: { p: CropParamDto; units: DisplayUnit }) {
  const b = p.ddBasis;
  if (!b || (p.origin !== 'garden' && !b.stale)) return null;
  const words = basisWords(b, units);
  if (!b.stale) return <span className="block text-sm text-loam-soft">set at {words}</span>;
  const whose = p.origin === 'garden' ? 'Set' : 'Shared figure counted';
  return (
    <span className="block text-sm text-clay">
      {whose} at {words}; this crop now counts differently, so it is not used until it is set again.
    </span>
  );
}

function Param({
  gardenId,
  cropKey,
  p,
  params,
  units,
  canEdit,
}: {
  gardenId: number;
  cropKey: string;
  p: CropParamDto;
  params: readonly CropParamDto[];
  units: DisplayUnit;
  canEdit: boolean;
}) {
  const [editing, setEditing] = useState(false);
  const clear = useUpdateCropOverrides(gardenId, cropKey);
  const overridden = p.origin === 'garden';
  return (
    <div className="grid gap-1 border-b border-line py-2 sm:grid-cols-[14rem_9rem_1fr] sm:gap-3">
      <dt className="font-semibold">{p.label}</dt>
      <dd className="tabular-nums">
        {formatParam(p, units)}
        <DegreeDayBasisNote p={p} units={units} />
        {overridden && (
          <span className="mt-1 flex w-fit items-center gap-1 rounded-full border border-frost bg-frost-tint px-2 text-sm font-semibold text-frost">
            <SlidersHorizontal className="size-3.5" aria-hidden="true" /> Overridden for this garden
          </span>
        )}
      </dd>
      <dd className="text-sm text-loam-soft">
        {overridden && p.libraryDefault ? (
          <>
            <span className="block">{p.source}.</span>
            <span className="block">
              <span className="font-semibold text-loam">Shared default:</span> {formatParam({ ...p, value: p.libraryDefault.value }, units)} · {sourceInPlainWords(p.libraryDefault.source)} ·{' '}
              <ConfidenceWord confidence={p.libraryDefault.confidence} />
            </span>
          </>
        ) : (
          <>
            <span className="font-semibold text-loam">Source:</span> {sourceInPlainWords(p.source)}
            {p.confidence && (
              <>
                {' '}
                · <ConfidenceWord confidence={p.confidence} />
              </>
            )}
          </>
        )}
        {canEdit && !editing && (
          <span className="mt-1 flex flex-wrap gap-2">
            <Button variant="quiet" className="text-sm" aria-label={`${overridden ? 'Change' : 'Set'} ${p.label} for this garden`} onClick={() => setEditing(true)}>
              <Pencil className="size-4" aria-hidden="true" /> {overridden ? 'Change' : 'Set for this garden'}
            </Button>
            {overridden && (
              <Button
                variant="quiet"
                className="text-sm"
                aria-label={`Use the shared default for ${p.label}`}
                disabled={clear.isPending}
                onClick={() => clear.mutate({ params: { [p.key]: null } })}
              >
                <Undo2 className="size-4" aria-hidden="true" /> Use shared default
              </Button>
            )}
          </span>
        )}
        {clear.isError && <FieldError>{clear.error.message}</FieldError>}
      </dd>
      {editing && <ParamOverrideForm gardenId={gardenId} cropKey={cropKey} param={p} params={params} units={units} onDone={() => setEditing(false)} />}
    </div>
  );
}

/** `canEdit` is the owner's: crop values steer every planting's projection in the garden. */
export function CropLibrary({ gardenId, crops, units, canEdit }: { gardenId: number; crops: CropDto[]; units: DisplayUnit; canEdit: boolean }) {
  return (
    <ul className="flex flex-col gap-3">
      {crops.map((crop) => {
        const base = crop.params.find((p) => p.key === 'baseC')!;
        const upper = crop.params.find((p) => p.key === 'upperC')!;
        return (
          <li key={crop.key} className="rounded-lg border border-line bg-paper-raised">
            <details>
              <summary className="flex min-h-11 cursor-pointer flex-wrap items-baseline gap-x-3 px-4 py-3">
                <span className="text-lg font-bold">{crop.name}</span>
                <span className="italic text-loam-soft">{crop.botanicalName}</span>
                <span className="text-sm">
                  {ENUM_WORDS[crop.season]} · base {formatParam(base, units)}
                  {upper.value !== null && ` · upper ${formatParam(upper, units)}`}
                  {crop.overrides > 0 && ` · ${countOf(crop.overrides, 'value')} overridden for this garden`}
                </span>
              </summary>
              <div className="px-4 pb-4">
                {PARAM_GROUPS.map((g) => {
                  const inGroup = crop.params.filter((p) => p.group === g);
                  // Figures the library has no value for stay one click away, not row after row of "Not set".
                  const known = inGroup.filter((p) => p.value !== null || p.origin === 'garden');
                  const unset = inGroup.filter((p) => !known.includes(p));
                  const row = (p: CropParamDto) => <Param key={p.key} gardenId={gardenId} cropKey={crop.key} p={p} params={crop.params} units={units} canEdit={canEdit} />;
                  return (
                    <section key={g} aria-label={g}>
                      <h3 className="mt-3 font-bold">{g}</h3>
                      {known.length > 0 && <dl>{known.map(row)}</dl>}
                      {unset.length > 0 && (
                        <details className="mt-1">
                          <summary className="flex min-h-11 cursor-pointer items-center gap-1 text-sm text-loam-soft underline">
                            <ChevronRight className="size-4 shrink-0" aria-hidden="true" />
                            {countOf(unset.length, 'figure')} with no value for {crop.name.toLowerCase()}
                            {canEdit ? ' (set one for this garden if you know it)' : ''}
                          </summary>
                          <dl>{unset.map(row)}</dl>
                        </details>
                      )}
                    </section>
                  );
                })}
              </div>
            </details>
          </li>
        );
      })}
    </ul>
  );
}
