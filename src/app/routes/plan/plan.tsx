import { useState } from 'react';
import type { FrostRisk } from '#shared/schemas/plan';
import { Loading } from '@/components/ui/loading';
import { LoadProblem } from '@/components/ui/load-problem';
import { useCurrentGarden } from '@/app/routes/gardens/garden-layout';
import { useVarieties } from '@/features/varieties/api/get-varieties';
import { usePlan } from '@/features/plan/api/get-plan';
import { PlanView } from '@/features/plan/components/plan-view';

const RISKS: ReadonlyArray<{ value: FrostRisk; words: string }> = [
  { value: '10', words: 'Careful: a frost later than the dates in about 1 year in 10' },
  { value: '50', words: 'Even chance: a later frost in about 1 year in 2' },
  { value: '90', words: 'Daring: a later frost in about 9 years in 10' },
];

export function PlanPage() {
  const garden = useCurrentGarden();
  const varieties = useVarieties(garden.id);
  const [chosen, setChosen] = useState<number | null>(null);
  const [risk, setRisk] = useState<FrostRisk>('50');
  const varietyId = chosen ?? varieties.data?.items[0]?.id ?? null;
  const plan = usePlan(garden.id, varietyId, risk);
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-semibold">Plan</h1>
      {varieties.isPending && <Loading label="Loading varieties…" />}
      {varieties.isError && <LoadProblem error={varieties.error} what="the varieties" onRetry={() => varieties.refetch()} retrying={varieties.isFetching} />}
      {varieties.data && !varieties.data.items.length && <p>Add a variety first: the plan is made for one variety.</p>}
      {varieties.data && varieties.data.items.length > 0 && (
        <div className="flex flex-wrap gap-4">
          <label className="flex flex-col gap-1">
            Variety
            <select className="rounded border border-line bg-paper-raised p-2" value={varietyId ?? ''} onChange={(e) => setChosen(Number(e.target.value))}>
              {varieties.data.items.map((v) => (
                <option key={v.id} value={v.id}>{v.name}</option>
              ))}
            </select>
          </label>
          <fieldset className="flex flex-col gap-1">
            <legend>Frost risk you accept</legend>
            {RISKS.map((r) => (
              <label key={r.value} className="flex items-center gap-2">
                <input type="radio" name="frost-risk" value={r.value} checked={risk === r.value} onChange={() => setRisk(r.value)} />
                {r.words}
              </label>
            ))}
          </fieldset>
        </div>
      )}
      {plan.isPending && varietyId !== null && <Loading label="Making the plan…" />}
      {plan.isError && <LoadProblem error={plan.error} what="the plan" onRetry={() => plan.refetch()} retrying={plan.isFetching} />}
      {plan.data && <PlanView plan={plan.data} />}
    </div>
  );
}
