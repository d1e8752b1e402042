/** One formatter per time zone: building an Intl.DateTimeFormat costs far more than using one. */
const formatters = new Map<string, Intl.DateTimeFormat>();

/** The calendar day it is now in a time zone, as 'YYYY-MM-DD' (a garden's days are local days). */
export function localDate(timeZone: string, now: Date = new Date()): string {
  let f = formatters.get(timeZone);
  if (!f) {
    // Throws RangeError for an unknown zone, as before, so nothing bad is kept.
    f = new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' });
    formatters.set(timeZone, f);
  }
  return f.format(now);
}
