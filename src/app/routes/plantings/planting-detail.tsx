import { Link, useParams } from 'react-router-dom';
import { ArrowLeft } from 'lucide-react';
import { isApiError } from '@/lib/api-client';
import { parseId } from '@/lib/ids';
import { Loading } from '@/components/ui/loading';
import { Notice } from '@/components/ui/notice';
import { NotFoundMessage } from '@/components/ui/not-found-message';
import { useCurrentGarden } from '@/app/routes/gardens/garden-layout';
import { usePlanting } from '@/features/plantings/api/get-planting';
import { PlantingFacts } from '@/features/plantings/components/planting-facts';
import { PlantingLog } from '@/features/plantings/components/planting-log';
import { PlantingPhotos } from '@/features/plantings/components/planting-photos';
import { QuickLog } from '@/features/plantings/components/quick-log';
import { todayIn } from '@/features/plantings/components/today';

function Detail({ plantingId }: { plantingId: number }) {
  const garden = useCurrentGarden();
  const planting = usePlanting(garden.id, plantingId);
  const canEdit = garden.role !== 'viewer';
  if (planting.isPending) return <Loading label="Loading the planting…" />;
  if (planting.isError) {
    if (isApiError(planting.error, 404)) return <NotFoundMessage />;
    return <Notice tone="error" live="alert">{planting.error.message}</Notice>;
  }
  const p = planting.data;
  return (
    <div className="flex flex-col gap-5">
      <title>{`${p.crop.name}: ${p.variety.name} · ${garden.name} · Heatclock`}</title>
      <Link to={`/g/${garden.id}/plantings`} className="inline-flex min-h-11 items-center gap-1 self-start underline">
        <ArrowLeft className="size-4" aria-hidden="true" /> All plantings
      </Link>
      <h1 className="text-2xl font-bold sm:text-3xl">
        {p.crop.name}: {p.variety.name}
      </h1>
      <div className="grid gap-5 lg:grid-cols-2">
        <div className="flex flex-col gap-5">
          {canEdit && <QuickLog gardenId={garden.id} plantingId={p.id} today={todayIn(garden.timeZone)} />}
          <section aria-labelledby="facts" className="flex flex-col gap-2">
            <h2 id="facts" className="text-lg font-bold">Facts</h2>
            <PlantingFacts planting={p} />
          </section>
        </div>
        <div className="flex flex-col gap-5">
          <section aria-labelledby="log" className="flex flex-col gap-2">
            <h2 id="log" className="text-lg font-bold">Log ({p.logCount} {p.logCount === 1 ? 'entry' : 'entries'})</h2>
            <PlantingLog gardenId={garden.id} plantingId={p.id} />
          </section>
          <section aria-labelledby="photos" className="flex flex-col gap-2">
            <h2 id="photos" className="text-lg font-bold">Photos</h2>
            <PlantingPhotos gardenId={garden.id} plantingId={p.id} canEdit={canEdit} />
          </section>
        </div>
      </div>
    </div>
  );
}

export function PlantingDetailPage() {
  const id = parseId(useParams().plantingId);
  return id === null ? <NotFoundMessage /> : <Detail plantingId={id} />;
}
