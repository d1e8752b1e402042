import { Loading } from '@/components/ui/loading';
import { LoadProblem } from '@/components/ui/load-problem';
import { Notice } from '@/components/ui/notice';
import { unitSystemOf } from '#shared/units/measures';
import { useCurrentGarden } from '@/app/routes/gardens/garden-layout';
import { useBeds } from '@/features/beds/api/get-beds';
import { BedCard } from '@/features/beds/components/bed-card';
import { BedForm } from '@/features/beds/components/bed-form';

export function BedsPage() {
  const garden = useCurrentGarden();
  const canEdit = garden.role !== 'viewer';
  const beds = useBeds(garden.id);
  const system = unitSystemOf(garden.units);
  return (
    <div className="flex flex-col gap-4">
      <title>{`Beds · ${garden.name} · Heatclock`}</title>
      <h1 className="text-2xl font-bold sm:text-3xl">Beds</h1>
      {canEdit ? <BedForm gardenId={garden.id} system={system} /> : <Notice tone="info" title="Read only">Viewers see the beds but cannot change them.</Notice>}
      {beds.isPending && <Loading label="Loading beds…" />}
      {beds.isError && <LoadProblem error={beds.error} what="the beds" onRetry={() => beds.refetch()} retrying={beds.isFetching} />}
      {beds.data && (
        <ul className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
          {beds.data.items.map((b) => (
            <li key={b.id}>
              <BedCard gardenId={garden.id} bed={b} canEdit={canEdit} system={system} />
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
