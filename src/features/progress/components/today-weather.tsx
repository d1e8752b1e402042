import { useEffect, useRef } from 'react';
import { CloudSun, Thermometer } from 'lucide-react';
import type { TodayDto } from '#shared/schemas/progress';
import { formatTemp, formatWeekdayDayMonth, SOURCE_WORDS } from '@/lib/format';

/**
 * The last 7 and next 7 days, one card each; forecast days say so in words, today is marked.
 * Wide screens show the fortnight in two rows; a phone scrolls sideways and opens on yesterday.
 */
export function TodayWeather({ today }: { today: TodayDto }) {
  const strip = useRef<HTMLDivElement>(null);
  useEffect(() => {
    const el = strip.current;
    const current = el?.querySelector<HTMLElement>('[aria-current="date"]');
    const before = current?.previousElementSibling as HTMLElement | null | undefined;
    // Only a strip wider than its box scrolls (a phone); the wide grid shows every day from the first.
    if (el && before && el.scrollWidth > el.clientWidth) el.scrollLeft = before.offsetLeft - el.offsetLeft;
  }, [today]);
  if (!today.weather.length) return <p>No weather for these days yet.</p>;
  return (
    <div ref={strip} className="overflow-x-auto" tabIndex={0} role="region" aria-label="Highs and lows, last 7 and next 7 days">
      <ol className="flex gap-2 pb-2 lg:grid lg:grid-cols-8">
        {today.weather.map((d) => {
          const isToday = d.date === today.today;
          const Icon = d.source === 'forecast' ? CloudSun : Thermometer;
          return (
            <li
              key={d.date}
              aria-current={isToday ? 'date' : undefined}
              className={`flex min-w-[7.5rem] flex-col lg:min-w-0 gap-0.5 rounded-md border p-2 text-sm ${isToday ? 'border-2 border-loam bg-paper-raised' : 'border-line bg-paper-raised'}`}
            >
              <span className="font-semibold">
                {formatWeekdayDayMonth(d.date)}
                {isToday && <span className="block text-xs font-bold uppercase">Today</span>}
              </span>
              <span className="tabular-nums text-ember">
                {`High ${formatTemp(d.tmax, today.unit)}`}
              </span>
              <span className="tabular-nums text-frost">
                {`Low ${formatTemp(d.tmin, today.unit)}`}
              </span>
              <span className="inline-flex items-center gap-1 text-loam-soft">
                <Icon className="size-3.5 shrink-0" aria-hidden="true" />
                {d.source === 'forecast' ? 'forecast' : SOURCE_WORDS[d.source].toLowerCase()}
              </span>
            </li>
          );
        })}
      </ol>
    </div>
  );
}
