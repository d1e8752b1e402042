import { z } from 'zod';

/** The frost risks a plan can be made at: the share of past seasons a frost still came past the date. */
export const FROST_RISKS = ['10', '50', '90'] as const;
export type FrostRisk = (typeof FROST_RISKS)[number];

/** The plan of one variety: `GET /api/gardens/:gardenId/plan`. */
export const planQuerySchema = z.strictObject({
  varietyId: z.coerce.number({ error: 'Choose a variety.' }).int({ error: 'Choose a variety.' }).min(1, { error: 'Choose a variety.' }),
  frostRisk: z.enum(FROST_RISKS, { error: 'Frost risk must be 10, 50 or 90.' }).default('50'),
});
export type PlanQuery = z.input<typeof planQuerySchema>;

export interface PlanCandidateDto {
  /** The start day tried: a sowing day, or a transplant day for a variety counted from transplanting. */
  sowOn: string;
  /** Ready to pick, across the analog past years: by p10 of them, half, p90. null: not reached. */
  harvest: { p10: string | null; p50: string | null; p90: string | null };
  /** Share (0–1) of the analog years with high bolt risk during the harvest window. */
  boltHighShare: number;
  /** Clear of the frost rules at the chosen risk (tender crops after the last spring frost; ready before the first fall frost in most years). */
  frostOk: boolean;
  /** Analog years this start day was judged from. */
  years: number;
  recommended: boolean;
  /** Why, in words (may hold date tokens). */
  reason: string;
}

export interface PlanWindowDto {
  from: string;
  to: string;
  /** "spring window", "autumn window", … */
  name: string;
  reason: string;
}

export interface PlanExcludedDto {
  from: string;
  to: string;
  /** "midsummer", "late autumn", … */
  name: string;
  reason: string;
}

export interface PlanSuccessionDto {
  everyDays: number;
  from: string;
  to: string;
  words: string;
}

export interface PlanDto {
  variety: { id: number; name: string; cropName: string };
  /** The season planned: '2027', or '2026–27' south of the equator. */
  season: { label: string; from: string; to: string };
  frostRisk: FrostRisk;
  /** The start is a sowing or a transplanting (the variety's days to maturity count from it). */
  startKind: 'sowing' | 'transplant';
  tender: boolean;
  /** Frost dates at the chosen risk, in the planned season ('YYYY-MM-DD'), null when past seasons had none. */
  frost: { lastSpring: string | null; firstFall: string | null; seasons: number };
  candidates: PlanCandidateDto[];
  windows: PlanWindowDto[];
  excluded: PlanExcludedDto[];
  succession: PlanSuccessionDto | null;
  /** The plan in one or two sentences, or why there is none. */
  summary: string;
  /** How the plan was made, in words (rules of thumb marked as such). */
  method: string;
}
