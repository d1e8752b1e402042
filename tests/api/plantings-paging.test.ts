import { describe, expect, it } from 'vitest';
import { testApp } from '../helpers/test-app';
import { gardenWithClients, makeBed, makePlanting, makeVariety } from '../helpers/garden-records';
import { addDays } from '#shared/thermal/dates';

const app = testApp();

describe('plantings pages', () => {
  it('when a long list is read page by page in any order, then every planting comes exactly once, in that order, with the total', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const beds = [await makeBed(garden.id, 'A bed'), await makeBed(garden.id, 'B bed'), await makeBed(garden.id, 'C bed')];
    const variety = await makeVariety(garden.id, { dtmDays: 55 });
    const made = [];
    for (let i = 0; i < 8; i++) made.push(await makePlanting(garden.id, { bedId: beds[i % 3].id, varietyId: variety.id, sownOn: addDays('2026-03-01', (i * 5) % 17) }));
    for (const sort of ['sown', 'bed', 'status', 'variety']) {
      const seen: { id: number; bed: string; sownOn: string | null }[] = [];
      for (let page = 1; page <= 3; page++) {
        const res = await clients.viewer.get(`${base}/plantings?sort=${sort}&pageSize=3&page=${page}`);
        expect(res.status).toBe(200);
        expect(res.body).toMatchObject({ total: 8, page, pageSize: 3 });
        seen.push(...res.body.items.map((p: { id: number; bed: { name: string }; sownOn: string | null }) => ({ id: p.id, bed: p.bed.name, sownOn: p.sownOn })));
      }
      expect(seen.map((p) => p.id).sort((a, b) => a - b)).toEqual(made.map((p) => p.id).sort((a, b) => a - b));
      if (sort === 'bed') expect(seen.map((p) => p.bed)).toEqual([...seen.map((p) => p.bed)].sort());
      if (sort === 'sown') expect(seen.map((p) => p.sownOn)).toEqual([...seen.map((p) => p.sownOn)].sort());
    }
  });
});
