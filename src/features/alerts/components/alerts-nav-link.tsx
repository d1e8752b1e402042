import type { ReactNode } from 'react';
import { NavLink } from 'react-router-dom';
import { useAlertCounts } from '@/features/alerts/api/get-alert-counts';

// On the phone's tab bar the number sits on the icon's corner (the tab is `relative`), so the
// label stays one short word; from 768 px it follows the word.
const BADGE_ON_ICON = 'absolute top-1 left-1/2 ml-1.5 md:static md:ml-0';

/** "Alerts 3" in the garden navigation; read out as "Alerts, 3 open". A tab (`icon`) brings its own spacing. */
export function AlertsNavLink({ gardenId, className, icon }: { gardenId: number; className: string; icon?: ReactNode }) {
  const open = useAlertCounts(gardenId).data?.open ?? 0;
  return (
    <NavLink to={`/g/${gardenId}/alerts`} className={icon ? className : `${className} gap-1.5`}>
      {icon}
      <span>Alerts</span>
      {open > 0 && (
        <>
          <span className="sr-only">, {open} open</span>
          <span
            aria-hidden="true"
            className={`rounded-full border border-loam bg-paper-raised px-1.5 text-sm leading-tight tabular-nums text-loam ${icon ? BADGE_ON_ICON : ''}`}
          >
            {open}
          </span>
        </>
      )}
    </NavLink>
  );
}
