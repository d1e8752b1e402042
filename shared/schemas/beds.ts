import { z } from 'zod';
import { nameSchema, notesSchema, nullableNumber, pageQueryShape } from './records';
import type { Page } from './records';

export const BED_KINDS = ['bed', 'raised-bed', 'plot', 'row', 'container'] as const;
export type BedKind = (typeof BED_KINDS)[number];

export const BED_KIND_WORDS: Record<BedKind, string> = {
  bed: 'Bed',
  'raised-bed': 'Raised bed',
  plot: 'Plot',
  row: 'Row',
  container: 'Container',
};

export const bedCreateSchema = z.strictObject({
  name: nameSchema('Name', 80),
  kind: z.enum(BED_KINDS, { error: 'Kind must be bed, raised bed, plot, row or container.' }),
  lengthM: nullableNumber('Length', 0.1, 1000, ' m').optional(),
  widthM: nullableNumber('Width', 0.1, 1000, ' m').optional(),
  notes: notesSchema.optional(),
});
export type BedCreateInput = z.infer<typeof bedCreateSchema>;

export const bedUpdateSchema = bedCreateSchema.partial();
export type BedUpdateInput = z.infer<typeof bedUpdateSchema>;

export const bedListQuerySchema = z.strictObject({
  q: z.string().trim().max(80).optional(),
  kind: z.enum(BED_KINDS).optional(),
  ...pageQueryShape,
});
export type BedListQuery = z.input<typeof bedListQuerySchema>;

export interface BedDto {
  id: number;
  name: string;
  kind: BedKind;
  lengthM: number | null;
  widthM: number | null;
  /** Length × width, m², when both are known. */
  areaM2: number | null;
  notes: string;
  /** Plantings in this bed that are planned or growing. */
  activePlantings: number;
  /** Every planting on record in this bed, past ones included; a bed with any cannot be deleted. */
  plantingsOnRecord: number;
}

export type BedPage = Page<BedDto>;
