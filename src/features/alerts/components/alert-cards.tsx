import type { AlertDto } from '#shared/schemas/alerts';
import type { AlertCardProps } from '@/features/alerts/components/alert-card';
import { AlertCard } from '@/features/alerts/components/alert-card';

/** Alerts as a list of cards, in the order given. */
export function AlertCards({ alerts, ...card }: Omit<AlertCardProps, 'alert'> & { alerts: AlertDto[] }) {
  return (
    <ul className="flex flex-col gap-3">
      {alerts.map((alert) => (
        <li key={alert.id}>
          <AlertCard alert={alert} {...card} />
        </li>
      ))}
    </ul>
  );
}
