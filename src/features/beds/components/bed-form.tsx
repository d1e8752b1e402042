import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { BED_KINDS, BED_KIND_WORDS, bedCreateSchema } from '#shared/schemas/beds';
import type { BedCreateInput } from '#shared/schemas/beds';
import { applyServerFieldErrors } from '@/lib/form-errors';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { FieldError, TextField } from '@/components/ui/text-field';
import { useCreateBed } from '@/features/beds/api/create-bed';

const numberOrNull = (v: unknown) => (typeof v === 'string' && v.trim() === '' ? null : Number(v));
const CONTROL = 'min-h-11 w-full rounded-md border border-line bg-paper-raised px-3 py-2';

export function BedForm({ gardenId }: { gardenId: number }) {
  const create = useCreateBed(gardenId);
  const { register, handleSubmit, formState, setError, reset } = useForm<z.input<typeof bedCreateSchema>, unknown, BedCreateInput>({
    resolver: zodResolver(bedCreateSchema),
    defaultValues: { name: '', kind: 'bed', lengthM: null, widthM: null, notes: '' },
  });
  const e = formState.errors;
  const onSubmit = handleSubmit((values) =>
    create.mutateAsync(values).then(
      () => reset(),
      (error: unknown) => applyServerFieldErrors(error, setError, ['name', 'kind', 'lengthM', 'widthM', 'notes']),
    ),
  );
  return (
    <form onSubmit={onSubmit} noValidate aria-label="New bed" className="grid gap-3 rounded-lg border border-line bg-paper-raised p-4 sm:grid-cols-2">
      <TextField label="Name" error={e.name?.message} {...register('name')} />
      <div className="flex flex-col gap-1">
        <label htmlFor="bed-kind" className="font-semibold">Kind</label>
        <select id="bed-kind" className={CONTROL} {...register('kind')}>
          {BED_KINDS.map((k) => (
            <option key={k} value={k}>{BED_KIND_WORDS[k]}</option>
          ))}
        </select>
        {e.kind?.message && <FieldError>{e.kind.message}</FieldError>}
      </div>
      <TextField label="Length" unit="m" inputMode="decimal" error={e.lengthM?.message} {...register('lengthM', { setValueAs: numberOrNull })} />
      <TextField label="Width" unit="m" inputMode="decimal" error={e.widthM?.message} {...register('widthM', { setValueAs: numberOrNull })} />
      <TextField label="Notes" className="sm:col-span-2" error={e.notes?.message} {...register('notes')} />
      {create.isError && !Object.keys(e).length && <div className="sm:col-span-2"><Notice tone="error" live="alert">{create.error.message}</Notice></div>}
      <div>
        <Button type="submit" disabled={formState.isSubmitting}>Add bed</Button>
      </div>
    </form>
  );
}
