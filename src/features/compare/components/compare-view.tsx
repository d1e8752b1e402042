import { useMemo, useState } from 'react';
import { countOf } from '#shared/format/count-words';
import type { CompareDto, ComparePlantingDto } from '#shared/schemas/compare';
import { lazyPart } from '@/lib/lazy-part';
import { degreeDayUnit, formatDegreeDays, formatFullDate, formatPercent } from '@/lib/format';
import { MarkIcon, seasonMark } from './season-marks';
import { chartPoints } from './chart-points';

// Recharts is large: it loads with this component, in its own chunk, only when a comparison is shown.
const CompareChart = lazyPart(() => import('@/features/compare/components/compare-chart').then((m) => m.CompareChart), {
  loading: 'Drawing the chart…',
  failed: 'The chart could not be loaded',
});

const days = (n: number) => (n === 1 ? '1 day' : `${n} days`);

function Ranking({ dto }: { dto: CompareDto }) {
  const ddUnit = degreeDayUnit(dto.unit);
  return (
    <section aria-labelledby="compare-ranking">
      <h2 id="compare-ranking" className="text-lg font-semibold">{dto.heatThreshold === null ? 'Varieties' : 'Heat tolerance, most tolerant first'}</h2>
      <ol className="mt-2 space-y-3">
        {dto.varieties.map((v) => (
          <li key={v.varietyId} className="rounded border border-line bg-paper-raised p-3">
            <p className="font-semibold">{v.rank === null ? `${v.name} (not ranked)` : `${v.rank}. ${v.name}`}</p>
            <p>{v.evidence}</p>
            {v.boltedBeforeHarvestShare !== null && (
              <p>
                {`Bolted before harvest: ${formatPercent(v.boltedBeforeHarvestShare * 100)} of ${v.withOutcome === 1 ? '1 planting' : `${v.withOutcome} plantings`} with a bolt or harvest on record.`}
                {v.medians.daysToHarvest !== null && ` Median to first harvest: ${days(v.medians.daysToHarvest)}${v.medians.ddToHarvest !== null ? `, ${formatDegreeDays(v.medians.ddToHarvest, dto.unit)}` : ''}.`}
              </p>
            )}
            {v.caution && <p className="mt-1 font-semibold text-clay">{v.caution}</p>}
          </li>
        ))}
      </ol>
      <p className="mt-2 text-sm text-loam-soft">{dto.method}</p>
      <p className="sr-only">{`Degree days are in ${ddUnit}.`}</p>
    </section>
  );
}

function Legend({ dto }: { dto: CompareDto }) {
  return (
    <ul className="mt-2 flex flex-wrap gap-x-4 gap-y-1" aria-label="Seasons on the chart">
      {dto.seasons.map((s, k) => {
        const mark = seasonMark(k);
        return (
          <li key={s.year} className="flex items-center gap-2">
            <MarkIcon mark={mark} />
            {`${s.label}: ${mark.shapeWords}`}
          </li>
        );
      })}
    </ul>
  );
}

type SortKey = 'variety' | 'season' | 'startOn' | 'daysToHarvest' | 'ddToHarvest' | 'daysToBolt' | 'ddToBolt' | 'heatDays' | 'longestHotStreak' | 'dayLengthAtBolt' | 'boltedBeforeHarvest';
type Row = ComparePlantingDto & { variety: string };

function sortValue(row: Row, key: SortKey): string | number | null {
  if (key === 'variety') return row.variety;
  if (key === 'boltedBeforeHarvest') return row.boltedBeforeHarvest === null ? null : row.boltedBeforeHarvest ? 1 : 0;
  return row[key];
}

/** Rows without a figure go last either way. */
function compareRows(a: Row, b: Row, key: SortKey, dir: 1 | -1): number {
  const x = sortValue(a, key);
  const y = sortValue(b, key);
  if (x === null || y === null) return x === y ? a.plantingId - b.plantingId : x === null ? 1 : -1;
  const c = typeof x === 'string' && typeof y === 'string' ? x.localeCompare(y) : Number(x) - Number(y);
  return c * dir || a.plantingId - b.plantingId;
}

function PlantingsTable({ dto }: { dto: CompareDto }) {
  const [sort, setSort] = useState<{ key: SortKey; dir: 1 | -1 }>({ key: 'heatDays', dir: -1 });
  const names = useMemo(() => new Map(dto.varieties.map((v) => [v.varietyId, v.name])), [dto]);
  const rows = useMemo(
    () => dto.plantings.map((p) => ({ ...p, variety: names.get(p.varietyId) ?? '' })).sort((a, b) => compareRows(a, b, sort.key, sort.dir)),
    [dto, names, sort],
  );
  const ddUnit = degreeDayUnit(dto.unit);
  const heatHead = dto.heatThreshold === null ? 'Heat days' : `Heat days (high above ${dto.heatThreshold} °${dto.unit})`;
  const columns: ReadonlyArray<{ key: SortKey; label: string }> = [
    { key: 'variety', label: 'Variety' },
    { key: 'season', label: 'Season' },
    { key: 'startOn', label: 'Started' },
    { key: 'daysToHarvest', label: 'Days to first harvest' },
    { key: 'ddToHarvest', label: `To first harvest (${ddUnit})` },
    { key: 'daysToBolt', label: 'Days to bolting' },
    { key: 'ddToBolt', label: `To bolting (${ddUnit})` },
    { key: 'heatDays', label: heatHead },
    { key: 'longestHotStreak', label: 'Longest hot run (days)' },
    { key: 'dayLengthAtBolt', label: 'Day length at bolting (hours)' },
    { key: 'boltedBeforeHarvest', label: 'Bolted before harvest' },
  ];
  const choose = (key: SortKey) => setSort((s) => (s.key === key ? { key, dir: s.dir === 1 ? -1 : 1 } : { key, dir: key === 'variety' || key === 'season' || key === 'startOn' ? 1 : -1 }));
  const dd = (x: number | null) => (x === null ? '—' : formatDegreeDays(x, dto.unit, 1));
  const days = (x: number | null) => (x === null ? '—' : countOf(x, 'day'));
  return (
    <div className="overflow-x-auto">
      <table className="w-full min-w-[56rem] border-collapse text-left text-sm">
        <caption className="sr-only">Every planting compared; the column buttons sort the table.</caption>
        <thead>
          <tr>
            {columns.map((c) => (
              <th key={c.key} scope="col" aria-sort={sort.key === c.key ? (sort.dir === 1 ? 'ascending' : 'descending') : 'none'} className="border-b border-line p-1 align-bottom">
                <button type="button" className="min-h-11 text-left font-semibold underline-offset-2 hover:underline" onClick={() => choose(c.key)}>
                  {c.label}
                  {sort.key === c.key && <span aria-hidden="true">{sort.dir === 1 ? ' ▲' : ' ▼'}</span>}
                </button>
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {rows.map((p) => (
            <tr key={p.plantingId} className="border-b border-line">
              <th scope="row" className="p-1 font-normal">{p.variety}</th>
              <td className="p-1">{p.seasonLabel ?? '—'}</td>
              <td className="p-1">{p.startOn ? formatFullDate(p.startOn) : '—'}</td>
              <td className="p-1">{days(p.daysToHarvest)}</td>
              <td className="p-1">{dd(p.ddToHarvest)}</td>
              <td className="p-1">{days(p.daysToBolt)}</td>
              <td className="p-1">{dd(p.ddToBolt)}</td>
              <td className="p-1">{p.heatDays === null ? '—' : `${p.heatDays} before ${p.heatUntil === 'bolt' ? 'bolting' : 'harvest'}`}</td>
              <td className="p-1">{days(p.longestHotStreak)}</td>
              <td className="p-1">{p.dayLengthAtBolt === null ? '—' : `${p.dayLengthAtBolt} h`}</td>
              <td className="p-1">{p.boltedBeforeHarvest === null ? '—' : p.boltedBeforeHarvest ? 'Yes' : 'No'}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

export function CompareView({ dto, csvHref }: { dto: CompareDto; csvHref: string }) {
  if (!dto.plantings.length) return <p>{`No ${dto.crop.name.toLowerCase()} plantings are on record in these seasons yet.`}</p>;
  return (
    <div className="space-y-5">
      <Ranking dto={dto} />
      {dto.heatThreshold !== null && (
        <section aria-labelledby="compare-chart">
          <h2 id="compare-chart" className="text-lg font-semibold">Each planting: heat days and degree days</h2>
          {dto.seasons.some((s) => chartPoints(dto, s.year).length > 0) ? (
            <>
              <CompareChart dto={dto} />
              <Legend dto={dto} />
            </>
          ) : (
            <p className="mt-2">No planting has both its heat days and its degree days to bolting or harvest yet, so there is nothing to draw.</p>
          )}
        </section>
      )}
      <section aria-labelledby="compare-table" className="space-y-2">
        <h2 id="compare-table" className="text-lg font-semibold">All plantings</h2>
        <PlantingsTable dto={dto} />
        <a href={csvHref} download className="inline-flex min-h-11 items-center font-semibold text-frost underline">
          Download CSV
        </a>
      </section>
    </div>
  );
}
