import { Loading } from '@/components/ui/loading';
import { LoadProblem } from '@/components/ui/load-problem';
import { Notice } from '@/components/ui/notice';
import { useCurrentGarden } from '@/app/routes/gardens/garden-layout';
import { useCrops } from '@/features/crops/api/get-crops';
import { CropLibrary } from '@/features/crops/components/crop-library';

export function CropsPage() {
  const garden = useCurrentGarden();
  const crops = useCrops(garden.id);
  return (
    <div className="flex flex-col gap-4">
      <title>{`Crop library · ${garden.name} · Heatclock`}</title>
      <h1 className="text-2xl font-bold sm:text-3xl">Crop library</h1>
      <p className="max-w-prose">
        The figures Heatclock counts with, each with where it comes from and how sure that source is. Open a crop to see them all.
        Values that are commonly given rather than checked against a published table, or of low confidence, are starting points: your own records will tell you more.
      </p>
      {crops.isPending && <Loading label="Loading the crop library…" />}
      {crops.isError && <LoadProblem error={crops.error} what="the crop library" onRetry={() => crops.refetch()} retrying={crops.isFetching} />}
      {garden.role === 'owner' ? (
        <Notice tone="info" title="Your garden’s own values">
          As the owner you can set a value for this garden where your own records or local advice differ. The shared default stays
          beside it, and “Use shared default” goes back to it. Changes apply to every planting of the crop in this garden.
        </Notice>
      ) : (
        <Notice tone="info" title="Read only">
          Only the garden’s owner can set this garden’s own values.
        </Notice>
      )}
      {crops.data && <CropLibrary gardenId={garden.id} crops={crops.data} units={garden.units} canEdit={garden.role === 'owner'} />}
    </div>
  );
}
