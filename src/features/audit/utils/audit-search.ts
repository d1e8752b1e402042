import type { AuditEntityKind } from '#shared/schemas/audit';

/** What the page asks the trail for; every part is also in the address. */
export interface AuditQuery {
  entity?: AuditEntityKind;
  /** A member's user id, as the address and the query string carry it. */
  actor?: string;
  from?: string;
  to?: string;
  page?: number;
}

/** `?entity=planting&actor=7&page=2` with only what is set (page 1 left out). */
export function auditSearchParams(query: AuditQuery): URLSearchParams {
  const params = new URLSearchParams();
  if (query.entity) params.set('entity', query.entity);
  if (query.actor) params.set('actor', query.actor);
  if (query.from) params.set('from', query.from);
  if (query.to) params.set('to', query.to);
  if (query.page && query.page > 1) params.set('page', String(query.page));
  return params;
}
