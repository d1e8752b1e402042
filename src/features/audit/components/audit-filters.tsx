import { AUDIT_ENTITIES, AUDIT_ENTITY_WORDS } from '#shared/schemas/audit';
import type { AuditActorDto, AuditEntityKind } from '#shared/schemas/audit';
import type { AuditQuery } from '@/features/audit/utils/audit-search';

const CONTROL = 'min-h-11 w-full min-w-0 rounded-md border border-line bg-paper-raised px-3 py-2 text-loam';

/** Record type, member and days; an empty choice means all. Any change starts again at page 1. */
export function AuditFilters({ query, actors, onChange }: { query: AuditQuery; actors: AuditActorDto[]; onChange: (query: AuditQuery) => void }) {
  const set = (patch: Partial<AuditQuery>) => onChange({ ...query, ...patch, page: undefined });
  return (
    <form role="search" aria-label="Filter the changes" className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4" onSubmit={(e) => e.preventDefault()}>
      <label className="flex flex-col gap-1">
        <span className="font-semibold">Record type</span>
        <select className={CONTROL} value={query.entity ?? ''} onChange={(e) => set({ entity: (e.target.value || undefined) as AuditEntityKind | undefined })}>
          <option value="">All records</option>
          {AUDIT_ENTITIES.map((kind) => (
            <option key={kind} value={kind}>
              {AUDIT_ENTITY_WORDS[kind]}
            </option>
          ))}
        </select>
      </label>
      <label className="flex flex-col gap-1">
        <span className="font-semibold">Member</span>
        <select className={CONTROL} value={query.actor ?? ''} onChange={(e) => set({ actor: e.target.value || undefined })}>
          <option value="">Everyone</option>
          {actors.map((a) => (
            <option key={a.id} value={a.id}>
              {a.name}
            </option>
          ))}
        </select>
      </label>
      <label className="flex flex-col gap-1">
        <span className="font-semibold">From</span>
        <input type="date" className={CONTROL} value={query.from ?? ''} max={query.to} onChange={(e) => set({ from: e.target.value || undefined })} />
      </label>
      <label className="flex flex-col gap-1">
        <span className="font-semibold">To</span>
        <input type="date" className={CONTROL} value={query.to ?? ''} min={query.from} onChange={(e) => set({ to: e.target.value || undefined })} />
      </label>
    </form>
  );
}
