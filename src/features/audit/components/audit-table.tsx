import { AUDIT_ENTITY_WORDS } from '#shared/schemas/audit';
import type { AuditChangeDto, AuditEntryDto } from '#shared/schemas/audit';
import { formatInstant } from '@/lib/format';
import { changeValue } from '@/features/audit/utils/change-value';

/** "sowing date: 2 Apr 2025 → 5 Apr 2025"; a created record shows only the new value, a deleted one only the old. */
function ChangeLine({ change, entity }: { change: AuditChangeDto; entity: string }) {
  const hasFrom = 'from' in change;
  const hasTo = 'to' in change;
  return (
    <li className="break-words">
      <span className="font-semibold">{change.label}:</span> {hasFrom && <span>{changeValue(change.field, change.from, entity)}</span>}
      {hasFrom && hasTo && <span> → </span>}
      {hasTo && <span>{changeValue(change.field, change.to, entity)}</span>}
    </li>
  );
}

// Below 48rem each row stacks as a card (the cells' own small labels show); wider, a plain table.
const CELL = 'block px-0 py-0.5 md:table-cell md:px-3 md:py-2 md:align-top';
const LABEL = 'font-semibold text-loam-soft md:hidden';

/** The entries as a table: when, who, what, and the fields changed "from → to". */
export function AuditTable({ entries, timeZone }: { entries: AuditEntryDto[]; timeZone: string }) {
  return (
    <table className="w-full border-collapse text-left">
      <caption className="sr-only">Changes, newest first</caption>
      <thead className="sr-only md:not-sr-only">
        <tr className="border-b border-line">
          <th scope="col" className="px-3 py-2">When</th>
          <th scope="col" className="px-3 py-2">Who</th>
          <th scope="col" className="px-3 py-2">What</th>
          <th scope="col" className="px-3 py-2">Fields changed</th>
        </tr>
      </thead>
      <tbody className="flex flex-col gap-3 md:table-row-group">
        {entries.map((e) => (
          <tr key={e.id} className="block rounded-md border border-line bg-paper-raised p-3 md:table-row md:rounded-none md:border-0 md:border-b md:bg-transparent md:p-0">
            <td className={`${CELL} md:whitespace-nowrap`}>
              <span className={LABEL}>When: </span>
              <time dateTime={e.at}>{formatInstant(e.at, timeZone)}</time>
            </td>
            <td className={CELL}>
              <span className={LABEL}>Who: </span>
              {e.actor.name}
            </td>
            <td className={CELL}>
              <span className={LABEL}>What: </span>
              <span className="text-loam-soft">{AUDIT_ENTITY_WORDS[e.entity] ?? e.entity} · </span>
              {e.summary}
            </td>
            <td className={CELL}>
              {e.changes.length ? (
                <ul aria-label="Fields changed" className="flex flex-col gap-0.5">
                  {e.changes.map((c) => (
                    <ChangeLine key={c.field} change={c} entity={e.entity} />
                  ))}
                </ul>
              ) : (
                <span className="text-loam-soft">No fields recorded</span>
              )}
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
