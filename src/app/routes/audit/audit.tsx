import { useSearchParams } from 'react-router-dom';
import { AUDIT_ENTITIES } from '#shared/schemas/audit';
import { Loading } from '@/components/ui/loading';
import { LoadProblem } from '@/components/ui/load-problem';
import { Notice } from '@/components/ui/notice';
import { useCurrentGarden } from '@/app/routes/gardens/garden-layout';
import { useAudit } from '@/features/audit/api/get-audit';
import { AuditFilters } from '@/features/audit/components/audit-filters';
import { AuditPager } from '@/features/audit/components/audit-pager';
import { AuditTable } from '@/features/audit/components/audit-table';
import { auditSearchParams } from '@/features/audit/utils/audit-search';
import type { AuditQuery } from '@/features/audit/utils/audit-search';

const ISO_DAY = /^\d{4}-\d{2}-\d{2}$/;
const isOneOf = <T extends string>(values: readonly T[], value: string | null): value is T => value !== null && (values as readonly string[]).includes(value);

/** The filters and the page live in the address, so a filtered trail can be shared or reopened. */
function useAuditQuery(): [AuditQuery, (query: AuditQuery) => void] {
  const [params, setParams] = useSearchParams();
  const entity = params.get('entity');
  const actor = params.get('actor');
  const from = params.get('from');
  const to = params.get('to');
  const page = Number(params.get('page'));
  const query: AuditQuery = {
    entity: isOneOf(AUDIT_ENTITIES, entity) ? entity : undefined,
    actor: actor && /^[1-9]\d{0,9}$/.test(actor) ? actor : undefined,
    from: from && ISO_DAY.test(from) ? from : undefined,
    to: to && ISO_DAY.test(to) ? to : undefined,
    page: Number.isInteger(page) && page > 1 ? page : undefined,
  };
  const setQuery = (next: AuditQuery) => setParams(auditSearchParams(next), { replace: true });
  return [query, setQuery];
}

const filtered = (q: AuditQuery) => Boolean(q.entity || q.actor || q.from || q.to);

/** Who changed which record of the garden and when, newest first: for the garden's owners. */
export function AuditPage() {
  const garden = useCurrentGarden();
  const isOwner = garden.role === 'owner';
  const [query, setQuery] = useAuditQuery();
  const audit = useAudit(garden.id, query, isOwner);

  return (
    <div className="flex flex-col gap-4">
      <title>{`Audit · ${garden.name} · Heatclock`}</title>
      <div>
        <h1 className="text-2xl font-bold sm:text-3xl">Audit trail</h1>
        <p className="max-w-prose text-loam-soft">Who changed what in this garden, and when, newest first. Passwords and sign-in links are never kept here.</p>
      </div>
      {!isOwner ? (
        <Notice tone="info" title="For the garden’s owners">
          Only an owner of this garden can read its audit trail.
        </Notice>
      ) : (
        <>
          <AuditFilters query={query} actors={audit.data?.actors ?? []} onChange={setQuery} />
          {audit.isPending && <Loading label="Loading the changes…" />}
          {audit.isError && <LoadProblem error={audit.error} what="the changes" onRetry={() => audit.refetch()} retrying={audit.isFetching} />}
          {audit.data &&
            (audit.data.items.length ? (
              <>
                <AuditTable entries={audit.data.items} timeZone={garden.timeZone} />
                <AuditPager page={audit.data.page} pageSize={audit.data.pageSize} total={audit.data.total} busy={audit.isFetching} onPage={(page) => setQuery({ ...query, page })} />
              </>
            ) : (
              <p>{filtered(query) ? 'No changes match these filters.' : audit.data.page > 1 ? 'There are no changes on this page.' : 'No changes yet. Each change to a planting, variety, seed lot, bed, the weather or the settings will show here.'}</p>
            ))}
        </>
      )}
    </div>
  );
}
