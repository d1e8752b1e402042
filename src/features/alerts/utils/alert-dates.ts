import type { AlertDto } from '#shared/schemas/alerts';
import { formatDayInContext, formatDayMonth, formatDayWindow, formatFullDate, formatFullRange } from '@/lib/format';
import { dayIn, todayIn } from '@/lib/garden-day';

/** "2 Jun" in the garden's own calendar; the year is added when it is not the current one. */
function formatAlertDay(instant: string, timeZone: string): string {
  return formatDayInContext(dayIn(instant, timeZone), todayIn(timeZone));
}

/** "For 9–12 Jun", "On 9 Jun", or "From 9 Jun" while the alert has no end date; with years when not this year's. */
export function formatAlertSpan({ startsOn, endsOn }: Pick<AlertDto, 'startsOn' | 'endsOn'>, timeZone: string): string {
  const year = todayIn(timeZone).slice(0, 4);
  const thisYear = startsOn.startsWith(year) && (!endsOn || endsOn.startsWith(year));
  const day = thisYear ? formatDayMonth : formatFullDate;
  if (!endsOn) return `From ${day(startsOn)}`;
  if (endsOn === startsOn) return `On ${day(startsOn)}`;
  return `For ${(thisYear ? formatDayWindow : formatFullRange)(startsOn, endsOn)}`;
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
