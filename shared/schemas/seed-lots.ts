import { z } from 'zod';
import { idSchema, isoDateSchema, notesSchema, nullableInt, nullableNumber, optionalText, pageQueryShape } from './records';
import type { Page } from './records';

export const QUANTITY_UNITS = ['seeds', 'grams'] as const;
export type SeedQuantityUnit = (typeof QUANTITY_UNITS)[number];

const lotShape = {
  varietyId: idSchema('Variety'),
  supplier: optionalText('Supplier', 120),
  lotNumber: optionalText('Lot number', 60),
  packedForYear: nullableInt('Packed-for year', 1950, 2100),
  quantity: nullableNumber('Quantity', 0, 10_000_000),
  quantityUnit: z.enum(QUANTITY_UNITS, { error: 'Quantity is counted in seeds or grams.' }),
  storageNotes: notesSchema,
};

export const seedLotCreateSchema = z.strictObject(lotShape);
export type SeedLotCreateInput = z.infer<typeof seedLotCreateSchema>;
export const seedLotUpdateSchema = z.strictObject(lotShape).partial();
export type SeedLotUpdateInput = z.infer<typeof seedLotUpdateSchema>;

export const seedLotListQuerySchema = z.strictObject({
  varietyId: z.coerce.number().int().min(1).optional(),
  crop: z.string().max(40).optional(),
  q: z.string().trim().max(100).optional(),
  ...pageQueryShape,
});
export type SeedLotListQuery = z.input<typeof seedLotListQuerySchema>;

export const germinationTestCreateSchema = z
  .strictObject({
    testedOn: isoDateSchema('Test date'),
    seedsTested: z.number({ error: 'Seeds tested must be a whole number.' }).int('Seeds tested must be a whole number.').min(1, 'Test at least 1 seed.').max(10_000),
    germinated: z.number({ error: 'Seeds germinated must be a whole number.' }).int('Seeds germinated must be a whole number.').min(0, 'Seeds germinated cannot be negative.').max(10_000),
    notes: notesSchema.optional(),
  })
  .refine((t) => t.germinated <= t.seedsTested, { path: ['germinated'], message: 'More seeds germinated than were tested.' });
export type GerminationTestCreateInput = z.infer<typeof germinationTestCreateSchema>;

export const seedsToSowQuerySchema = z.strictObject({
  plants: z.coerce.number({ error: 'Plants wanted must be a whole number.' }).int('Plants wanted must be a whole number.').min(1, 'Want at least 1 plant.').max(1_000_000),
  /** Share of germinating seeds expected to come up in the field (0.8 = 80 %). */
  emergenceFactor: z.coerce.number({ error: 'Field emergence must be a number.' }).gt(0, 'Field emergence must be above 0.').max(1, 'Field emergence is at most 1 (100 %).').default(1),
});

export interface GerminationTestDto {
  id: number;
  testedOn: string;
  seedsTested: number;
  germinated: number;
  /** germinated ÷ tested × 100 (thermal engine). */
  percent: number;
  notes: string;
}

export type ViabilityStatus = 'tested' | 'fresh' | 'ageing' | 'past-seed-life' | 'unknown';

export interface ViabilityDto {
  status: ViabilityStatus;
  /** Seasons since the packed-for year; null without one. */
  ageYears: number | null;
  seedLifeYears: number | null;
  message: string;
}

export interface SeedLotDto {
  id: number;
  variety: { id: number; name: string; cropKey: string; cropName: string; traits: string[] };
  supplier: string;
  lotNumber: string;
  packedForYear: number | null;
  quantity: number | null;
  quantityUnit: SeedQuantityUnit;
  storageNotes: string;
  latestTest: GerminationTestDto | null;
  viability: ViabilityDto;
  /** Only on the single-lot answer. */
  tests?: GerminationTestDto[];
}

export interface SeedsToSowDto {
  plants: number;
  emergenceFactor: number;
  germinationPercent: number;
  basedOn: { testId: number; testedOn: string };
  seeds: number;
}

export type SeedLotPage = Page<SeedLotDto>;
