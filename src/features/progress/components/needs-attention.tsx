import { Link } from 'react-router-dom';
import { ArrowRight } from 'lucide-react';
import type { TodayDto } from '#shared/schemas/progress';
import { formatDayMonth } from '@/lib/format';
import { ACTION_LOOK, ACTION_ORDER } from '@/features/progress/utils/progress-words';

const byKind = (actions: TodayDto['actions']) =>
  [...actions].sort((a, b) => ACTION_ORDER.indexOf(a.kind) - ACTION_ORDER.indexOf(b.kind));

/**
 * What to act on today: each action with its kind in words and icon, the figures, the advice and
 * the planting. Actions whose alert is already shown in full above (`shownAlertIds`) are left out.
 */
export function NeedsAttention({ gardenId, today, shownAlertIds }: { gardenId: number; today: TodayDto; shownAlertIds: number[] }) {
  const names = new Map(today.plantings.map((p) => [p.plantingId, `${p.crop.name}: ${p.variety.name}`]));
  const actions = today.actions.filter((a) => !shownAlertIds.includes(a.alertId));
  if (!actions.length) return shownAlertIds.length ? null : <p>Nothing needs attention today.</p>;
  const more = today.actionsTotal > today.actions.length;
  return (
    <>
      {more && (
        <p className="text-loam-soft">
          The {today.actions.length.toLocaleString()} most severe of {today.actionsTotal.toLocaleString()} open alerts; the rest are on the alerts page.
        </p>
      )}
      <ul className="flex flex-col gap-3">
        {byKind(actions).map((a) => {
          const { words, icon: Icon, className } = ACTION_LOOK[a.kind];
          const name = a.plantingId === null ? undefined : names.get(a.plantingId);
          return (
            <li key={a.alertId} className="flex flex-col gap-1.5 rounded-lg border border-line bg-paper-raised p-3 sm:p-4">
              <span className={`inline-flex items-center gap-1 self-start rounded-full border px-2 py-0.5 text-sm font-semibold ${className}`}>
                <Icon className="size-4" aria-hidden="true" />
                {words}
                {a.date && ` · ${formatDayMonth(a.date)}`}
              </span>
              <h3 className="font-bold">{a.title}</h3>
              <p className="tabular-nums">{a.detail}</p>
              <p>{a.advice}</p>
              {a.caution && <p className="border-l-4 border-ember pl-2 text-sm"><strong>Take care:</strong> {a.caution}</p>}
              {a.plantingId === null ? (
                <Link to={`/g/${gardenId}/weather`} className="inline-flex min-h-11 items-center gap-1 self-start font-semibold text-frost underline">
                  Open the weather
                  <ArrowRight className="size-4" aria-hidden="true" />
                </Link>
              ) : (
                <Link to={`/g/${gardenId}/plantings/${a.plantingId}`} className="inline-flex min-h-11 items-center gap-1 self-start font-semibold text-frost underline">
                  {name ? `Open ${name}` : 'Open the planting'}
                  <ArrowRight className="size-4" aria-hidden="true" />
                </Link>
              )}
            </li>
          );
        })}
      </ul>
    </>
  );
}
