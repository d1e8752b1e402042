import { useMemo } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { BED_KINDS, BED_KIND_WORDS, bedCreateSchema } from '#shared/schemas/beds';
import type { BedCreateInput, BedDto } from '#shared/schemas/beds';
import { nullableNumber } from '#shared/schemas/records';
import { M_PER_FOOT, measureSymbol, toShown, toStored } from '#shared/units/measures';
import type { UnitSystem } from '#shared/units/measures';
import { ApiError } from '@/lib/api-client';
import { applyServerFieldErrors } from '@/lib/form-errors';
import { mutationProblem } from '@/lib/problems';
import { changedValues } from '@/lib/changed-values';
import { useSubmissionKey } from '@/lib/use-submission-key';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { FieldError, TextField } from '@/components/ui/text-field';
import { useCreateBed } from '@/features/beds/api/create-bed';
import { useUpdateBed } from '@/features/beds/api/update-bed';

// react-hook-form also passes the default value (null) through here: still "not set", not 0.
const numberOrNull = (v: unknown) => (v == null || (typeof v === 'string' && v.trim() === '') ? null : Number(v));
const CONTROL = 'min-h-11 w-full rounded-md border border-line bg-paper-raised px-3 py-2';
const FIELDS = ['name', 'kind', 'length', 'width', 'notes'] as const;

// The server's bounds on a side (shared/schemas/beds.ts), in metres.
const SIDE_MIN_M = 0.1;
const SIDE_MAX_M = 1000;

/**
 * The bed form's fields: length and width typed in the garden's unit (ft or m), checked against
 * the server's bounds in that unit ("at least 0.4 ft"), so nobody typing feet reads metres.
 */
function bedFormSchema(system: UnitSystem) {
  // Rounded inwards to a tenth of a foot, so every value the form accepts the server accepts too.
  const inShown = (m: number, round: (x: number) => number) => (system === 'us' ? round((m / M_PER_FOOT) * 10) / 10 : m);
  const side = (what: string) => nullableNumber(what, inShown(SIDE_MIN_M, Math.ceil), inShown(SIDE_MAX_M, Math.floor), ` ${measureSymbol('bed', system)}`).optional();
  return bedCreateSchema.omit({ lengthM: true, widthM: true }).extend({ length: side('Length'), width: side('Width') });
}
type BedFormSchema = ReturnType<typeof bedFormSchema>;
type BedFormValues = z.output<BedFormSchema>;

const shownSide = (m: number | null | undefined, system: UnitSystem) => (m == null ? null : toShown('bed', m, system));
const storedSide = (shown: number | null | undefined, system: UnitSystem) => (shown == null ? shown : toStored('bed', shown, system));

/** The form's values as the API takes them: sides back in metres, under the API's names. */
function toInput<T extends Partial<BedFormValues>>({ length, width, ...rest }: T, system: UnitSystem): Omit<T, 'length' | 'width'> & Pick<BedCreateInput, 'lengthM' | 'widthM'> {
  return {
    ...rest,
    ...(length !== undefined && { lengthM: storedSide(length, system) }),
    ...(width !== undefined && { widthM: storedSide(width, system) }),
  };
}

const SERVER_FIELDS: Record<string, string> = { lengthM: 'length', widthM: 'width' };

/** A server refusal with its field messages moved from the API's names to this form's. */
function underFormFields(error: unknown): unknown {
  if (!(error instanceof ApiError)) return error;
  const fields = Object.fromEntries(Object.entries(error.fields).map(([name, message]) => [SERVER_FIELDS[name] ?? name, message]));
  return new ApiError({ status: error.status, code: error.code, message: error.message, fields, requestId: error.requestId, details: error.details });
}

/**
 * Adds a bed, or with `bed` edits that one and sends only the fields that changed. Sides are
 * typed in the garden's unit (`system`) and stored in metres.
 */
export function BedForm({ gardenId, bed, system, onDone }: { gardenId: number; bed?: BedDto; system: UnitSystem; onDone?: () => void }) {
  const create = useCreateBed(gardenId);
  const update = useUpdateBed(gardenId, bed?.id ?? 0);
  const mutation = bed ? update : create;
  const submission = useSubmissionKey();
  const add = (input: BedCreateInput) => create.mutateAsync({ ...input, idempotencyKey: submission.keyFor(input) });
  const schema = useMemo(() => bedFormSchema(system), [system]);
  const { register, handleSubmit, formState, setError, reset } = useForm<z.input<BedFormSchema>, unknown, BedFormValues>({
    resolver: zodResolver(schema),
    defaultValues: bed
      ? { name: bed.name, kind: bed.kind, length: shownSide(bed.lengthM, system), width: shownSide(bed.widthM, system), notes: bed.notes }
      : { name: '', kind: 'bed', length: null, width: null, notes: '' },
  });
  const symbol = measureSymbol('bed', system);
  const e = formState.errors;
  // Read while rendering: react-hook-form only tracks the parts of formState that are read.
  const dirtyFields = formState.dirtyFields;
  const onSubmit = handleSubmit((values) => {
    const changes = changedValues(values, dirtyFields);
    // Nothing changed: close without asking the server to rewrite the same values.
    if (bed && !Object.keys(changes).length) return onDone?.();
    const saving = bed ? update.mutateAsync(toInput(changes, system)) : add(toInput(values, system));
    return saving.then(
      () => {
        submission.renew();
        return bed ? onDone?.() : reset();
      },
      (error: unknown) => applyServerFieldErrors(underFormFields(error), setError, FIELDS),
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
      <TextField label={`Length (${symbol})`} inputMode="decimal" error={e.length?.message} {...register('length', { setValueAs: numberOrNull })} />
      <TextField label={`Width (${symbol})`} inputMode="decimal" error={e.width?.message} {...register('width', { setValueAs: numberOrNull })} />
      <TextField label="Notes" className="sm:col-span-2" error={e.notes?.message} {...register('notes')} />
      {mutation.isError && !Object.keys(e).length && <div className="sm:col-span-2"><Notice tone="error" live="alert">{mutationProblem(mutation.error)}</Notice></div>}
      <div className="flex flex-wrap gap-2">
        <Button type="submit" disabled={formState.isSubmitting}>{bed ? 'Save changes' : 'Add bed'}</Button>
        {bed && <Button variant="quiet" onClick={onDone}>Cancel</Button>}
      </div>
    </form>
  );
}
