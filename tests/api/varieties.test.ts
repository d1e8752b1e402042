import { describe, expect, it } from 'vitest';
import { testApp, testDb } from '../helpers/test-app';
import { giveGardenWeather, steadyDays } from '../helpers/garden-weather';
import { gardenWithClients, makeLot, makeVariety, makePlanting } from '../helpers/garden-records';
import { createGarden } from '../helpers/factories';
import { fToC } from '#shared/thermal/index';
import { Variety } from '../../server/db/models';

const app = testApp();

const packet = {
  cropKey: 'spinach',
  name: 'Test Savoy',
  dtmDays: 42,
  dtmFrom: 'emergence',
  emergenceDaysMin: 6,
  emergenceDaysMax: 10,
  boltTolerance: 4,
  heatTolerance: 2,
  traits: ['f1-hybrid', 'treated', 'pelleted'],
  containerFriendly: true,
  sunHours: 6,
  waterCmPerWeek: 2.5,
  sowDepthCm: 1.5,
  spacingCm: 8,
  thinSpacingCm: 10,
  gddTargetOverrideC: null,
  notes: '',
};

describe('varieties', () => {
  it('when a grower adds a variety, then its packet facts, trait guidance and target basis come back', async () => {
    const { clients, base } = await gardenWithClients(app);
    const res = await clients.grower.post(`${base}/varieties`).send(packet);
    expect(res.status).toBe(201);
    const v = res.body.variety;
    expect(v).toMatchObject({ name: 'Test Savoy', crop: { key: 'spinach', name: 'Spinach', season: 'cool' }, dtmFrom: 'emergence', traits: ['f1-hybrid', 'treated', 'pelleted'] });
    const text = v.guidance.map((g: { text: string }) => g.text).join(' ');
    expect(text).toMatch(/does not come true/);
    expect(text).toMatch(/wear gloves/i);
    expect(text).toMatch(/label/);
    expect(text).toMatch(/Pelleted seed/);
    // Test gardens have no weather until a test gives them some: nothing to derive from yet.
    expect(v.gddTarget).toMatchObject({ basis: 'none', valueC: null, explanation: expect.stringMatching(/^No past weather for this garden yet/) });
  });

  it('when the target is overridden, then the variety reports the override in °C-days', async () => {
    const { clients, base } = await gardenWithClients(app);
    const id = (await clients.grower.post(`${base}/varieties`).send(packet)).body.variety.id;
    const res = await clients.grower.patch(`${base}/varieties/${id}`).send({ gddTargetOverrideC: 480 });
    expect(res.body.variety.gddTarget).toMatchObject({ valueC: 480, basis: 'override', countsFrom: 'sowing' });
  });

  it('when traits conflict or fields are unknown, then 400 names them', async () => {
    const { clients, base } = await gardenWithClients(app);
    const res = await clients.grower.post(`${base}/varieties`).send({ ...packet, traits: ['f1-hybrid', 'heirloom'], emergenceDaysMin: 9, emergenceDaysMax: 3, cropKey: 'mandrake', id: 4 });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['cropKey', 'emergenceDaysMax', 'id', 'traits']);
    const id = (await clients.grower.post(`${base}/varieties`).send(packet)).body.variety.id;
    // A partial change is checked against the whole record.
    const partial = await clients.grower.patch(`${base}/varieties/${id}`).send({ traits: ['open-pollinated', 'f1-hybrid'] });
    expect(partial.status).toBe(400);
  });

  it('when roles differ, then viewers read, growers write, outsiders see nothing', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const v = await makeVariety(garden.id);
    expect((await clients.viewer.get(`${base}/varieties/${v.id}`)).status).toBe(200);
    expect((await clients.viewer.patch(`${base}/varieties/${v.id}`).send({ notes: 'x' })).status).toBe(403);
    expect((await clients.viewer.post(`${base}/varieties`).send(packet)).status).toBe(403);
    expect((await clients.outsider.get(`${base}/varieties/${v.id}`)).status).toBe(404);
    const list = await clients.viewer.get(`${base}/varieties?crop=lettuce&trait=open-pollinated`);
    expect(list.body.total).toBe(1);
    expect((await clients.grower.delete(`${base}/varieties/${v.id}`)).status).toBe(204);
  });

  it('when a variety has seed lots, or belongs to another garden, then delete is refused', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const v = await makeVariety(garden.id);
    await makeLot(garden.id, v.id);
    expect((await clients.grower.delete(`${base}/varieties/${v.id}`)).status).toBe(409);
    const other = await makeVariety((await createGarden()).id);
    expect((await clients.grower.delete(`${base}/varieties/${other.id}`)).status).toBe(404);
  });
});

describe('a variety in use keeps its crop', () => {
  it('when a variety with plantings is moved to another crop, then 409 names the crop field and nothing changes', async () => {
    const app = testApp();
    const { garden, clients, base } = await gardenWithClients(app);
    const planting = await makePlanting(garden.id);
    const res = await clients.grower.patch(`${base}/varieties/${planting.varietyId}`).send({ cropKey: 'spinach' });
    expect(res.status).toBe(409);
    expect(res.body.error.fields.cropKey).toMatch(/cannot change/);
    const again = await clients.grower.get(`${base}/varieties/${planting.varietyId}`).expect(200);
    expect(again.body.variety.crop.key).toBe('lettuce');
  });
});

/**
 * Lettuce's degree days by the single sine without an upper threshold (Baskerville & Emin 1969;
 * the B term of Zalom et al. 1983, UC DANR Leaflet 21373, Table 5, with θ2 = π/2), written here
 * apart from the engine: T(θ) = M + α sin θ, θ1 = asin((L − M)/α), DD = [(M − L)(π/2 − θ1) + α cos θ1]/π.
 */
function sineDegreeDays(tx: number, tn: number, base: number) {
  const m = (tx + tn) / 2;
  const a = (tx - tn) / 2;
  if (tn >= base) return m - base;
  if (tx <= base) return 0;
  const t1 = Math.asin((base - m) / a);
  return ((m - base) * (Math.PI / 2 - t1) + a * Math.cos(t1)) / Math.PI;
}

/** Days that rise and fall with the seasons and from day to day, at tenths of a degree as stations report. */
function seasonalDays(from: string, to: string) {
  return steadyDays(from, to, 0, 0).map((d, k) => {
    const tmax = Math.round((12 + 10 * Math.sin((2 * Math.PI * (k - 100)) / 365.25) + ((k * 7) % 5)) * 10) / 10;
    return { ...d, tmax, tmin: Math.round((tmax - 8 - (k % 4) * 1.5) * 10) / 10 };
  });
}

describe('the packet-derived target over a garden’s own weather', () => {
  it('when the weather varies, then the target is the median of 50-day sums over the usual spring window, as computed independently', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const days = seasonalDays('2021-01-01', '2024-12-31');
    await giveGardenWeather(testDb().sequelize, garden, days);
    const variety = await makeVariety(garden.id, { cropKey: 'lettuce', dtmDays: 50, dtmFrom: 'sowing' });
    const t = (await clients.viewer.get(`${base}/varieties/${variety.id}`).expect(200)).body.variety.gddTarget;

    // Every start from 15 March to 15 May (the cool-season default window, northern hemisphere) in
    // each year: the start day is day 0, so a sample is the 50 days after it.
    const base40F = ((40 - 32) * 5) / 9;
    const dd = days.map((d) => sineDegreeDays(d.tmax, d.tmin, base40F));
    const index = new Map(days.map((d, i) => [d.date, i]));
    const samples: number[] = [];
    for (const year of [2021, 2022, 2023, 2024]) {
      for (let a = index.get(`${year}-03-15`)!; a <= index.get(`${year}-05-15`)!; a++) {
        samples.push(dd.slice(a + 1, a + 51).reduce((sum, x) => sum + x, 0));
      }
    }
    samples.sort((x, y) => x - y);
    const mid = samples.length / 2;
    const median = samples.length % 2 ? samples[Math.floor(mid)] : (samples[mid - 1] + samples[mid]) / 2;
    const rank = (p: number) => samples[Math.ceil((p / 100) * samples.length) - 1];
    // The series crosses the base inside the window, so the sine's partial days are exercised.
    expect(days.some((d, i) => index.get('2022-03-15')! <= i && i <= index.get('2022-07-04')! && d.tmin < base40F && d.tmax > base40F)).toBe(true);
    expect(t).toMatchObject({ basis: 'derived', countsFrom: 'sowing', stale: false });
    expect(t.valueC).toBeCloseTo(median, 6);
    expect(t.p10C).toBeCloseTo(rank(10), 6);
    expect(t.p90C).toBeCloseTo(rank(90), 6);
    expect(t.p90C).toBeGreaterThan(t.p10C);
    expect(t.explanation).toMatch(/50 days from sowing/);
    expect(t.explanation).toContain(`; ${samples.length.toLocaleString('en-US')} samples)`);
    // The list gives the same figure as the single variety.
    const items = (await clients.viewer.get(`${base}/varieties`).expect(200)).body.items as Array<{ id: number; gddTarget: { valueC: number } }>;
    expect(items.find((v) => v.id === variety.id)!.gddTarget.valueC).toBeCloseTo(median, 6);
  });

  it('when the weather is a steady 20 °C, then the target is the packet’s days times 20 °C less lettuce’s base 40 °F', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    await giveGardenWeather(testDb().sequelize, garden, steadyDays('2022-01-01', '2024-12-31', 20, 20));
    const variety = await makeVariety(garden.id, { cropKey: 'lettuce', dtmDays: 50, dtmFrom: 'sowing' });
    const t = (await clients.viewer.get(`${base}/varieties/${variety.id}`).expect(200)).body.variety.gddTarget;
    // Univ. of Delaware: base 40 °F (4.44 °C) for lettuce; at α = 0 the sine gives T − L a day.
    const perDay = 20 - ((40 - 32) * 5) / 9;
    expect(t).toMatchObject({ basis: 'derived', valueC: expect.closeTo(50 * perDay, 6), p10C: expect.closeTo(50 * perDay, 6), p90C: expect.closeTo(50 * perDay, 6) });
  });
});

describe('a grower’s degree-day target keeps the method it was set in', () => {
  it('when a grower sets the target, then the crop’s method is stored with it and shown beside it', async () => {
    const { clients, base } = await gardenWithClients(app);
    const id = (await clients.grower.post(`${base}/varieties`).send({ ...packet, gddTargetOverrideC: 500 })).body.variety.id;
    const row = await Variety.findByPk(id);
    expect(row).toMatchObject({ gddTargetBaseC: expect.closeTo(fToC(40), 9), gddTargetUpperC: null, gddTargetMethod: 'single-sine', gddTargetCutoff: 'horizontal' });
    const v = (await clients.viewer.get(`${base}/varieties/${id}`)).body.variety;
    expect(v.gddTargetBasis).toMatchObject({ method: 'single-sine', upperC: null });
    expect(v.gddTarget).toMatchObject({ valueC: 500, basis: 'override', stale: false, basisNote: 'Set at base 40 °F, single sine.' });
  });

  it('when a client sends the method itself, then 400: only the server records it', async () => {
    const { clients, base } = await gardenWithClients(app);
    const res = await clients.grower.post(`${base}/varieties`).send({ ...packet, gddTargetOverrideC: 500, gddTargetBaseC: 0 });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(['gddTargetBaseC']);
  });

  it('when the crop’s base changes after the target was set, then the packet-derived target is used and the note says why in units', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const id = (await clients.grower.post(`${base}/varieties`).send({ ...packet, gddTargetOverrideC: 500 })).body.variety.id;
    expect((await clients.owner.patch(`${base}/crops/spinach`).send({ params: { baseC: { value: 7 } } })).status).toBe(200);
    await giveGardenWeather(testDb().sequelize, garden, steadyDays('2022-01-01', '2024-12-31', 20, 20));
    const t = (await clients.viewer.get(`${base}/varieties/${id}`)).body.variety.gddTarget;
    const note = 'Your target of 900 °F-days was set at base 40 °F, single sine; this crop now counts from base 44.6 °F, single sine, so the packet-derived target is used until you set it again.';
    // 42 days from emergence plus the packet's 10 days to emerge, at 20 °C over the new base 7 °C.
    expect(t).toMatchObject({ basis: 'derived', stale: true, basisNote: note, valueC: expect.closeTo((42 + 10) * (20 - 7), 6) });
    expect(t.explanation.startsWith(note)).toBe(true);

    const again = await clients.grower.patch(`${base}/varieties/${id}`).send({ gddTargetOverrideC: 500 });
    expect(again.body.variety.gddTarget).toMatchObject({ valueC: 500, basis: 'override', stale: false, basisNote: 'Set at base 44.6 °F, single sine.' });
  });

  it('when a target stored before the method was recorded is read, then it counts as the library default method', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const v = await makeVariety(garden.id, { cropKey: 'spinach', gddTargetOverrideC: 450 });
    const t = (await clients.viewer.get(`${base}/varieties/${v.id}`)).body.variety.gddTarget;
    expect(t).toMatchObject({ valueC: 450, basis: 'override', stale: false });
  });
});

describe('the varieties list carries each degree-day target', () => {
  /** How many SQL statements one request runs (this file's requests run one at a time). */
  async function queriesOf(run: () => Promise<unknown>) {
    const { sequelize } = testDb();
    let n = 0;
    const count = () => {
      n++;
    };
    sequelize.addHook('beforeQuery', 'count-queries', count);
    try {
      await run();
    } finally {
      sequelize.removeHook('beforeQuery', 'count-queries');
    }
    return n;
  }

  it('when a garden has weather history, then every listed variety has its target, an override as the grower set it', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    await giveGardenWeather(testDb().sequelize, garden, steadyDays('2022-01-01', '2024-12-31', 24, 12));
    const derived = await makeVariety(garden.id, { name: 'Derived leaf', dtmDays: 40 });
    const own = await makeVariety(garden.id, { name: 'Own leaf', cropKey: 'lettuce', gddTargetOverrideC: 520 });
    await makePlanting(garden.id, { varietyId: derived.id, sownOn: '2024-04-10' });
    const items = (await clients.viewer.get(`${base}/varieties`).expect(200)).body.items as Array<{ id: number; gddTarget: { valueC: number; basis: string } }>;
    const byId = new Map(items.map((v) => [v.id, v.gddTarget]));
    // Lettuce counts from base 40 °F (4.4 °C) with no upper limit: days of 24/12 °C give 18 − 4.4 °C-days each.
    expect(byId.get(derived.id)).toMatchObject({ basis: 'derived', valueC: expect.closeTo(40 * (18 - fToC(40)), 1) });
    expect(byId.get(own.id)).toMatchObject({ basis: 'override', valueC: 520 });
  });

  it('when the list grows from two varieties to eight, then it takes the same number of queries', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    await giveGardenWeather(testDb().sequelize, garden, steadyDays('2023-01-01', '2024-12-31', 22, 10));
    const add = async (n: number) => {
      for (let i = 0; i < n; i++) {
        const v = await makeVariety(garden.id);
        await makePlanting(garden.id, { varietyId: v.id });
      }
    };
    await add(2);
    const few = await queriesOf(() => clients.viewer.get(`${base}/varieties`).expect(200));
    await add(6);
    let listed = 0;
    const many = await queriesOf(async () => {
      listed = (await clients.viewer.get(`${base}/varieties`).expect(200)).body.items.filter((v: { gddTarget?: unknown }) => v.gddTarget).length;
    });
    expect(listed).toBe(8);
    expect(few).toBeGreaterThan(0);
    expect(many).toBe(few);
  });
});
