import { ALERT_SEVERITY_WORDS, ALERT_TYPE_WORDS } from '#shared/schemas/alerts';
import type { AlertSeverity, AlertType } from '#shared/schemas/alerts';
import { SEVERITY_LOOK, TYPE_LOOK } from '@/features/alerts/utils/alert-look';

const PILL = 'inline-flex items-center gap-1 rounded-full border px-2 py-0.5 text-sm font-semibold';

export function AlertTypeLabel({ type }: { type: AlertType }) {
  const { icon: Icon, className } = TYPE_LOOK[type];
  return (
    <span className={`${PILL} ${className}`}>
      <Icon className="size-4 shrink-0" aria-hidden="true" />
      {ALERT_TYPE_WORDS[type]}
    </span>
  );
}

export function AlertSeverityLabel({ severity }: { severity: AlertSeverity }) {
  const { icon: Icon, className } = SEVERITY_LOOK[severity];
  return (
    <span className={`${PILL} ${className}`}>
      <Icon className="size-4 shrink-0" aria-hidden="true" />
      <span className="sr-only">Severity: </span>
      {ALERT_SEVERITY_WORDS[severity]}
    </span>
  );
}
