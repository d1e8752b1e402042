import { Link } from 'react-router-dom';
import { ShieldAlert } from 'lucide-react';
import type { AlertDto } from '#shared/schemas/alerts';
import { AcknowledgeButton } from '@/features/alerts/components/acknowledge-button';
import { AlertSeverityLabel, AlertTypeLabel } from '@/features/alerts/components/alert-labels';
import { alertHistory, formatAlertSpan } from '@/features/alerts/utils/alert-dates';

function Subject({ gardenId, alert }: { gardenId: number; alert: AlertDto }) {
  if (alert.plantingId === null) return <p className="text-sm font-semibold text-loam-soft">{alert.subject}</p>;
  return (
    <Link to={`/g/${gardenId}/plantings/${alert.plantingId}`} className="inline-flex min-h-11 items-center self-start text-sm font-semibold text-frost underline">
      {alert.subject}
    </Link>
  );
}

function Caution({ text }: { text: string }) {
  return (
    <div className="flex gap-2 rounded-md border-l-4 border-loam bg-paper-sunk px-3 py-2">
      <ShieldAlert className="mt-0.5 size-5 shrink-0" aria-hidden="true" />
      <p>
        <strong>Take care: </strong>
        {text}
      </p>
    </div>
  );
}

export interface AlertCardProps {
  gardenId: number;
  timeZone: string;
  alert: AlertDto;
  canAcknowledge: boolean;
}

/** One alert in full: what, how serious, for which planting, why (with units), what to do and when. */
export function AlertCard({ gardenId, timeZone, alert, canAcknowledge }: AlertCardProps) {
  const titleId = `alert-${alert.id}-title`;
  return (
    <article aria-labelledby={titleId} className="flex min-w-0 flex-col gap-2 rounded-lg border border-line bg-paper-raised p-3 break-words sm:p-4">
      <div className="flex flex-wrap gap-2">
        <AlertTypeLabel type={alert.type} />
        <AlertSeverityLabel severity={alert.severity} />
      </div>
      <Subject gardenId={gardenId} alert={alert} />
      <h3 id={titleId} className="font-bold">
        {alert.title}
      </h3>
      <ul className="list-disc pl-5 tabular-nums">
        {alert.reasons.map((reason) => (
          <li key={reason}>{reason}</li>
        ))}
      </ul>
      <p>
        <strong>What to do: </strong>
        {alert.action}
      </p>
      {alert.caution && <Caution text={alert.caution} />}
      <p className="text-sm text-loam-soft">
        {formatAlertSpan(alert, timeZone)} · {alertHistory(alert, timeZone).join(' · ')}
      </p>
      {canAcknowledge && alert.status === 'open' && <AcknowledgeButton gardenId={gardenId} alertId={alert.id} title={alert.title} />}
    </article>
  );
}
