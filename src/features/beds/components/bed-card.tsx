import { useState } from 'react';
import { Link } from 'react-router-dom';
import { Box, Fence, LayoutGrid, Pencil, Rows3, Square } from 'lucide-react';
import { BED_KIND_WORDS } from '#shared/schemas/beds';
import type { BedDto, BedKind } from '#shared/schemas/beds';
import { Button } from '@/components/ui/button';
import { ConfirmDelete } from '@/components/ui/confirm-delete';
import { useDeleteBed } from '@/features/beds/api/delete-bed';
import { BedForm } from '@/features/beds/components/bed-form';
import { countOf } from '#shared/format/count-words';
import { formatMeasure, measureSymbol, toShown } from '#shared/units/measures';
import type { UnitSystem } from '#shared/units/measures';

const ICON: Record<BedKind, typeof Box> = { bed: Square, 'raised-bed': LayoutGrid, plot: Fence, row: Rows3, container: Box };
const figure = new Intl.NumberFormat('en', { maximumFractionDigits: 2 });

/** "10 × 4 ft", "3.05 × 1.22 m", or "10 ft × —" while one side is unknown: stored metres in the garden's unit. */
function formatSize(lengthM: number | null, widthM: number | null, system: UnitSystem): string {
  if (lengthM !== null && widthM !== null) {
    return `${figure.format(toShown('bed', lengthM, system))} × ${figure.format(toShown('bed', widthM, system))} ${measureSymbol('bed', system)}`;
  }
  const side = (m: number | null) => (m === null ? '—' : formatMeasure('bed', m, system));
  return `${side(lengthM)} × ${side(widthM)}`;
}

/** A bed in the garden's units (`system`), with a way to its plantings. */
export function BedCard({ gardenId, bed: b, canEdit, system }: { gardenId: number; bed: BedDto; canEdit: boolean; system: UnitSystem }) {
  const [editing, setEditing] = useState(false);
  const remove = useDeleteBed(gardenId, b.id);
  if (editing) return <BedForm gardenId={gardenId} bed={b} system={system} onDone={() => setEditing(false)} />;
  const Icon = ICON[b.kind];
  return (
    <article className="flex h-full flex-col gap-1 rounded-lg border border-line bg-paper-raised p-4">
      <h2 className="flex items-center gap-2 text-lg font-bold">
        <Icon className="size-5" aria-hidden="true" /> {b.name}
      </h2>
      <p className="text-sm text-loam-soft">{BED_KIND_WORDS[b.kind]}</p>
      <p>
        {formatSize(b.lengthM, b.widthM, system)}
        {b.areaM2 !== null && ` · ${formatMeasure('area', b.areaM2, system)}`}
      </p>
      <p>
        {b.activePlantings} growing or planned now · {b.plantingsOnRecord} on record in all
      </p>
      <Link to={`/g/${gardenId}/plantings?bed=${b.id}`} className="inline-flex min-h-11 items-center self-start font-semibold underline">
        Plantings in {b.name}
      </Link>
      {b.notes && <p className="text-sm">{b.notes}</p>}
      {canEdit && (
        <div className="mt-auto flex flex-wrap gap-2 pt-2">
          <Button variant="quiet" aria-label={`Edit bed ${b.name}`} onClick={() => setEditing(true)}>
            <Pencil className="size-5" aria-hidden="true" /> Edit
          </Button>
          {b.plantingsOnRecord === 0 ? (
            <ConfirmDelete
              label={`Delete bed ${b.name}`}
              question={`Delete the bed “${b.name}”?`}
              consequence="Its name, size and notes are removed for good."
              confirmLabel="Delete bed"
              onConfirm={() => remove.mutate()}
              pending={remove.isPending}
              error={remove.error}
            />
          ) : (
            <p className="self-center text-sm text-loam-soft">
              Can’t be deleted: {countOf(b.plantingsOnRecord, 'planting on record grew', 'plantings on record grew')} here, and their history keeps the bed.
            </p>
          )}
        </div>
      )}
    </article>
  );
}
