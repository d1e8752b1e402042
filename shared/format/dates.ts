/**
 * Calendar days and instants in words: the one date language of Heatclock, used by the client
 * (src/lib/format.ts passes the browser's languages) and by the server (server/lib/locale.ts
 * passes the request's Accept-Language, or the default for stored text and e-mail).
 *
 * A calendar day ('YYYY-MM-DD', local to the garden) is formatted at UTC from its own parts, so
 * no time zone of the reader or the server can move it to another day. Date inputs stay ISO.
 */
export type Locales = string | readonly string[] | undefined;

/** The wording used when nobody said which language they read (stored text, e-mail). */
export const DEFAULT_LOCALE = 'en-GB';

const cache = new Map<string, Intl.DateTimeFormat>();
/** Enough for every language and zone in use at once; beyond it the cache starts afresh. */
const CACHE_MAX = 500;

function listOf(locales: Locales): string[] {
  const list = locales === undefined ? [] : typeof locales === 'string' ? [locales] : [...locales];
  try {
    const known = Intl.DateTimeFormat.supportedLocalesOf(list);
    return known.length ? known : [DEFAULT_LOCALE];
  } catch {
    return [DEFAULT_LOCALE]; // a malformed tag from a header must not break a page
  }
}

function formatter(locales: Locales, options: Intl.DateTimeFormatOptions, timeZone = 'UTC'): Intl.DateTimeFormat {
  const key = `${typeof locales === 'string' ? locales : (locales ?? []).join(',')}|${timeZone}|${JSON.stringify(options)}`;
  let f = cache.get(key);
  if (!f) {
    f = new Intl.DateTimeFormat(listOf(locales), { ...options, timeZone });
    if (cache.size >= CACHE_MAX) cache.clear();
    cache.set(key, f);
  }
  return f;
}

function asUtc(day: string): Date {
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(day);
  if (!m) throw new RangeError(`Not a calendar day: ${day}`);
  const d = new Date(Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3])));
  // 2001-02-29 would roll over to 1 March: a day that does not exist is an error, not another day.
  if (d.getUTCMonth() !== Number(m[2]) - 1 || d.getUTCDate() !== Number(m[3])) throw new RangeError(`Not a calendar day: ${day}`);
  return d;
}

const DAY_MONTH: Intl.DateTimeFormatOptions = { day: 'numeric', month: 'short' };
const FULL: Intl.DateTimeFormatOptions = { day: 'numeric', month: 'short', year: 'numeric' };

// A range within one month reads "14–22 Jun": the dash closed up between the day numbers. Across
// months or years Intl's spaced dash stays ("28 Dec 2026 – 3 Jan 2027").
const closeUp = (s: string, from: string, to: string) => (from.slice(0, 7) === to.slice(0, 7) ? s.replace(/(\d)\s*[–-]\s*(\d)/u, '$1–$2') : s);

/** "14 Jun" (or "Jun 14", in the reader's order). */
export function dayMonth(day: string, locales: Locales = DEFAULT_LOCALE): string {
  return formatter(locales, DAY_MONTH).format(asUtc(day));
}

/** "Tue 14 Jun", for day-by-day strips and tables. */
export function weekdayDayMonth(day: string, locales: Locales = DEFAULT_LOCALE): string {
  return formatter(locales, { weekday: 'short', ...DAY_MONTH }).format(asUtc(day));
}

/** "14 Jun 2026": a day that may lie in another year. */
export function fullDate(day: string, locales: Locales = DEFAULT_LOCALE): string {
  return formatter(locales, FULL).format(asUtc(day));
}

/** "14 Jun", or "14 Jun 2025" when the day is not in the year of `today`. */
export function dayInContext(day: string, today: string, locales: Locales = DEFAULT_LOCALE): string {
  return day.slice(0, 4) === today.slice(0, 4) ? dayMonth(day, locales) : fullDate(day, locales);
}

/** "14–22 Jun", "28 May – 3 Jun", or one day when both ends are the same. */
export function dayRange(from: string, to: string, locales: Locales = DEFAULT_LOCALE): string {
  if (from === to) return dayMonth(from, locales);
  return closeUp(formatter(locales, DAY_MONTH).formatRange(asUtc(from), asUtc(to)), from, to);
}

/** "14–22 Jun 2026", "28 Dec 2025 – 3 Jan 2026": a range with its year. */
export function fullRange(from: string, to: string, locales: Locales = DEFAULT_LOCALE): string {
  if (from === to) return fullDate(from, locales);
  return closeUp(formatter(locales, FULL).formatRange(asUtc(from), asUtc(to)), from, to);
}

/** "14 Jun 2026, 6:10" (the locale's clock): an instant in the garden's own time zone. */
export function instant(iso: string | Date, timeZone: string, locales: Locales = DEFAULT_LOCALE): string {
  return formatter(locales, { ...FULL, hour: 'numeric', minute: '2-digit' }, timeZone).format(typeof iso === 'string' ? new Date(iso) : iso);
}

/*
 * Text the server words once and keeps (progress summaries, alert titles and reasons) cannot know
 * who will read it. It carries its dates as tokens instead, and every way out resolves them in the
 * reader's language: API answers (server/lib/locale.ts) and e-mail (DEFAULT_LOCALE).
 */
const TOKEN = /⟦(\d{4}-\d{2}-\d{2}|--\d{2}-\d{2})(?:\/(\d{4}-\d{2}-\d{2}))?⟧/gu;

/** A calendar day in stored text, shown as dayMonth when read. */
export function dayToken(day: string): string {
  return `⟦${day}⟧`;
}

/** A day of any year ('MM-DD', ISO 8601's --MM-DD) in stored text, shown as a day and month, never with a year. */
export function monthDayToken(monthDay: string): string {
  return `⟦--${monthDay}⟧`;
}

/** A range of days in stored text, shown as dayRange when read. */
export function rangeToken(from: string, to: string): string {
  return from === to ? dayToken(from) : `⟦${from}/${to}⟧`;
}

/**
 * The text with every date token worded in these languages: "14 Jun", or "14 Jun 2025" for a day
 * outside the year of `today` (the reader's; the server passes its own UTC day). A token that is
 * not a real day is left as it is.
 */
export function resolveDates(text: string, locales: Locales = DEFAULT_LOCALE, today = new Date().toISOString().slice(0, 10)): string {
  if (!text.includes('⟦')) return text;
  return text.replace(TOKEN, (whole, from: string, to?: string) => {
    try {
      if (from.startsWith('--')) return dayMonth(`2000${from.slice(1)}`, locales); // a leap year: 29 Feb exists
      if (!to) return dayInContext(from, today, locales);
      const sameYear = from.slice(0, 4) === to.slice(0, 4) && from.slice(0, 4) === today.slice(0, 4);
      return sameYear ? dayRange(from, to, locales) : fullRange(from, to, locales);
    } catch {
      return whole;
    }
  });
}



