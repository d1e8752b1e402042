import { localDate } from '#shared/calendar/local-day';

/** The calendar day an instant falls on in the garden's time zone (shared/calendar/local-day.ts). */
export function dayIn(instant: string | Date, timeZone: string): string {
  return localDate(timeZone, instant);
}

/** Today in the garden's time zone. */
export function todayIn(timeZone: string): string {
  return localDate(timeZone);
}
