import { Box, Fence, LayoutGrid, Rows3, Square } from 'lucide-react';
import { BED_KIND_WORDS } from '#shared/schemas/beds';
import type { BedKind } from '#shared/schemas/beds';
import { Loading } from '@/components/ui/loading';
import { Notice } from '@/components/ui/notice';
import { useCurrentGarden } from '@/app/routes/gardens/garden-layout';
import { useBeds } from '@/features/beds/api/get-beds';
import { BedForm } from '@/features/beds/components/bed-form';

const ICON: Record<BedKind, typeof Box> = { bed: Square, 'raised-bed': LayoutGrid, plot: Fence, row: Rows3, container: Box };
const size = (n: number | null) => (n === null ? '—' : `${n} m`);

export function BedsPage() {
  const garden = useCurrentGarden();
  const beds = useBeds(garden.id);
  return (
    <div className="flex flex-col gap-4">
      <title>{`Beds · ${garden.name} · Heatclock`}</title>
      <h1 className="text-2xl font-bold sm:text-3xl">Beds</h1>
      {garden.role !== 'viewer' ? <BedForm gardenId={garden.id} /> : <Notice tone="info" title="Read only">Viewers see the beds but cannot change them.</Notice>}
      {beds.isPending && <Loading label="Loading beds…" />}
      {beds.isError && <Notice tone="error">{beds.error.message}</Notice>}
      {beds.data && (
        <ul className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
          {beds.data.items.map((b) => {
            const Icon = ICON[b.kind];
            return (
              <li key={b.id} className="rounded-lg border border-line bg-paper-raised p-4">
                <p className="flex items-center gap-2 text-lg font-bold">
                  <Icon className="size-5" aria-hidden="true" /> {b.name}
                </p>
                <p className="text-sm text-loam-soft">{BED_KIND_WORDS[b.kind]}</p>
                <p className="mt-1">
                  {size(b.lengthM)} × {size(b.widthM)}
                  {b.areaM2 !== null && ` · ${b.areaM2} m²`}
                </p>
                <p>{b.activePlantings} planted or planned</p>
                {b.notes && <p className="mt-1 text-sm">{b.notes}</p>}
              </li>
            );
          })}
        </ul>
      )}
    </div>
  );
}
