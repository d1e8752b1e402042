/**
 * Calendar days in words, for sentences made on either side (progress summaries, e-mail).
 * A 'YYYY-MM-DD' day is formatted in UTC so no time zone can move it to another day.
 */
const cache = new Map<string, Intl.DateTimeFormat>();

function formatter(locale: string, options: Intl.DateTimeFormatOptions): Intl.DateTimeFormat {
  const key = `${locale}|${JSON.stringify(options)}`;
  let f = cache.get(key);
  if (!f) {
    f = new Intl.DateTimeFormat(locale, { ...options, timeZone: 'UTC' });
    cache.set(key, f);
  }
  return f;
}

const asUtc = (day: string) => new Date(`${day}T00:00:00Z`);

/** "14 Jun" (or the locale's order). */
export function dayMonth(day: string, locale = 'en-GB'): string {
  return formatter(locale, { day: 'numeric', month: 'short' }).format(asUtc(day));
}

/** "14–22 Jun", "28 May – 3 Jun", or one day when both ends are the same. */
export function dayRange(from: string, to: string, locale = 'en-GB'): string {
  if (from === to) return dayMonth(from, locale);
  return formatter(locale, { day: 'numeric', month: 'short' }).formatRange(asUtc(from), asUtc(to));
}
