import { NavLink } from 'react-router-dom';
import { useAlertCounts } from '@/features/alerts/api/get-alert-counts';

/** "Alerts 3" in the garden navigation; read out as "Alerts, 3 open". */
export function AlertsNavLink({ gardenId, className }: { gardenId: number; className: string }) {
  const open = useAlertCounts(gardenId).data?.open ?? 0;
  return (
    <NavLink to={`/g/${gardenId}/alerts`} className={`${className} gap-1.5`}>
      Alerts
      {open > 0 && (
        <>
          <span className="sr-only">, {open} open</span>
          <span aria-hidden="true" className="rounded-full border border-loam px-1.5 text-sm tabular-nums">
            {open}
          </span>
        </>
      )}
    </NavLink>
  );
}
