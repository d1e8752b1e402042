import { useId, useState } from 'react';
import { paramProblems } from '#shared/crops/consistency';
import { CROP_PARAMS, CROP_PARAM_KEYS } from '#shared/crops/params';
import type { CropParamKey, CropParamValues } from '#shared/crops/params';
import { cropOverridesUpdateSchema } from '#shared/schemas/crops';
import type { CropParamDto } from '#shared/schemas/crops';
import type { DisplayUnit } from '#shared/schemas/gardens';
import { cDaysToFDays, cToF, fDaysToCDays, fToC } from '#shared/thermal/units';
import { mutationProblem } from '@/lib/problems';
import { Button } from '@/components/ui/button';
import { FieldError } from '@/components/ui/text-field';
import { useUpdateCropOverrides } from '@/features/crops/api/update-crop-overrides';
import { ENUM_WORDS } from '@/features/crops/components/param-words';

const CONTROL = 'min-h-11 w-full min-w-0 rounded-md border border-line bg-paper px-3 py-2 aria-[invalid=true]:border-2 aria-[invalid=true]:border-clay';
const round = (n: number, places: number) => Math.round(n * 10 ** places) / 10 ** places;

/** Temperatures are kept in °C; a °F garden types and reads them in °F. */
function toDisplay(value: number, unit: CropParamDto['unit'], units: DisplayUnit): number {
  if (units === 'C') return value;
  if (unit === 'C') return round(cToF(value), 1);
  if (unit === 'C-days') return round(cDaysToFDays(value), 1);
  return value;
}

function fromDisplay(value: number, unit: CropParamDto['unit'], units: DisplayUnit): number {
  if (units === 'C') return value;
  if (unit === 'C') return round(fToC(value), 2);
  if (unit === 'C-days') return round(fDaysToCDays(value), 2);
  return value;
}

export function unitWord(unit: CropParamDto['unit'], units: DisplayUnit): string {
  if (unit === 'C') return units === 'F' ? '°F' : '°C';
  if (unit === 'C-days') return units === 'F' ? '°F-days' : '°C-days';
  return unit ?? '';
}

function initialText(p: CropParamDto, units: DisplayUnit): string {
  if (p.value === null) return '';
  if (p.kind === 'number') return String(toDisplay(Number(p.value), p.unit, units));
  return String(p.value);
}

/** The crop's values as the garden has them, with this one changed: what the server will check. */
function valuesWith(params: readonly CropParamDto[], key: CropParamKey, value: unknown): CropParamValues {
  const byKey = new Map<string, unknown>(params.map((q) => [q.key, q.value]));
  byKey.set(key, value);
  return Object.fromEntries(CROP_PARAM_KEYS.map((k) => [k, byKey.get(k) ?? null])) as CropParamValues;
}

/** The server's message for this field, else its first one: a change may break a pair with another field. */
function serverProblem(error: Error, key: CropParamKey): string {
  const fields = (error as { fields?: Record<string, string> }).fields ?? {};
  return fields[`params.${key}.value`] ?? Object.values(fields)[0] ?? mutationProblem(error, 'your value is kept');
}

/**
 * Sets this garden's own value for one crop parameter, checked with the shared schema and then,
 * with the crop's other values, with the same consistency rule as the server.
 */
export function ParamOverrideForm({
  gardenId,
  cropKey,
  param: p,
  params,
  units,
  onDone,
}: {
  gardenId: number;
  cropKey: string;
  param: CropParamDto;
  /** Every parameter of the crop as the garden has it. */
  params: readonly CropParamDto[];
  units: DisplayUnit;
  onDone: () => void;
}) {
  const id = useId();
  const save = useUpdateCropOverrides(gardenId, cropKey);
  const [text, setText] = useState(() => initialText(p, units));
  const [note, setNote] = useState(p.origin === 'garden' ? p.source.replace(/^Set for this garden:? ?/, '') : '');
  const [problem, setProblem] = useState<string | null>(null);
  const meta = CROP_PARAMS[p.key];
  const unit = unitWord(p.unit, units);
  const range =
    meta.kind === 'number' ? `${toDisplay(meta.min, p.unit, units)} to ${toDisplay(meta.max, p.unit, units)}${unit ? ` ${unit}` : ''}` : null;

  const value = (): unknown => {
    if (p.kind === 'boolean') return text === 'true';
    if (p.kind === 'enum') return text;
    if (text.trim() === '') return null;
    const n = Number(text);
    return Number.isFinite(n) ? fromDisplay(n, p.unit, units) : text;
  };

  const submit = (e: React.FormEvent<HTMLFormElement>) => {
    e.preventDefault();
    const input = { params: { [p.key]: { value: value(), ...(note.trim() ? { note: note.trim() } : {}) } } };
    const parsed = cropOverridesUpdateSchema.safeParse(input);
    if (!parsed.success) {
      const issue = parsed.error.issues[0];
      // The schema's limits are in °C; say them in the unit the grower typed.
      const outOfRange = (issue.code === 'too_small' || issue.code === 'too_big') && range;
      return setProblem(outOfRange ? `${p.label} must be from ${range}.` : issue.message);
    }
    const key = p.key;
    const problems = paramProblems(valuesWith(params, key, parsed.data.params[key]?.value), units);
    const together = problems[key] ?? Object.values(problems)[0];
    if (together) return setProblem(together);
    setProblem(null);
    save.mutate(parsed.data, { onSuccess: onDone, onError: (error) => setProblem(serverProblem(error, key)) });
  };

  return (
    <form onSubmit={submit} noValidate aria-label={`Set ${p.label} for this garden`} className="flex flex-col gap-2 rounded-md border border-line bg-paper-sunk p-3 sm:col-span-3">
      <div className="grid gap-2 sm:grid-cols-2">
        <div className="flex flex-col gap-1">
          <label htmlFor={`${id}-v`} className="font-semibold">
            Value for this garden{unit && `, ${unit}`}
          </label>
          {p.kind === 'number' ? (
            <input
              id={`${id}-v`}
              inputMode="decimal"
              className={CONTROL}
              value={text}
              onChange={(e) => setText(e.target.value)}
              aria-invalid={problem ? true : undefined}
              aria-describedby={`${id}-hint${problem ? ` ${id}-err` : ''}`}
            />
          ) : (
            <select id={`${id}-v`} className={CONTROL} value={text} onChange={(e) => setText(e.target.value)}>
              {(p.kind === 'boolean' ? ['true', 'false'] : meta.kind === 'enum' ? meta.options : []).map((o) => (
                <option key={o} value={o}>
                  {o === 'true' ? 'Yes' : o === 'false' ? 'No' : (ENUM_WORDS[o] ?? o)}
                </option>
              ))}
            </select>
          )}
          <p id={`${id}-hint`} className="text-sm text-loam-soft">
            {range ? `From ${range}; leave empty for “does not apply”.` : 'Choose one.'}
          </p>
        </div>
        <div className="flex flex-col gap-1">
          <label htmlFor={`${id}-n`} className="font-semibold">
            Why (optional)
          </label>
          <input id={`${id}-n`} className={CONTROL} value={note} maxLength={300} onChange={(e) => setNote(e.target.value)} placeholder="e.g. our own trials, 3 seasons" />
        </div>
      </div>
      {problem && <FieldError id={`${id}-err`}>{problem}</FieldError>}
      <div className="flex flex-wrap gap-2">
        <Button type="submit" disabled={save.isPending}>
          {save.isPending ? 'Saving…' : 'Save for this garden'}
        </Button>
        <Button variant="quiet" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
