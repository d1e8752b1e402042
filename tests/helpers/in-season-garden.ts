import { Garden } from '../../server/db/models';
import { inSeason } from '../../server/db/seeders/demo-records';
import { DEMO_GARDENS } from '../../server/db/seeders/demo';
import { localDate } from '../../server/lib/local-date';
import type { WeatherService } from '../../server/modules/weather/weather.service';

/**
 * The demo garden in its growing season today (so it has growing plantings), with its past seasons
 * and forecast fetched from the local fake weather service, so its charts have lines to draw.
 */
export async function inSeasonGarden(weather: WeatherService): Promise<Garden> {
  const demo = DEMO_GARDENS.find((g) => inSeason(g.latitude, localDate(g.timeZone)))!;
  const g = (await Garden.findOne({ where: { name: demo.name } }))!;
  const cellId = (await weather.locateGarden(g)) ?? g.weatherCellId!;
  // Another test file may hold the cell's lease for a moment; backfill resumes where it stopped.
  for (let i = 0; i < 40 && !(await weather.backfillStatus(cellId))?.complete; i++) {
    await weather.backfill(cellId);
    await new Promise((r) => setTimeout(r, 250));
  }
  await weather.runRefresh({ kind: 'manual', gardenId: g.id, cellId });
  return (await Garden.findByPk(g.id))!;
}
