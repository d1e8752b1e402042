/**
 * The nightly refresh, and "refresh now" for one cell: each worker claims a cell through a lease
 * (WeatherRepository.claimCell), asks for its recent days and forecast in one request, stores
 * them, fills short holes, and records a job run for the whole pass.
 *
 * On several instances (one database, or a Galera cluster): a claim that loses to another claimer
 * (1213) is counted in `claimConflicts` and tried again with backoff, never counted as a failed
 * cell; a cell's lease is short and renewed while its work goes on, so a dead instance's cells
 * lapse within `runLeaseMs` and a run still going elsewhere takes them (it waits up to
 * `awaitOthersMs` for due cells others hold); the run's heartbeat lets the next run or boot close
 * a run whose instance died (sweepStaleRuns); every worker has settled before the run is recorded.
 */
import { addDays, daysBetween } from '#shared/thermal/dates';
import { isConflict, retryOnConflict } from '../../../db/migrate';
import { requestsOf } from '../../../integrations/weather/open-meteo';
import type { CellRow, RunTotals } from '../weather.repository';
import type { WeatherContext } from '../weather-context';
import { fillShortGaps } from './fill-gaps';
import { storeCellDays } from './store-cell-days';
import { storeCellSoil } from './store-cell-soil';

export interface RefreshOptions {
  kind: 'nightly' | 'manual';
  gardenId?: number;
  cellId?: number;
}

/** The service reaches back at most this many days on its forecast endpoint. */
const MAX_PAST_DAYS = 92;

const sleep = (ms: number) => new Promise<void>((resolve) => setTimeout(resolve, ms));

function emptyTotals(): RunTotals {
  return { cellsOk: 0, cellsFailed: 0, cellsSkipped: 0, daysWritten: 0, daysRejected: 0, requests: 0, claimConflicts: 0 };
}

/** Closes runs whose instance stopped mid-run; a failure here never stops the run that asked. */
export async function sweepStaleRuns(ctx: WeatherContext): Promise<number> {
  try {
    const closed = await retryOnConflict(() => ctx.repo.sweepStaleRuns(ctx.settings.staleRunMs));
    if (closed) ctx.logger.warn('stale weather runs closed', { runs: closed });
    return closed;
  } catch (err) {
    ctx.logger.warn('stale weather runs not swept', { error: (err as Error).message });
    return 0;
  }
}

export async function refreshCells(ctx: WeatherContext, opts: RefreshOptions, onRefreshed: (cellId: number) => Promise<void>) {
  const s = ctx.settings;
  await sweepStaleRuns(ctx);
  const runId = await retryOnConflict(() => ctx.repo.startRun(opts.kind, ctx.instance, opts.gardenId ?? null), { attempts: 4 });
  const totals = emptyTotals();
  const cutoff = new Date(ctx.now().getTime() - (opts.kind === 'manual' ? 30_000 : s.minRefreshMinutes * 60_000));
  // Wall time (not ctx.now, which tests pin): how long this run may wait for others' cells.
  const waitUntil = Date.now() + s.awaitOthersMs;
  // A failed cell keeps its old refresh time and would be claimable again at once: one try per run.
  const failed: number[] = [];
  // Cells this run's own workers hold: not "others'" cells to wait for.
  const mine = new Set<number>();
  const heartbeat = setInterval(() => {
    ctx.repo.heartbeatRun(runId).catch((err: Error) => ctx.logger.warn('weather run heartbeat failed', { runId, error: err.message }));
  }, s.heartbeatMs);
  heartbeat.unref();

  const worker = async () => {
    let lost = 0;
    for (;;) {
      const token = ctx.leaseToken();
      let cell: CellRow | null;
      try {
        cell = await ctx.repo.claimCell(token, cutoff, s.runLeaseMs, opts.cellId, failed);
        lost = 0;
      } catch (err) {
        if (!isConflict(err)) throw err;
        totals.claimConflicts = (totals.claimConflicts ?? 0) + 1;
        // Another worker or instance took that cell (or one next to it in the index): back off, look again.
        if (++lost >= s.claimAttempts) return;
        await sleep(Math.min(2000, 25 * 2 ** lost) * (0.5 + Math.random()));
        continue;
      }
      if (!cell) {
        if (opts.cellId) return;
        // Due cells others hold: still being refreshed there, or left by an instance that died.
        if (Date.now() < waitUntil && (await ctx.repo.cellsLeasedElsewhere(cutoff, s.runLeaseMs, [...failed, ...mine])) > 0) {
          await sleep(Math.min(1000, Math.max(100, s.runLeaseMs / 10)) * (0.5 + Math.random()));
          continue;
        }
        return;
      }
      const id = cell.id;
      mine.add(id);
      const ok = await refreshLeasedCell(ctx, cell, totals, token).finally(() => mine.delete(id));
      if (ok) await onRefreshed(cell.id);
      else failed.push(cell.id);
      if (opts.cellId) return;
    }
  };
  try {
    const settled = await Promise.allSettled(Array.from({ length: opts.cellId ? 1 : s.concurrency }, worker));
    for (const r of settled) {
      if (r.status === 'rejected') {
        totals.message = (r.reason as Error).message;
        totals.cellsFailed++;
      }
    }
    if (opts.cellId && totals.cellsOk + totals.cellsFailed === 0) totals.cellsSkipped = 1;
  } finally {
    clearInterval(heartbeat);
    // If even this fails (the database is gone), the row stays `running` and the next sweep closes it.
    await retryOnConflict(() => ctx.repo.finishRun(runId, totals), { attempts: 6 }).catch((err: Error) =>
      ctx.logger.error('weather run not recorded', { runId, error: err.message }),
    );
  }
  return { runId, ...totals };
}

/** Keeps a cell's lease while its work goes on; stops on its own when the work settles. */
function keepLease(ctx: WeatherContext, cell: CellRow, token: string): () => void {
  const timer = setInterval(() => {
    ctx.repo.renewCell(cell.id, token, ctx.settings.runLeaseMs).then(
      (held) => {
        if (!held) ctx.logger.warn('weather cell lease lost', { cellId: cell.id });
      },
      (err: Error) => ctx.logger.warn('weather cell lease not renewed', { cellId: cell.id, error: err.message }),
    );
  }, Math.max(50, Math.floor(ctx.settings.runLeaseMs / 3)));
  timer.unref();
  return () => clearInterval(timer);
}

async function refreshLeasedCell(ctx: WeatherContext, cell: CellRow, totals: RunTotals, token: string): Promise<boolean> {
  const stopLease = keepLease(ctx, cell, token);
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
    // Soil is a help for sowing, not the cell's weather: a failed soil write is logged and the refresh goes on.
    await storeCellSoil(
      ctx,
      cell.id,
      rows.flatMap((r) => (r.soil == null ? [] : [{ date: r.date, soil: r.soil, source: r.source }])),
    ).catch((err: unknown) => ctx.logger.warn('soil days not stored', { cellId: cell.id, error: (err as Error).message }));
    const filled = await fillShortGaps(ctx, cell.id, addDays(today, -pastDays), addDays(today, -1));
    totals.daysWritten += written + filled;
    const observed = rows.filter((r) => r.source === 'observed').map((r) => r.date);
    await retryOnConflict(() =>
      ctx.repo.releaseCell(cell.id, token, {
        refreshed: true,
        historyThrough: observed.length ? observed[observed.length - 1] : undefined,
      }),
    );
    totals.cellsOk++;
    return true;
  } catch (err) {
    totals.requests += requestsOf(err);
    totals.cellsFailed++;
    totals.message = `cell ${cell.id}: ${(err as Error).message}`;
    ctx.logger.error('weather refresh failed', { cellId: cell.id, error: (err as Error).message });
    await ctx.repo.releaseCell(cell.id, token).catch(() => undefined);
    return false;
  } finally {
    stopLease();
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
