/**
 * The Recharts drawing of a garden's highs and lows. Loaded lazily (see weather-chart-panel) so
 * Recharts stays in its own chunk and only pages with a chart pay for it.
 */
import { CartesianGrid, ComposedChart, Line, ReferenceArea, ReferenceLine, Tooltip, usePlotArea, useYAxisScale, XAxis, YAxis } from 'recharts';
import type { DotItemDotProps } from 'recharts';
import type { WeatherResponse, WeatherThresholdDto } from '#shared/schemas/weather';
import { fromDayNumber, toDayNumber } from '#shared/thermal/dates';
import { dayTicks, spreadLabels, temperatureDomain, weekStepFor } from '@/lib/chart-axes';
import { formatTemp, SOURCE_WORDS } from '@/lib/format';
import { useWideChart } from '@/lib/use-wide-chart';
import { buildChartPoints, numberThresholds } from '@/features/weather/utils/chart-series';
import type { ChartPoint } from '@/features/weather/utils/chart-series';
import { formatDayMonth, formatWeekdayDayMonth } from '@/lib/format';

export const CHART_COLOURS = {
  high: 'var(--color-ember)',
  low: 'var(--color-frost)',
  today: 'var(--color-loam)',
  gap: 'var(--color-clay-tint)',
  grid: 'var(--color-line)',
  text: 'var(--color-loam-soft)',
} as const;

export const THRESHOLD_COLOURS: Record<WeatherThresholdDto['kind'], string> = {
  base: 'var(--color-leaf)',
  upper: 'var(--color-ember)',
  'bolt-heat': 'var(--color-clay)',
};

/** Filled days get a hollow ring and station days a small square, on top of the line's colour. */
function SourceDot({ cx, cy, stroke, payload }: DotItemDotProps) {
  const point = payload as ChartPoint;
  if (cx == null || cy == null) return null;
  if (point.source === 'filled') {
    return <circle cx={cx} cy={cy} r={4} fill="var(--color-paper-raised)" stroke={stroke} strokeWidth={2} />;
  }
  if (point.source === 'imported') {
    return <rect x={cx - 3.5} y={cy - 3.5} width={7} height={7} fill={stroke} />;
  }
  return null;
}

interface DayTooltipProps {
  active?: boolean;
  payload?: ReadonlyArray<{ payload?: unknown }>;
  unit: 'F' | 'C';
}

function DayTooltip({ active, payload, unit }: DayTooltipProps) {
  const point = payload?.[0]?.payload as ChartPoint | undefined;
  if (!active || !point) return null;
  return (
    <div className="rounded-md border border-line bg-paper-raised px-3 py-2 text-sm text-loam shadow-sm">
      <p className="font-semibold">{formatWeekdayDayMonth(point.date)}</p>
      {point.source === null || point.tmax === null || point.tmin === null ? (
        <p>No reading for this day</p>
      ) : (
        <>
          <p>
            High {formatTemp(point.tmax, unit)} · Low {formatTemp(point.tmin, unit)}
          </p>
          <p className="text-loam-soft">{SOURCE_WORDS[point.source]}</p>
        </>
      )}
    </div>
  );
}

type NumberedThreshold = ReturnType<typeof numberThresholds<WeatherThresholdDto>>[number];

/** Room for a label on its own line: 12 px text and a little air. */
const LABEL_GAP = 15;

/**
 * The thresholds' keys in the right margin, each beside the end of its line and pushed apart
 * when lines run close, so no word is printed over a line; the list under the chart says what
 * each number is. On a wide screen the value is written too.
 */
function ThresholdKeys({ thresholds, unit, wide }: { thresholds: NumberedThreshold[]; unit: 'F' | 'C'; wide: boolean }) {
  const plot = usePlotArea();
  const y = useYAxisScale();
  if (!plot || !y || !thresholds.length) return null;
  const lineYs = thresholds.map((t) => y(t.value) ?? plot.y);
  const placed = spreadLabels(lineYs, LABEL_GAP, [plot.y + 6, plot.y + plot.height]);
  const right = plot.x + plot.width;
  return (
    <g aria-hidden="true">
      {thresholds.map((t, k) => (
        <g key={`${t.kind}-${t.label}`}>
          <line x1={right} y1={lineYs[k]} x2={right + 5} y2={placed[k] - 4} stroke={THRESHOLD_COLOURS[t.kind]} strokeWidth={1.5} />
          <text data-threshold-key={t.key} x={right + 7} y={placed[k]} fill={THRESHOLD_COLOURS[t.kind]} fontSize={12} fontWeight={700}>
            {wide ? `${t.key} · ${formatTemp(t.value, unit)}` : t.key}
          </text>
        </g>
      ))}
    </g>
  );
}

export function WeatherChart({ weather }: { weather: WeatherResponse }) {
  const { unit, thresholds, gaps, today } = weather;
  const points = buildChartPoints(weather);
  const values = [
    ...weather.days.flatMap((d) => [d.tmax, d.tmin]),
    ...thresholds.map((t) => t.value),
  ];
  const domain = temperatureDomain(values, unit === 'F' ? 10 : 5);
  const todayX = toDayNumber(today);
  const [first, last] = [toDayNumber(weather.from), toDayNumber(weather.to)];
  const wide = useWideChart();
  const line = { type: 'linear', connectNulls: false, isAnimationActive: false, strokeWidth: 2.5 } as const;
  const numbered = numberThresholds(thresholds);
  // The right margin holds the threshold keys: "1 · 30.0 °C" on a wide screen, "1" on a phone.
  const right = numbered.length ? (wide ? 84 : 22) : 12;
  const tick = { fill: CHART_COLOURS.text, fontSize: 12 };

  return (
    <ComposedChart
      responsive
      data={points}
      margin={{ top: 24, right, bottom: 24, left: 4 }}
      style={{ width: '100%', height: 'clamp(16rem, 45vw, 22rem)' }}
    >
      <CartesianGrid stroke={CHART_COLOURS.grid} strokeDasharray="2 4" vertical={false} />
      <XAxis
        dataKey="x"
        type="number"
        domain={[first - 0.5, last + 0.5]}
        // About one date per 70 px: at most four on a phone, so the dates never touch.
        ticks={dayTicks(weather.from, weather.to, today, weekStepFor(weather.from, weather.to, wide ? 9 : 4))}
        tickFormatter={(x: number) => formatDayMonth(fromDayNumber(x))}
        tick={tick}
        stroke={CHART_COLOURS.grid}
        label={{ value: 'Date', position: 'bottom', offset: 4, fill: CHART_COLOURS.text, fontSize: 12 }}
      />
      <YAxis
        domain={domain}
        allowDecimals={false}
        tickCount={wide ? 5 : 4}
        tickFormatter={(v: number) => `${v.toString().replace('-', '−')} °${unit}`}
        tick={tick}
        stroke={CHART_COLOURS.grid}
        width={54}
        label={{ value: `Temperature (°${unit})`, angle: -90, position: 'insideLeft', offset: 8, fill: CHART_COLOURS.text, fontSize: 12, style: { textAnchor: 'middle' } }}
      />
      {gaps.map((gap) => (
        <ReferenceArea
          key={gap.from}
          x1={toDayNumber(gap.from) - 0.5}
          x2={toDayNumber(gap.to) + 0.5}
          fill={CHART_COLOURS.gap}
          fillOpacity={0.9}
          ifOverflow="hidden"
        />
      ))}
      {numbered.map((t) => (
        <ReferenceLine key={`${t.kind}-${t.label}`} y={t.value} stroke={THRESHOLD_COLOURS[t.kind]} strokeDasharray="1 5" strokeWidth={2} />
      ))}
      <ReferenceLine
        x={todayX}
        stroke={CHART_COLOURS.today}
        strokeWidth={1.5}
        label={{ value: 'Today', position: 'top', fill: CHART_COLOURS.today, fontSize: 12, fontWeight: 600 }}
      />
      <Line {...line} dataKey="pastHigh" name="High" stroke={CHART_COLOURS.high} dot={SourceDot} activeDot={{ r: 4 }} />
      <Line {...line} dataKey="pastLow" name="Low" stroke={CHART_COLOURS.low} dot={SourceDot} activeDot={{ r: 4 }} />
      <Line {...line} dataKey="forecastHigh" name="High (forecast)" stroke={CHART_COLOURS.high} strokeDasharray="6 5" dot={false} activeDot={false} />
      <Line {...line} dataKey="forecastLow" name="Low (forecast)" stroke={CHART_COLOURS.low} strokeDasharray="6 5" dot={false} activeDot={false} />
      <ThresholdKeys thresholds={numbered} unit={unit} wide={wide} />
      <Tooltip content={({ active, payload }) => <DayTooltip active={active} payload={payload} unit={unit} />} cursor={{ stroke: CHART_COLOURS.grid }} />
    </ComposedChart>
  );
}
