import { describe, expect, it } from 'vitest';
import { testApp } from '../../helpers/test-app';
import { gardenWithClients, makePlanting, makeVariety } from '../../helpers/garden-records';

const app = testApp();

describe('crop thresholds on the weather chart', () => {
  it('when lettuce and tomato are growing, then their base, upper and bolting lines come in the garden’s unit, grouped by value', async () => {
    const { garden, clients, base } = await gardenWithClients(app);
    await makePlanting(garden.id, { varietyId: (await makeVariety(garden.id, { cropKey: 'lettuce' })).id });
    await makePlanting(garden.id, { varietyId: (await makeVariety(garden.id, { cropKey: 'tomato', name: 'Test tomato' })).id });
    await makePlanting(garden.id, { varietyId: (await makeVariety(garden.id, { cropKey: 'spinach', name: 'Old spinach' })).id, status: 'harvested' });
    const res = await clients.viewer.get(`${base}/weather`).expect(200);
    const labels = res.body.thresholds.map((t: { label: string }) => t.label);
    // SCIENCE.md §2: extension defaults 40 °F base for cool-season crops, 50/86 °F for warm-season crops.
    const lines = res.body.thresholds.map((t: { label: string; value: number }) => `${t.label}: ${t.value}`);
    expect(lines).toContain('Base temperature – Lettuce: 40');
    expect(lines).toContain('Base temperature – Tomato: 50');
    expect(lines).toContain('Upper threshold – Tomato: 86');
    expect(labels.some((l: string) => l.includes('Spinach'))).toBe(false);
    expect(res.body.thresholds.find((t: { kind: string }) => t.kind === 'bolt-heat')?.label).toBe('Bolting heat – Lettuce');
  });

  it('when peas grow beside lettuce, then only the lettuce gets a bolting line: peas do not bolt', async () => {
    const { garden, clients, base } = await gardenWithClients(app);
    await makePlanting(garden.id, { varietyId: (await makeVariety(garden.id, { cropKey: 'pea', name: 'Test pea', boltTolerance: null })).id });
    const peasOnly = await clients.viewer.get(`${base}/weather`).expect(200);
    expect(peasOnly.body.thresholds.map((t: { label: string }) => t.label)).toEqual(['Base temperature – Pea']);
    await makePlanting(garden.id, { varietyId: (await makeVariety(garden.id, { cropKey: 'lettuce', name: 'Test leaf' })).id });
    const both = await clients.viewer.get(`${base}/weather`).expect(200);
    const bolting = both.body.thresholds.filter((t: { kind: string }) => t.kind === 'bolt-heat').map((t: { label: string }) => t.label);
    expect(bolting).toEqual(['Bolting heat – Lettuce']);
  });

  it('when an owner overrides a crop’s base for this garden, then the line follows the override', async () => {
    const { garden, clients, base } = await gardenWithClients(app);
    await makePlanting(garden.id);
    await clients.owner.patch(`${base}/crops/lettuce`).send({ params: { baseC: { value: 5, note: 'Our own trial' } } }).expect(200);
    const res = await clients.grower.get(`${base}/weather`).expect(200);
    expect(res.body.thresholds).toContainEqual({ kind: 'base', value: 41, label: 'Base temperature – Lettuce' });
  });
});
