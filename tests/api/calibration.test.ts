import { describe, expect, it } from 'vitest';
import { testApp, testDb, testWeather } from '../helpers/test-app';
import { gardenWithClients, makePlanting, makeVariety } from '../helpers/garden-records';
import { giveGardenWeather, steadyDays } from '../helpers/garden-weather';
import { addDays } from '#shared/thermal/dates';
import { fToC } from '#shared/thermal/units';
import type { CalibrationDto } from '#shared/schemas/varieties';

const TODAY = '2026-08-20';
const app = testApp({}, testWeather({}, () => new Date(`${TODAY}T17:00:00Z`)));
const { sequelize } = testDb();
// Constant 20 °C against lettuce's base 40 °F (Univ. of Delaware, SCIENCE.md): 20 − 4.44 °C-days a day; the start day is day 0.
const PER_DAY = 20 - fToC(40);

describe('calibrating a variety from the garden’s own harvests', () => {
  it('when plantings of a variety were harvested, then the observed target is the median of their degree days to first harvest, with the spread and a caution for few harvests', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    await garden.update({ units: 'C' });
    await giveGardenWeather(sequelize, garden, steadyDays('2021-01-01', addDays(TODAY, -1), 20, 20));
    const variety = await makeVariety(garden.id, { dtmDays: 50, dtmFrom: 'sowing' });
    await makePlanting(garden.id, { varietyId: variety.id, sownOn: '2026-05-01', firstHarvestOn: '2026-06-10', status: 'harvested' }); // 40 days
    await makePlanting(garden.id, { varietyId: variety.id, sownOn: '2026-05-10', firstHarvestOn: '2026-07-09', status: 'harvested' }); // 60 days
    await makePlanting(garden.id, { varietyId: variety.id, sownOn: '2026-07-01' }); // growing: not a harvest
    const first = await clients.viewer.get(`${base}/varieties/${variety.id}/calibration`);
    expect(first.status).toBe(200);
    const c = first.body as CalibrationDto;
    expect(c.count).toBe(2);
    expect(c.unit).toBe('C');
    expect(c.harvests.map((h) => h.days).sort()).toEqual([40, 60]);
    expect(c.median).toBe(Math.round(50 * PER_DAY));
    expect(c.min).toBeCloseTo(40 * PER_DAY, 0);
    expect(c.max).toBeCloseTo(60 * PER_DAY, 0);
    expect(c.caution).toMatch(/^Only 2 harvests back this figure/);

    await makePlanting(garden.id, { varietyId: variety.id, sownOn: '2026-05-20', firstHarvestOn: '2026-07-04', status: 'harvested' }); // 45 days
    const third = (await clients.viewer.get(`${base}/varieties/${variety.id}/calibration`)).body as CalibrationDto;
    expect(third.count).toBe(3);
    expect(third.median).toBe(Math.round(45 * PER_DAY));
    expect(third.caution).toBeNull();

    // Adopting it: the grower's target is set to the median, and the variety then uses it.
    const adopted = await clients.grower.patch(`${base}/varieties/${variety.id}`).send({ gddTargetOverrideC: third.medianC });
    expect(adopted.status).toBe(200);
    expect(adopted.body.variety.gddTarget).toMatchObject({ basis: 'override' });
    expect(adopted.body.variety.gddTarget.valueC).toBeCloseTo(45 * PER_DAY, 0);
  });

  it('when another garden’s variety is asked for, then 404', async () => {
    const { clients, base } = await gardenWithClients(app);
    const other = await gardenWithClients(app);
    const theirs = await makeVariety(other.garden.id);
    expect((await clients.viewer.get(`${base}/varieties/${theirs.id}/calibration`)).status).toBe(404);
  });
});
