import { useMemo, useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import { Loading } from '@/components/ui/loading';
import { LoadProblem } from '@/components/ui/load-problem';
import { useCurrentGarden } from '@/app/routes/gardens/garden-layout';
import { useVarieties } from '@/features/varieties/api/get-varieties';
import { compareCsvHref, useCompare } from '@/features/compare/api/get-compare';
import { CompareView } from '@/features/compare/components/compare-view';

export function ComparePage() {
  const garden = useCurrentGarden();
  const varieties = useVarieties(garden.id);
  // The crops with records: those the garden has varieties of.
  const crops = useMemo(() => {
    const seen = new Map<string, { key: string; name: string; varieties: number }>();
    for (const v of varieties.data?.items ?? []) {
      const c = seen.get(v.crop.key) ?? { key: v.crop.key, name: v.crop.name, varieties: 0 };
      c.varieties++;
      seen.set(v.crop.key, c);
    }
    return [...seen.values()].sort((a, b) => a.name.localeCompare(b.name));
  }, [varieties.data]);
  // The crop in the address (?crop=), else the one with the most varieties to compare.
  const [params, setParams] = useSearchParams();
  const asked = params.get('crop');
  const [seasons, setSeasons] = useState<number[] | null>(null);
  const most = crops.reduce<(typeof crops)[number] | undefined>((best, c) => (!best || c.varieties > best.varieties ? c : best), undefined);
  const crop = (asked && crops.some((c) => c.key === asked) ? asked : most?.key) ?? null;
  const compare = useCompare(garden.id, crop, seasons);
  const available = compare.data?.availableSeasons ?? [];
  const checked = (year: number) => seasons === null || seasons.includes(year);
  const toggle = (year: number) => {
    const now = seasons ?? available.map((s) => s.year);
    const next = now.includes(year) ? now.filter((y) => y !== year) : [...now, year].sort((a, b) => a - b);
    setSeasons(next.length === available.length ? null : next);
  };
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-semibold">Compare</h1>
      <p>How the varieties of one crop did here: days and degree days to harvest and to bolting, and how much heat each stood before it bolted.</p>
      {varieties.isPending && <Loading label="Loading varieties…" />}
      {varieties.isError && <LoadProblem error={varieties.error} what="the varieties" onRetry={() => varieties.refetch()} retrying={varieties.isFetching} />}
      {varieties.data && !crops.length && <p>Add a variety and record its plantings first: the comparison is made from them.</p>}
      {crops.length > 0 && (
        <div className="flex flex-wrap gap-4">
          <label className="flex flex-col gap-1">
            Crop
            <select
              className="min-h-11 rounded border border-line bg-paper-raised p-2"
              value={crop ?? ''}
              onChange={(e) => {
                setParams({ crop: e.target.value }, { replace: true });
                setSeasons(null);
              }}
            >
              {crops.map((c) => (
                <option key={c.key} value={c.key}>{c.name}</option>
              ))}
            </select>
          </label>
          {available.length > 0 && (
            <fieldset className="flex flex-col gap-1">
              <legend>Seasons</legend>
              <div className="flex flex-wrap gap-x-4">
                {available.map((s) => (
                  <label key={s.year} className="flex min-h-11 items-center gap-2">
                    <input type="checkbox" checked={checked(s.year)} onChange={() => toggle(s.year)} />
                    {s.label}
                  </label>
                ))}
              </div>
            </fieldset>
          )}
        </div>
      )}
      {seasons !== null && seasons.length === 0 && <p>Choose at least one season to compare.</p>}
      {compare.isPending && crop !== null && (seasons === null || seasons.length > 0) && <Loading label="Comparing the varieties…" />}
      {compare.isError && <LoadProblem error={compare.error} what="the comparison" onRetry={() => compare.refetch()} retrying={compare.isFetching} />}
      {compare.data && crop !== null && (seasons === null || seasons.length > 0) && <CompareView dto={compare.data} csvHref={compareCsvHref(garden.id, crop, seasons)} />}
    </div>
  );
}
