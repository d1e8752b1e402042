import { toDayNumber } from '#shared/thermal/dates';

/** Axis helpers shared by the Recharts drawings (weather, progress); no Recharts import, so they cost no chunk. */

/** A y range that holds every value and threshold with some room, on round numbers. */
export function temperatureDomain(values: number[], step: number): [number, number] {
  if (!values.length) return [0, step * 4];
  const lo = Math.min(...values);
  const hi = Math.max(...values);
  return [Math.floor((lo - step / 2) / step) * step, Math.ceil((hi + step / 2) / step) * step];
}

/** Tick days every `step` days counted from today, so today always has a tick. */
export function dayTicks(from: string, to: string, today: string, step: number): number[] {
  const first = toDayNumber(from);
  const last = toDayNumber(to);
  const anchor = toDayNumber(today);
  const ticks: number[] = [];
  for (let x = anchor - Math.floor((anchor - first) / step) * step; x <= last; x += step) ticks.push(x);
  return ticks;
}

/** Where each (highest-first) label goes, so lines close together do not print over each other. */
export function placeThresholdLabels<T extends { value: number }>(sorted: T[], domain: [number, number]) {
  const close = (domain[1] - domain[0]) * 0.1;
  return sorted.map((t, k) => ({
    ...t,
    side: k % 2 === 0 ? ('left' as const) : ('right' as const),
    below: k > 0 && sorted[k - 1].value - t.value < close,
  }));
}
