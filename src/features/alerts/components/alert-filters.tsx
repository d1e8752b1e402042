import { ALERT_STATUSES, ALERT_TYPE_WORDS, ALERT_TYPES } from '#shared/schemas/alerts';
import type { AlertListQuery, AlertStatus, AlertType } from '#shared/schemas/alerts';
import { STATUS_WORDS } from '@/features/alerts/utils/alert-look';

const CONTROL = 'min-h-11 w-full min-w-0 rounded-md border border-line bg-paper-raised px-3 py-2 text-loam';

/** Type and status pickers; an empty choice means all. */
export function AlertFilters({ query, onChange }: { query: AlertListQuery; onChange: (query: AlertListQuery) => void }) {
  return (
    <form role="search" aria-label="Filter alerts" className="grid gap-3 sm:grid-cols-2" onSubmit={(e) => e.preventDefault()}>
      <label className="flex flex-col gap-1">
        <span className="font-semibold">Type</span>
        <select className={CONTROL} value={query.type ?? ''} onChange={(e) => onChange({ ...query, type: (e.target.value || undefined) as AlertType | undefined })}>
          <option value="">All types</option>
          {ALERT_TYPES.map((t) => (
            <option key={t} value={t}>
              {ALERT_TYPE_WORDS[t]}
            </option>
          ))}
        </select>
      </label>
      <label className="flex flex-col gap-1">
        <span className="font-semibold">Status</span>
        <select className={CONTROL} value={query.status ?? ''} onChange={(e) => onChange({ ...query, status: (e.target.value || undefined) as AlertStatus | undefined })}>
          <option value="">All statuses</option>
          {ALERT_STATUSES.map((s) => (
            <option key={s} value={s}>
              {STATUS_WORDS[s]}
            </option>
          ))}
        </select>
      </label>
    </form>
  );
}
