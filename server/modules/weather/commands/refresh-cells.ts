/**
 * The nightly refresh, and "refresh now" for one cell: each worker claims a cell through a lease
 * (WeatherRepository.claimCell), asks for its recent days and forecast in one request, stores
 * them, fills short holes, and records a job run for the whole pass.
 */
import { addDays, daysBetween } from '#shared/thermal/dates';
import { requestsOf } from '../../../integrations/weather/open-meteo';
import type { CellRow, RunTotals } from '../weather.repository';
import type { WeatherContext } from '../weather-context';
import { fillShortGaps } from './fill-gaps';
import { storeCellDays } from './store-cell-days';

export interface RefreshOptions {
  kind: 'nightly' | 'manual';
  gardenId?: number;
  cellId?: number;
}

/** The service reaches back at most this many days on its forecast endpoint. */
const MAX_PAST_DAYS = 92;

function emptyTotals(): RunTotals {
  return { cellsOk: 0, cellsFailed: 0, cellsSkipped: 0, daysWritten: 0, daysRejected: 0, requests: 0 };
}

export async function refreshCells(ctx: WeatherContext, opts: RefreshOptions, onRefreshed: (cellId: number) => Promise<void>) {
  const s = ctx.settings;
  const runId = await ctx.repo.startRun(opts.kind, ctx.instance, opts.gardenId ?? null);
  const totals = emptyTotals();
  const cutoff = new Date(ctx.now().getTime() - (opts.kind === 'manual' ? 30_000 : s.minRefreshMinutes * 60_000));
  // A failed cell keeps its old refresh time and would be claimable again at once: one try per run.
  const failed: number[] = [];
  const worker = async () => {
    for (;;) {
      const token = ctx.leaseToken();
      const cell = await ctx.repo.claimCell(token, cutoff, s.leaseMs, opts.cellId, failed);
      if (!cell) return;
      if (await refreshLeasedCell(ctx, cell, totals, token)) await onRefreshed(cell.id);
      else failed.push(cell.id);
      if (opts.cellId) return;
    }
  };
  try {
    await Promise.all(Array.from({ length: opts.cellId ? 1 : s.concurrency }, worker));
    if (opts.cellId && totals.cellsOk + totals.cellsFailed === 0) totals.cellsSkipped = 1;
  } catch (err) {
    totals.message = (err as Error).message;
    totals.cellsFailed++;
  } finally {
    await ctx.repo.finishRun(runId, totals);
  }
  return { runId, ...totals };
}

async function refreshLeasedCell(ctx: WeatherContext, cell: CellRow, totals: RunTotals, token: string): Promise<boolean> {
  try {
    // Inside the try: a cell whose time zone the runtime refuses fails alone and gives its lease back.
    const today = ctx.today(cell);
    const pastDays = await pastDaysToAsk(ctx, cell, today);
    const res = await ctx.client.recent({
      latitude: cell.latitude,
      longitude: cell.longitude,
      timeZone: cell.timeZone,
      pastDays,
      forecastDays: ctx.settings.forecastDays,
    });
    totals.requests += res.requests;
    totals.daysRejected += res.rejected.length;
    const rows = res.days.map((d) => ({ ...d, source: d.date < today ? ('observed' as const) : ('forecast' as const) }));
    // Await first, then add: `total += await …` would read the total before other workers' updates.
    const written = await storeCellDays(ctx, cell.id, rows);
    const filled = await fillShortGaps(ctx, cell.id, addDays(today, -pastDays), addDays(today, -1));
    totals.daysWritten += written + filled;
    const observed = rows.filter((r) => r.source === 'observed').map((r) => r.date);
    await ctx.repo.releaseCell(cell.id, token, {
      refreshed: true,
      historyThrough: observed.length ? observed[observed.length - 1] : undefined,
    });
    totals.cellsOk++;
    return true;
  } catch (err) {
    totals.requests += requestsOf(err);
    totals.cellsFailed++;
    totals.message = `cell ${cell.id}: ${(err as Error).message}`;
    ctx.logger.error('weather refresh failed', { cellId: cell.id, error: (err as Error).message });
    await ctx.repo.releaseCell(cell.id, token).catch(() => undefined);
    return false;
  }
}

/**
 * Reach back far enough to replace what is not yet observed: missing days, filled days and
 * stale forecasts; at least the last two days.
 */
async function pastDaysToAsk(ctx: WeatherContext, cell: CellRow, today: string): Promise<number> {
  const from = addDays(today, -MAX_PAST_DAYS);
  const have = await ctx.repo.cellDays(cell.id, from, addDays(today, -1));
  const observed = new Set(have.filter((d) => d.source === 'observed').map((d) => d.date));
  const start = cell.historyFrom && cell.historyFrom > from ? cell.historyFrom : from;
  let first = addDays(today, -2);
  for (let d = start; d < first; d = addDays(d, 1)) {
    if (!observed.has(d)) {
      first = d;
      break;
    }
  }
  return Math.min(MAX_PAST_DAYS, daysBetween(first, today));
}
