import { useState } from 'react';
import { Plus } from 'lucide-react';
import { Button } from '@/components/ui/button';
import { Loading } from '@/components/ui/loading';
import { LoadProblem } from '@/components/ui/load-problem';
import { Notice } from '@/components/ui/notice';
import { useCurrentGarden } from '@/app/routes/gardens/garden-layout';
import { todayIn } from '@/lib/garden-day';
import { useSeedLots } from '@/features/seed-lots/api/get-seed-lots';
import { useVarieties } from '@/features/varieties/api/get-varieties';
import { SeedLotCard } from '@/features/seed-lots/components/seed-lot-card';
import { SeedLotForm } from '@/features/seed-lots/components/seed-lot-form';

export function SeedLotsPage() {
  const garden = useCurrentGarden();
  const canEdit = garden.role !== 'viewer';
  const [adding, setAdding] = useState(false);
  const lots = useSeedLots(garden.id);
  const varieties = useVarieties(garden.id);
  const choices = varieties.data?.items.map((v) => ({ id: v.id, label: `${v.crop.name}: ${v.name}` })) ?? [];
  return (
    <div className="flex flex-col gap-4">
      <title>{`Seed lots · ${garden.name} · Heatclock`}</title>
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h1 className="text-2xl font-bold sm:text-3xl">Seed lots</h1>
        {canEdit && !adding && (
          <Button onClick={() => setAdding(true)}>
            <Plus className="size-5" aria-hidden="true" /> New seed lot
          </Button>
        )}
      </div>
      {!canEdit && <Notice tone="info" title="Read only">Viewers see the seed lots but cannot change them.</Notice>}
      {adding && varieties.isPending && <Loading label="Loading varieties…" />}
      {adding && varieties.isError && <LoadProblem error={varieties.error} what="the varieties" onRetry={() => varieties.refetch()} retrying={varieties.isFetching} />}
      {adding && varieties.data && <SeedLotForm gardenId={garden.id} varieties={choices} onSaved={() => setAdding(false)} onCancel={() => setAdding(false)} />}
      <p className="max-w-prose text-sm text-loam-soft">
        Seed life is the typical number of years seed keeps under good storage (cool, dry, dark). A germination test tells you more than age: count how many of 10–20 seeds sprout on a damp towel.
      </p>
      {lots.isPending && <Loading label="Loading seed lots…" />}
      {lots.isError && <LoadProblem error={lots.error} what="the seed lots" onRetry={() => lots.refetch()} retrying={lots.isFetching} />}
      {lots.data && (
        <div className="grid gap-3 md:grid-cols-2">
          {lots.data.items.map((lot) => <SeedLotCard key={lot.id} gardenId={garden.id} lot={lot} canEdit={canEdit} today={todayIn(garden.timeZone)} varieties={choices} />)}
        </div>
      )}
    </div>
  );
}
