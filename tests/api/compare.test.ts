import { describe, expect, it } from 'vitest';
import { testApp, testDb, testWeather } from '../helpers/test-app';
import { gardenWithClients, makeBed, makePlanting, makeVariety } from '../helpers/garden-records';
import { giveGardenWeather, steadyDays } from '../helpers/garden-weather';
import { dayLengthHours } from '#shared/thermal/day-length';
import type { DailyTemp } from '#shared/thermal/types';
import type { CompareDto } from '#shared/schemas/compare';
import { withinCap } from '../../server/modules/compare/compare.service';
import { Planting } from '../../server/db/models';
import type { Garden } from '../../server/db/models';
import { seasonYearOf } from '../../server/db/planting-season';
import { addDays } from '#shared/thermal/dates';

const TODAY = '2025-09-01';
// Lettuce counts from 40 °F (4.444… °C) by single sine with no upper threshold; its bolt heat threshold is 27 °C.
const BASE = (40 - 32) / 1.8;
const COOL = 15 - BASE; // a cool day: high 20, low 10 °C, both above the base
const HOT = 23 - BASE; // a hot day: high 30, low 16 °C

/** Each spring: April cool, May hot but for a cool 10 May, cool from June. */
function springs(): DailyTemp[] {
  const year = (y: number) => [
    ...steadyDays(`${y}-03-01`, `${y}-04-30`, 20, 10),
    ...steadyDays(`${y}-05-01`, `${y}-05-09`, 30, 16),
    ...steadyDays(`${y}-05-10`, `${y}-05-10`, 20, 10),
    ...steadyDays(`${y}-05-11`, `${y}-05-31`, 30, 16),
    ...steadyDays(`${y}-06-01`, `${y}-12-31`, 20, 10),
  ];
  return [...year(2024), ...year(2025)].filter((d) => d.date < TODAY);
}

const r1 = (x: number) => Math.round(x * 10) / 10;

const { sequelize } = testDb();

async function comparedGarden(app: ReturnType<typeof testApp>) {
  const ctx = await gardenWithClients(app);
  const garden: Garden = ctx.garden;
  await garden.update({ units: 'C' });
  await giveGardenWeather(sequelize, garden, springs());
  const alpha = await makeVariety(garden.id, { name: 'Alpha' });
  const bravo = await makeVariety(garden.id, { name: 'Bravo' });
  const charlie = await makeVariety(garden.id, { name: 'Charlie' });
  const a1 = await makePlanting(garden.id, { varietyId: alpha.id, sownOn: '2025-04-01', boltedOn: '2025-05-05', status: 'bolted' });
  const b1 = await makePlanting(garden.id, { varietyId: bravo.id, sownOn: '2024-04-01', boltedOn: '2024-05-09', status: 'bolted' });
  const b2 = await makePlanting(garden.id, { varietyId: bravo.id, sownOn: '2025-04-01', firstHarvestOn: '2025-05-21', status: 'harvested' });
  const b3 = await makePlanting(garden.id, { varietyId: bravo.id, sownOn: '2025-04-15', boltedOn: '2025-05-20', firstHarvestOn: '2025-05-25', status: 'bolted' });
  const c1 = await makePlanting(garden.id, { varietyId: charlie.id, sownOn: '2025-08-01', status: 'growing' });
  return { ...ctx, alpha, bravo, charlie, a1, b1, b2, b3, c1 };
}

describe('the variety comparison', () => {
  const app = testApp({}, testWeather({}, () => new Date(`${TODAY}T12:00:00Z`)));

  it('when plantings bolted or were picked in known weather, then every figure equals the hand count', async () => {
    const { clients, base, garden, alpha, bravo, a1, b1, b2, b3 } = await comparedGarden(app);
    const res = await clients.viewer.get(`${base}/compare?crop=lettuce`);
    expect(res.status).toBe(200);
    const dto = res.body as CompareDto;
    expect(JSON.stringify(dto)).not.toMatch(/SCIENCE|from memory|no source|⟦/);
    expect(dto.unit).toBe('C');
    expect(dto.heatThreshold).toBe(27);
    expect(dto.seasons.map((s) => s.year)).toEqual([2024, 2025]);
    const row = (id: number) => dto.plantings.find((p) => p.plantingId === id)!;

    // Degree days count from the day after the start event (as the planting's progress does).
    // Alpha: sown 1 Apr 2025, bolted 5 May: 29 cool April days and 5 hot May days through the bolt day.
    expect(row(a1.id)).toMatchObject({
      varietyId: alpha.id,
      season: 2025,
      seasonLabel: '2025',
      startOn: '2025-04-01',
      daysToBolt: 34,
      ddToBolt: r1(29 * COOL + 5 * HOT),
      daysToHarvest: null,
      ddToHarvest: null,
      heatDays: 4,
      longestHotStreak: 4,
      heatUntil: 'bolt',
      dayLengthAtBolt: r1(dayLengthHours(garden.latitude!, '2025-05-05')),
      boltedBeforeHarvest: true,
    });
    // Bravo 2024: bolted 9 May after the 8 hot days of 1–8 May.
    expect(row(b1.id)).toMatchObject({ season: 2024, daysToBolt: 38, ddToBolt: r1(29 * COOL + 9 * HOT), heatDays: 8, longestHotStreak: 8, heatUntil: 'bolt', boltedBeforeHarvest: true });
    // Bravo 2025: picked 21 May, never bolted: 19 heat days before the harvest (cool 10 May breaks the run), longest run 11–20 May.
    expect(row(b2.id)).toMatchObject({ daysToHarvest: 50, ddToHarvest: r1(30 * COOL + 20 * HOT), daysToBolt: null, heatDays: 19, longestHotStreak: 10, heatUntil: 'harvest', dayLengthAtBolt: null, boltedBeforeHarvest: false });
    // Bravo sown 15 Apr: bolted 20 May before its 25 May harvest; 9 + 9 heat days before the bolt.
    // Its progress ends at the bolting, so no degree days to the later harvest are counted.
    expect(row(b3.id)).toMatchObject({ daysToBolt: 35, ddToBolt: r1(16 * COOL + 19 * HOT), daysToHarvest: 40, ddToHarvest: null, heatDays: 18, longestHotStreak: 9, boltedBeforeHarvest: true });

    const b = dto.varieties.find((v) => v.varietyId === bravo.id)!;
    expect(b.plantings).toBe(3);
    expect(b.withOutcome).toBe(3);
    expect(b.boltedBeforeHarvestShare).toBe(0.67);
    expect(b.medians).toMatchObject({ heatDays: 18, longestHotStreak: 9, daysToBolt: 36.5, daysToHarvest: 45, ddToHarvest: r1(30 * COOL + 20 * HOT), ddToBolt: r1((r1(29 * COOL + 9 * HOT) + r1(16 * COOL + 19 * HOT)) / 2) });
  });

  it('when a variety bolted after fewer heat days, then it ranks below one that endured more, with the evidence in words and a caution under 3 plantings', async () => {
    const { clients, base, alpha, bravo, charlie } = await comparedGarden(app);
    const dto = (await clients.viewer.get(`${base}/compare?crop=lettuce`)).body as CompareDto;
    expect(dto.varieties.map((v) => [v.varietyId, v.rank])).toEqual([
      [bravo.id, 1],
      [alpha.id, 2],
      [charlie.id, null],
    ]);
    const [b, a, c] = dto.varieties;
    expect(a.evidence).toBe('Bolted after a median of 4 heat days (highs above 27 °C) across 1 planting.');
    expect(a.caution).toBe('Only 1 planting backs this rank: treat it as a first hint and keep recording.');
    expect(b.evidence).toBe('Endured a median of 18 heat days (highs above 27 °C) across 3 plantings; 2 of them bolted, the others reached harvest first.');
    expect(b.caution).toBeNull();
    expect(c.rank).toBeNull();
    expect(c.evidence).toMatch(/No bolting or harvest/);
    expect(c.boltedBeforeHarvestShare).toBeNull();
  });

  it('when a planting was picked before it bolted, then its heat days count up to the harvest and it did not bolt before harvest', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    await garden.update({ units: 'C' });
    await giveGardenWeather(sequelize, garden, springs());
    const delta = await makeVariety(garden.id, { name: 'Delta' });
    const d1 = await makePlanting(garden.id, { varietyId: delta.id, sownOn: '2025-04-01', firstHarvestOn: '2025-05-08', boltedOn: '2025-05-25', status: 'bolted' });
    // A planned planting has nothing to compare yet: it is left out, not counted as a planting.
    await makePlanting(garden.id, { varietyId: delta.id, sownOn: '2025-09-01', status: 'planned' });
    const dto = (await clients.viewer.get(`${base}/compare?crop=lettuce`)).body as CompareDto;
    expect(dto.plantings.map((p) => p.plantingId)).toEqual([d1.id]);
    expect(dto.varieties[0].plantings).toBe(1);
    // 1–7 May: 7 hot days before the harvest on 8 May.
    expect(dto.plantings.find((p) => p.plantingId === d1.id)).toMatchObject({ heatUntil: 'harvest', heatDays: 7, longestHotStreak: 7, daysToHarvest: 37, ddToHarvest: r1(29 * COOL + 8 * HOT), daysToBolt: 54, boltedBeforeHarvest: false });
    expect(dto.varieties[0]).toMatchObject({ rank: 1, boltedBeforeHarvestShare: 0 });
    expect(dto.varieties[0].evidence).toBe('Never bolted before harvest: reached it after a median of 7 heat days (highs above 27 °C) across 1 planting, so it stood at least that much heat.');
  });

  it('when seasons are chosen, then only their plantings count', async () => {
    const { clients, base, bravo, b1 } = await comparedGarden(app);
    const dto = (await clients.viewer.get(`${base}/compare?crop=lettuce&seasons=2024`)).body as CompareDto;
    expect(dto.seasons).toEqual([{ year: 2024, label: '2024' }]);
    expect(dto.availableSeasons.map((s) => s.year)).toEqual([2024, 2025]);
    expect(dto.plantings.map((p) => p.plantingId)).toEqual([b1.id]);
    expect(dto.varieties.map((v) => v.varietyId)).toEqual([bravo.id]);
    expect(dto.varieties[0].caution).toBe('Only 1 planting backs this rank: treat it as a first hint and keep recording.');
  });

  it('when the query is wrong, then the error names the field; a viewer reads, an outsider gets 404', async () => {
    const { clients, base } = await gardenWithClients(app);
    const missing = await clients.viewer.get(`${base}/compare`);
    expect(missing.status).toBe(400);
    expect(missing.body.error.fields).toHaveProperty('crop');
    const unknownCrop = await clients.viewer.get(`${base}/compare?crop=moonflower`);
    expect(unknownCrop.status).toBe(400);
    expect(unknownCrop.body.error.fields).toHaveProperty('crop');
    const seasons = await clients.viewer.get(`${base}/compare?crop=lettuce&seasons=2024,25`);
    expect(seasons.status).toBe(400);
    expect(seasons.body.error.fields).toHaveProperty('seasons');
    const extra = await clients.viewer.get(`${base}/compare?crop=lettuce&year=2024`);
    expect(extra.status).toBe(400);
    expect(extra.body.error.fields).toHaveProperty('year');
    expect((await clients.viewer.get(`${base}/compare.csv?crop=`)).status).toBe(400);
    const empty = await clients.viewer.get(`${base}/compare?crop=lettuce`);
    expect(empty.status).toBe(200);
    expect(empty.body.varieties).toEqual([]);
    expect((await clients.outsider.get(`${base}/compare?crop=lettuce`)).status).toBe(404);
    expect((await clients.outsider.get(`${base}/compare.csv?crop=lettuce`)).status).toBe(404);
  });

  it('when the comparison is downloaded, then the CSV has the unit in its header and one row per planting', async () => {
    const { clients, base, a1, b2 } = await comparedGarden(app);
    const res = await clients.viewer.get(`${base}/compare.csv?crop=lettuce&seasons=2025`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    expect(res.headers['content-disposition']).toBe('attachment; filename="compare-lettuce.csv"');
    const lines = res.text.replace(/^\uFEFF/, '').trimEnd().split('\r\n');
    expect(lines[0]).toBe(
      'planting_id,variety,season,start_on,first_harvest_on,bolted_on,days_to_harvest,dd_to_harvest_C_days,days_to_bolt,dd_to_bolt_C_days,heat_days_above_27_C,longest_hot_streak_days,heat_counted_until,day_length_at_bolt_hours,bolted_before_harvest',
    );
    expect(lines).toHaveLength(1 + 4);
    expect(lines.find((l) => l.startsWith(`${a1.id},`))).toMatch(new RegExp(`^${a1.id},Alpha,2025,2025-04-01,,2025-05-05,,,34,${r1(29 * COOL + 5 * HOT)},4,4,bolt,[0-9.]+,yes$`));
    expect(lines.find((l) => l.startsWith(`${b2.id},`))).toBe(`${b2.id},Bravo,2025,2025-04-01,2025-05-21,,50,${r1(30 * COOL + 20 * HOT)},,,19,10,harvest,,no`);
  });
  it('when a garden holds 600 plantings of the crop over two seasons, then every one of them counts, newest season included', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    await garden.update({ units: 'C' });
    await giveGardenWeather(sequelize, garden, springs());
    const variety = await makeVariety(garden.id, { name: 'Many' });
    const beds = await Promise.all(Array.from({ length: 20 }, () => makeBed(garden.id)));
    // Written in bulk as a seeder would: no save hooks, so the start day and season are given from the same rule.
    const rows = ['2024-04-01', '2025-04-01'].flatMap((first) =>
      Array.from({ length: 300 }, (_, i) => {
        const sownOn = addDays(first, Math.floor(i / beds.length));
        const p = {
          gardenId: garden.id, bedId: beds[i % beds.length].id, varietyId: variety.id, seedLotId: null, method: 'direct-sow' as const,
          status: 'harvested' as const, quantity: 10, quantityUnit: 'plants' as const, sownOn, emergedOn: null, thinnedOn: null,
          transplantedOn: null, firstHarvestOn: addDays(sownOn, 40), lastHarvestOn: null, boltedOn: null, notes: '', createdBy: null, startOn: sownOn,
        };
        return { ...p, seasonYear: seasonYearOf(p, variety, garden.latitude) };
      }),
    );
    await Planting.bulkCreate(rows);
    const dto = (await clients.viewer.get(`${base}/compare?crop=lettuce`)).body as CompareDto;
    expect(dto.seasons.map((s) => s.year)).toEqual([2024, 2025]);
    expect(dto.plantings).toHaveLength(600);
    expect(dto.plantings.filter((p) => p.season === 2025)).toHaveLength(300);
    expect(dto.plantings.every((p) => p.daysToHarvest === 40)).toBe(true);
    expect(dto.varieties[0]).toMatchObject({ plantings: 600, withOutcome: 600 });
  });
  it('when a crop holds more plantings than the cap, then whole seasons are counted, newest first, and the ones left out are named', () => {
    const of = (year: number | null, n: number, from: number) => Array.from({ length: n }, (_, k) => ({ id: from + k, varietyId: 1, seasonYear: year }));
    const wanted = [...of(2022, 300, 1), ...of(2023, 300, 301), ...of(null, 5, 601), ...of(2024, 300, 606)];
    expect(withinCap(wanted, 1000).picked).toHaveLength(905);
    const { picked, left } = withinCap(wanted, 700);
    expect([...new Set(picked.map((p) => p.seasonYear))]).toEqual([2023, 2024]);
    expect(picked).toHaveLength(600);
    expect([...left]).toEqual([2022, null]);
    // A newest season larger than the cap alone is cut to it rather than dropped.
    expect(withinCap(of(2024, 300, 1), 200).picked).toHaveLength(200);
  });
});
