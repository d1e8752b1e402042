/** The garden's audit trail: the list query (owners' page and route alike) and the entries it answers. */
import { z } from 'zod';
import { idParamSchema, isoDateSchema, pageQueryShape } from './records';

export const AUDIT_ENTITIES = ['planting', 'variety', 'seed-lot', 'germination-test', 'bed', 'weather-import', 'member', 'invitation', 'garden-settings', 'crop-settings', 'climate', 'soil-reading'] as const;
export type AuditEntityKind = (typeof AUDIT_ENTITIES)[number];

/** What each kind of record is called on the page, in the filter and beside each entry. */
export const AUDIT_ENTITY_WORDS: Record<AuditEntityKind, string> = {
  planting: 'Planting',
  variety: 'Variety',
  'seed-lot': 'Seed lot',
  'germination-test': 'Germination test',
  bed: 'Bed',
  'weather-import': 'Weather import',
  member: 'Member',
  invitation: 'Invitation',
  'garden-settings': 'Garden settings',
  'crop-settings': 'Crop settings',
  climate: 'Climate',
  'soil-reading': 'Soil reading',
};

export const auditListQuerySchema = z
  .strictObject({
    entity: z.enum(AUDIT_ENTITIES, { error: 'Record type must be one of: ' + AUDIT_ENTITIES.join(', ') + '.' }).optional(),
    actor: idParamSchema.optional(),
    from: isoDateSchema('From').optional(),
    to: isoDateSchema('To').optional(),
    ...pageQueryShape,
  })
  .refine((q) => !q.from || !q.to || q.from <= q.to, { path: ['to'], message: 'To must be on or after From.' });
export type AuditListQuery = z.input<typeof auditListQuerySchema>;

export interface AuditChangeDto {
  field: string;
  /** The field in plain words ("sowing date"). */
  label: string;
  /** Absent for a created record's fields; stored values as they are (dates ISO, lengths in m, temperatures in °C). */
  from?: unknown;
  /** Absent for a deleted record's fields. */
  to?: unknown;
}

export interface AuditEntryDto {
  id: number;
  /** ISO instant, UTC. */
  at: string;
  /** `id` null for the system or an account that is gone; the name is kept with the entry. */
  actor: { id: number | null; name: string };
  entity: AuditEntityKind;
  entityId: string | null;
  action: string;
  summary: string;
  changes: AuditChangeDto[];
}

/** The people who appear in the trail, for the "who" filter. */
export interface AuditActorDto {
  id: number;
  name: string;
}

export interface AuditPageDto {
  items: AuditEntryDto[];
  page: number;
  pageSize: number;
  total: number;
  /** Everyone who has an entry in this garden's trail, by name (for the filter). */
  actors: AuditActorDto[];
}
