/**
 * History for analog years in yearly batches, newest first, so the recent seasons are there
 * soonest. Resumable: progress lives in history_from / history_through on the cell. Each batch
 * commits with its events; they coalesce per garden, so a whole backfill owes one evaluation.
 */
import { addDays, daysBetween } from '#shared/thermal/dates';
import type { WeatherContext } from '../weather-context';
import { storeCellDays } from './store-cell-days';

export function historyTarget(ctx: WeatherContext, today: string): string {
  return `${Number(today.slice(0, 4)) - ctx.settings.historyYears}-01-01`;
}

export async function backfillCell(ctx: WeatherContext, cellId: number): Promise<void> {
  const s = ctx.settings;
  const token = ctx.leaseToken();
  let targetFrom: string | undefined;
  try {
    if (!(await ctx.repo.leaseCell(cellId, token, s.leaseMs))) return;
    const cell = (await ctx.repo.cell(cellId))!;
    const today = ctx.today(cell);
    targetFrom = historyTarget(ctx, today);
    let historyFrom = cell.historyFrom;
    let historyThrough = cell.historyThrough;
    // Continue below what is already stored; on a first run start at the archive's end.
    let to = historyFrom && historyThrough ? addDays(historyFrom, -1) : addDays(today, -s.archiveLagDays);
    while (daysBetween(targetFrom, to) >= 0) {
      const from = [addDays(to, -365), targetFrom].sort().pop()!;
      const res = await ctx.client.history({ latitude: cell.latitude, longitude: cell.longitude, timeZone: cell.timeZone, from, to });
      await storeCellDays(ctx, cellId, res.days.map((d) => ({ ...d, source: 'observed' as const })));
      historyFrom = from;
      historyThrough = historyThrough && historyThrough > to ? historyThrough : to;
      await ctx.repo.leaseCell(cellId, token, s.leaseMs);
      await ctx.repo.recordHistory(cellId, { historyFrom, historyThrough, targetFrom });
      to = addDays(from, -1);
    }
    await ctx.repo.releaseCell(cellId, token, { backfillTargetFrom: targetFrom, backfillError: null });
  } catch (err) {
    ctx.logger.error('weather backfill failed', { cellId, error: (err as Error).message });
    await ctx.repo
      .releaseCell(cellId, token, { backfillTargetFrom: targetFrom, backfillError: (err as Error).message.slice(0, 500) })
      .catch(() => undefined);
  }
}
