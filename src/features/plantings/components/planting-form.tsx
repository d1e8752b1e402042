import { useId } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import {
  METHOD_WORDS,
  PLANTING_METHODS,
  PLANTING_QUANTITY_UNITS,
  PLANTING_STATUSES,
  PLANTING_UNIT_WORDS,
  STAGE_FIELDS,
  STAGE_WORDS,
  STATUS_WORDS,
  plantingCreateSchema,
} from '#shared/schemas/plantings';
import type { PlantingCreateInput, PlantingDto } from '#shared/schemas/plantings';
import { applyServerFieldErrors } from '@/lib/form-errors';
import { mutationProblem } from '@/lib/problems';
import { changedValues } from '@/lib/changed-values';
import { useSubmissionKey } from '@/lib/use-submission-key';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { FieldError, TextField } from '@/components/ui/text-field';
import { useCreatePlanting } from '@/features/plantings/api/create-planting';
import { useUpdatePlanting } from '@/features/plantings/api/update-planting';
import { CONTROL } from '@/features/plantings/components/field-styles';
import { HarvestPreview } from '@/features/plantings/components/harvest-preview';

export interface PlantingChoices {
  beds: { id: number; name: string }[];
  varieties: { id: number; name: string; cropName: string; cropKey?: string }[];
  seedLots: { id: number; varietyId: number; label: string }[];
  /** What the soil means for sowing now, by crop key; null when no soil temperature is known. */
  soil?: { now: string; byCrop: Record<string, string> } | null;
}

type FormInput = z.input<typeof plantingCreateSchema>;

const FIELDS = ['bedId', 'varietyId', 'seedLotId', 'method', 'status', 'quantity', 'quantityUnit', ...STAGE_FIELDS, 'notes'] as const;

// Inputs hold text; the schema wants numbers, dates or null. Blank is "not set", never zero.
const idOrUndefined = (v: unknown) => (v === '' || v == null ? undefined : Number(v));
const idOrNull = (v: unknown) => (v === '' || v == null ? null : Number(v));
// react-hook-form also passes the default value (null) through here: still "not set", not 0.
const numberOrNull = (v: unknown) => (v == null || (typeof v === 'string' && v.trim() === '') ? null : Number(v));
const dateOrNull = (v: unknown) => (v === '' || v === undefined ? null : v);

function Select({ label, error, children, ...props }: React.SelectHTMLAttributes<HTMLSelectElement> & { label: string; error?: string }) {
  const id = useId();
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="font-semibold">
        {label}
      </label>
      <select id={id} aria-invalid={error ? true : undefined} aria-describedby={error ? `${id}-e` : undefined} className={CONTROL} {...props}>
        {children}
      </select>
      {error && <FieldError id={`${id}-e`}>{error}</FieldError>}
    </div>
  );
}

function valuesOf(p: PlantingDto): FormInput {
  return {
    bedId: p.bed.id,
    varietyId: p.variety.id,
    seedLotId: p.seedLot?.id ?? null,
    method: p.method,
    status: p.status,
    quantity: p.quantity,
    quantityUnit: p.quantityUnit,
    sownOn: p.sownOn,
    emergedOn: p.emergedOn,
    thinnedOn: p.thinnedOn,
    transplantedOn: p.transplantedOn,
    firstHarvestOn: p.firstHarvestOn,
    lastHarvestOn: p.lastHarvestOn,
    boltedOn: p.boltedOn,
    notes: p.notes,
  };
}

/**
 * Adds a planting, or with `planting` edits that one. The whole record is checked with the create
 * schema, as the server checks the merged record; only the fields that changed are sent.
 */
export function PlantingForm({
  gardenId,
  choices,
  today,
  planting,
  onSaved,
  onCancel,
}: {
  gardenId: number;
  choices: PlantingChoices;
  today: string;
  planting?: PlantingDto;
  onSaved: (planting: PlantingDto) => void;
  onCancel?: () => void;
}) {
  const create = useCreatePlanting(gardenId);
  const update = useUpdatePlanting(gardenId, planting?.id ?? 0);
  const mutation = planting ? update : create;
  const submission = useSubmissionKey();
  const form = useForm<FormInput, unknown, PlantingCreateInput>({
    resolver: zodResolver(plantingCreateSchema),
    defaultValues: planting ? valuesOf(planting) : {
      seedLotId: null,
      method: 'direct-sow',
      status: 'growing',
      quantity: null,
      quantityUnit: 'plants',
      sownOn: today,
      emergedOn: null,
      thinnedOn: null,
      transplantedOn: null,
      firstHarvestOn: null,
      lastHarvestOn: null,
      boltedOn: null,
      notes: '',
    },
  });
  const { register, handleSubmit, formState, setError, watch } = form;
  const errors = formState.errors;
  const varietyId = watch('varietyId');
  const lots = choices.seedLots.filter((l) => l.varietyId === Number(varietyId));

  // Read while rendering: react-hook-form only tracks the parts of formState that are read.
  const dirtyFields = formState.dirtyFields;
  const onSubmit = handleSubmit((values) => {
    const changes = changedValues(values, dirtyFields);
    // Nothing changed: close without asking the server to rewrite the same values.
    if (planting && !Object.keys(changes).length) return onSaved(planting);
    const saving = planting ? update.mutateAsync(changes) : create.mutateAsync({ ...values, idempotencyKey: submission.keyFor(values) });
    return saving.then((saved) => {
      submission.renew();
      onSaved(saved);
    }, (error: unknown) => {
      applyServerFieldErrors(error, setError, FIELDS);
    });
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4" aria-label={planting ? 'Edit planting' : 'New planting'}>
      {mutation.isError && !Object.keys(errors).length && (
        <Notice tone="error" title="The planting was not saved" live="alert">
          {mutationProblem(mutation.error)}
        </Notice>
      )}
      <div className="grid gap-4 sm:grid-cols-2">
        <Select label="Bed" error={errors.bedId?.message} {...register('bedId', { setValueAs: idOrUndefined })}>
          <option value="">Choose a bed…</option>
          {choices.beds.map((b) => (
            <option key={b.id} value={b.id}>
              {b.name}
            </option>
          ))}
        </Select>
        <Select label="Variety" error={errors.varietyId?.message} {...register('varietyId', { setValueAs: idOrUndefined })}>
          <option value="">Choose a variety…</option>
          {choices.varieties.map((v) => (
            <option key={v.id} value={v.id}>
              {v.cropName}: {v.name}
            </option>
          ))}
        </Select>
        {!planting && <SoilLine choices={choices} varietyId={varietyId ? Number(varietyId) : null} />}
        <Select label="Seed lot (optional)" error={errors.seedLotId?.message} {...register('seedLotId', { setValueAs: idOrNull })}>
          <option value="">{lots.length ? 'No lot recorded' : 'No lots of this variety'}</option>
          {lots.map((l) => (
            <option key={l.id} value={l.id}>
              {l.label}
            </option>
          ))}
        </Select>
        <Select label="Method" error={errors.method?.message} {...register('method')}>
          {PLANTING_METHODS.map((m) => (
            <option key={m} value={m}>
              {METHOD_WORDS[m]}
            </option>
          ))}
        </Select>
        <Select label="Status" error={errors.status?.message} {...register('status')}>
          {PLANTING_STATUSES.map((s) => (
            <option key={s} value={s}>
              {STATUS_WORDS[s]}
            </option>
          ))}
        </Select>
        <div className="grid grid-cols-[1fr_auto] items-end gap-2">
          <TextField label="Quantity" inputMode="decimal" error={errors.quantity?.message} {...register('quantity', { setValueAs: numberOrNull })} />
          <select aria-label="Quantity unit" className={`${CONTROL} w-auto`} {...register('quantityUnit')}>
            {PLANTING_QUANTITY_UNITS.map((u) => (
              <option key={u} value={u}>
                {PLANTING_UNIT_WORDS[u]}
              </option>
            ))}
          </select>
        </div>
        <TextField label="Sown on" type="date" error={errors.sownOn?.message} {...register('sownOn', { setValueAs: dateOrNull })} />
        <TextField
          label="Transplanted on"
          type="date"
          hint="For transplants and indoor starts."
          error={errors.transplantedOn?.message}
          {...register('transplantedOn', { setValueAs: dateOrNull })}
        />
      </div>
      {!planting && (
        <HarvestPreview
          gardenId={gardenId}
          varietyId={varietyId ? Number(varietyId) : null}
          method={watch('method') ?? 'direct-sow'}
          sownOn={watch('sownOn') || null}
          transplantedOn={watch('transplantedOn') || null}
        />
      )}
      <details className="rounded-md border border-line px-4 py-2" open={planting ? STAGE_FIELDS.some((f) => f !== 'sownOn' && f !== 'transplantedOn' && planting[f]) : undefined}>
        <summary className="cursor-pointer py-1 font-semibold">More dates (emerged, harvested, bolted…)</summary>
        <div className="grid gap-4 py-3 sm:grid-cols-2">
          {STAGE_FIELDS.filter((f) => f !== 'sownOn' && f !== 'transplantedOn').map((f) => (
            <TextField key={f} label={STAGE_WORDS[f]} type="date" error={errors[f]?.message} {...register(f, { setValueAs: dateOrNull })} />
          ))}
        </div>
      </details>
      <div className="flex flex-col gap-1">
        <label htmlFor="planting-notes" className="font-semibold">
          Notes
        </label>
        <textarea id="planting-notes" rows={2} className={CONTROL} {...register('notes')} />
        {errors.notes?.message && <FieldError>{errors.notes.message}</FieldError>}
      </div>
      <div className="flex flex-wrap gap-2">
        <Button type="submit" disabled={formState.isSubmitting}>
          {formState.isSubmitting ? 'Saving…' : planting ? 'Save changes' : 'Save planting'}
        </Button>
        {onCancel && (
          <Button variant="quiet" onClick={onCancel}>
            Cancel
          </Button>
        )}
      </div>
    </form>
  );
}

/** Under the variety of a new planting: whether the soil suits sowing its crop now. */
function SoilLine({ choices, varietyId }: { choices: PlantingChoices; varietyId: number | null }) {
  const cropKey = choices.varieties.find((v) => v.id === varietyId)?.cropKey;
  const words = cropKey ? choices.soil?.byCrop[cropKey] : undefined;
  if (!words || !choices.soil) return null;
  return (
    <p role="status" className="rounded-md border border-line bg-paper-sunk px-3 py-2 text-sm sm:col-span-2">
      {choices.soil.now}. {words}
    </p>
  );
}
