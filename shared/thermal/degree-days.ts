/**
 * Daily degree days from a day's high and low (SCIENCE §1).
 * Sources: Baskerville & Emin 1969 (single sine); Zalom et al. 1983, UC DANR Leaflet 21373
 * (triangle, sine, cutoffs); Allen 1976 (double sine); McMaster & Wilhelm 1997 (average methods).
 * Matches the UC IPM calculators on the UC ANR IGIS validation set to ±0.01 (tests/reference).
 */

export type DegreeDayMethodName =
  | 'average'
  | 'clamped-average'
  | 'single-sine'
  | 'single-triangle'
  | 'double-sine'
  | 'double-triangle';

export type Cutoff = 'horizontal' | 'vertical' | 'intermediate';

export interface DegreeDayOptions {
  base: number;
  upper?: number;
  method: DegreeDayMethodName;
  cutoff?: Cutoff;
  /** Tomorrow's low, for the double methods; today's low is used when absent (SCIENCE §1). */
  tminNext?: number;
}

const METHODS: ReadonlySet<string> = new Set([
  'average',
  'clamped-average',
  'single-sine',
  'single-triangle',
  'double-sine',
  'double-triangle',
]);
const CUTOFFS: ReadonlySet<string> = new Set(['horizontal', 'vertical', 'intermediate']);

function requireFinite(name: string, value: number): void {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new RangeError(`${name} (${String(value)}) is not a finite number`);
  }
}

function validate(tmax: number, tmin: number, opts: DegreeDayOptions): void {
  requireFinite('tmax', tmax);
  requireFinite('tmin', tmin);
  if (tmin > tmax) throw new RangeError(`tmin (${tmin}) is above tmax (${tmax})`);
  requireFinite('base', opts.base);
  if (opts.upper !== undefined) {
    requireFinite('upper', opts.upper);
    if (opts.upper <= opts.base) {
      throw new RangeError(`upper (${opts.upper}) is not above base (${opts.base})`);
    }
  }
  if (opts.tminNext !== undefined) requireFinite('tminNext', opts.tminNext);
  if (!METHODS.has(opts.method)) throw new RangeError(`method (${String(opts.method)}) is unknown`);
  if (opts.cutoff !== undefined && !CUTOFFS.has(opts.cutoff)) {
    throw new RangeError(`cutoff (${String(opts.cutoff)}) is unknown`);
  }
}

/** asin of (x − M)/α clamped to [−1, 1]; α = 0 (a constant day) is the limit of a step. */
function phase(x: number, mean: number, amp: number): number {
  if (amp > 0) return Math.asin(Math.min(1, Math.max(-1, (x - mean) / amp)));
  return x >= mean ? Math.PI / 2 : -Math.PI / 2;
}

function sine(tmax: number, tmin: number, base: number, upper: number, cutoff: Cutoff): number {
  const mean = (tmax + tmin) / 2;
  const amp = (tmax - tmin) / 2;
  const t1 = phase(base, mean, amp);
  if (upper === Infinity) {
    return ((mean - base) * (Math.PI / 2 - t1) + amp * Math.cos(t1)) / Math.PI;
  }
  const t2 = phase(upper, mean, amp);
  const between = ((mean - base) * (t2 - t1) + amp * (Math.cos(t1) - Math.cos(t2))) / Math.PI;
  if (cutoff === 'vertical') return between;
  const cap = ((upper - base) * (Math.PI / 2 - t2)) / Math.PI;
  if (cutoff === 'horizontal') return between + cap;
  const above = ((mean - upper) * (Math.PI / 2 - t2) + amp * Math.cos(t2)) / Math.PI;
  return Math.max(between, between + cap - above);
}

function triangleAreaAbove(x: number, tmax: number, tmin: number): number {
  if (x <= tmin) return (tmax + tmin) / 2 - x;
  if (x >= tmax) return 0;
  return (tmax - x) ** 2 / (2 * (tmax - tmin));
}

function triangleFractionAbove(x: number, tmax: number, tmin: number): number {
  if (x >= tmax) return 0;
  if (x <= tmin) return 1;
  return (tmax - x) / (tmax - tmin);
}

function triangle(tmax: number, tmin: number, base: number, upper: number, cutoff: Cutoff): number {
  const aboveBase = triangleAreaAbove(base, tmax, tmin);
  if (upper === Infinity) return aboveBase;
  const aboveUpper = triangleAreaAbove(upper, tmax, tmin);
  const horizontal = aboveBase - aboveUpper;
  if (cutoff === 'horizontal') return horizontal;
  const vertical = horizontal - (upper - base) * triangleFractionAbove(upper, tmax, tmin);
  if (cutoff === 'vertical') return vertical;
  return Math.max(vertical, horizontal - aboveUpper);
}

type Shape = (tmax: number, tmin: number, base: number, upper: number, cutoff: Cutoff) => number;

/**
 * Allen 1976 / UC IPM: the morning half runs from today's low up to the high, the evening half
 * from the high down to tomorrow's low; each half is half a single-method day. A half-sine's
 * area does not depend on its direction, so a "low" above the high just swaps the ends.
 */
function double(shape: Shape, tmax: number, tmin: number, tminNext: number, base: number, upper: number, cutoff: Cutoff): number {
  const hi2 = Math.max(tmax, tminNext);
  const lo2 = Math.min(tmax, tminNext);
  return (shape(tmax, tmin, base, upper, cutoff) + shape(hi2, lo2, base, upper, cutoff)) / 2;
}

/** The constant-temperature day at the mean; cutoffs behave as for a sine with α = 0. */
function average(mean: number, base: number, upper: number, cutoff: Cutoff): number {
  if (mean <= base) return 0;
  if (mean <= upper) return mean - base;
  if (cutoff === 'horizontal') return upper - base;
  if (cutoff === 'vertical') return 0;
  return Math.max(0, upper - base - (mean - upper));
}

/**
 * Degree days for one day; unit-agnostic (°C in, °C-days out; °F in, °F-days out).
 * Throws a RangeError naming the offending input. Never negative.
 * 'clamped-average' clamps Tx and Tn into [base, upper] (McMaster & Wilhelm method 2); that
 * clamp is its own horizontal cap, so `cutoff` does not change it.
 */
export function dailyDegreeDays(tmax: number, tmin: number, opts: DegreeDayOptions): number {
  validate(tmax, tmin, opts);
  return degreeDaysUnchecked(tmax, tmin, opts.tminNext ?? tmin, opts.base, opts.upper ?? Infinity, opts.method, opts.cutoff ?? 'horizontal');
}

/** The same without validation or an options object, for loops over already-checked series. */
export function degreeDaysUnchecked(
  tmax: number,
  tmin: number,
  tminNext: number,
  base: number,
  upper: number,
  method: DegreeDayMethodName,
  cutoff: Cutoff,
): number {
  let dd: number;
  switch (method) {
    case 'average':
      dd = average((tmax + tmin) / 2, base, upper, cutoff);
      break;
    case 'clamped-average':
      dd = (Math.min(upper, Math.max(base, tmax)) + Math.min(upper, Math.max(base, tmin))) / 2 - base;
      break;
    case 'single-sine':
      dd = sine(tmax, tmin, base, upper, cutoff);
      break;
    case 'single-triangle':
      dd = triangle(tmax, tmin, base, upper, cutoff);
      break;
    case 'double-sine':
      dd = double(sine, tmax, tmin, tminNext, base, upper, cutoff);
      break;
    case 'double-triangle':
      dd = double(triangle, tmax, tmin, tminNext, base, upper, cutoff);
      break;
  }
  return dd > 0 ? dd : 0;
}

/** Checks a method's thresholds once, so loops can use degreeDaysUnchecked. */
export function validateMethod(opts: Omit<DegreeDayOptions, 'tminNext'>): void {
  validate(0, 0, opts);
}
