import type { DisplayUnit, GardenDto, Role } from '#shared/schemas/gardens';
import type { BoltLevelOrNone, MaturityBasisKind } from '#shared/schemas/progress';
import type { WeatherDayDto } from '#shared/schemas/weather';
import * as dates from '#shared/format/dates';
import { formatMeasure, unitSystemOf } from '#shared/units/measures';

export const ROLE_WORDS: Record<Role, string> = {
  owner: 'Owner',
  grower: 'Grower',
  viewer: 'Viewer',
};

export const ROLE_SENTENCES: Record<Role, string> = {
  owner: 'You own this garden: you can change its settings and records.',
  grower: 'You are a grower here: you can keep all of the garden’s records.',
  viewer: 'You are a viewer here: you can read the garden’s records but not change them.',
};

export const UNIT_WORDS: Record<DisplayUnit, string> = {
  F: '°F (Fahrenheit)',
  C: '°C (Celsius)',
};

export const HEMISPHERE_SENTENCES: Record<GardenDto['hemisphere'], string> = {
  N: 'Northern hemisphere: seasons run January–December.',
  S: 'Southern hemisphere: seasons run July–June.',
};

const coordinate = new Intl.NumberFormat('en', { minimumFractionDigits: 0, maximumFractionDigits: 4 });
const whole = new Intl.NumberFormat('en', { maximumFractionDigits: 0 });
const tenth = new Intl.NumberFormat('en', { minimumFractionDigits: 1, maximumFractionDigits: 1 });

export function formatLatitude(latitude: number): string {
  return `${coordinate.format(Math.abs(latitude))}° ${latitude < 0 ? 'S' : 'N'}`;
}

export function formatLongitude(longitude: number): string {
  return `${coordinate.format(Math.abs(longitude))}° ${longitude < 0 ? 'W' : 'E'}`;
}

export function formatLocation(garden: Pick<GardenDto, 'latitude' | 'longitude'>): string | null {
  if (garden.latitude === null || garden.longitude === null) return null;
  return `${formatLatitude(garden.latitude)}, ${formatLongitude(garden.longitude)}`;
}

/** "256 m" in a °C garden, "840 ft" in a °F one (shared/units/measures.ts). */
export function formatElevation(elevationM: number | null, unit: DisplayUnit = 'C'): string | null {
  return elevationM === null ? null : formatMeasure('elevation', elevationM, unitSystemOf(unit));
}

/** "3 seconds", "1 minute", "5 minutes" — rounded up so the grower never retries too early. */
export function formatWait(seconds: number): string {
  if (seconds < 60) {
    const s = Math.max(1, Math.ceil(seconds));
    return `${s} ${s === 1 ? 'second' : 'seconds'}`;
  }
  const minutes = Math.ceil(seconds / 60);
  return `${minutes} ${minutes === 1 ? 'minute' : 'minutes'}`;
}

/** "−3.5 °C": a true minus sign, one decimal, and the unit on every figure. */
export function formatTemp(value: number, unit: DisplayUnit): string {
  return `${tenth.format(value).replace('-', '−')} °${unit}`;
}

/** "35–85 °F", "1.7–29.4 °C": a range with its unit once, whole figures without a trailing .0. */
export function formatTempRange(min: number, max: number, unit: DisplayUnit): string {
  const figure = (v: number) => (Math.abs(v * 10 - Math.round(v) * 10) < 0.5 ? whole.format(v) : tenth.format(v)).replace('-', '−');
  return `${figure(min)}–${figure(max)} °${unit}`;
}

/** "°F-days" or "°C-days": the one unit of a garden's degree days, never mixed. */
export function degreeDayUnit(unit: DisplayUnit): string {
  return `°${unit}-days`;
}

/** "1,204 °F-days"; `digits` 1 for a single day's figure ("12.4 °C-days"). */
export function formatDegreeDays(value: number, unit: DisplayUnit, digits: 0 | 1 = 0): string {
  return `${(digits ? tenth : whole).format(value).replace('-', '−')} ${degreeDayUnit(unit)}`;
}

export function formatPercent(percent: number): string {
  return `${whole.format(percent)} %`;
}

/** "412 of 950 °F-days (43 %)", or "412 °F-days" when there is no target. */
export function formatHeat(accumulated: number, target: number | null, percent: number | null, unit: DisplayUnit): string {
  if (target === null) return formatDegreeDays(accumulated, unit);
  const share = percent === null ? '' : ` (${formatPercent(percent)})`;
  return `${whole.format(accumulated)} of ${formatDegreeDays(target, unit)}${share}`;
}

/** The reader's languages, as the browser lists them (the server reads the same from Accept-Language). */
export function readerLocales(): readonly string[] {
  return typeof navigator === 'undefined' ? [] : navigator.languages;
}

// Every date on screen goes through shared/format/dates.ts with the reader's languages.

/** "14 Jun" (or "Jun 14"): the short day-month form in the browser's language. */
export function formatDayMonth(date: string): string {
  return dates.dayMonth(date, readerLocales());
}

/** "Tue 14 Jun" in the browser's language, for day-by-day strips. */
export function formatWeekdayDayMonth(date: string): string {
  return dates.weekdayDayMonth(date, readerLocales());
}

/** "14 Jun 2026": a day with its year. */
export function formatFullDate(date: string): string {
  return dates.fullDate(date, readerLocales());
}

/** "14 Jun", or "14 Jun 2025" when the day is not in the garden's current year. */
export function formatDayInContext(date: string, today: string): string {
  return dates.dayInContext(date, today, readerLocales());
}

/** "14–22 Jun", "28 May – 3 Jun" (or "Jun 14–22"). */
export function formatDayWindow(from: string, to: string): string {
  return dates.dayRange(from, to, readerLocales());
}

/** "14–22 Jun 2026": a range with its year. */
export function formatFullRange(from: string, to: string): string {
  return dates.fullRange(from, to, readerLocales());
}

/** "14 Jun 2026, 06:10": an instant in the garden's own time zone. */
export function formatInstant(iso: string, timeZone: string): string {
  return dates.instant(iso, timeZone, readerLocales());
}

/** "14 Jun 2026, 06:10" in the browser's own time zone, for what belongs to no garden (the mailbox). */
export function formatLocalInstant(iso: string): string {
  return formatInstant(iso, Intl.DateTimeFormat().resolvedOptions().timeZone);
}

export const BOLT_WORDS: Record<BoltLevelOrNone, string> = {
  none: 'Not assessed',
  low: 'Low',
  elevated: 'Elevated',
  high: 'High',
};

/** "Likely ready 14–22 Jun", from a maturity window of any source. */
export function formatReady(maturity: { p10: string | null; p50: string | null; p90: string | null; kind: MaturityBasisKind }): string {
  const { p10, p50, p90, kind } = maturity;
  if (kind === 'recorded' && p50) return `Harvested ${formatDayMonth(p50)}`;
  if (kind === 'none' || !p50) return 'No maturity window yet';
  if (kind === 'observed') return `Target reached ${formatDayMonth(p50)}`;
  return `Likely ready ${formatDayWindow(p10 ?? p50, p90 ?? p50)}`;
}

/** Where a day's temperatures come from, in words (shown with an icon, never by colour alone). */
export const SOURCE_WORDS: Record<WeatherDayDto['source'], string> = {
  observed: 'Observed',
  forecast: 'Forecast',
  imported: 'Your station',
  filled: 'Estimated (filled)',
};
