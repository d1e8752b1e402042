import { parseIsoDate } from '#shared/thermal/dates';
import { countOf } from '#shared/format/count-words';

const whole = new Intl.NumberFormat('en', { maximumFractionDigits: 0 });

/** A count with its noun in the right form (the one counting helper, shared/format/count-words.ts). */
export function formatCount(n: number, one: string, many: string): string {
  return countOf(n, one, many);
}

// A calendar date is formatted from its own parts at UTC, so no browser time zone can shift it.
function civilUtc(date: string): Date {
  const { year, month, day } = parseIsoDate(date);
  return new Date(Date.UTC(year, month - 1, day));
}

const dayFormat = new Intl.DateTimeFormat('en', { weekday: 'short', month: 'short', day: 'numeric', timeZone: 'UTC' });
const shortFormat = new Intl.DateTimeFormat('en', { month: 'short', day: 'numeric', timeZone: 'UTC' });
const longFormat = new Intl.DateTimeFormat('en', { month: 'short', day: 'numeric', year: 'numeric', timeZone: 'UTC' });

/** "Tue, May 12" */
export function formatDay(date: string): string {
  return dayFormat.format(civilUtc(date));
}

/** "May 12" — for chart ticks. */
export function formatShortDay(date: string): string {
  return shortFormat.format(civilUtc(date));
}

/** "May 12, 2026" */
export function formatLongDay(date: string): string {
  return longFormat.format(civilUtc(date));
}

export function formatDayRange(from: string, to: string): string {
  return from === to ? formatLongDay(from) : `${formatLongDay(from)} – ${formatLongDay(to)}`;
}

/** An instant shown in the garden's own time zone, which is named so nobody has to guess. */
export function formatInstant(iso: string, timeZone: string): string {
  return new Intl.DateTimeFormat('en', { dateStyle: 'medium', timeStyle: 'short', timeZone }).format(new Date(iso));
}

/** "4 min 12 s", "850 ms" */
export function formatDuration(ms: number): string {
  if (ms < 1_000) return `${whole.format(ms)} ms`;
  const seconds = Math.round(ms / 1_000);
  if (seconds < 60) return `${seconds} s`;
  return `${Math.floor(seconds / 60)} min ${seconds % 60} s`;
}
