import { useEffect, useRef } from 'react';
import type { WeatherResponse } from '#shared/schemas/weather';
import { SourceLabel } from '@/features/weather/components/source-label';
import { formatTemp, formatWeekdayDayMonth } from '@/lib/format';

const CELL = 'px-1.5 py-2 text-left align-top sm:px-3';
const HEAD = `${CELL} sticky top-0 z-10 border-b border-line bg-paper-raised`;

export function WeatherTable({ weather }: { weather: WeatherResponse }) {
  const { unit, today } = weather;
  // Soil comes with the recent days and the forecast only; a column of dashes would say nothing.
  const hasSoil = weather.days.some((d) => d.soil !== undefined);
  const box = useRef<HTMLDivElement>(null);

  // Forty-odd days do not fit on a screen; open the box with today a few rows from the top.
  useEffect(() => {
    const container = box.current;
    const row = container?.querySelector('tr[aria-current="date"]');
    if (!container || !row) return;
    const offset = row.getBoundingClientRect().top - container.getBoundingClientRect().top;
    container.scrollTop += offset - 3 * row.getBoundingClientRect().height;
  }, [today]);

  return (
    <section aria-labelledby="weather-table-heading" className="flex flex-col gap-2">
      <div>
        <h2 id="weather-table-heading" className="text-lg font-bold">
          Day by day
        </h2>
        <p className="text-sm text-loam-soft">Opens at today; scroll inside the table for earlier and later days.</p>
      </div>
      <div
        ref={box}
        className="max-h-[30rem] overflow-auto rounded-lg border border-line bg-paper-raised"
        tabIndex={0}
        role="region"
        aria-label={`Day by day, in °${unit} (scrolls)`}
      >
        <table className="w-full border-collapse text-sm sm:text-base">
          <caption className="sr-only">Day by day, in °{unit}</caption>
          <thead>
            <tr>
              <th scope="col" className={HEAD}>Date</th>
              <th scope="col" className={`${HEAD} text-right`}>High</th>
              <th scope="col" className={`${HEAD} text-right`}>Low</th>
              {hasSoil && <th scope="col" className={`${HEAD} text-right`}>Soil</th>}
              <th scope="col" className={HEAD}>Source</th>
              <th scope="col" className={`${HEAD} hidden sm:table-cell`}>Note</th>
            </tr>
          </thead>
          <tbody>
            {weather.days.map((day) => {
              const isToday = day.date === today;
              return (
                <tr
                  key={day.date}
                  aria-current={isToday ? 'date' : undefined}
                  className="border-b border-line/60 last:border-b-0 aria-[current=date]:bg-paper-sunk aria-[current=date]:font-semibold"
                >
                  <th scope="row" className={`${CELL} whitespace-nowrap ${isToday ? 'font-semibold' : 'font-normal'}`}>
                    <time dateTime={day.date}>{formatWeekdayDayMonth(day.date)}</time>
                    {isToday && (
                      <span className="mt-1 block w-fit rounded-sm bg-loam px-1.5 py-0.5 text-xs text-paper-raised sm:mt-0 sm:ml-2 sm:inline">
                        Today
                      </span>
                    )}
                  </th>
                  <td className={`${CELL} text-right whitespace-nowrap tabular-nums`}>{formatTemp(day.tmax, unit)}</td>
                  <td className={`${CELL} text-right whitespace-nowrap tabular-nums`}>{formatTemp(day.tmin, unit)}</td>
                  {hasSoil && (
                    <td className={`${CELL} text-right whitespace-nowrap tabular-nums`}>
                      {day.soil === undefined ? '—' : formatTemp(day.soil, unit)}
                      {day.soilSource === 'reading' && <span className="block text-xs font-normal text-loam-soft">your reading</span>}
                    </td>
                  )}
                  <td className={CELL}>
                    <SourceLabel source={day.source} />
                    {/* On a phone the note sits under its source instead of in a column off to the side. */}
                    {day.note && <p className="mt-0.5 text-xs font-normal text-loam-soft sm:hidden">{day.note}</p>}
                  </td>
                  <td className={`${CELL} hidden text-loam-soft sm:table-cell ${day.note ? 'min-w-56' : ''}`}>{day.note ?? ''}</td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
    </section>
  );
}
