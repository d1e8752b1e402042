import { useState } from 'react';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { ArrowLeft, Pencil } from 'lucide-react';
import type { PlantingDto } from '#shared/schemas/plantings';
import { unitSystemOf } from '#shared/units/measures';
import { isApiError } from '@/lib/api-client';
import { parseId } from '@/lib/ids';
import { Button } from '@/components/ui/button';
import { ConfirmDelete } from '@/components/ui/confirm-delete';
import { Loading } from '@/components/ui/loading';
import { LoadProblem } from '@/components/ui/load-problem';
import { NotFoundMessage } from '@/components/ui/not-found-message';
import { useCurrentGarden } from '@/app/routes/gardens/garden-layout';
import { usePlantingChoices } from '@/app/routes/plantings/use-planting-choices';
import { usePlanting } from '@/features/plantings/api/get-planting';
import { usePhotos } from '@/features/plantings/api/get-photos';
import { useDeletePlanting } from '@/features/plantings/api/delete-planting';
import { PlantingFacts } from '@/features/plantings/components/planting-facts';
import { PlantingForm } from '@/features/plantings/components/planting-form';
import { PlantingLog } from '@/features/plantings/components/planting-log';
import { PlantingPhotos } from '@/features/plantings/components/planting-photos';
import { QuickLog } from '@/features/plantings/components/quick-log';
import { todayIn } from '@/lib/garden-day';
import { PlantingProgress } from '@/features/progress/components/planting-progress';

const count = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

/** "a", "a and b", "a, b and c". */
const inWords = (items: string[]) => (items.length < 2 ? items.join('') : `${items.slice(0, -1).join(', ')} and ${items.at(-1)}`);

function EditPlanting({ planting, today, onDone }: { planting: PlantingDto; today: string; onDone: () => void }) {
  const garden = useCurrentGarden();
  const loaded = usePlantingChoices(garden.id);
  if (loaded.status === 'pending') return <Loading label="Loading beds and varieties…" />;
  if (loaded.status === 'error') return <LoadProblem error={loaded.error} what="the beds, varieties and seed lots" onRetry={loaded.retry} retrying={loaded.retrying} />;
  return (
    <section aria-labelledby="edit-planting" className="rounded-lg border border-line bg-paper-raised p-4">
      <h2 id="edit-planting" className="mb-3 text-lg font-bold">
        Edit planting
      </h2>
      <PlantingForm gardenId={garden.id} choices={loaded.choices} today={today} planting={planting} onSaved={onDone} onCancel={onDone} />
    </section>
  );
}

// Its own component holding no queries, so the mutation's progress re-renders nothing that
// would fetch the planting again once it is gone.
function DeletePlanting({ planting: p, photoCount }: { planting: PlantingDto; photoCount: number }) {
  const garden = useCurrentGarden();
  const navigate = useNavigate();
  const remove = useDeletePlanting(garden.id, p.id);
  const lost = [
    'Its dates and notes',
    ...(p.logCount ? [count(p.logCount, 'log entry', 'log entries')] : []),
    ...(photoCount ? [count(photoCount, 'photo', 'photos')] : []),
  ];
  return (
    <ConfirmDelete
      label={`Delete planting ${p.crop.name}: ${p.variety.name}`}
      question={`Delete this planting of ${p.variety.name} in ${p.bed.name}?`}
      consequence={`${inWords(lost)} are deleted with it, for good. To keep its record but show it ended, set its status to Failed or Harvested instead.`}
      confirmLabel="Delete planting"
      onConfirm={() => remove.mutate(undefined, { onSuccess: () => void navigate(`/g/${garden.id}/plantings`, { replace: true }) })}
      pending={remove.isPending}
      error={remove.error}
    />
  );
}

function Detail({ plantingId }: { plantingId: number }) {
  const garden = useCurrentGarden();
  const planting = usePlanting(garden.id, plantingId);
  const photos = usePhotos(garden.id, plantingId);
  const [editing, setEditing] = useState(false);
  const canEdit = garden.role !== 'viewer';
  if (planting.isPending) return <Loading label="Loading the planting…" />;
  if (planting.isError) {
    if (isApiError(planting.error, 404)) return <NotFoundMessage />;
    return <LoadProblem error={planting.error} what="the planting" onRetry={() => planting.refetch()} retrying={planting.isFetching} />;
  }
  const p = planting.data;
  const today = todayIn(garden.timeZone);
  return (
    <div className="flex flex-col gap-5">
      <title>{`${p.crop.name}: ${p.variety.name} · ${garden.name} · Heatclock`}</title>
      <Link to={`/g/${garden.id}/plantings`} className="inline-flex min-h-11 items-center gap-1 self-start underline">
        <ArrowLeft className="size-4" aria-hidden="true" /> All plantings
      </Link>
      <h1 className="text-2xl font-bold sm:text-3xl">
        {p.crop.name}: {p.variety.name}
      </h1>
      {canEdit && !editing && (
        <div className="flex flex-wrap gap-2">
          <Button variant="quiet" onClick={() => setEditing(true)}>
            <Pencil className="size-5" aria-hidden="true" /> Edit planting
          </Button>
          <DeletePlanting planting={p} photoCount={photos.data?.length ?? 0} />
        </div>
      )}
      {editing && <EditPlanting planting={p} today={today} onDone={() => setEditing(false)} />}
      <section aria-labelledby="progress" className="flex min-w-0 flex-col gap-2">
        <h2 id="progress" className="text-lg font-bold">Progress</h2>
        <PlantingProgress gardenId={garden.id} plantingId={p.id} />
      </section>
      <div className="grid gap-5 lg:grid-cols-2">
        <div className="flex flex-col gap-5">
          {canEdit && <QuickLog key={p.id} gardenId={garden.id} planting={p} today={today} units={garden.units} />}
          <section aria-labelledby="facts" className="flex flex-col gap-2">
            <h2 id="facts" className="text-lg font-bold">Facts</h2>
            <PlantingFacts planting={p} />
          </section>
        </div>
        <div className="flex flex-col gap-5">
          <section aria-labelledby="log" className="flex flex-col gap-2">
            <h2 id="log" className="text-lg font-bold">Log ({count(p.logCount, 'entry', 'entries')})</h2>
            <PlantingLog gardenId={garden.id} plantingId={p.id} canEdit={canEdit} system={unitSystemOf(garden.units)} />
          </section>
          <section aria-labelledby="photos" className="flex flex-col gap-2">
            <h2 id="photos" className="text-lg font-bold">Photos</h2>
            <PlantingPhotos gardenId={garden.id} plantingId={p.id} plantingName={`${p.variety.name} in ${p.bed.name}`} canEdit={canEdit} today={today} />
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
