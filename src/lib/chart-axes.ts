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

/**
 * A tick step in whole weeks (at least one) that puts at most `maxTicks` ticks across the range,
 * so dates stay apart on a narrow chart.
 */
export function weekStepFor(from: string, to: string, maxTicks: number): number {
  const days = toDayNumber(to) - toDayNumber(from) + 1;
  return Math.max(1, Math.ceil(days / Math.max(1, maxTicks) / 7)) * 7;
}

/**
 * Label baselines for lines at `ys` (pixels, any order): each as close to its line as it can be,
 * at least `gap` apart, all within `[top, bottom]` when they fit. Returned in the order given.
 */
export function spreadLabels(ys: number[], gap: number, [top, bottom]: [number, number]): number[] {
  const order = ys.map((y, i) => ({ y: y + 4, i })).sort((a, b) => a.y - b.y);
  const placed = order.map((o) => o.y);
  for (let k = 0; k < placed.length; k++) placed[k] = Math.max(placed[k], top, k ? placed[k - 1] + gap : -Infinity);
  // Pushed past the bottom: walk back up, keeping the gap.
  for (let k = placed.length - 1; k >= 0; k--) placed[k] = Math.min(placed[k], k === placed.length - 1 ? bottom : placed[k + 1] - gap);
  const out = new Array<number>(ys.length);
  order.forEach((o, k) => (out[o.i] = placed[k]));
  return out;
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
