/**
 * A garden's calendar day: the one function client and server call to learn which day an instant
 * falls on in the garden's time zone ('YYYY-MM-DD'). 'en-CA' is used only because it writes ISO
 * order; nothing here is shown to people (shared/format/dates.ts words dates).
 * One formatter per time zone: building an Intl.DateTimeFormat costs far more than using one.
 */
const formatters = new Map<string, Intl.DateTimeFormat>();

export function localDate(timeZone: string, now: Date | string = new Date()): string {
  let f = formatters.get(timeZone);
  if (!f) {
    // Throws RangeError for an unknown zone, so nothing bad is kept.
    f = new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' });
    formatters.set(timeZone, f);
  }
  return f.format(typeof now === 'string' ? new Date(now) : now);
}
