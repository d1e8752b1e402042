import { z } from 'zod';
import { CROP_KEYS } from '../crops/library';
import { nameSchema, notesSchema, nullableInt, nullableNumber, pageQueryShape } from './records';
import type { Page } from './records';
import type { TraitGuidance } from '../crops/guidance';
import type { DegreeDayBasis } from '../crops/basis';

export const DTM_FROM = ['sowing', 'emergence', 'transplant'] as const;
export type DtmFrom = (typeof DTM_FROM)[number];
export const DTM_FROM_WORDS: Record<DtmFrom, string> = {
  sowing: 'from sowing',
  emergence: 'from emergence',
  transplant: 'from transplanting',
};

export const VARIETY_TRAITS = ['f1-hybrid', 'open-pollinated', 'heirloom', 'organic', 'treated', 'pelleted'] as const;
export type VarietyTrait = (typeof VARIETY_TRAITS)[number];
export const TRAIT_WORDS: Record<VarietyTrait, string> = {
  'f1-hybrid': 'F1 hybrid',
  'open-pollinated': 'Open-pollinated',
  heirloom: 'Heirloom',
  organic: 'Organic',
  treated: 'Treated',
  pelleted: 'Pelleted',
};

/** 1 … 5 as on most catalogue scales; the thermal engine reads bolt tolerance the same way. */
export const RATING_WORDS = ['', 'Poor', 'Fair', 'Average', 'Good', 'Excellent'] as const;

const rating = (what: string) => nullableInt(what, 1, 5);

const varietyShape = {
  cropKey: z
    .string({ error: 'Crop is required.' })
    .refine((k) => CROP_KEYS.includes(k), 'Choose a crop from the library.'),
  name: nameSchema('Name', 100),
  dtmDays: nullableInt('Days to maturity', 1, 400, ' days'),
  dtmFrom: z.enum(DTM_FROM, { error: 'Say what the days to maturity count from: sowing, emergence or transplant.' }),
  emergenceDaysMin: nullableInt('Days to emergence (fewest)', 1, 60, ' days'),
  emergenceDaysMax: nullableInt('Days to emergence (most)', 1, 60, ' days'),
  boltTolerance: rating('Bolt tolerance'),
  heatTolerance: rating('Heat tolerance'),
  traits: z
    .array(z.enum(VARIETY_TRAITS, { error: 'Unknown trait.' }), { error: 'Traits must be a list.' })
    .max(VARIETY_TRAITS.length)
    .refine((t) => new Set(t).size === t.length, 'A trait is listed twice.'),
  containerFriendly: z.boolean({ error: 'Container-friendly must be yes or no.' }),
  sunHours: nullableNumber('Sun', 0, 16, ' hours a day'),
  waterCmPerWeek: nullableNumber('Water', 0, 20, ' cm a week'),
  sowDepthCm: nullableNumber('Sowing depth', 0, 15, ' cm'),
  spacingCm: nullableNumber('Spacing', 1, 300, ' cm'),
  thinSpacingCm: nullableNumber('Thinning spacing', 1, 300, ' cm'),
  /**
   * °C-days; replaces the target derived from days to maturity. The server records the crop's
   * method with it (VarietyDto.gddTargetBasis); clients never send that.
   */
  gddTargetOverrideC: nullableNumber('Degree-day target', 1, 10_000),
  notes: notesSchema,
};

type VarietyFields = { [K in keyof typeof varietyShape]?: z.infer<(typeof varietyShape)[K]> };

function crossCheck(v: VarietyFields, ctx: z.RefinementCtx) {
  if (v.emergenceDaysMin != null && v.emergenceDaysMax != null && v.emergenceDaysMin > v.emergenceDaysMax) {
    ctx.addIssue({ code: 'custom', path: ['emergenceDaysMax'], message: 'The most days to emergence cannot be fewer than the fewest.' });
  }
  const traits = v.traits ?? [];
  if (traits.includes('f1-hybrid') && (traits.includes('open-pollinated') || traits.includes('heirloom'))) {
    ctx.addIssue({ code: 'custom', path: ['traits'], message: 'An F1 hybrid cannot also be open-pollinated or heirloom.' });
  }
  if (v.dtmFrom === 'emergence' && v.dtmDays != null && v.emergenceDaysMin == null && v.emergenceDaysMax == null) {
    ctx.addIssue({
      code: 'custom',
      path: ['emergenceDaysMax'],
      message: 'Days to maturity count from emergence: add the days to emergence so the harvest date can be placed after sowing.',
    });
  }
}

export const varietyCreateSchema = z.strictObject(varietyShape).superRefine(crossCheck);
export type VarietyCreateInput = z.infer<typeof varietyCreateSchema>;

export const varietyUpdateSchema = z.strictObject(varietyShape).partial().superRefine(crossCheck);
export type VarietyUpdateInput = z.infer<typeof varietyUpdateSchema>;

export const varietyListQuerySchema = z.strictObject({
  crop: z.string().max(40).optional(),
  trait: z.enum(VARIETY_TRAITS).optional(),
  q: z.string().trim().max(100).optional(),
  ...pageQueryShape,
});
export type VarietyListQuery = z.input<typeof varietyListQuerySchema>;

export interface GddTargetDto {
  /** °C-days from the start event (sowing, or transplanting for transplant DTMs); null when unknown. */
  valueC: number | null;
  basis: 'override' | 'derived' | 'none';
  countsFrom: 'sowing' | 'transplant' | null;
  /** How it was found, or why it could not be. */
  explanation: string;
  /** Spread of the derivation over past years, °C-days. */
  p10C: number | null;
  p90C: number | null;
  /** Which method a grower's target was counted with, or why it is not used now. */
  basisNote?: string;
  /** True when the grower's target was counted with another method than the crop now uses. */
  stale: boolean;
}

export interface VarietyDto {
  id: number;
  crop: { key: string; name: string; season: 'cool' | 'warm' };
  name: string;
  dtmDays: number | null;
  dtmFrom: DtmFrom;
  emergenceDaysMin: number | null;
  emergenceDaysMax: number | null;
  boltTolerance: number | null;
  heatTolerance: number | null;
  traits: VarietyTrait[];
  containerFriendly: boolean;
  sunHours: number | null;
  waterCmPerWeek: number | null;
  sowDepthCm: number | null;
  spacingCm: number | null;
  thinSpacingCm: number | null;
  gddTargetOverrideC: number | null;
  /** What the override was counted with; null without an override. */
  gddTargetBasis: DegreeDayBasis | null;
  notes: string;
  guidance: TraitGuidance[];
  /** On the list and the single-variety answers; the list works out a page's targets in one pass. */
  gddTarget?: GddTargetDto;
}

export type VarietyPage = Page<VarietyDto>;

/** What this garden's own harvests say a variety needs (server/modules/varieties/calibration.ts). */
export interface CalibrationDto {
  /** The unit of every degree-day figure here except `medianC`. */
  unit: 'F' | 'C';
  /** Harvests measured; `unmeasured` had no start event or days without weather before the harvest. */
  count: number;
  unmeasured: number;
  median: number | null;
  /** The median in °C-days, as a grower's target is stored. */
  medianC: number | null;
  p25: number | null;
  p75: number | null;
  min: number | null;
  max: number | null;
  /** Words when few harvests back the figure; null when enough do. */
  caution: string | null;
  harvests: { plantingId: number; startOn: string; firstHarvestOn: string; degreeDays: number; days: number }[];
}
