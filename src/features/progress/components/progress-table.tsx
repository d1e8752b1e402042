import type { ProgressDto } from '#shared/schemas/progress';
import { BOLT_WORDS, degreeDayUnit, formatDegreeDays, formatTemp, formatWeekdayDayMonth, SOURCE_WORDS } from '@/lib/format';

const CELL = 'px-2 py-1.5 text-left align-top whitespace-nowrap';

interface Row {
  date: string;
  day: ProgressDto['series'][number] | undefined;
  projected: ProgressDto['projection'][number] | undefined;
  bolt: ProgressDto['boltRisk']['days'][number] | undefined;
}

function rowsOf(progress: ProgressDto): Row[] {
  const days = new Map(progress.series.map((d) => [d.date, d]));
  const projected = new Map(progress.projection.map((d) => [d.date, d]));
  const bolt = new Map(progress.boltRisk.days.map((d) => [d.date, d]));
  const dates = [...new Set([...days.keys(), ...projected.keys(), ...bolt.keys()])].sort();
  return dates.map((date) => ({ date, day: days.get(date), projected: projected.get(date), bolt: bolt.get(date) }));
}

/** The chart's text equivalent: every day it draws, with its unit on every figure. */
export function ProgressTable({ progress }: { progress: ProgressDto }) {
  const { unit } = progress;
  const showBolt = progress.boltRisk.level !== 'none';
  return (
    <details className="text-sm">
      <summary className="min-h-11 cursor-pointer py-2 font-semibold">The chart’s figures, day by day</summary>
      <div className="max-h-96 overflow-auto rounded-md border border-line" tabIndex={0} role="region" aria-label="Figures day by day">
        <table className="w-full border-collapse">
          <caption className="sr-only">
            Day by day: temperatures in °{unit}, degree days in {degreeDayUnit(unit)}
          </caption>
          <thead className="sticky top-0 bg-paper-raised">
            <tr className="border-b border-line">
              <th scope="col" className={CELL}>Date</th>
              <th scope="col" className={CELL}>High</th>
              <th scope="col" className={CELL}>Low</th>
              <th scope="col" className={CELL}>That day</th>
              <th scope="col" className={CELL}>Since the start</th>
              <th scope="col" className={CELL}>Projected (middle)</th>
              {showBolt && <th scope="col" className={CELL}>Bolt risk</th>}
              <th scope="col" className={CELL}>Source</th>
            </tr>
          </thead>
          <tbody className="tabular-nums">
            {rowsOf(progress).map(({ date, day, projected, bolt }) => (
              <tr key={date} className="border-b border-line/60" aria-current={date === progress.today ? 'date' : undefined}>
                <th scope="row" className={`${CELL} font-normal`}>
                  {formatWeekdayDayMonth(date)}
                  {date === progress.today && ' (today)'}
                </th>
                <td className={CELL}>{day ? formatTemp(day.tmax, unit) : '—'}</td>
                <td className={CELL}>{day ? formatTemp(day.tmin, unit) : '—'}</td>
                <td className={CELL}>{day ? formatDegreeDays(day.dd, unit, 1) : '—'}</td>
                <td className={CELL}>{day ? formatDegreeDays(day.cumulative, unit) : '—'}</td>
                <td className={CELL}>
                  {projected
                    ? `${formatDegreeDays(projected.p10, unit)} – ${formatDegreeDays(projected.p90, unit)} (${formatDegreeDays(projected.p50, unit)})`
                    : '—'}
                </td>
                {showBolt && <td className={CELL}>{bolt ? `${BOLT_WORDS[bolt.level]}${bolt.forecast ? ' (forecast)' : ''}` : '—'}</td>}
                <td className={CELL}>{day ? SOURCE_WORDS[day.source] : projected ? 'Projection' : '—'}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </details>
  );
}
