import type { AuditChangeDto, AuditEntityKind, AuditEntryDto } from '#shared/schemas/audit';
import type { AuditChanges } from './audit';
import { fieldWord } from './audit-words';
import type { AuditRow } from './audit.service';

function changesOf(json: string, entity: string): AuditChangeDto[] {
  let parsed: AuditChanges;
  try {
    parsed = JSON.parse(json) as AuditChanges;
  } catch {
    return [];
  }
  return Object.entries(parsed).map(([field, c]) => ({ field, label: fieldWord(field, entity), ...c }));
}

export function presentAuditEntry(row: AuditRow): AuditEntryDto {
  return {
    id: Number(row.id),
    at: new Date(row.created_at).toISOString(),
    actor: { id: row.actor_user_id, name: row.actor_name },
    entity: row.entity as AuditEntityKind,
    entityId: row.entity_id,
    action: row.action,
    summary: row.summary,
    changes: changesOf(row.changes, row.entity),
  };
}
