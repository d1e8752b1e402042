import type { WeatherResponse } from '#shared/schemas/weather';
import { ChartLegend } from '@/components/ui/chart-legend';
import type { LegendItem } from '@/components/ui/chart-legend';
import { formatFullRange, formatTemp } from '@/lib/format';
import { lazyPart } from '@/lib/lazy-part';
import { numberThresholds } from '@/features/weather/utils/chart-series';
import { formatCount } from '@/features/weather/utils/format-weather';

// Recharts is large: it loads with this component, in its own chunk, only when a chart is shown.
const WeatherChart = lazyPart(() => import('@/features/weather/components/weather-chart').then((m) => m.WeatherChart), {
  loading: 'Drawing the chart…',
  failed: 'The chart could not be loaded',
});

const LEGEND: LegendItem[] = [
  { swatch: <line x1="0" y1="6" x2="28" y2="6" className="stroke-ember" strokeWidth="3" />, words: 'Daily high' },
  { swatch: <line x1="0" y1="6" x2="28" y2="6" className="stroke-frost" strokeWidth="3" />, words: 'Daily low' },
  { swatch: <line x1="0" y1="6" x2="28" y2="6" className="stroke-loam" strokeWidth="2.5" />, words: 'Solid: measured' },
  { swatch: <line x1="0" y1="6" x2="28" y2="6" className="stroke-loam" strokeWidth="2.5" strokeDasharray="6 5" />, words: 'Dashed: forecast' },
  { swatch: <circle cx="14" cy="6" r="4" className="fill-paper-raised stroke-loam" strokeWidth="2" />, words: 'Ring: estimated (filled)' },
  { swatch: <rect x="10.5" y="2.5" width="7" height="7" className="fill-loam" />, words: 'Square: your station' },
  { swatch: <rect x="6" y="0" width="16" height="12" className="fill-clay-tint" />, words: 'Shaded: missing days' },
  { swatch: <line x1="14" y1="0" x2="14" y2="12" className="stroke-loam" strokeWidth="2" />, words: 'Vertical line: today' },
];

// The threshold lines' colours (weather-chart.tsx THRESHOLD_COLOURS), here as classes so the list needs no Recharts chunk.
const THRESHOLD_TEXT: Record<WeatherResponse['thresholds'][number]['kind'], string> = { base: 'text-leaf', upper: 'text-ember', 'bolt-heat': 'text-clay' };
const THRESHOLD_STROKE: Record<WeatherResponse['thresholds'][number]['kind'], string> = { base: 'stroke-leaf', upper: 'stroke-ember', 'bolt-heat': 'stroke-clay' };

function GapList({ gaps }: { gaps: WeatherResponse['gaps'] }) {
  if (!gaps.length) return <p className="text-sm text-loam-soft">No missing days in this period.</p>;
  return (
    <div className="text-sm">
      <p className="font-semibold">Missing days (no reading, shown as breaks in the lines):</p>
      <ul className="list-disc pl-5">
        {gaps.map((gap) => (
          <li key={gap.from}>
            {formatFullRange(gap.from, gap.to)} ({formatCount(gap.days, 'day', 'days')})
          </li>
        ))}
      </ul>
      <p className="mt-1 text-loam-soft">
        Gaps of one or two days are estimated from the days either side and marked “estimated (filled)”. Longer gaps
        stay empty: the next refresh may bring them, or upload your own station’s readings.
      </p>
    </div>
  );
}

function ThresholdList({ weather }: { weather: WeatherResponse }) {
  if (!weather.thresholds.length) {
    return (
      <p className="text-sm text-loam-soft">
        Crop thresholds (base temperature, upper threshold, bolting heat) are drawn across the chart once plantings
        are in the ground.
      </p>
    );
  }
  return (
    <div className="text-sm">
      <p className="font-semibold">Dotted lines across the chart: thresholds of crops in the ground, numbered at the right-hand end</p>
      <ul>
        {numberThresholds(weather.thresholds).map((t) => (
          <li key={`${t.kind}-${t.label}`} className="flex items-baseline gap-1.5">
            <span className={`inline-block w-5 shrink-0 font-bold tabular-nums ${THRESHOLD_TEXT[t.kind]}`}>{t.key}</span>
            <svg width="20" height="8" viewBox="0 0 20 8" aria-hidden="true" className="shrink-0">
              <line x1="0" y1="4" x2="20" y2="4" className={THRESHOLD_STROKE[t.kind]} strokeWidth="2" strokeDasharray="1 4" />
            </svg>
            <span>
              {t.label}: {formatTemp(t.value, weather.unit)}
            </span>
          </li>
        ))}
      </ul>
    </div>
  );
}

export function WeatherChartPanel({ weather }: { weather: WeatherResponse }) {
  return (
    <figure aria-labelledby="weather-chart-caption" className="flex flex-col gap-3 rounded-lg border border-line bg-paper-raised p-3 sm:p-5">
      <figcaption id="weather-chart-caption" className="font-bold">
        Daily highs and lows in °{weather.unit}, {formatFullRange(weather.from, weather.to)}
        <span className="sr-only">. The same days are listed in the table below.</span>
      </figcaption>
      <div className="min-h-64 w-full min-w-0">
        <WeatherChart weather={weather} />
      </div>
      <ChartLegend items={LEGEND} className="grid grid-cols-2 gap-x-4 gap-y-1.5 text-sm sm:flex sm:flex-wrap sm:gap-x-5" />
      <GapList gaps={weather.gaps} />
      <ThresholdList weather={weather} />
    </figure>
  );
}
