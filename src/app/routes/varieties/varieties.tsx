import { useState } from 'react';
import { Plus } from 'lucide-react';
import { CROP_LIBRARY } from '#shared/crops/library';
import { Button } from '@/components/ui/button';
import { Loading } from '@/components/ui/loading';
import { Notice } from '@/components/ui/notice';
import { LoadProblem } from '@/components/ui/load-problem';
import { useCurrentGarden } from '@/app/routes/gardens/garden-layout';
import { useVarieties } from '@/features/varieties/api/get-varieties';
import { VarietyCard } from '@/features/varieties/components/variety-card';
import { VarietyForm } from '@/features/varieties/components/variety-form';
import { TraitLegend } from '@/features/varieties/components/trait-legend';

export function VarietiesPage() {
  const garden = useCurrentGarden();
  const [crop, setCrop] = useState('');
  const [adding, setAdding] = useState(false);
  const varieties = useVarieties(garden.id, { crop: crop || undefined, pageSize: 200 });
  return (
    <div className="flex flex-col gap-4">
      <title>{`Varieties · ${garden.name} · Heatclock`}</title>
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h1 className="text-2xl font-bold sm:text-3xl">Varieties</h1>
        {garden.role !== 'viewer' && !adding && (
          <Button onClick={() => setAdding(true)}>
            <Plus className="size-5" aria-hidden="true" /> New variety
          </Button>
        )}
      </div>
      {garden.role === 'viewer' && <Notice tone="info" title="Read only">Viewers see the varieties but cannot change them.</Notice>}
      {adding && <VarietyForm gardenId={garden.id} units={garden.units} onSaved={() => setAdding(false)} onCancel={() => setAdding(false)} />}
      <label className="flex max-w-xs flex-col gap-1">
        <span className="font-semibold">Crop</span>
        <select className="min-h-11 rounded-md border border-line bg-paper-raised px-3" value={crop} onChange={(e) => setCrop(e.target.value)}>
          <option value="">All crops</option>
          {CROP_LIBRARY.map((c) => <option key={c.key} value={c.key}>{c.name}</option>)}
        </select>
      </label>
      {varieties.isPending && <Loading label="Loading varieties…" />}
      {varieties.isError && <LoadProblem error={varieties.error} what="the varieties" onRetry={() => varieties.refetch()} retrying={varieties.isFetching} />}
      {varieties.data && (
        varieties.data.items.length ? (
          <>
            <TraitLegend varieties={varieties.data.items} />
            <div className="grid items-start gap-3 md:grid-cols-2">
              {varieties.data.items.map((v) => <VarietyCard key={v.id} gardenId={garden.id} variety={v} units={garden.units} canEdit={garden.role !== 'viewer'} />)}
            </div>
          </>
        ) : <p>No varieties yet.</p>
      )}
    </div>
  );
}
