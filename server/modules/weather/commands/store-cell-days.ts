import { inTransaction } from '../../../lib/transaction';
import { recordWeatherChanged } from '../weather-events';
import type { WeatherContext } from '../weather-context';
import type { CellDayWrite } from '../weather.repository';

/**
 * The one way cell days are written: the days and the "weather changed" events of the cell's
 * gardens commit together, and only days that really changed raise an event.
 */
export async function storeCellDays(ctx: WeatherContext, cellId: number, days: CellDayWrite[]): Promise<number> {
  if (!days.length) return 0;
  return inTransaction(ctx.sequelize, async (transaction) => {
    const written = await ctx.repo.upsertCellDays(cellId, days, transaction);
    if (written.length) {
      await recordWeatherChanged(transaction, { cellId }, written[0], written[written.length - 1]);
      transaction.afterCommit(() => ctx.eventsCommitted());
    }
    return written.length;
  });
}
