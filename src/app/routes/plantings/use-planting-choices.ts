import type { SeedLotDto } from '#shared/schemas/seed-lots';
import { useBeds } from '@/features/beds/api/get-beds';
import { useVarieties } from '@/features/varieties/api/get-varieties';
import { useSeedLots } from '@/features/seed-lots/api/get-seed-lots';
import type { PlantingChoices } from '@/features/plantings/components/planting-form';
import { useSoil } from '@/features/soil/api/get-soil';
import { soilNowWords } from '@/features/soil/components/soil-panel';
import { todayIn } from '@/lib/garden-day';
import { useCurrentGarden } from '@/app/routes/gardens/garden-layout';

const lotLabel = (l: SeedLotDto) =>
  [l.lotNumber && `Lot ${l.lotNumber}`, l.packedForYear && `packed for ${l.packedForYear}`].filter(Boolean).join(', ') || 'Unlabelled lot';

/** The garden's beds, varieties and seed lots as the planting form offers them; composed here because features do not import each other. */
export type PlantingChoicesState =
  | { status: 'pending' }
  /** The first failure of the three; `retry` asks again for each that failed. */
  | { status: 'error'; error: unknown; retry: () => void; retrying: boolean }
  | { status: 'success'; choices: PlantingChoices };

export function usePlantingChoices(gardenId: number): PlantingChoicesState {
  const beds = useBeds(gardenId);
  const varieties = useVarieties(gardenId);
  const lots = useSeedLots(gardenId);
  // Soil advice is a help, not a need: the form opens without it when it cannot load.
  const garden = useCurrentGarden();
  const soil = useSoil(gardenId);
  const failed = [beds, varieties, lots].filter((q) => q.isError);
  if (failed.length) {
    return {
      status: 'error',
      error: failed[0].error,
      retry: () => failed.forEach((q) => void q.refetch()),
      retrying: failed.some((q) => q.isFetching),
    };
  }
  if (!beds.data || !varieties.data || !lots.data) return { status: 'pending' };
  return {
    status: 'success',
    choices: {
      beds: beds.data.items,
      varieties: varieties.data.items.map((v) => ({ id: v.id, name: v.name, cropName: v.crop.name, cropKey: v.crop.key })),
      seedLots: lots.data.items.map((l) => ({ id: l.id, varietyId: l.variety.id, label: lotLabel(l) })),
      soil: soil.data?.current
        ? {
            now: `Soil ${soilNowWords(soil.data.current, soil.data.unit, todayIn(garden.timeZone))}`,
            byCrop: Object.fromEntries(soil.data.crops.map((c) => [c.key, `${c.name}: ${c.words}`])),
          }
        : null,
    },
  };
}
