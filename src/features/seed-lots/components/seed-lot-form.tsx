import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { QUANTITY_UNITS, seedLotCreateSchema } from '#shared/schemas/seed-lots';
import type { SeedLotCreateInput, SeedLotDto } from '#shared/schemas/seed-lots';
import { applyServerFieldErrors } from '@/lib/form-errors';
import { mutationProblem } from '@/lib/problems';
import { changedValues } from '@/lib/changed-values';
import { useSubmissionKey } from '@/lib/use-submission-key';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { FieldError, TextField } from '@/components/ui/text-field';
import { useCreateSeedLot } from '@/features/seed-lots/api/create-seed-lot';
import { useUpdateSeedLot } from '@/features/seed-lots/api/update-seed-lot';

const CONTROL = 'min-h-11 w-full rounded-md border border-line bg-paper-raised px-3 py-2';
const numberOrNull = (v: unknown) => (v === '' || v === undefined || v === null ? null : Number(v));
const FIELDS = ['varietyId', 'supplier', 'lotNumber', 'packedForYear', 'quantity', 'quantityUnit', 'storageNotes'] as const;

function valuesOf(lot: SeedLotDto): z.input<typeof seedLotCreateSchema> {
  return {
    varietyId: lot.variety.id,
    supplier: lot.supplier,
    lotNumber: lot.lotNumber,
    packedForYear: lot.packedForYear,
    quantity: lot.quantity,
    quantityUnit: lot.quantityUnit,
    storageNotes: lot.storageNotes,
  };
}

/** Adds a seed lot, or with `lot` edits that one and sends only the fields that changed. */
export function SeedLotForm({
  gardenId,
  varieties,
  lot,
  onSaved,
  onCancel,
}: {
  gardenId: number;
  varieties: { id: number; label: string }[];
  lot?: SeedLotDto;
  onSaved: () => void;
  onCancel?: () => void;
}) {
  const create = useCreateSeedLot(gardenId);
  const update = useUpdateSeedLot(gardenId, lot?.id ?? 0);
  const mutation = lot ? update : create;
  const submission = useSubmissionKey();
  const { register, handleSubmit, formState, setError } = useForm<z.input<typeof seedLotCreateSchema>, unknown, SeedLotCreateInput>({
    resolver: zodResolver(seedLotCreateSchema),
    defaultValues: lot ? valuesOf(lot) : { supplier: '', lotNumber: '', packedForYear: null, quantity: null, quantityUnit: 'seeds', storageNotes: '' },
  });
  const e = formState.errors;
  // Read while rendering: react-hook-form only tracks the parts of formState that are read.
  const dirtyFields = formState.dirtyFields;
  const onSubmit = handleSubmit((values) => {
    const changes = changedValues(values, dirtyFields);
    // Nothing changed: close without asking the server to rewrite the same values.
    if (lot && !Object.keys(changes).length) return onSaved();
    const saving = lot ? update.mutateAsync(changes) : create.mutateAsync({ ...values, idempotencyKey: submission.keyFor(values) });
    return saving.then(
      () => {
        submission.renew();
        onSaved();
      },
      (error: unknown) => applyServerFieldErrors(error, setError, FIELDS),
    );
  });
  const idp = `lot-${lot?.id ?? 'new'}`;
  return (
    <form
      onSubmit={onSubmit}
      noValidate
      aria-label={lot ? `Edit seed lot of ${lot.variety.name}` : 'New seed lot'}
      className="grid gap-3 rounded-lg border border-line bg-paper-raised p-4 sm:grid-cols-2"
    >
      {lot && <h2 className="text-lg font-bold sm:col-span-2">Edit seed lot of {lot.variety.cropName}: {lot.variety.name}</h2>}
      <div className="flex flex-col gap-1">
        <label htmlFor={`${idp}-variety`} className="font-semibold">Variety</label>
        <select
          id={`${idp}-variety`}
          className={CONTROL}
          aria-invalid={e.varietyId ? true : undefined}
          {...register('varietyId', { setValueAs: (v) => (v === '' ? undefined : Number(v)) })}
        >
          <option value="">Choose a variety…</option>
          {varieties.map((v) => <option key={v.id} value={v.id}>{v.label}</option>)}
        </select>
        {e.varietyId?.message && <FieldError>{e.varietyId.message}</FieldError>}
      </div>
      <TextField label="Supplier" error={e.supplier?.message} {...register('supplier')} />
      <TextField label="Lot number" error={e.lotNumber?.message} {...register('lotNumber')} />
      <TextField label="Packed-for year" inputMode="numeric" error={e.packedForYear?.message} {...register('packedForYear', { setValueAs: numberOrNull })} />
      <div className="grid grid-cols-[1fr_auto] items-end gap-2">
        <TextField label="Quantity" inputMode="decimal" error={e.quantity?.message} {...register('quantity', { setValueAs: numberOrNull })} />
        <select aria-label="Quantity unit" className={`${CONTROL} w-auto`} {...register('quantityUnit')}>
          {QUANTITY_UNITS.map((u) => <option key={u} value={u}>{u}</option>)}
        </select>
      </div>
      <TextField label="Storage notes" error={e.storageNotes?.message} {...register('storageNotes')} />
      {mutation.isError && !Object.keys(e).length && (
        <div className="sm:col-span-2">
          <Notice tone="error" title="The seed lot was not saved" live="alert">{mutationProblem(mutation.error)}</Notice>
        </div>
      )}
      <div className="flex flex-wrap gap-2">
        <Button type="submit" disabled={formState.isSubmitting}>{lot ? 'Save changes' : 'Save seed lot'}</Button>
        {onCancel && <Button variant="quiet" onClick={onCancel}>Cancel</Button>}
      </div>
    </form>
  );
}
