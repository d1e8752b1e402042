/**
 * Days still missing further back than the nightly refresh reaches (rejected days, long outages)
 * are asked of the archive again; at most a few holes per cell and night, so a cell with a
 * permanent hole cannot swamp the service.
 */
import { addDays, daysBetween } from '#shared/thermal/dates';
import { findGaps } from '../weather-gaps';
import type { WeatherContext } from '../weather-context';
import { fillShortGaps } from './fill-gaps';
import { storeCellDays } from './store-cell-days';

/** Older than this the nightly refresh no longer asks again (its 92-day reach, plus one). */
const REFRESH_REACH_DAYS = 93;

export async function repairOldGaps(ctx: WeatherContext, maxPerCell: number): Promise<number> {
  let repaired = 0;
  for (const cellId of await ctx.repo.cellsInUse()) {
    const token = ctx.leaseToken();
    try {
      if (!(await ctx.repo.leaseCell(cellId, token, ctx.settings.leaseMs))) continue;
      const cell = (await ctx.repo.cell(cellId))!;
      if (!cell.historyFrom) continue;
      const to = addDays(ctx.today(cell), -REFRESH_REACH_DAYS);
      if (daysBetween(cell.historyFrom, to) < 0) continue;
      const have = await ctx.repo.knownDates(cellId, cell.historyFrom, to);
      if (have.size === daysBetween(cell.historyFrom, to) + 1) continue;
      for (const gap of findGaps(have, cell.historyFrom, to).slice(0, maxPerCell)) {
        const res = await ctx.client.history({ latitude: cell.latitude, longitude: cell.longitude, timeZone: cell.timeZone, from: gap.from, to: gap.to });
        repaired += await storeCellDays(ctx, cellId, res.days.map((d) => ({ ...d, source: 'observed' as const })));
        repaired += await fillShortGaps(ctx, cellId, gap.from, gap.to);
      }
    } catch (err) {
      ctx.logger.error('weather gap repair failed', { cellId, error: (err as Error).message });
    } finally {
      await ctx.repo.releaseCell(cellId, token).catch(() => undefined);
    }
  }
  return repaired;
}
