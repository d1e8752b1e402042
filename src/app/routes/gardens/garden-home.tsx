import { GardenOverview } from '@/features/gardens/components/garden-overview';
import { useCurrentGarden } from '@/app/routes/gardens/garden-layout';

export function GardenHomePage() {
  const garden = useCurrentGarden();
  return (
    <>
      <title>{`${garden.name} · Heatclock`}</title>
      <GardenOverview garden={garden} />
    </>
  );
}
