import { describe, expect, it } from 'vitest';
import { testApp } from '../helpers/test-app';
import { gardenWithClients } from '../helpers/garden-records';
import { CROP_LIBRARY } from '#shared/crops/library';
import { CONFIDENCES } from '#shared/crops/params';

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
