/** The calendar day it is now in a time zone, as 'YYYY-MM-DD' (a garden's days are local days). */
export function localDate(timeZone: string, now: Date = new Date()): string {
  return new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' }).format(now);
}
