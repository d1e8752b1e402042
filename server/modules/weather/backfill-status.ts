import { daysBetween } from '#shared/thermal/dates';
import type { WeatherContext } from './weather-context';
import { historyTarget } from './commands/backfill-cell';

/** How far a cell's history reaches towards its target, as the weather page shows it. */
export async function backfillStatus(ctx: WeatherContext, cellId: number | null, running: (cellId: number) => boolean) {
  if (!cellId) return null;
  const cell = await ctx.repo.cell(cellId);
  if (!cell) return null;
  const today = ctx.today(cell);
  const targetFrom = cell.backfillTargetFrom ?? historyTarget(ctx, today);
  const wanted = Math.max(1, daysBetween(targetFrom, today));
  const have = cell.historyFrom && cell.historyThrough ? daysBetween(cell.historyFrom, cell.historyThrough) + 1 : 0;
  return {
    historyFrom: cell.historyFrom,
    historyThrough: cell.historyThrough,
    targetFrom,
    percent: Math.min(100, Math.round((have / wanted) * 100)),
    complete: !!cell.historyFrom && cell.historyFrom <= targetFrom,
    error: cell.backfillError,
    refreshedAt: cell.refreshedAt,
    running: running(cellId),
  };
}
