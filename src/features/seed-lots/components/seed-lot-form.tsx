import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { QUANTITY_UNITS, seedLotCreateSchema } from '#shared/schemas/seed-lots';
import type { SeedLotCreateInput } from '#shared/schemas/seed-lots';
import { applyServerFieldErrors } from '@/lib/form-errors';
import { Button } from '@/components/ui/button';
import { FieldError, TextField } from '@/components/ui/text-field';
import { useCreateSeedLot } from '@/features/seed-lots/api/create-seed-lot';

const CONTROL = 'min-h-11 w-full rounded-md border border-line bg-paper-raised px-3 py-2';
const numberOrNull = (v: unknown) => (v === '' || v === undefined || v === null ? null : Number(v));

export function SeedLotForm({ gardenId, varieties, onSaved }: { gardenId: number; varieties: { id: number; label: string }[]; onSaved: () => void }) {
  const create = useCreateSeedLot(gardenId);
  const { register, handleSubmit, formState, setError } = useForm<z.input<typeof seedLotCreateSchema>, unknown, SeedLotCreateInput>({
    resolver: zodResolver(seedLotCreateSchema),
    defaultValues: { supplier: '', lotNumber: '', packedForYear: null, quantity: null, quantityUnit: 'seeds', storageNotes: '' },
  });
  const e = formState.errors;
  const onSubmit = handleSubmit((values) =>
    create.mutateAsync(values).then(onSaved, (error: unknown) => applyServerFieldErrors(error, setError, ['varietyId', 'supplier', 'lotNumber', 'packedForYear', 'quantity', 'storageNotes'])),
  );
  return (
    <form onSubmit={onSubmit} noValidate aria-label="New seed lot" className="grid gap-3 rounded-lg border border-line bg-paper-raised p-4 sm:grid-cols-2">
      <div className="flex flex-col gap-1">
        <label htmlFor="lot-variety" className="font-semibold">Variety</label>
        <select id="lot-variety" className={CONTROL} defaultValue="" {...register('varietyId', { setValueAs: (v) => (v === '' ? undefined : Number(v)) })}>
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
      <div>
        <Button type="submit" disabled={formState.isSubmitting}>Save seed lot</Button>
      </div>
    </form>
  );
}
