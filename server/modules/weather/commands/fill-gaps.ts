import { addDays } from '#shared/thermal/dates';
import { planFills } from '../weather-gaps';
import type { WeatherContext } from '../weather-context';
import { storeCellDays } from './store-cell-days';

/** Stores marked interpolations for the short holes of [from, to]; forecasts never count as known. */
export async function fillShortGaps(ctx: WeatherContext, cellId: number, from: string, to: string): Promise<number> {
  const days = await ctx.repo.cellDays(cellId, addDays(from, -1), addDays(to, 1));
  const known = new Map(days.filter((d) => d.source !== 'forecast').map((d) => [d.date, d]));
  return storeCellDays(ctx, cellId, planFills(known, from, to));
}
