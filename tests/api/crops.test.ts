import { describe, expect, it } from 'vitest';
import { testApp } from '../helpers/test-app';
import { gardenWithClients } from '../helpers/garden-records';
import { CROP_LIBRARY } from '#shared/crops/library';
import { CONFIDENCES } from '#shared/crops/params';
import { fToC } from '#shared/thermal/index';
import { CropOverride, Garden } from '../../server/db/models';
import { effectiveValues, getCrop } from '../../server/modules/crops/crops.service';
import { cropBoltTriggers } from '../../server/modules/crops/crop-thermal';

const app = testApp();

describe('crop library', () => {
  it('when the library is read, then it holds the issue’s crops and every parameter carries a source and a confidence', async () => {
    const { clients, base } = await gardenWithClients(app);
    const res = await clients.viewer.get(`${base}/crops`);
    expect(res.status).toBe(200);
    const keys = res.body.crops.map((c: { key: string }) => c.key);
    for (const k of ['lettuce', 'spinach', 'arugula', 'cilantro', 'radish', 'pea', 'bok-choy', 'broccoli', 'cabbage', 'carrot', 'beet', 'onion', 'tomato', 'pepper', 'snap-bean', 'sweet-corn', 'cucumber', 'squash', 'watermelon']) {
      expect(keys).toContain(k);
    }
    for (const crop of res.body.crops) {
      for (const p of crop.params) {
        expect(p.source.length, `${crop.key}.${p.key}`).toBeGreaterThan(5);
        expect(CONFIDENCES, `${crop.key}.${p.key}`).toContain(p.confidence);
        expect(p.origin).toBe('library');
      }
    }
  });

  it('when figures from SCIENCE.md are read, then they carry the sources named there', async () => {
    const { clients, base } = await gardenWithClients(app);
    const param = async (crop: string, key: string) =>
      (await clients.viewer.get(`${base}/crops/${crop}`)).body.crop.params.find((p: { key: string }) => p.key === key);
    // SCIENCE §2: Univ. of Delaware, base 40 °F for peas (H); Tan et al. 2000, broccoli base 0 °C (H).
    expect(await param('pea', 'baseC')).toMatchObject({ value: expect.closeTo(4.444, 2), confidence: 'H', source: expect.stringContaining('Delaware') });
    expect(await param('broccoli', 'baseC')).toMatchObject({ value: 0, confidence: 'H', source: expect.stringContaining('Tan et al. 2000') });
    // SCIENCE §7: Harrington, Oregon State Ext.: tomato germination minimum 50 °F; Iowa State seed life of onion 1 year.
    expect(await param('tomato', 'germMinC')).toMatchObject({ value: 10, confidence: 'H', source: expect.stringContaining('Harrington') });
    expect(await param('onion', 'seedLifeYears')).toMatchObject({ value: 1, source: expect.stringContaining('Iowa State') });
    // SCIENCE §3: Chun et al. 2001 for spinach's critical day length (M), from the engine's defaults.
    expect(await param('spinach', 'criticalPhotoperiodH')).toMatchObject({ confidence: 'M', source: expect.stringContaining('Chun') });
  });

  it('when the owner overrides a value, then this garden sees its own value and the default, and other gardens keep the default', async () => {
    const a = await gardenWithClients(app);
    const b = await gardenWithClients(app);
    const before = CROP_LIBRARY.find((c) => c.key === 'lettuce')!.params.baseC.value;
    const res = await a.clients.owner.patch(`${a.base}/crops/lettuce`).send({ params: { baseC: { value: 3, note: 'our cold valley' }, season: { value: 'cool' } } });
    expect(res.status).toBe(200);
    const base = res.body.crop.params.find((p: { key: string }) => p.key === 'baseC');
    expect(base).toMatchObject({ value: 3, origin: 'garden', confidence: null, source: 'Set for this garden: our cold valley' });
    expect(base.libraryDefault.value).toBeCloseTo(before!, 6);
    expect(res.body.crop.overrides).toBe(2);
    const other = (await b.clients.owner.get(`${b.base}/crops/lettuce`)).body.crop.params.find((p: { key: string }) => p.key === 'baseC');
    expect(other).toMatchObject({ origin: 'library' });
    const cleared = await a.clients.owner.patch(`${a.base}/crops/lettuce`).send({ params: { baseC: null } });
    expect(cleared.body.crop.overrides).toBe(1);
    expect(CROP_LIBRARY.find((c) => c.key === 'lettuce')!.params.baseC.value).toBe(before);
  });

  it('when a grower or viewer overrides, or values are out of range or unknown, then 403 or 400', async () => {
    const { clients, base } = await gardenWithClients(app);
    expect((await clients.grower.patch(`${base}/crops/lettuce`).send({ params: { baseC: { value: 3 } } })).status).toBe(403);
    expect((await clients.viewer.patch(`${base}/crops/lettuce`).send({ params: { baseC: { value: 3 } } })).status).toBe(403);
    const bad = await clients.owner.patch(`${base}/crops/lettuce`).send({ params: { baseC: { value: 99 }, method: { value: 'guess' }, colour: { value: 1 }, upperC: { value: 30, extra: 1 } } });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['params.baseC.value', 'params.colour', 'params.method.value', 'params.upperC.extra']);
    expect((await clients.owner.get(`${base}/crops/mandrake`)).status).toBe(404);
    expect((await clients.outsider.get(`${base}/crops`)).status).toBe(404);
  });
});

describe('crop parameters checked together', () => {
  const pairs: [string, string, Record<string, { value: number }>, string[]][] = [
    ['upper threshold below the base', 'tomato', { baseC: { value: 25 }, upperC: { value: 15 } }, ['baseC', 'upperC']],
    ['germination minimum above the optimum', 'tomato', { germMinC: { value: 30 } }, ['germMinC', 'germOptC']],
    ['germination optimum above the maximum', 'tomato', { germOptC: { value: 40 } }, ['germMaxC', 'germOptC']],
    ['vernalization minimum not below the maximum', 'cabbage', { vernalizationMinC: { value: 12 }, vernalizationMaxC: { value: 8 } }, ['vernalizationMaxC', 'vernalizationMinC']],
    ['blossom-drop watch above the warning', 'tomato', { blossomDropWatchC: { value: 35 } }, ['blossomDropWarningC', 'blossomDropWatchC']],
    ['cool-night limit not below the warm-night limit', 'tomato', { blossomDropNightBelowC: { value: 22 } }, ['blossomDropNightAboveC', 'blossomDropNightBelowC']],
  ];

  for (const [what, cropKey, params, named] of pairs) {
    it(`when the owner sets a ${what}, then 400 names every field of the pair and nothing is stored`, async () => {
      const { clients, base, garden } = await gardenWithClients(app);
      const res = await clients.owner.patch(`${base}/crops/${cropKey}`).send({ params });
      expect(res.status).toBe(400);
      expect(res.body.error.code).toBe('validation_failed');
      expect(Object.keys(res.body.error.fields).sort()).toEqual(named.map((k) => `params.${k}.value`));
      expect(res.body.error.message).toMatch(/must (be above|not be below)/);
      expect(await CropOverride.count({ where: { gardenId: garden.id } })).toBe(0);
    });
  }

  it('when the upper threshold is set below the base, then the message says both figures in the garden’s unit', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    await Garden.update({ units: 'C' }, { where: { id: garden.id } });
    const res = await clients.owner.patch(`${base}/crops/tomato`).send({ params: { baseC: { value: 25 }, upperC: { value: 15 } } });
    expect(res.body.error.message).toBe('The upper threshold (15 °C) must be above the base temperature (25 °C).');
  });

  it('when a change conflicts with a value stored earlier, then it is refused against the merged values', async () => {
    const { clients, base } = await gardenWithClients(app);
    expect((await clients.owner.patch(`${base}/crops/tomato`).send({ params: { upperC: { value: 20 } } })).status).toBe(200);
    const res = await clients.owner.patch(`${base}/crops/tomato`).send({ params: { baseC: { value: 22 } } });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['params.baseC.value', 'params.upperC.value']);
  });

  it('when a consistent change is sent, then it is stored, and clearing one side goes back to the default', async () => {
    const { clients, base } = await gardenWithClients(app);
    const res = await clients.owner.patch(`${base}/crops/tomato`).send({ params: { baseC: { value: 12 }, upperC: { value: 32 }, germMinC: { value: 12 } } });
    expect(res.status).toBe(200);
    expect(res.body.crop.overrides).toBe(3);
    expect((await clients.owner.patch(`${base}/crops/tomato`).send({ params: { upperC: null } })).status).toBe(200);
  });
});

describe('degree-day figures keep the method they were counted with', () => {
  it('when the owner sets a juvenile phase, then the row stores the crop’s method at that moment, shown beside the value', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const res = await clients.owner.patch(`${base}/crops/cabbage`).send({ params: { juvenileGdd: { value: 400 } } });
    expect(res.status).toBe(200);
    const row = await CropOverride.findOne({ where: { gardenId: garden.id, cropKey: 'cabbage', paramKey: 'juvenileGdd' } });
    expect(row).toMatchObject({ ddBaseC: expect.closeTo(fToC(40), 9), ddUpperC: null, ddMethod: 'single-sine', ddCutoff: 'horizontal' });
    const param = res.body.crop.params.find((p: { key: string }) => p.key === 'juvenileGdd');
    expect(param.ddBasis).toMatchObject({ method: 'single-sine', upperC: null, stale: false });
  });

  it('when the crop’s base changes after the juvenile phase was set, then it is shown as stale and the bolt triggers leave the gate off with a note', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    await clients.owner.patch(`${base}/crops/cabbage`).send({ params: { juvenileGdd: { value: 400 } } });
    const res = await clients.owner.patch(`${base}/crops/cabbage`).send({ params: { baseC: { value: 7 } } });
    expect(res.body.crop.params.find((p: { key: string }) => p.key === 'juvenileGdd').ddBasis.stale).toBe(true);
    const crop = await getCrop(garden.id, 'cabbage');
    const bolt = cropBoltTriggers('cabbage', effectiveValues(crop), crop.overrides, 'F')!;
    expect(bolt.triggers.vernalization!.juvenileGdd).toBe(0);
    expect(bolt.notes).toEqual([
      'Your juvenile phase of 720 °F-days was counted at base 40 °F, single sine; this crop now counts from base 44.6 °F, single sine, so cold counts from the start until you set the juvenile phase again.',
    ]);
  });

  it('when a stored figure has no recorded method, then it counts as the library default method', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    await CropOverride.create({ gardenId: garden.id, cropKey: 'cabbage', paramKey: 'juvenileGdd', valueJson: '400', note: '', updatedBy: null });
    const param = (await clients.owner.get(`${base}/crops/cabbage`)).body.crop.params.find((p: { key: string }) => p.key === 'juvenileGdd');
    expect(param.ddBasis).toMatchObject({ baseC: expect.closeTo(fToC(40), 9), method: 'single-sine', stale: false });
  });
});
