import { useSearchParams } from 'react-router-dom';
import { ALERT_STATUSES, ALERT_TYPES } from '#shared/schemas/alerts';
import type { AlertDto, AlertListQuery, AlertStatus } from '#shared/schemas/alerts';
import { Loading } from '@/components/ui/loading';
import { LoadProblem } from '@/components/ui/load-problem';
import { Notice } from '@/components/ui/notice';
import { useCurrentGarden } from '@/app/routes/gardens/garden-layout';
import { useAlerts } from '@/features/alerts/api/get-alerts';
import { AlertCards } from '@/features/alerts/components/alert-cards';
import { AlertFilters } from '@/features/alerts/components/alert-filters';
import { alertSearchParams } from '@/features/alerts/utils/alert-search';

const SECTIONS: { status: AlertStatus; title: string; empty: string }[] = [
  { status: 'open', title: 'Open', empty: 'No open alerts.' },
  { status: 'acknowledged', title: 'Acknowledged', empty: 'No acknowledged alerts waiting to pass.' },
  { status: 'resolved', title: 'History', empty: 'No resolved alerts yet.' },
];

const isOneOf = <T extends string>(values: readonly T[], value: string | null): value is T => value !== null && (values as readonly string[]).includes(value);

/** The filters live in the address, so a filtered list can be shared or reopened. */
function useAlertQuery(): [AlertListQuery, (query: AlertListQuery) => void] {
  const [params, setParams] = useSearchParams();
  const type = params.get('type');
  const status = params.get('status');
  const query: AlertListQuery = {
    type: isOneOf(ALERT_TYPES, type) ? type : undefined,
    status: isOneOf(ALERT_STATUSES, status) ? status : undefined,
  };
  const setQuery = (next: AlertListQuery) => setParams(alertSearchParams(next), { replace: true });
  return [query, setQuery];
}

function AlertSections({ alerts, status }: { alerts: AlertDto[]; status: AlertStatus | undefined }) {
  const garden = useCurrentGarden();
  const canAcknowledge = garden.role !== 'viewer';
  return SECTIONS.filter((s) => status === undefined || s.status === status).map((s) => {
    const items = alerts.filter((a) => a.status === s.status);
    const id = `alerts-${s.status}`;
    return (
      <section key={s.status} aria-labelledby={id} className="flex flex-col gap-3">
        <h2 id={id} className="text-xl font-bold">
          {s.title} <span className="font-normal text-loam-soft">({items.length})</span>
        </h2>
        {items.length ? <AlertCards alerts={items} gardenId={garden.id} timeZone={garden.timeZone} canAcknowledge={canAcknowledge} /> : <p>{s.empty}</p>}
      </section>
    );
  });
}

function noneWords(query: AlertListQuery): string {
  if (query.type || query.status) return 'No alerts match these filters.';
  return 'No alerts yet. One is raised when the forecast or a planting’s progress calls for action.';
}

/** Every alert of the garden: open first, then acknowledged, then the resolved ones as history. */
export function AlertsPage() {
  const garden = useCurrentGarden();
  const [query, setQuery] = useAlertQuery();
  const alerts = useAlerts(garden.id, query);

  return (
    <div className="flex flex-col gap-4">
      <title>{`Alerts · ${garden.name} · Heatclock`}</title>
      <div>
        <h1 className="text-2xl font-bold sm:text-3xl">Alerts</h1>
        <p className="max-w-prose text-loam-soft">What the forecast and each planting’s progress call for. An alert resolves by itself once its condition passes.</p>
      </div>
      {garden.role === 'viewer' && (
        <Notice tone="info" title="Read only">
          Viewers see every alert; growers and owners acknowledge them.
        </Notice>
      )}
      <AlertFilters query={query} onChange={setQuery} />
      {alerts.isPending && <Loading label="Loading alerts…" />}
      {alerts.isError && (
        <LoadProblem error={alerts.error} what="alerts" onRetry={() => alerts.refetch()} retrying={alerts.isFetching} />
      )}
      {alerts.data && (alerts.data.items.length ? <AlertSections alerts={alerts.data.items} status={query.status} /> : <p>{noneWords(query)}</p>)}
    </div>
  );
}
