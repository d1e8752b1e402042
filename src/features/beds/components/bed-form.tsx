import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { BED_KINDS, BED_KIND_WORDS, bedCreateSchema } from '#shared/schemas/beds';
import type { BedCreateInput, BedDto } from '#shared/schemas/beds';
import { applyServerFieldErrors } from '@/lib/form-errors';
import { changedValues } from '@/lib/changed-values';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { FieldError, TextField } from '@/components/ui/text-field';
import { useCreateBed } from '@/features/beds/api/create-bed';
import { useUpdateBed } from '@/features/beds/api/update-bed';

const numberOrNull = (v: unknown) => (typeof v === 'string' && v.trim() === '' ? null : Number(v));
const CONTROL = 'min-h-11 w-full rounded-md border border-line bg-paper-raised px-3 py-2';
const FIELDS = ['name', 'kind', 'lengthM', 'widthM', 'notes'] as const;

/** Adds a bed, or with `bed` edits that one and sends only the fields that changed. */
export function BedForm({ gardenId, bed, onDone }: { gardenId: number; bed?: BedDto; onDone?: () => void }) {
  const create = useCreateBed(gardenId);
  const update = useUpdateBed(gardenId, bed?.id ?? 0);
  const mutation = bed ? update : create;
  const { register, handleSubmit, formState, setError, reset } = useForm<z.input<typeof bedCreateSchema>, unknown, BedCreateInput>({
    resolver: zodResolver(bedCreateSchema),
    defaultValues: bed
      ? { name: bed.name, kind: bed.kind, lengthM: bed.lengthM, widthM: bed.widthM, notes: bed.notes }
      : { name: '', kind: 'bed', lengthM: null, widthM: null, notes: '' },
  });
  const e = formState.errors;
  // Read while rendering: react-hook-form only tracks the parts of formState that are read.
  const dirtyFields = formState.dirtyFields;
  const onSubmit = handleSubmit((values) => {
    const changes = changedValues(values, dirtyFields);
    // Nothing changed: close without asking the server to rewrite the same values.
    if (bed && !Object.keys(changes).length) return onDone?.();
    const saving = bed ? update.mutateAsync(changes) : create.mutateAsync(values);
    return saving.then(
      () => (bed ? onDone?.() : reset()),
      (error: unknown) => applyServerFieldErrors(error, setError, FIELDS),
    );
  });
  const title = bed ? `Edit bed ${bed.name}` : 'New bed';
  return (
    <form onSubmit={onSubmit} noValidate aria-label={title} className="grid gap-3 rounded-lg border border-line bg-paper-raised p-4 sm:grid-cols-2">
      <h2 className="text-lg font-bold sm:col-span-2">{bed ? `Edit “${bed.name}”` : 'Add a bed'}</h2>
      <TextField label="Name" error={e.name?.message} {...register('name')} />
      <div className="flex flex-col gap-1">
        <label htmlFor={`bed-kind-${bed?.id ?? 'new'}`} className="font-semibold">Kind</label>
        <select id={`bed-kind-${bed?.id ?? 'new'}`} className={CONTROL} {...register('kind')}>
          {BED_KINDS.map((k) => (
            <option key={k} value={k}>{BED_KIND_WORDS[k]}</option>
          ))}
        </select>
        {e.kind?.message && <FieldError>{e.kind.message}</FieldError>}
      </div>
      <TextField label="Length" unit="m" inputMode="decimal" error={e.lengthM?.message} {...register('lengthM', { setValueAs: numberOrNull })} />
      <TextField label="Width" unit="m" inputMode="decimal" error={e.widthM?.message} {...register('widthM', { setValueAs: numberOrNull })} />
      <TextField label="Notes" className="sm:col-span-2" error={e.notes?.message} {...register('notes')} />
      {mutation.isError && !Object.keys(e).length && <div className="sm:col-span-2"><Notice tone="error" live="alert">{mutation.error.message}</Notice></div>}
      <div className="flex flex-wrap gap-2">
        <Button type="submit" disabled={formState.isSubmitting}>{bed ? 'Save changes' : 'Add bed'}</Button>
        {bed && <Button variant="quiet" onClick={onDone}>Cancel</Button>}
      </div>
    </form>
  );
}
