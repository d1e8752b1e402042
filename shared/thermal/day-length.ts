import { dayOfYear } from './dates';

export interface DayLengthOptions {
  /** Sun-below-horizon angle p in degrees: 0.8333 = sunrise/sunset, 6 = civil twilight. */
  twilightDeg?: number;
}

const RAD = Math.PI / 180;

/**
 * Day length in hours by the CBM model (Forsythe et al. 1995, Ecological Modelling 80:87–95).
 * `date` is 'YYYY-MM-DD' (day of year computed arithmetically) or a day-of-year number 1–366.
 * Polar day and night come out as 24 and 0 through the clamp on the acos argument.
 */
export function dayLengthHours(latitude: number, date: string | number, opts: DayLengthOptions = {}): number {
  if (!Number.isFinite(latitude) || latitude < -90 || latitude > 90) {
    throw new RangeError(`latitude (${latitude}) is outside −90…90`);
  }
  const p = opts.twilightDeg ?? 0.8333;
  if (!Number.isFinite(p)) throw new RangeError(`twilightDeg (${p}) is not a finite number`);
  const j = typeof date === 'number' ? date : dayOfYear(date);
  if (!Number.isInteger(j) || j < 1 || j > 366) {
    throw new RangeError(`day of year (${String(date)}) is outside 1…366`);
  }
  return dayLengthForDay(latitude, j, p);
}

function dayLengthForDay(latitude: number, j: number, twilightDeg = 0.8333): number {
  const theta = 0.2163108 + 2 * Math.atan(0.9671396 * Math.tan(0.0086 * (j - 186)));
  const phi = Math.asin(0.39795 * Math.cos(theta));
  const lat = latitude * RAD;
  const arg = (Math.sin(twilightDeg * RAD) + Math.sin(lat) * Math.sin(phi)) / (Math.cos(lat) * Math.cos(phi));
  return 24 - (24 / Math.PI) * Math.acos(Math.min(1, Math.max(-1, arg)));
}
