import { Loading } from '@/components/ui/loading';
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
        Values marked “from memory” or low confidence are starting points: your own records will tell you more.
      </p>
      {crops.isPending && <Loading label="Loading the crop library…" />}
      {crops.isError && <Notice tone="error">{crops.error.message}</Notice>}
      {crops.data && <CropLibrary crops={crops.data} units={garden.units} />}
    </div>
  );
}
