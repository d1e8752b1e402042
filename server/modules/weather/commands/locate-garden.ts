import type { Garden } from '../../../db/models';
import { inTransaction } from '../../../lib/transaction';
import { recordWeatherChanged } from '../weather-events';
import type { WeatherContext } from '../weather-context';

/**
 * Puts a garden in the weather cell of its location (creating the cell if new). Returns the cell
 * id when it changed, so the caller can start fetching that cell's history. A move into a cell
 * that already has days changes the garden's weather without writing any, so it raises the event.
 */
export async function locateGarden(ctx: WeatherContext, garden: Garden): Promise<number | null> {
  if (garden.latitude === null || garden.longitude === null) return null;
  const cellId = await ctx.repo.findOrCreateCell(garden.latitude, garden.longitude, garden.timeZone);
  if (cellId === garden.weatherCellId) return null;
  await inTransaction(ctx.sequelize, async (transaction) => {
    // Through the instance, so the garden's hooks drop its progress and move its revision here too.
    await garden.update({ weatherCellId: cellId }, { transaction });
    const span = await ctx.repo.cellSpan(cellId, transaction);
    if (span) {
      await recordWeatherChanged(transaction, { gardenId: garden.id }, span.from, span.to);
      transaction.afterCommit(() => ctx.eventsCommitted());
    }
  });
  await garden.reload();
  return cellId;
}
