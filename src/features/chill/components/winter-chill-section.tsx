import type { GardenChill } from '#shared/schemas/chill';
import type { DisplayUnit } from '#shared/schemas/gardens';
import { countOf } from '#shared/format/count-words';
import { cToF } from '#shared/thermal/units';
import { formatDayMonth, formatTemp } from '@/lib/format';
import { LoadProblem } from '@/components/ui/load-problem';
import { Loading } from '@/components/ui/loading';
import { useChill } from '@/features/chill/api/get-chill';

const hoursOf = (n: number) => `${Math.round(n).toLocaleString()} h`;

function ChillFigures({ chill, unit }: { chill: GardenChill; unit: DisplayUnit }) {
  // 7.2 °C is Weinberger's 45 °F; formatTemp takes the figure in the display unit.
  const threshold = formatTemp(unit === 'F' ? Math.round(cToF(7.2)) : 7.2, unit);
  return (
    <>
      <dl className="grid gap-3 sm:grid-cols-2">
        <div className="rounded border border-line p-3">
          <dt className="text-sm text-loam-soft">Chill hours at or below {threshold}</dt>
          <dd className="text-2xl font-bold">{hoursOf(chill.hoursAtOrBelow7C)}</dd>
        </div>
        <div className="rounded border border-line p-3">
          <dt className="text-sm text-loam-soft">Utah chill units (warm hours count against)</dt>
          <dd className="text-2xl font-bold">{Math.round(chill.utahUnits).toLocaleString()} units</dd>
        </div>
      </dl>
      {chill.seasonEnded && (
        <p className="font-semibold">
          Last winter’s totals: the chill season ran until {formatDayMonth(chill.until)}; counting starts again on {formatDayMonth(chill.since)}.
        </p>
      )}
      <p className="text-sm text-loam-soft">
        Counted from {formatDayMonth(chill.since)}
        {chill.through ? ` through ${formatDayMonth(chill.through)}` : ''} over {countOf(chill.daysCounted, 'day')}, estimated hour by hour from each day’s high and
        low.{chill.daysMissing > 0 ? ` ${countOf(chill.daysMissing, 'day')} without weather are left out, so the real figure is higher.` : ''}
      </p>
      <div className="overflow-x-auto">
        <table className="w-full text-left text-sm">
          <caption className="sr-only">Chill needed by fruit, against this garden’s chill hours so far</caption>
          <thead>
            <tr className="border-b border-line">
              <th scope="col" className="py-2 pr-3">Fruit</th>
              <th scope="col" className="py-2 pr-3">Chill hours needed</th>
              <th scope="col" className="py-2">So far</th>
            </tr>
          </thead>
          <tbody>
            {chill.fruit.map((f) => (
              <tr key={f.key} className="border-b border-line last:border-b-0">
                <th scope="row" className="py-2 pr-3 font-semibold">{f.name}</th>
                <td className="py-2 pr-3 whitespace-nowrap">
                  {f.chillHours.min.toLocaleString()}–{f.chillHours.max.toLocaleString()} h
                </td>
                <td className="py-2">
                  <span className={f.status === 'short' ? '' : 'font-semibold'}>{f.words}</span>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <p className="text-sm text-loam-soft">
        The ranges are typical spreads across varieties, not checked against a published source. A variety’s own need depends on the variety and its rootstock: use the figure
        from your nursery.
      </p>
    </>
  );
}

/** Winter chill so far this season, for growers with fruit trees or bushes. */
export function WinterChillSection({ gardenId, unit }: { gardenId: number; unit: DisplayUnit }) {
  const chill = useChill(gardenId);
  return (
    <section aria-labelledby="chill-heading" className="flex flex-col gap-4 rounded-lg border border-line bg-paper-raised p-4 sm:p-6">
      <h2 id="chill-heading" className="text-xl font-bold">
        Winter chill for fruit
      </h2>
      <p className="text-loam-soft">Fruit trees and bushes need enough cold hours in winter to leaf out and flower evenly in spring.</p>
      {chill.isPending && <Loading label="Counting this winter’s chill…" />}
      {chill.isError && <LoadProblem error={chill.error} what="this winter’s chill" onRetry={() => chill.refetch()} retrying={chill.isFetching} compact />}
      {chill.data && <ChillFigures chill={chill.data} unit={unit} />}
    </section>
  );
}
