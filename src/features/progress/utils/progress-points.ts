import type { BoltLevel, ProgressDto, ProgressSeriesDay } from '#shared/schemas/progress';
import { fromDayNumber, toDayNumber } from '#shared/thermal/dates';

/**
 * One point per calendar day of the chart (day number on the x axis), shared by the stacked
 * panels so they line up. Observed and forecast values sit in separate series so one can be drawn
 * solid and the other dashed; a day without a value is null, which the chart draws as a break.
 */
export interface ProgressPoint {
  x: number;
  date: string;
  day: ProgressSeriesDay | null;
  observed: number | null;
  forecast: number | null;
  band: [number, number] | null;
  median: number | null;
  pastHigh: number | null;
  pastLow: number | null;
  forecastHigh: number | null;
  forecastLow: number | null;
}

/** The days the chart spans: from the start (or today, if earlier) to the last day anything is known for. */
export function progressDomain(progress: ProgressDto): { from: string; to: string } {
  const dates = [
    progress.today,
    progress.startEvent?.on,
    progress.series[0]?.date,
    progress.series.at(-1)?.date,
    progress.projection.at(-1)?.date,
    progress.boltRisk.days.at(-1)?.date,
    progress.maturity.p90,
    progress.recorded.firstHarvestOn,
    progress.recorded.boltedOn,
  ].filter((d): d is string => Boolean(d));
  const sorted = [...dates].sort();
  return { from: sorted[0], to: sorted.at(-1)! };
}

const isForecast = (d: ProgressSeriesDay) => d.source === 'forecast';

export function buildProgressPoints(progress: ProgressDto): ProgressPoint[] {
  const { from, to } = progressDomain(progress);
  const days = new Map(progress.series.map((d) => [d.date, d]));
  const projected = new Map(progress.projection.map((d) => [d.date, d]));
  const points: ProgressPoint[] = [];
  for (let x = toDayNumber(from); x <= toDayNumber(to); x++) {
    const date = fromDayNumber(x);
    const day = days.get(date) ?? null;
    const ahead = projected.get(date);
    const past = day && !isForecast(day) ? day : null;
    const coming = day && isForecast(day) ? day : null;
    points.push({
      x,
      date,
      day,
      observed: past?.cumulative ?? null,
      forecast: coming?.cumulative ?? null,
      band: ahead ? [ahead.p10, ahead.p90] : null,
      median: ahead?.p50 ?? null,
      pastHigh: past?.tmax ?? null,
      pastLow: past?.tmin ?? null,
      forecastHigh: coming?.tmax ?? null,
      forecastLow: coming?.tmin ?? null,
    });
  }
  joinSeries(points);
  return points;
}

/** Where solid meets dashed, and where the record meets the projection, the lines join without a gap. */
function joinSeries(points: ProgressPoint[]) {
  for (let k = 1; k < points.length; k++) {
    const [a, b] = [points[k - 1], points[k]];
    if (a.observed !== null && b.forecast !== null && a.day) {
      a.forecast = a.observed;
      a.forecastHigh = a.day.tmax;
      a.forecastLow = a.day.tmin;
    }
    const recorded = a.forecast ?? a.observed;
    if (recorded !== null && a.band === null && b.band !== null) {
      a.band = [recorded, recorded];
      a.median = recorded;
    }
  }
}

/** A 0-based y range that holds the curve, the band and the target, on a round number. */
export function heatDomain(progress: ProgressDto): [number, number] {
  const top = Math.max(
    10,
    progress.target ?? 0,
    ...progress.series.map((d) => d.cumulative),
    ...progress.projection.map((d) => d.p90),
  ) * 1.08;
  const step = 10 ** Math.floor(Math.log10(top)) / 2;
  return [0, Math.ceil(top / step) * step];
}

/** Ticks every whole number of weeks from today, about `count` of them across the span. */
export function weekStep(from: string, to: string, count: number): number {
  const span = toDayNumber(to) - toDayNumber(from) + 1;
  return 7 * Math.max(1, Math.ceil(span / (7 * count)));
}

/** Consecutive days of the same level and kind (recorded or forecast), for the bolt-risk strip. */
export interface BoltRun {
  level: BoltLevel;
  forecast: boolean;
  from: string;
  to: string;
  days: number;
}

export function boltRuns(days: ProgressDto['boltRisk']['days']): BoltRun[] {
  const runs: BoltRun[] = [];
  for (const d of days) {
    const last = runs.at(-1);
    if (last && last.level === d.level && last.forecast === d.forecast && toDayNumber(d.date) === toDayNumber(last.to) + 1) {
      last.to = d.date;
      last.days += 1;
    } else {
      runs.push({ level: d.level, forecast: d.forecast, from: d.date, to: d.date, days: 1 });
    }
  }
  return runs;
}
