import type { AlertDto } from '#shared/schemas/alerts';
import { formatDayMonth, formatDayWindow } from '@/lib/format';

/** The garden-local calendar date of an instant, 'YYYY-MM-DD'. */
function localDate(instant: string, timeZone: string): string {
  return new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' }).format(new Date(instant));
}

/** "2 Jun" in the garden's own calendar; the year is added when it is not the current one. */
function formatAlertDay(instant: string, timeZone: string): string {
  const date = localDate(instant, timeZone);
  const thisYear = localDate(new Date().toISOString(), timeZone).slice(0, 4);
  const year = date.slice(0, 4);
  return year === thisYear ? formatDayMonth(date) : `${formatDayMonth(date)} ${year}`;
}

/** "For 9–12 Jun", "On 9 Jun", or "From 9 Jun" while the alert has no end date. */
export function formatAlertSpan({ startsOn, endsOn }: Pick<AlertDto, 'startsOn' | 'endsOn'>): string {
  if (!endsOn) return `From ${formatDayMonth(startsOn)}`;
  return endsOn === startsOn ? `On ${formatDayMonth(startsOn)}` : `For ${formatDayWindow(startsOn, endsOn)}`;
}

/** "Raised 2 Jun", "Acknowledged 3 Jun by Mara Quill", "Resolved 5 Jun": each step the alert has taken. */
export function alertHistory(alert: AlertDto, timeZone: string): string[] {
  const steps = [`Raised ${formatAlertDay(alert.createdAt, timeZone)}`];
  if (alert.acknowledgedAt) {
    const by = alert.acknowledgedBy ? ` by ${alert.acknowledgedBy}` : '';
    steps.push(`Acknowledged ${formatAlertDay(alert.acknowledgedAt, timeZone)}${by}`);
  }
  if (alert.resolvedAt) steps.push(`Resolved ${formatAlertDay(alert.resolvedAt, timeZone)}`);
  return steps;
}
