import { inTransaction } from '../../../lib/transaction';
import { moveGardenRevisions } from '../../../lib/garden-revision';
import type { WeatherContext } from '../weather-context';
import type { SoilDay } from '../weather.repository';

/**
 * The one way a cell's soil days are written. Soil does not change any degree day, so no
 * progress is re-evaluated; the gardens' revisions move so their cached answers are refreshed.
 */
export async function storeCellSoil(ctx: WeatherContext, cellId: number, days: SoilDay[]): Promise<number> {
  if (!days.length) return 0;
  return inTransaction(ctx.sequelize, async (transaction) => {
    const written = await ctx.repo.upsertCellSoil(cellId, days, transaction);
    // Inside the transaction: a second connection would wait for the first (a pool of one never gives it).
    if (written) await moveGardenRevisions(ctx.sequelize, await ctx.repo.gardensOfCell(cellId, transaction), transaction);
    return written;
  });
}
