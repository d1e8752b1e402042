import { z } from 'zod';
import { CROP_PARAMS, CROP_PARAM_KEYS } from '../crops/params';
import type { Confidence, CropParamKey, ParamGroup, ParamUnit } from '../crops/params';
import type { DegreeDayBasis } from '../crops/basis';

export const cropKeySchema = z.string().regex(/^[a-z][a-z-]{1,39}$/, 'Must be a crop key such as lettuce or bok-choy.');

function valueSchema(key: CropParamKey) {
  const meta = CROP_PARAMS[key];
  const label = meta.label;
  if (meta.kind === 'enum') return z.enum(meta.options as unknown as [string, ...string[]], { error: `${label} must be one of: ${meta.options.join(', ')}.` });
  if (meta.kind === 'boolean') return z.boolean({ error: `${label} must be yes or no.` });
  let n = z.number({ error: `${label} must be a number.` }).min(meta.min, `${label} must be at least ${meta.min}.`).max(meta.max, `${label} must be at most ${meta.max}.`);
  if ('integer' in meta && meta.integer) n = n.int(`${label} must be a whole number.`);
  return n.nullable();
}

/** One garden override: the value and why it was changed; null removes the override. */
const overrideSchema = (key: CropParamKey) =>
  z
    .strictObject({
      value: valueSchema(key),
      note: z.string().trim().max(300, 'The note must be at most 300 characters.').optional(),
    })
    .nullable()
    .optional();

export const cropOverridesUpdateSchema = z.strictObject({
  params: z.strictObject(Object.fromEntries(CROP_PARAM_KEYS.map((k) => [k, overrideSchema(k)])) as Record<CropParamKey, ReturnType<typeof overrideSchema>>),
});
export type CropOverridesUpdateInput = z.infer<typeof cropOverridesUpdateSchema>;

export const cropListQuerySchema = z.strictObject({
  season: z.enum(['cool', 'warm']).optional(),
  q: z.string().trim().max(60).optional(),
});

export interface CropParamDto {
  key: CropParamKey;
  label: string;
  group: ParamGroup;
  kind: 'number' | 'enum' | 'boolean';
  /** For numbers: C (°C), C-days (°C-days), h, days, years, cm. */
  unit: ParamUnit | null;
  value: number | string | boolean | null;
  source: string;
  /** Null for a garden's own value: its source is the note of whoever set it. */
  confidence: Confidence | null;
  origin: 'library' | 'garden';
  /** The shared default, present when this garden overrides it. */
  libraryDefault: { value: number | string | boolean | null; source: string; confidence: Confidence } | null;
  updatedAt: string | null;
  /**
   * Degree-day figures only: the method the value was counted with; `stale` when the crop now
   * counts with another, so the figure is not used until it is set again.
   */
  ddBasis?: DegreeDayBasis & { stale: boolean };
}

export interface CropDto {
  key: string;
  name: string;
  botanicalName: string;
  season: 'cool' | 'warm';
  overrides: number;
  params: CropParamDto[];
}
