import type { BoltLevel, ProgressDto } from '#shared/schemas/progress';
import { toDayNumber } from '#shared/thermal/dates';
import { BOLT_WORDS, formatDayMonth, formatDayWindow } from '@/lib/format';
import { BOLT_LOOK } from '@/components/ui/bolt-risk-label';
import { PLOT_INSET } from '@/features/progress/utils/chart-look';
import { boltRuns, progressDomain } from '@/features/progress/utils/progress-points';

// Height says the level as well as colour and icon do: a third, two thirds or the full strip.
const HEIGHT: Record<BoltLevel, string> = { low: 'h-1/3', elevated: 'h-2/3', high: 'h-full' };
const FILL: Record<BoltLevel, string> = { low: 'bg-line', elevated: 'bg-ember-tint border border-ember', high: 'bg-ember text-paper-raised' };
const FORECAST = 'bg-[repeating-linear-gradient(135deg,transparent_0_3px,rgb(255_250_240/0.55)_3px_6px)]';
const LEVELS: BoltLevel[] = ['low', 'elevated', 'high'];

/** "Bolt risk high from 9 Jun", or how far the days run without a high level. */
function boltHeadline(boltRisk: ProgressDto['boltRisk']): string {
  if (boltRisk.highFrom) return `Bolt risk high from ${formatDayMonth(boltRisk.highFrom)}`;
  const last = boltRisk.days.at(-1);
  return last ? `No high bolt risk through ${formatDayMonth(last.date)}` : 'No bolt-risk days yet';
}

function StripLegend() {
  return (
    <ul aria-label="Bolt-risk levels" className="flex flex-wrap gap-x-4 gap-y-1 text-sm">
      {LEVELS.map((level) => {
        const Icon = BOLT_LOOK[level].icon;
        return (
          <li key={level} className="flex items-center gap-1.5">
            <span className="flex h-4 w-4 items-end" aria-hidden="true">
              <span className={`w-full ${HEIGHT[level]} ${FILL[level]}`} />
            </span>
            <Icon className="size-4" aria-hidden="true" />
            {BOLT_WORDS[level]}
          </li>
        );
      })}
      <li className="flex items-center gap-1.5">
        <span className={`h-4 w-4 bg-ember ${FORECAST}`} aria-hidden="true" />
        Striped: forecast
      </li>
    </ul>
  );
}

/** The daily bolt-risk level as a strip under the chart's day axis, each stretch with its words. */
export function BoltRiskStrip({ progress }: { progress: ProgressDto }) {
  const { from, to } = progressDomain(progress);
  const first = toDayNumber(from);
  const total = toDayNumber(to) - first + 1;
  const runs = boltRuns(progress.boltRisk.days);
  return (
    <div className="flex flex-col gap-2">
      <p className="font-semibold">{boltHeadline(progress.boltRisk)}</p>
      <ol
        aria-label="Bolt risk by day"
        className="grid h-7 items-end border-b border-line"
        style={{ gridTemplateColumns: `repeat(${total}, minmax(0, 1fr))`, marginLeft: PLOT_INSET.left, marginRight: PLOT_INSET.right }}
      >
        {runs.map((run) => {
          const Icon = BOLT_LOOK[run.level].icon;
          const start = toDayNumber(run.from) - first + 1;
          return (
            <li
              key={run.from}
              className={`flex items-center justify-center overflow-hidden ${HEIGHT[run.level]} ${FILL[run.level]} ${run.forecast ? FORECAST : ''}`}
              style={{ gridColumn: `${start} / span ${run.days}` }}
              title={`${BOLT_WORDS[run.level]}, ${formatDayWindow(run.from, run.to)}${run.forecast ? ' (forecast)' : ''}`}
            >
              {run.level !== 'low' && run.days / total >= 0.07 && <Icon className="size-3.5 shrink-0" aria-hidden="true" />}
              <span className="sr-only">
                {BOLT_WORDS[run.level]}: {formatDayWindow(run.from, run.to)}
                {run.forecast ? ' (forecast)' : ''}
              </span>
            </li>
          );
        })}
      </ol>
      <StripLegend />
    </div>
  );
}
