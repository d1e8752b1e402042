/**
 * The Recharts drawing of a planting's progress: degree days with the projection band above,
 * daily highs and lows against the crop's thresholds below, on one shared day axis. Loaded
 * lazily (see progress-chart-panel) so Recharts stays in its own chunk.
 */
import { Area, CartesianGrid, ComposedChart, Line, ReferenceArea, ReferenceLine, Tooltip, XAxis, YAxis } from 'recharts';
import type { ProgressDto } from '#shared/schemas/progress';
import { fromDayNumber, toDayNumber } from '#shared/thermal/dates';
import { dayTicks, placeThresholdLabels, temperatureDomain } from '@/lib/chart-axes';
import { degreeDayUnit, formatDayMonth, formatDegreeDays, formatTemp } from '@/lib/format';
import { useWideChart } from '@/lib/use-wide-chart';
import { ChartLineLabel, HaloText } from '@/components/ui/chart-line-label';
import { HeatTooltip, TemperatureTooltip } from '@/features/progress/components/progress-tooltips';
import { PLOT_INSET, PROGRESS_COLOURS } from '@/features/progress/utils/chart-look';
import { buildProgressPoints, heatDomain, progressDomain, weekStep } from '@/features/progress/utils/progress-points';

const Y_AXIS_WIDTH = 60;
const MARGIN = { right: PLOT_INSET.right, left: PLOT_INSET.left - Y_AXIS_WIDTH };

interface VerticalLabelProps {
  viewBox?: { x?: number; y?: number };
  text: string;
  row: number;
  anchor: 'start' | 'middle' | 'end';
}

/** Words beside a vertical line; `row` stacks labels of nearby lines so they do not overlap. */
function VerticalLabel({ viewBox, text, row, anchor }: VerticalLabelProps) {
  if (viewBox?.x == null || viewBox.y == null) return null;
  const dx = anchor === 'start' ? 4 : anchor === 'end' ? -4 : 0;
  return (
    <HaloText x={viewBox.x + dx} y={row === 0 ? viewBox.y - 6 : viewBox.y + 14 * row} anchor={anchor} colour={PROGRESS_COLOURS.today}>
      {text}
    </HaloText>
  );
}

function useDayAxis(progress: ProgressDto) {
  const { from, to } = progressDomain(progress);
  const wide = useWideChart();
  const [first, last] = [toDayNumber(from), toDayNumber(to)];
  const axis = {
    dataKey: 'x',
    type: 'number',
    domain: [first - 0.5, last + 0.5],
    ticks: dayTicks(from, to, progress.today, weekStep(from, to, wide ? 8 : 4)),
    tickFormatter: (x: number) => formatDayMonth(fromDayNumber(x)),
    tick: { fill: PROGRESS_COLOURS.text, fontSize: 12 },
    stroke: PROGRESS_COLOURS.grid,
  } as const;
  // Labels near an edge are written away from it, to stay inside the chart; recorded events
  // (`beside`) sit to one side of their line, today's label over it.
  const anchorAt = (date: string, beside: boolean) => {
    const share = (toDayNumber(date) - first) / Math.max(1, last - first);
    if (share > (beside ? 0.6 : 0.9)) return 'end' as const;
    return beside || share < 0.1 ? ('start' as const) : ('middle' as const);
  };
  return { axis, anchorAt, wide };
}

const yTick = { fill: PROGRESS_COLOURS.text, fontSize: 12 };
const line = { type: 'linear', connectNulls: false, isAnimationActive: false, strokeWidth: 2.5, dot: false } as const;

function HeatPanel({ progress }: { progress: ProgressDto }) {
  const { unit, target, today, maturity, recorded } = progress;
  const points = buildProgressPoints(progress);
  const { axis, anchorAt, wide } = useDayAxis(progress);
  const events = [
    recorded.firstHarvestOn && { date: recorded.firstHarvestOn, words: 'First harvest', short: 'Harvest' },
    recorded.boltedOn && { date: recorded.boltedOn, words: 'Bolted', short: 'Bolted' },
  ].filter((e): e is { date: string; words: string; short: string } => Boolean(e));
  const window = (maturity.basis.kind === 'forecast' || maturity.basis.kind === 'analog') && maturity.p10 && maturity.p90;

  return (
    <ComposedChart responsive data={points} margin={{ ...MARGIN, top: 24, bottom: 4 }} style={{ width: '100%', height: 'clamp(15rem, 40vw, 20rem)' }}>
      <CartesianGrid stroke={PROGRESS_COLOURS.grid} strokeDasharray="2 4" vertical={false} />
      <XAxis {...axis} />
      <YAxis
        domain={heatDomain(progress)}
        allowDecimals={false}
        tickFormatter={(v: number) => v.toLocaleString('en')}
        tick={yTick}
        stroke={PROGRESS_COLOURS.grid}
        width={Y_AXIS_WIDTH}
        label={{ value: `Degree days (${degreeDayUnit(unit)})`, angle: -90, position: 'insideLeft', offset: 4, fill: PROGRESS_COLOURS.text, fontSize: 12, style: { textAnchor: 'middle' } }}
      />
      {window && <ReferenceArea x1={toDayNumber(maturity.p10!) - 0.5} x2={toDayNumber(maturity.p90!) + 0.5} fill={PROGRESS_COLOURS.band} fillOpacity={0.5} ifOverflow="hidden" />}
      <Area type="linear" dataKey="band" name="Projection, 10th–90th percentile" stroke="none" fill={PROGRESS_COLOURS.band} fillOpacity={0.9} isAnimationActive={false} connectNulls={false} activeDot={false} />
      {target !== null && (
        <ReferenceLine
          y={target}
          stroke={PROGRESS_COLOURS.target}
          strokeDasharray="1 4"
          strokeWidth={2}
          label={<ChartLineLabel text={`Target ${formatDegreeDays(target, unit)}`} colour={PROGRESS_COLOURS.target} side="left" below={false} />}
        />
      )}
      <ReferenceLine x={toDayNumber(today)} stroke={PROGRESS_COLOURS.today} strokeWidth={1.5} label={<VerticalLabel text="Today" row={0} anchor={anchorAt(today, false)} />} />
      {events.map((e, k) => (
        <ReferenceLine
          key={e.words}
          x={toDayNumber(e.date)}
          stroke={PROGRESS_COLOURS.event}
          strokeWidth={2}
          strokeDasharray="4 3"
          label={<VerticalLabel text={wide ? `${e.words} ${formatDayMonth(e.date)}` : e.short} row={k + 1} anchor={anchorAt(e.date, true)} />}
        />
      ))}
      <Line {...line} dataKey="median" name="Middle estimate" stroke={PROGRESS_COLOURS.median} strokeDasharray="10 5" strokeWidth={2} />
      <Line {...line} dataKey="observed" name="So far" stroke={PROGRESS_COLOURS.heat} strokeWidth={3} activeDot={{ r: 4 }} />
      <Line {...line} dataKey="forecast" name="With the forecast" stroke={PROGRESS_COLOURS.heat} strokeWidth={3} strokeDasharray="3 4" activeDot={{ r: 4 }} />
      <Tooltip content={({ active, payload }) => <HeatTooltip active={active} payload={payload} unit={unit} />} cursor={{ stroke: PROGRESS_COLOURS.grid }} />
    </ComposedChart>
  );
}

function TemperaturePanel({ progress }: { progress: ProgressDto }) {
  const { unit, base, upper, series, today } = progress;
  const points = buildProgressPoints(progress);
  const { axis } = useDayAxis(progress);
  const thresholds = [
    ...(upper === null ? [] : [{ value: upper, words: 'Upper threshold', colour: PROGRESS_COLOURS.upper }]),
    { value: base, words: 'Base', colour: PROGRESS_COLOURS.base },
  ];
  const domain = temperatureDomain([...series.flatMap((d) => [d.tmax, d.tmin]), ...thresholds.map((t) => t.value)], unit === 'F' ? 10 : 5);

  return (
    <ComposedChart responsive data={points} margin={{ ...MARGIN, top: 8, bottom: 4 }} style={{ width: '100%', height: 'clamp(11rem, 30vw, 15rem)' }}>
      <CartesianGrid stroke={PROGRESS_COLOURS.grid} strokeDasharray="2 4" vertical={false} />
      <XAxis {...axis} />
      <YAxis
        domain={domain}
        allowDecimals={false}
        tickFormatter={(v: number) => `${v.toString().replace('-', '−')} °${unit}`}
        tick={yTick}
        stroke={PROGRESS_COLOURS.grid}
        width={Y_AXIS_WIDTH}
      />
      {placeThresholdLabels(thresholds, domain).map((t) => (
        <ReferenceLine
          key={t.words}
          y={t.value}
          stroke={t.colour}
          strokeDasharray="1 5"
          strokeWidth={2}
          label={<ChartLineLabel text={`${t.words} ${formatTemp(t.value, unit)}`} colour={t.colour} side={t.side} below={t.below} />}
        />
      ))}
      <ReferenceLine x={toDayNumber(today)} stroke={PROGRESS_COLOURS.today} strokeWidth={1.5} />
      <Line {...line} dataKey="pastHigh" name="High" stroke={PROGRESS_COLOURS.high} activeDot={{ r: 4 }} />
      <Line {...line} dataKey="pastLow" name="Low" stroke={PROGRESS_COLOURS.low} activeDot={{ r: 4 }} />
      <Line {...line} dataKey="forecastHigh" name="High (forecast)" stroke={PROGRESS_COLOURS.high} strokeDasharray="6 5" activeDot={false} />
      <Line {...line} dataKey="forecastLow" name="Low (forecast)" stroke={PROGRESS_COLOURS.low} strokeDasharray="6 5" activeDot={false} />
      <Tooltip content={({ active, payload }) => <TemperatureTooltip active={active} payload={payload} unit={unit} />} cursor={{ stroke: PROGRESS_COLOURS.grid }} />
    </ComposedChart>
  );
}

export function ProgressChart({ progress }: { progress: ProgressDto }) {
  return (
    <div className="flex flex-col gap-1">
      <HeatPanel progress={progress} />
      <p className="text-sm font-semibold" style={{ paddingLeft: PLOT_INSET.left }}>
        Daily highs and lows (°{progress.unit})
      </p>
      <TemperaturePanel progress={progress} />
    </div>
  );
}
