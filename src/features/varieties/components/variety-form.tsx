import { useForm } from 'react-hook-form';
import type { FieldErrors, Resolver } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { CROP_LIBRARY } from '#shared/crops/library';
import { DTM_FROM, DTM_FROM_WORDS, RATING_WORDS, TRAIT_WORDS, VARIETY_TRAITS, varietyCreateSchema } from '#shared/schemas/varieties';
import type { VarietyCreateInput, VarietyDto } from '#shared/schemas/varieties';
import type { DisplayUnit } from '#shared/schemas/gardens';
import { unitSystemOf } from '#shared/units/measures';
import type { UnitSystem } from '#shared/units/measures';
import { applyServerFieldErrors } from '@/lib/form-errors';
import { mutationProblem } from '@/lib/problems';
import { changedValues } from '@/lib/changed-values';
import { useSubmissionKey } from '@/lib/use-submission-key';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { FieldError, TextField } from '@/components/ui/text-field';
import { useCreateVariety } from '@/features/varieties/api/create-variety';
import { useUpdateVariety } from '@/features/varieties/api/update-variety';
import { targetWords } from '@/features/varieties/components/target-words';
import { MEASURE_FIELDS, measureProblem, measureUnit, shownValue, storedValue } from '@/features/varieties/utils/variety-measures';

type FormInput = z.input<typeof varietyCreateSchema>;
const numberOrNull = (v: unknown) => (v === '' || v === undefined || v === null ? null : Number(v));
const CONTROL = 'min-h-11 w-full rounded-md border border-line bg-paper-raised px-3 py-2';
const FIELDS = ['cropKey', 'name', 'dtmDays', 'dtmFrom', 'emergenceDaysMin', 'emergenceDaysMax', 'boltTolerance', 'heatTolerance', 'traits', 'containerFriendly', 'sunHours', 'waterCmPerWeek', 'sowDepthCm', 'spacingCm', 'thinSpacingCm', 'notes'] as const;

const EMPTY: FormInput = {
  cropKey: 'lettuce', name: '', dtmDays: null, dtmFrom: 'sowing', emergenceDaysMin: null, emergenceDaysMax: null, boltTolerance: null, heatTolerance: null,
  traits: [], containerFriendly: false, sunHours: null, waterCmPerWeek: null, sowDepthCm: null, spacingCm: null, thinSpacingCm: null, gddTargetOverrideC: null, notes: '',
};

/** The form holds lengths as typed (inches in a °F garden); these two convert at its edges. */
function withMeasures<T extends Partial<Record<(typeof MEASURE_FIELDS)[number], unknown>>>(values: T, convert: (n: number | null) => number | null): T {
  const out = { ...values };
  for (const f of MEASURE_FIELDS) out[f] = convert((values[f] ?? null) as number | null) as T[typeof f];
  return out;
}

function valuesOf(v: VarietyDto, system: UnitSystem): FormInput {
  const { id: _id, crop, guidance: _guidance, gddTarget: _target, gddTargetBasis: _basis, ...fields } = v;
  return withMeasures({ ...fields, cropKey: crop.key }, (cm) => shownValue(cm, system));
}

/**
 * Checks lengths in the unit typed, so a °F garden's message reads in inches, then the whole
 * variety against the shared schema in the centimetres it is stored in.
 */
function varietyResolver(system: UnitSystem): Resolver<FormInput, unknown, VarietyCreateInput> {
  const schema = zodResolver(varietyCreateSchema);
  return async (values, context, options) => {
    const result = await schema(withMeasures(values, (n) => storedValue(n, system)), context, options);
    const measureErrors: FieldErrors<FormInput> = {};
    for (const f of MEASURE_FIELDS) {
      const message = measureProblem(f, (values[f] ?? null) as number | null, system);
      if (message) measureErrors[f] = { type: 'range', message };
    }
    if (!Object.keys(measureErrors).length) return result;
    return { values: {}, errors: { ...result.errors, ...measureErrors } };
  };
}

/** Adds a variety, or with `variety` edits that one and sends only the fields that changed. */
export function VarietyForm({
  gardenId,
  variety,
  units = 'C',
  onSaved,
  onCancel,
}: {
  gardenId: number;
  variety?: VarietyDto;
  /** The garden's units: lengths are typed in inches or cm, the grower's own target shown in °F- or °C-days. */
  units?: DisplayUnit;
  onSaved: () => void;
  onCancel?: () => void;
}) {
  const create = useCreateVariety(gardenId);
  const update = useUpdateVariety(gardenId, variety?.id ?? 0);
  const mutation = variety ? update : create;
  const submission = useSubmissionKey();
  const system = unitSystemOf(units);
  const { register, handleSubmit, formState, setError } = useForm<FormInput, unknown, VarietyCreateInput>({
    resolver: varietyResolver(system),
    defaultValues: variety ? valuesOf(variety, system) : EMPTY,
  });
  const e = formState.errors;
  const num = (name: Parameters<typeof register>[0]) => register(name, { setValueAs: numberOrNull });
  // Read while rendering: react-hook-form only tracks the parts of formState that are read.
  const dirtyFields = formState.dirtyFields;
  const onSubmit = handleSubmit((values) => {
    const changes = changedValues(values, dirtyFields);
    // Nothing changed: close without asking the server to rewrite the same values.
    if (variety && !Object.keys(changes).length) return onSaved();
    const saving = variety ? update.mutateAsync(changes) : create.mutateAsync({ ...values, idempotencyKey: submission.keyFor(values) });
    return saving.then(
      () => {
        submission.renew();
        onSaved();
      },
      (error: unknown) => applyServerFieldErrors(error, setError, FIELDS),
    );
  });
  const idp = `v${variety?.id ?? 'new'}`;
  const ratingSelect = (name: 'boltTolerance' | 'heatTolerance', label: string) => (
    <div className="flex flex-col gap-1">
      <label htmlFor={`${idp}-${name}`} className="font-semibold">{label}</label>
      <select id={`${idp}-${name}`} className={CONTROL} {...num(name)}>
        <option value="">Not known</option>
        {[1, 2, 3, 4, 5].map((n) => <option key={n} value={n}>{RATING_WORDS[n]} ({n} of 5)</option>)}
      </select>
    </div>
  );
  return (
    <form onSubmit={onSubmit} noValidate aria-label={variety ? `Edit variety ${variety.name}` : 'New variety'} className="grid gap-3 rounded-lg border border-line bg-paper-raised p-4 sm:grid-cols-2">
      {variety && <h2 className="text-lg font-bold sm:col-span-2">Edit “{variety.name}”</h2>}
      <div className="flex flex-col gap-1">
        <label htmlFor={`${idp}-crop`} className="font-semibold">Crop</label>
        <select id={`${idp}-crop`} className={CONTROL} {...register('cropKey')}>
          {CROP_LIBRARY.map((c) => <option key={c.key} value={c.key}>{c.name}</option>)}
        </select>
        {e.cropKey?.message && <FieldError>{e.cropKey.message}</FieldError>}
      </div>
      <TextField label="Variety name" error={e.name?.message} {...register('name')} />
      <TextField label="Days to maturity" unit="days" inputMode="numeric" error={e.dtmDays?.message} {...num('dtmDays')} />
      <div className="flex flex-col gap-1">
        <label htmlFor={`${idp}-from`} className="font-semibold">Counted from</label>
        <select id={`${idp}-from`} className={CONTROL} {...register('dtmFrom')}>
          {DTM_FROM.map((f) => <option key={f} value={f}>{DTM_FROM_WORDS[f]}</option>)}
        </select>
        {e.dtmFrom?.message && <FieldError>{e.dtmFrom.message}</FieldError>}
      </div>
      <TextField label="Days to emergence, fewest" unit="days" inputMode="numeric" error={e.emergenceDaysMin?.message} {...num('emergenceDaysMin')} />
      <TextField label="Days to emergence, most" unit="days" inputMode="numeric" error={e.emergenceDaysMax?.message} {...num('emergenceDaysMax')} />
      {ratingSelect('boltTolerance', 'Bolt tolerance')}
      {ratingSelect('heatTolerance', 'Heat tolerance')}
      <fieldset className="sm:col-span-2">
        <legend className="font-semibold">Traits</legend>
        <div className="flex flex-wrap gap-x-4">
          {VARIETY_TRAITS.map((t) => (
            <label key={t} className="inline-flex min-h-11 items-center gap-2">
              <input type="checkbox" value={t} {...register('traits')} className="size-5" /> {TRAIT_WORDS[t]}
            </label>
          ))}
          <label className="inline-flex min-h-11 items-center gap-2">
            <input type="checkbox" {...register('containerFriendly')} className="size-5" /> Container-friendly
          </label>
        </div>
        {e.traits?.message && <FieldError>{e.traits.message}</FieldError>}
      </fieldset>
      <TextField label="Sowing depth" unit={measureUnit('sowDepthCm', system)} inputMode="decimal" error={e.sowDepthCm?.message} {...num('sowDepthCm')} />
      <TextField label="Spacing" unit={measureUnit('spacingCm', system)} inputMode="decimal" error={e.spacingCm?.message} {...num('spacingCm')} />
      <TextField label="Thin to" unit={measureUnit('thinSpacingCm', system)} inputMode="decimal" error={e.thinSpacingCm?.message} {...num('thinSpacingCm')} />
      <TextField label="Sun" unit="h a day" inputMode="decimal" error={e.sunHours?.message} {...num('sunHours')} />
      <TextField label="Water" unit={measureUnit('waterCmPerWeek', system)} inputMode="decimal" error={e.waterCmPerWeek?.message} {...num('waterCmPerWeek')} />
      <TextField label="Notes" error={e.notes?.message} {...register('notes')} />
      {variety && variety.gddTargetOverrideC !== null && (
        <p className="text-sm text-loam-soft sm:col-span-2">Your degree-day target: {targetWords(variety, units)}.</p>
      )}
      {mutation.isError && !Object.keys(e).length && <div className="sm:col-span-2"><Notice tone="error" live="alert">{mutationProblem(mutation.error)}</Notice></div>}
      <div className="flex flex-wrap gap-2">
        <Button type="submit" disabled={formState.isSubmitting}>{variety ? 'Save changes' : 'Save variety'}</Button>
        {onCancel && <Button variant="quiet" onClick={onCancel}>Cancel</Button>}
      </div>
    </form>
  );
}
