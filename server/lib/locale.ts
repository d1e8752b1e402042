/**
 * The reader's language for dates the server words (progress sentences, planting windows): the
 * first language of the request's Accept-Language that Intl knows, else DEFAULT_LOCALE. Text the
 * server stores or mails (alert messages, e-mail) uses DEFAULT_LOCALE so it never depends on who
 * happened to trigger it. The formatting itself is shared/format/dates.ts, the client's too.
 */
import { AsyncLocalStorage } from 'node:async_hooks';
import type { NextFunction, Request, Response } from 'express';
import { DEFAULT_LOCALE, resolveDates } from '#shared/format/dates';

const store = new AsyncLocalStorage<{ locale: string; today: string }>();
const known = new Map<string, string>();

/** The best language of an Accept-Language header that Intl supports (cached per header). */
export function localeOf(header: string | undefined): string {
  if (!header) return DEFAULT_LOCALE;
  let hit = known.get(header);
  if (hit === undefined) {
    const tags = header
      .split(',')
      .map((part) => {
        const [tag, ...params] = part.trim().split(';');
        const q = params.map((p) => /^\s*q=([\d.]+)\s*$/.exec(p)).find(Boolean);
        return { tag: tag.trim(), q: q ? Number(q[1]) : 1 };
      })
      .filter((t) => t.tag && t.tag !== '*' && t.q > 0 && /^[A-Za-z]{2,8}(-[A-Za-z0-9]{1,8})*$/.test(t.tag))
      .sort((a, b) => b.q - a.q);
    hit = DEFAULT_LOCALE;
    for (const t of tags) {
      try {
        const [supported] = Intl.DateTimeFormat.supportedLocalesOf([t.tag]);
        if (supported) {
          // Language, script and region only: extensions (-u-ca-…, -x-…) would make endless cache keys.
          hit = new Intl.Locale(supported).baseName;
          break;
        }
      } catch {
        // a malformed tag: try the next one
      }
    }
    if (known.size < 500) known.set(header, hit);
  }
  return hit;
}

/** Express middleware: the rest of the request reads its language through requestLocale(). */
export function localeContext(req: Request, _res: Response, next: NextFunction) {
  // The app's clock (the weather service's, which tests can move) says which year is "this year".
  const clock = req.app.locals.weather as { now?: () => Date } | undefined;
  const today = (clock?.now?.() ?? new Date()).toISOString().slice(0, 10);
  store.run({ locale: localeOf(req.headers['accept-language']), today }, next);
}

/** The language of the request being answered, or DEFAULT_LOCALE outside one. */
export function requestLocale(): string {
  return store.getStore()?.locale ?? DEFAULT_LOCALE;
}

/** The app's UTC day for the request being answered. */
export function requestToday(): string {
  return store.getStore()?.today ?? new Date().toISOString().slice(0, 10);
}

/**
 * JSON.stringify replacer for every API answer (app.set('json replacer')): date tokens in stored
 * text (shared/format/dates.ts) are worded in the reader's language on the way out.
 */
export function resolveDateTokens(_key: string, value: unknown): unknown {
  return typeof value === 'string' && value.includes('⟦') ? resolveDates(value, requestLocale(), requestToday()) : value;
}
