import type { WeatherResponse } from '#shared/schemas/weather';
import { fromDayNumber, toDayNumber } from '#shared/thermal/dates';

type Source = WeatherResponse['days'][number]['source'];

/**
 * One point per calendar day of the range (day number on the x axis). Past values and forecast
 * values sit in separate series so one can be drawn solid and the other dashed; a missing day is
 * null in every series, which the chart draws as a break.
 */
export interface ChartPoint {
  x: number;
  date: string;
  source: Source | null;
  tmax: number | null;
  tmin: number | null;
  pastHigh: number | null;
  pastLow: number | null;
  forecastHigh: number | null;
  forecastLow: number | null;
}

export function buildChartPoints(weather: Pick<WeatherResponse, 'from' | 'to' | 'days'>): ChartPoint[] {
  const byDate = new Map(weather.days.map((d) => [d.date, d]));
  const first = toDayNumber(weather.from);
  const last = toDayNumber(weather.to);
  const points: ChartPoint[] = [];
  for (let x = first; x <= last; x++) {
    const date = fromDayNumber(x);
    const day = byDate.get(date);
    const isForecast = day?.source === 'forecast';
    points.push({
      x,
      date,
      source: day?.source ?? null,
      tmax: day?.tmax ?? null,
      tmin: day?.tmin ?? null,
      pastHigh: day && !isForecast ? day.tmax : null,
      pastLow: day && !isForecast ? day.tmin : null,
      forecastHigh: isForecast ? day.tmax : null,
      forecastLow: isForecast ? day.tmin : null,
    });
  }
  // Where a past day meets a forecast day, the dashed line starts from the last solid point.
  for (let k = 1; k < points.length; k++) {
    const [a, b] = [points[k - 1], points[k]];
    if (a.source === null || b.source === null) continue;
    const aPast = a.source !== 'forecast';
    const bPast = b.source !== 'forecast';
    if (aPast === bPast) continue;
    const past = aPast ? a : b;
    past.forecastHigh = past.tmax;
    past.forecastLow = past.tmin;
  }
  return points;
}

/** Thresholds from the highest down, numbered: on a narrow chart the number keys a line to the list. */
export function numberThresholds<T extends { value: number }>(thresholds: T[]): Array<T & { key: number }> {
  return [...thresholds].sort((a, b) => b.value - a.value).map((t, k) => ({ ...t, key: k + 1 }));
}
