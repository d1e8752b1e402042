/** Pieces every garden-records schema shares: record ids, paging, dates and free text. */
import { z } from 'zod';

export const MAX_ID = 2_147_483_647;

/** A record id in a JSON body. */
export const idSchema = (what: string) =>
  z.number({ error: `${what} must be chosen.` }).int(`${what} must be chosen.`).min(1, `${what} must be chosen.`).max(MAX_ID, `${what} is not a record id.`);

/** A record id in a path or query string, where it arrives as text. */
export const idParamSchema = z
  .string()
  .regex(/^[1-9]\d{0,9}$/, 'Must be a positive whole number.')
  .transform(Number)
  .refine((n) => n <= MAX_ID, 'Must be a positive whole number.');

export const isoDateSchema = (what: string) =>
  z.iso.date({ error: `${what} must be a date (YYYY-MM-DD).` }).refine((d) => d >= '1900-01-01' && d <= '2199-12-31', `${what} is out of range.`);

/**
 * Characters a name must not hold: control characters (NUL, line breaks, …), bidirectional
 * overrides and isolates that reorder what is shown (U+202A–U+202E, U+2066–U+2069, Trojan Source,
 * CVE-2021-42574) and direction marks (U+200E, U+200F, U+061C), the brackets ⟦ ⟧ that mark dates
 * in the server's stored text (shared/format/dates.ts), and unpaired surrogates, which are not
 * text at all and cannot be stored.
 */
const HIDDEN = /[\p{Cc}\u061C\u200E\u200F\u202A-\u202E\u2066-\u2069⟦⟧]/u;
const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

/** A name a person reads and others must tell apart: NFC, trimmed, no hidden characters, 1–max long. */
export const nameSchema = (what: string, max: number) =>
  z
    .string({ error: `${what} is required.` })
    .refine((s) => !LONE_SURROGATE.test(s), `${what} contains a broken character; type it again.`)
    .transform((s) => s.normalize('NFC').trim())
    .pipe(
      z
        .string()
        .min(1, `${what} is required.`)
        .max(max, `${what} must be at most ${max} characters.`)
        .refine((s) => !HIDDEN.test(s), `${what} cannot contain control characters or hidden direction marks.`),
    );

export const notesSchema = z
  .string({ error: 'Notes must be text.' })
  .max(2000, 'Notes must be at most 2000 characters.')
  .refine((s) => !/[⟦⟧]/u.test(s), 'Notes cannot contain the characters ⟦ and ⟧.');

export const optionalText = (what: string, max: number) =>
  z.string({ error: `${what} must be text.` }).trim().max(max, `${what} must be at most ${max} characters.`);

export const pageQueryShape = {
  page: z.coerce.number({ error: 'Page must be a number.' }).int().min(1, 'Page starts at 1.').max(100_000).default(1),
  pageSize: z.coerce.number({ error: 'Page size must be a number.' }).int().min(1).max(200, 'Page size is at most 200.').default(50),
};

export const sortOrderSchema = z.enum(['asc', 'desc'], { error: 'Order must be asc or desc.' }).default('asc');

export interface Page<T> {
  items: T[];
  page: number;
  pageSize: number;
  total: number;
}

/** A nullable number field that forms can leave blank. */
export const nullableNumber = (what: string, min: number, max: number, unit = '') =>
  z
    .number({ error: `${what} must be a number.` })
    .min(min, `${what} must be at least ${min}${unit}.`)
    .max(max, `${what} must be at most ${max}${unit}.`)
    .nullable();

export const nullableInt = (what: string, min: number, max: number, unit = '') =>
  z
    .number({ error: `${what} must be a whole number.` })
    .int(`${what} must be a whole number.`)
    .min(min, `${what} must be at least ${min}${unit}.`)
    .max(max, `${what} must be at most ${max}${unit}.`)
    .nullable();
