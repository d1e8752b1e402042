import { useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import type { FrostRisk } from '#shared/schemas/plan';
import { Loading } from '@/components/ui/loading';
import { LoadProblem } from '@/components/ui/load-problem';
import { useCurrentGarden } from '@/app/routes/gardens/garden-layout';
import { useVarieties } from '@/features/varieties/api/get-varieties';
import { usePlan } from '@/features/plan/api/get-plan';
import { PlanView } from '@/features/plan/components/plan-view';
import { SoilPanel } from '@/features/soil/components/soil-panel';
import { todayIn } from '@/lib/garden-day';

const RISKS: ReadonlyArray<{ value: FrostRisk; words: string }> = [
  { value: '10', words: 'Careful: a frost later than the dates in about 1 year in 10' },
  { value: '50', words: 'Even chance: a later frost in about 1 year in 2' },
  { value: '90', words: 'Daring: a later frost in about 9 years in 10' },
];

export function PlanPage() {
  const garden = useCurrentGarden();
  const varieties = useVarieties(garden.id);
  // The varieties live in the address (?variety=…&with=…), so a plan can be linked and reloaded.
  const [params, setParams] = useSearchParams();
  const [risk, setRisk] = useState<FrostRisk>('50');
  const items = varieties.data?.items ?? [];
  const known = (raw: string | null) => (raw && items.some((v) => String(v.id) === raw) ? Number(raw) : null);
  const varietyId = known(params.get('variety')) ?? items[0]?.id ?? null;
  const otherId = known(params.get('with'));
  const secondId = otherId !== null && otherId !== varietyId ? otherId : null;
  const plan = usePlan(garden.id, varietyId, risk);
  const second = usePlan(garden.id, secondId, risk);
  const choose = (key: 'variety' | 'with', value: string) => {
    const next = new URLSearchParams(params);
    if (value) next.set(key, value);
    else next.delete(key);
    setParams(next, { replace: true });
  };
  const select = 'min-h-11 rounded border border-line bg-paper-raised p-2';
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-semibold">Plan</h1>
      {varieties.isPending && <Loading label="Loading varieties…" />}
      {varieties.isError && <LoadProblem error={varieties.error} what="the varieties" onRetry={() => varieties.refetch()} retrying={varieties.isFetching} />}
      {varieties.data && !items.length && <p>Add a variety first: the plan is made for one variety.</p>}
      {items.length > 0 && (
        <div className="flex flex-wrap gap-4">
          <label className="flex flex-col gap-1">
            Variety
            <select className={select} value={varietyId ?? ''} onChange={(e) => choose('variety', e.target.value)}>
              {items.map((v) => (
                <option key={v.id} value={v.id}>{`${v.name} (${v.crop.name})`}</option>
              ))}
            </select>
          </label>
          <label className="flex flex-col gap-1">
            Side by side with
            <select className={select} value={secondId ?? ''} onChange={(e) => choose('with', e.target.value)}>
              <option value="">No second variety</option>
              {items
                .filter((v) => v.id !== varietyId)
                .map((v) => (
                  <option key={v.id} value={v.id}>{`${v.name} (${v.crop.name})`}</option>
                ))}
            </select>
          </label>
          <fieldset className="flex flex-col gap-1">
            <legend>Frost risk you accept</legend>
            {RISKS.map((r) => (
              <label key={r.value} className="flex min-h-11 items-center gap-2">
                <input type="radio" name="frost-risk" value={r.value} checked={risk === r.value} onChange={() => setRisk(r.value)} />
                {r.words}
              </label>
            ))}
          </fieldset>
        </div>
      )}
      <div className={secondId !== null ? 'grid gap-8 lg:grid-cols-2' : undefined}>
        <PlanPart plan={plan} shown={varietyId !== null} />
        {secondId !== null && <PlanPart plan={second} shown />}
      </div>
      <section aria-labelledby="soil-heading" className="space-y-3 border-t border-line pt-4">
        <h2 id="soil-heading" className="text-xl font-semibold">
          Soil temperature and sowing now
        </h2>
        <SoilPanel
          gardenId={garden.id}
          today={todayIn(garden.timeZone)}
          canEdit={garden.role !== 'viewer'}
          highlight={items.filter((v) => v.id === varietyId || v.id === secondId).map((v) => v.crop.key)}
        />
      </section>
    </div>
  );
}

function PlanPart({ plan, shown }: { plan: ReturnType<typeof usePlan>; shown: boolean }) {
  if (!shown) return null;
  if (plan.isPending) return <Loading label="Making the plan…" />;
  if (plan.isError) return <LoadProblem error={plan.error} what="the plan" onRetry={() => plan.refetch()} retrying={plan.isFetching} />;
  return <PlanView plan={plan.data} />;
}
