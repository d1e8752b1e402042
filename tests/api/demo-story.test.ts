import { describe, expect, it } from 'vitest';
import { testApp, testDb, testWeather } from '../helpers/test-app';
import { gardenWithClients } from '../helpers/garden-records';
import { DEMO_GARDENS } from '../../server/db/seeders/demo';
import { DEMO_VARIETY_TRUTH, seedGardenRecords } from '../../server/db/seeders/demo-records';
import { settleDemoOutcomes } from '../../server/db/seeders/demo-outcomes';
import { Variety } from '../../server/db/models';
import { localDate } from '../../server/lib/local-date';
import type { CompareDto } from '#shared/schemas/compare';
import type { CalibrationDto } from '#shared/schemas/varieties';
import type { PlanDto } from '#shared/schemas/plan';

const weather = testWeather();
const app = testApp({}, weather);
const { sequelize } = testDb();

/**
 * A copy of a demo garden (same place, zone and units) with the demo's records, its weather from
 * the local fake, and the lettuce and spinach outcomes decided by that weather, as `npm start`
 * seeds it. The demo's data is invented; these checks are that the story it tells is true to the
 * weather and to its own invented needs (DEMO_VARIETY_TRUTH).
 */
async function demoCopy(demo: (typeof DEMO_GARDENS)[number]) {
  const ctx = await gardenWithClients(app);
  const { garden } = ctx;
  await garden.update({ latitude: demo.latitude, longitude: demo.longitude, timeZone: demo.timeZone, units: demo.units, elevationM: demo.elevationM });
  const cellId = (await weather.locateGarden(garden))!;
  // Another test file may hold the shared cell's lease for a moment; backfill resumes where it stopped.
  await weather.prepareCell(cellId, garden.id);
  for (let i = 0; i < 40 && !(await weather.backfillStatus(cellId))?.complete; i++) {
    await weather.backfill(cellId);
    await new Promise((r) => setTimeout(r, 250));
  }
  await garden.reload();
  const today = localDate(garden.timeZone);
  const users = [ctx.owner, ctx.grower, ctx.viewer];
  const pending = await sequelize.transaction((t) => seedGardenRecords(garden, users, today, t, { weatherDecides: true }));
  const settled = await settleDemoOutcomes(sequelize, weather, garden, pending);
  return { ...ctx, pending, settled };
}

const ranks = (c: CompareDto) => c.varieties.filter((v) => v.rank !== null).map((v) => [v.rank, v.name]);

describe('the demo’s seasons tell a true story', () => {
  for (const demo of DEMO_GARDENS) {
    it(`at ${demo.name}: Compare ranks lettuce and spinach as the weather treated them, Calibration finds their real needs, and Plan gives radish a spring and an autumn window`, async () => {
      const { clients, base, garden, pending, settled } = await demoCopy(demo);
      expect(pending.length).toBeGreaterThanOrEqual(24);
      expect(settled).toBeGreaterThanOrEqual(24);

      const lettuce = (await clients.viewer.get(`${base}/compare?crop=lettuce`)).body as CompareDto;
      const spinach = (await clients.viewer.get(`${base}/compare?crop=spinach`)).body as CompareDto;
      // Three past seasons and the current one.
      expect(lettuce.availableSeasons.length).toBe(4);
      // The ranking follows the invented heat each variety stands (Summerhold 14 > Copperleaf 6 > Marbleridge 2; Tealshield 7 > Longwinter 2).
      expect(ranks(lettuce)).toEqual([
        [1, 'Summerhold Batavian'],
        [2, 'Copperleaf Butterhead'],
        [3, 'Marbleridge Romaine'],
      ]);
      expect(ranks(spinach)).toEqual([
        [1, 'Tealshield'],
        [2, 'Longwinter Savoy'],
      ]);
      for (const c of [lettuce, spinach]) {
        const ranked = c.varieties.filter((v) => v.rank !== null);
        // Enough plantings back each rank, and the one that endured least bolted most often.
        for (const v of ranked) expect(v.caution).toBeNull();
        expect(ranked.at(-1)!.boltedBeforeHarvestShare!).toBeGreaterThan(ranked[0].boltedBeforeHarvestShare!);
        // Each planting's figures agree with what was recorded: bolted before harvest means no harvest before it.
        for (const p of c.plantings) if (p.boltedBeforeHarvest) expect(p.firstHarvestOn === null || p.firstHarvestOn > p.boltedOn!).toBe(true);
      }

      // Calibration recovers the invented need of a harvested variety: picked on the first day the
      // need is reached, so the median is at or above it by less than one warm day's degree days
      // (15 °C-days: a daily mean 15 °C above lettuce's 4.4 °C base).
      const copperleaf = (await Variety.findOne({ where: { gardenId: garden.id, name: 'Copperleaf Butterhead' } }))!;
      const cal = (await clients.viewer.get(`${base}/varieties/${copperleaf.id}/calibration`)).body as CalibrationDto;
      const need = DEMO_VARIETY_TRUTH['Copperleaf Butterhead'].dd;
      expect(cal.count).toBeGreaterThanOrEqual(3);
      expect(cal.medianC!).toBeGreaterThanOrEqual(need - 0.5);
      expect(cal.medianC!).toBeLessThan(need + 15);

      // Plan: a quick cool-season crop gets a spring and an autumn window, with the summer between left out for bolting.
      const radish = (await Variety.findOne({ where: { gardenId: garden.id, name: 'Emberglobe' } }))!;
      const plan = (await clients.viewer.get(`${base}/plan?varietyId=${radish.id}&frostRisk=50`)).body as PlanDto;
      expect(plan.windows.map((w) => w.name)).toEqual(['Spring window', 'Autumn window']);
      const summer = plan.excluded.find((e) => e.from > plan.windows[0].to && e.to < plan.windows[1].from)!;
      expect(summer.reason).toMatch(/high bolt risk while ready to pick in \d+ of \d+ past years/);
    });
  }
});
