import { useState } from 'react';
import { useNavigate, useSearchParams } from 'react-router-dom';
import { useQuery } from '@tanstack/react-query';
import { Download, FileUp, Plus, X } from 'lucide-react';
import { CROP_LIBRARY } from '#shared/crops/library';
import { PLANTING_STATUSES, STATUS_WORDS } from '#shared/schemas/plantings';
import type { PlantingListQuery, PlantingStatus } from '#shared/schemas/plantings';
import { Button } from '@/components/ui/button';
import { Loading } from '@/components/ui/loading';
import { LoadProblem } from '@/components/ui/load-problem';
import { Notice } from '@/components/ui/notice';
import { useCurrentGarden } from '@/app/routes/gardens/garden-layout';
import { usePlantings } from '@/features/plantings/api/get-plantings';
import { bedsQueryOptions, useBeds } from '@/features/beds/api/get-beds';
import { parseId } from '@/lib/ids';
import { useVarieties } from '@/features/varieties/api/get-varieties';
import { PlantingForm } from '@/features/plantings/components/planting-form';
import { PlantingImportForm } from '@/features/plantings/components/planting-import-form';
import { PlantingsTable } from '@/features/plantings/components/plantings-table';
import type { SortState } from '@/features/plantings/components/plantings-table';
import { CONTROL } from '@/features/plantings/components/field-styles';
import { todayIn } from '@/lib/garden-day';
import { usePlantingChoices } from '@/app/routes/plantings/use-planting-choices';
import { countOf } from '#shared/format/count-words';

const PAGE_SIZE = 25;

function NewPlanting({ gardenId, today, onClose }: { gardenId: number; today: string; onClose: () => void }) {
  const navigate = useNavigate();
  const loaded = usePlantingChoices(gardenId);
  if (loaded.status === 'pending') return <Loading label="Loading beds and varieties…" />;
  if (loaded.status === 'error') return <LoadProblem error={loaded.error} what="the beds, varieties and seed lots" onRetry={loaded.retry} retrying={loaded.retrying} />;
  return (
    <section aria-labelledby="new-planting" className="rounded-lg border border-line bg-paper-raised p-4">
      <div className="mb-3 flex items-center justify-between">
        <h2 id="new-planting" className="text-lg font-bold">
          New planting
        </h2>
        <Button variant="quiet" onClick={onClose}>
          <X className="size-5" aria-hidden="true" /> Close
        </Button>
      </div>
      <PlantingForm
        gardenId={gardenId}
        today={today}
        choices={loaded.choices}
        onSaved={(p) => navigate(`/g/${gardenId}/plantings/${p.id}`)}
        onCancel={onClose}
      />
    </section>
  );
}

// Invented names for a garden that has no beds or varieties yet.
const STAND_IN = { bed: 'North 1', crop: 'lettuce', variety: 'Copperleaf Butterhead' };

/** The example file names one of this garden's own beds and varieties, so it imports as it is. */
function ImportPlantings({ gardenId, today, onClose }: { gardenId: number; today: string; onClose: () => void }) {
  const beds = useBeds(gardenId);
  const varieties = useVarieties(gardenId);
  const bed = beds.data?.items[0];
  const variety = varieties.data?.items[0];
  const example = bed && variety ? { bed: bed.name, crop: variety.crop.key, variety: variety.name } : STAND_IN;
  return <PlantingImportForm gardenId={gardenId} example={example} year={today.slice(0, 4)} onClose={onClose} />;
}

/** The name of the bed the list is narrowed to (`?bed=<id>`, as each bed's card links); the beds are asked for only then. */
function useBedFilter(gardenId: number) {
  const [params, setParams] = useSearchParams();
  const bedId = parseId(params.get('bed') ?? undefined);
  const beds = useQuery({ ...bedsQueryOptions(gardenId), enabled: bedId !== null });
  const name = beds.data?.items.find((b) => b.id === bedId)?.name;
  const clear = () => setParams((p) => { p.delete('bed'); return p; });
  return { bedId, name, clear };
}

export function PlantingsPage() {
  const garden = useCurrentGarden();
  const bed = useBedFilter(garden.id);
  const canEdit = garden.role !== 'viewer';
  const today = todayIn(garden.timeZone);
  const [adding, setAdding] = useState(false);
  const [importing, setImporting] = useState(false);
  const [status, setStatus] = useState<PlantingStatus | ''>('');
  const [crop, setCrop] = useState('');
  const [q, setQ] = useState('');
  const [sort, setSort] = useState<SortState>({ sort: 'sown', order: 'desc' });
  const [page, setPage] = useState(1);
  const query: PlantingListQuery = { bedId: bed.bedId ?? undefined, status: status || undefined, crop: crop || undefined, q: q || undefined, ...sort, page, pageSize: PAGE_SIZE };
  const plantings = usePlantings(garden.id, query);
  const pages = plantings.data ? Math.max(1, Math.ceil(plantings.data.total / PAGE_SIZE)) : 1;
  const heading = bed.bedId === null ? 'Plantings' : `Plantings in ${bed.name ?? 'this bed'}`;

  return (
    <div className="flex flex-col gap-4">
      <title>{`${heading} · ${garden.name} · Heatclock`}</title>
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h1 className="text-2xl font-bold sm:text-3xl">{heading}</h1>
        <div className="flex flex-wrap gap-2">
          <a href={`/api/gardens/${garden.id}/plantings/export.csv`} className="inline-flex min-h-11 items-center gap-2 rounded-md border border-line bg-paper-raised px-4 font-semibold" download>
            <Download className="size-5" aria-hidden="true" /> Export CSV
          </a>
          {canEdit && !importing && (
            <Button variant="quiet" onClick={() => setImporting(true)}>
              <FileUp className="size-5" aria-hidden="true" /> Import CSV
            </Button>
          )}
          {canEdit && !adding && (
            <Button onClick={() => setAdding(true)}>
              <Plus className="size-5" aria-hidden="true" /> New planting
            </Button>
          )}
        </div>
      </div>
      {!canEdit && (
        <Notice tone="info" title="Read only">
          Viewers see every planting but cannot change them.
        </Notice>
      )}
      {bed.bedId !== null && (
        <Button variant="quiet" className="self-start" onClick={() => { bed.clear(); setPage(1); }}>
          <X className="size-5" aria-hidden="true" /> Show plantings in every bed
        </Button>
      )}
      {importing && <ImportPlantings gardenId={garden.id} today={today} onClose={() => setImporting(false)} />}
      {adding && <NewPlanting gardenId={garden.id} today={today} onClose={() => setAdding(false)} />}
      <form role="search" className="grid gap-3 sm:grid-cols-3" onSubmit={(e) => e.preventDefault()}>
        <label className="flex flex-col gap-1">
          <span className="font-semibold">Status</span>
          <select className={CONTROL} value={status} onChange={(e) => { setStatus(e.target.value as PlantingStatus | ''); setPage(1); }}>
            <option value="">All statuses</option>
            {PLANTING_STATUSES.map((s) => (
              <option key={s} value={s}>{STATUS_WORDS[s]}</option>
            ))}
          </select>
        </label>
        <label className="flex flex-col gap-1">
          <span className="font-semibold">Crop</span>
          <select className={CONTROL} value={crop} onChange={(e) => { setCrop(e.target.value); setPage(1); }}>
            <option value="">All crops</option>
            {CROP_LIBRARY.map((c) => (
              <option key={c.key} value={c.key}>{c.name}</option>
            ))}
          </select>
        </label>
        <label className="flex flex-col gap-1">
          <span className="font-semibold">Search</span>
          <input type="search" className={CONTROL} value={q} placeholder="Variety, bed or note" onChange={(e) => { setQ(e.target.value); setPage(1); }} />
        </label>
      </form>
      {plantings.isPending && <Loading label="Loading plantings…" />}
      {plantings.isError && <LoadProblem error={plantings.error} what="the plantings" onRetry={() => plantings.refetch()} retrying={plantings.isFetching} />}
      {plantings.data && (
        <>
          <p className="text-sm text-loam-soft" role="status">
            {countOf(plantings.data.total, 'planting')}
            {pages > 1 && ` · page ${page} of ${pages}`}
          </p>
          {plantings.data.items.length ? (
            <PlantingsTable gardenId={garden.id} plantings={plantings.data.items} sort={sort} onSort={(s) => { setSort(s); setPage(1); }} />
          ) : (
            <p>No plantings match.</p>
          )}
          {pages > 1 && (
            <nav aria-label="Pages" className="flex gap-2">
              <Button variant="quiet" disabled={page <= 1} disabledReason="This is the first page." onClick={() => setPage(page - 1)}>Previous</Button>
              <Button variant="quiet" disabled={page >= pages} disabledReason="This is the last page." onClick={() => setPage(page + 1)}>Next</Button>
            </nav>
          )}
        </>
      )}
    </div>
  );
}
