import type { AttentionDto } from '../plantings/attention';
import { z } from 'zod';
import { idSchema, isoDateSchema, notesSchema, nullableNumber, pageQueryShape, sortOrderSchema } from './records';
import type { Page } from './records';
import type { ProgressSummaryDto } from './progress';

export const PLANTING_METHODS = ['direct-sow', 'transplant', 'indoor-start'] as const;
export type PlantingMethod = (typeof PLANTING_METHODS)[number];
export const METHOD_WORDS: Record<PlantingMethod, string> = {
  'direct-sow': 'Direct sow',
  transplant: 'Transplant',
  'indoor-start': 'Indoor start',
};

export const PLANTING_STATUSES = ['planned', 'growing', 'harvested', 'bolted', 'failed'] as const;
export type PlantingStatus = (typeof PLANTING_STATUSES)[number];
export const STATUS_WORDS: Record<PlantingStatus, string> = {
  planned: 'Planned',
  growing: 'Growing',
  harvested: 'Harvested',
  bolted: 'Bolted',
  failed: 'Failed',
};

export const PLANTING_QUANTITY_UNITS = ['plants', 'seeds', 'row-m', 'grams'] as const;
export type PlantingQuantityUnit = (typeof PLANTING_QUANTITY_UNITS)[number];
export const PLANTING_UNIT_WORDS: Record<PlantingQuantityUnit, string> = {
  plants: 'plants',
  seeds: 'seeds',
  'row-m': 'm of row',
  grams: 'g of seed',
};

/** The dated stages of a planting, in the order they happen. */
export const STAGE_FIELDS = ['sownOn', 'emergedOn', 'thinnedOn', 'transplantedOn', 'firstHarvestOn', 'lastHarvestOn', 'boltedOn'] as const;
export type StageField = (typeof STAGE_FIELDS)[number];
export const STAGE_WORDS: Record<StageField, string> = {
  sownOn: 'Sown',
  emergedOn: 'Emerged',
  thinnedOn: 'Thinned',
  transplantedOn: 'Transplanted',
  firstHarvestOn: 'First harvest',
  lastHarvestOn: 'Last harvest',
  boltedOn: 'Bolted',
};

const stage = (what: string) => isoDateSchema(what).nullable();

const plantingShape = {
  bedId: idSchema('Bed'),
  varietyId: idSchema('Variety'),
  seedLotId: idSchema('Seed lot').nullable(),
  method: z.enum(PLANTING_METHODS, { error: 'Method must be direct sow, transplant or indoor start.' }),
  status: z.enum(PLANTING_STATUSES, { error: 'Status must be planned, growing, harvested, bolted or failed.' }),
  quantity: nullableNumber('Quantity', 0, 1_000_000),
  quantityUnit: z.enum(PLANTING_QUANTITY_UNITS, { error: 'Quantity is counted in plants, seeds, metres of row or grams of seed.' }),
  sownOn: stage('Sowing date'),
  emergedOn: stage('Emergence date'),
  thinnedOn: stage('Thinning date'),
  transplantedOn: stage('Transplant date'),
  firstHarvestOn: stage('First harvest date'),
  lastHarvestOn: stage('Last harvest date'),
  boltedOn: stage('Bolting date'),
  notes: notesSchema,
};

type PlantingFields = { [K in keyof typeof plantingShape]?: z.infer<(typeof plantingShape)[K]> };

/** Dates must follow each other; a planting needs a start (sowing or transplant) unless it is only planned. */
function checkStages(p: PlantingFields, ctx: z.RefinementCtx, complete: boolean) {
  const after = (later: StageField, earlier: StageField, message: string) => {
    const a = p[later];
    const b = p[earlier];
    if (a && b && a < b) ctx.addIssue({ code: 'custom', path: [later], message });
  };
  after('emergedOn', 'sownOn', 'Emergence cannot come before sowing.');
  after('thinnedOn', 'sownOn', 'Thinning cannot come before sowing.');
  after('transplantedOn', 'sownOn', 'Transplanting cannot come before sowing.');
  after('firstHarvestOn', 'sownOn', 'Harvest cannot come before sowing.');
  after('firstHarvestOn', 'transplantedOn', 'Harvest cannot come before transplanting.');
  after('lastHarvestOn', 'firstHarvestOn', 'The last harvest cannot come before the first.');
  after('boltedOn', 'sownOn', 'Bolting cannot come before sowing.');
  if (complete && p.status !== 'planned' && !p.sownOn && !p.transplantedOn) {
    ctx.addIssue({ code: 'custom', path: ['sownOn'], message: 'Give the sowing date (or the transplant date for bought plants).' });
  }
  if (complete && p.status === 'harvested' && !p.firstHarvestOn) {
    ctx.addIssue({ code: 'custom', path: ['firstHarvestOn'], message: 'A harvested planting needs its first harvest date.' });
  }
  if (complete && p.status === 'bolted' && !p.boltedOn) {
    ctx.addIssue({ code: 'custom', path: ['boltedOn'], message: 'A bolted planting needs the date it bolted.' });
  }
}

export const plantingCreateSchema = z.strictObject(plantingShape).superRefine((p, ctx) => checkStages(p, ctx, true));
export type PlantingCreateInput = z.infer<typeof plantingCreateSchema>;

/** A partial change; the service re-checks the merged record with plantingCreateSchema. */
export const plantingUpdateSchema = z
  .strictObject(plantingShape)
  .partial()
  .superRefine((p, ctx) => checkStages(p, ctx, false));
export type PlantingUpdateInput = z.infer<typeof plantingUpdateSchema>;

export const PLANTING_SORTS = ['sown', 'crop', 'variety', 'bed', 'status', 'progress', 'ready', 'risk'] as const;
export type PlantingSort = (typeof PLANTING_SORTS)[number];

export const plantingListQuerySchema = z.strictObject({
  status: z.enum(PLANTING_STATUSES, { error: 'Unknown status.' }).optional(),
  bedId: z.coerce.number().int().min(1).optional(),
  varietyId: z.coerce.number().int().min(1).optional(),
  seedLotId: z.coerce.number().int().min(1).optional(),
  crop: z.string().max(40).optional(),
  q: z.string().trim().max(100).optional(),
  sownFrom: z.iso.date().optional(),
  sownTo: z.iso.date().optional(),
  /** A growing season by its start year: '2025' is the 2025 season north, the 2025–26 season south. */
  season: z.coerce.number({ error: 'Season must be a year, e.g. 2025.' }).int({ error: 'Season must be a year, e.g. 2025.' }).min(1900, { error: 'Season must be a year, e.g. 2025.' }).max(2200, { error: 'Season must be a year, e.g. 2025.' }).optional(),
  sort: z.enum(PLANTING_SORTS, { error: 'Sort by sown, crop, variety, bed, status, progress, ready or risk.' }).default('sown'),
  order: sortOrderSchema,
  ...pageQueryShape,
});
export type PlantingListQuery = z.input<typeof plantingListQuerySchema>;

/** A planting not yet saved, for the new-planting form's harvest preview (nothing is stored). */
export const plantingPreviewQuerySchema = z.strictObject({
  varietyId: z.coerce.number({ error: 'Choose a variety.' }).int().min(1, { error: 'Choose a variety.' }),
  method: z.enum(PLANTING_METHODS, { error: 'Method must be direct sow, transplant or indoor start.' }),
  sownOn: isoDateSchema('Sowing date').optional(),
  transplantedOn: isoDateSchema('Transplant date').optional(),
});
export type PlantingPreviewQuery = z.infer<typeof plantingPreviewQuerySchema>;

export interface PlantingPreviewDto {
  /** The unit of `target` (°F-days or °C-days). */
  unit: 'F' | 'C';
  target: number | null;
  /** Where the target comes from, in words. */
  targetNote: string;
  startEvent: { kind: 'sowing' | 'transplant'; on: string } | null;
  /** Why there is no start yet ("No transplant date yet: …"), else null. */
  startReason: string | null;
  maturity: { p10: string | null; p50: string | null; p90: string | null; kind: 'analog' | 'forecast' | 'observed' | 'recorded' | 'none'; note: string };
  /**
   * For a crop that bolts: how many of the garden's past seasons, started this day, had high bolt
   * risk in the harvest window; `warning` in words when that is half of them or more.
   */
  boltSeason: { highShare: number; years: number; warning: string | null } | null;
}

export const LOG_KINDS = ['watered', 'fed', 'thinned', 'observation', 'harvest', 'bolted', 'photo'] as const;
export type LogKind = (typeof LOG_KINDS)[number];
export const LOG_KIND_WORDS: Record<LogKind, string> = {
  watered: 'Watered',
  fed: 'Fed',
  thinned: 'Thinned',
  observation: 'Observation',
  harvest: 'Harvest',
  bolted: 'Bolted',
  photo: 'Photo',
};

export const HARVEST_UNITS = ['kg', 'g', 'lb', 'count', 'bunches'] as const;
export type HarvestUnit = (typeof HARVEST_UNITS)[number];
export const HARVEST_UNIT_WORDS: Record<HarvestUnit, string> = { kg: 'kg', g: 'g', lb: 'lb', count: 'pieces', bunches: 'bunches' };

export const logEntryCreateSchema = z
  .strictObject({
    entryOn: isoDateSchema('Date'),
    // A photo entry is written with its photo by the upload; on its own it would point at nothing.
    kind: z.enum(LOG_KINDS, { error: 'Choose what happened.' }).refine((k) => k !== 'photo', 'Photos are added by uploading the photo, not as a log entry.'),
    amount: nullableNumber('Amount', 0, 1_000_000).optional(),
    amountUnit: z.enum(HARVEST_UNITS, { error: 'Unknown unit.' }).nullable().optional(),
    note: z
      .string({ error: 'The note must be text.' })
      .trim()
      .max(1000, 'The note must be at most 1000 characters.')
      .refine((s) => !/[⟦⟧]/u.test(s), 'The note cannot contain the characters ⟦ and ⟧.')
      .optional(),
  })
  .superRefine((e, ctx) => {
    if (e.amount != null && !e.amountUnit) ctx.addIssue({ code: 'custom', path: ['amountUnit'], message: 'Give the unit of the amount.' });
    if (e.amount != null && e.kind !== 'harvest') ctx.addIssue({ code: 'custom', path: ['amount'], message: 'Only a harvest has an amount.' });
  });
export type LogEntryCreateInput = z.infer<typeof logEntryCreateSchema>;

export const logListQuerySchema = z.strictObject({ ...pageQueryShape });

export interface LogEntryDto {
  id: number;
  entryOn: string;
  kind: LogKind;
  amount: number | null;
  amountUnit: HarvestUnit | null;
  note: string;
  photoId: number | null;
  by: string | null;
  createdAt: string;
}

export interface PhotoDto {
  id: number;
  plantingId: number;
  takenOn: string;
  caption: string;
  width: number;
  height: number;
  bytes: number;
  /** Served only through the access-checked API route. */
  url: string;
  by: string | null;
}

export const photoFieldsSchema = z.strictObject({
  caption: z
    .string()
    .trim()
    .max(300, 'The caption must be at most 300 characters.')
    .refine((s) => !/[⟦⟧]/u.test(s), 'The caption cannot contain the characters ⟦ and ⟧.')
    .optional(),
  takenOn: isoDateSchema('Photo date').optional(),
});

export interface NextEventDto {
  label: string;
  /** From the degree-day projection where there is one, else from the planting's own dates. */
  on: string | null;
  basis: string;
}

export interface PlantingDto {
  id: number;
  bed: { id: number; name: string };
  variety: { id: number; name: string; dtmDays: number | null; dtmFrom: string; boltTolerance: number | null };
  crop: { key: string; name: string; season: 'cool' | 'warm' };
  seedLot: { id: number; label: string } | null;
  method: PlantingMethod;
  status: PlantingStatus;
  quantity: number | null;
  quantityUnit: PlantingQuantityUnit;
  sownOn: string | null;
  emergedOn: string | null;
  thinnedOn: string | null;
  transplantedOn: string | null;
  firstHarvestOn: string | null;
  lastHarvestOn: string | null;
  boltedOn: string | null;
  notes: string;
  /** The growing season (hemisphere-aware label, e.g. '2025' or '2025–26'). */
  season: string | null;
  nextEvent: NextEventDto | null;
  logCount: number;
  /** Progress in heat (list and detail answers); null when it cannot be computed (no location, no dates). */
  progress?: ProgressSummaryDto | null;
  /** A harvest past its expected window, or nothing recorded for weeks (shared/plantings/attention.ts). */
  attention: AttentionDto;
}

export type PlantingPage = Page<PlantingDto>;

export interface ImportProblem {
  line: number;
  column: string;
  message: string;
}

export interface ImportReport {
  plantingsCreated: number;
  plantingsUpdated: number;
  plantingsUnchanged: number;
  logEntriesCreated: number;
  logEntriesExisting: number;
}

/** Columns of the plantings CSV, in order; import reads the same layout export writes. */
export const PLANTING_CSV_COLUMNS = [
  'bed',
  'crop',
  'variety',
  'seed_lot',
  'method',
  'status',
  'quantity',
  'quantity_unit',
  'sown',
  'emerged',
  'thinned',
  'transplanted',
  'first_harvest',
  'last_harvest',
  'bolted',
  'notes',
  'log_date',
  'log_kind',
  'log_amount',
  'log_unit',
  'log_note',
] as const;
