import { describe, expect, it } from 'vitest';
import { testDb } from '../helpers/test-app';
import { seedDemo } from '../../server/db/seeders/demo';
import { Bed, GerminationTest, Planting, PlantingLog, SeedLot, Variety } from '../../server/db/models';

async function counts(gardenIds: number[]) {
  const where = { gardenId: gardenIds };
  return {
    beds: await Bed.count({ where }),
    varieties: await Variety.count({ where }),
    lots: await SeedLot.count({ where }),
    tests: await GerminationTest.count({ where }),
    plantings: await Planting.count({ where }),
    logs: await PlantingLog.count({ where }),
  };
}

describe('demo garden records', () => {
  it('when the demo is seeded twice, then nothing is duplicated and both hemispheres have a full history', async () => {
    const { sequelize } = testDb();
    const { gardens } = await seedDemo(sequelize);
    const ids = gardens.map((g) => g.id);
    const first = await counts(ids);
    await seedDemo(sequelize);
    expect(await counts(ids)).toEqual(first);

    for (const garden of gardens) {
      expect(await Bed.count({ where: { gardenId: garden.id } })).toBe(12);
      const plantings = await Planting.findAll({ where: { gardenId: garden.id }, include: [{ model: Variety, as: 'variety' }] });
      const crops = new Set(plantings.map((p) => p.variety!.cropKey));
      for (const c of ['lettuce', 'spinach', 'arugula', 'cilantro', 'radish', 'pea', 'bok-choy', 'tomato', 'pepper', 'snap-bean']) expect(crops).toContain(c);
      const statuses = new Set(plantings.map((p) => p.status));
      expect(statuses).toContain('bolted');
      expect(statuses).toContain('harvested');
      // Four seasons: three past and the current one, each starting on the hemisphere's season start.
      const south = (garden.latitude ?? 0) < 0;
      const seasons = new Set(plantings.map((p) => Number(p.startOn!.slice(0, 4)) - (south && Number(p.startOn!.slice(5, 7)) < 7 ? 1 : 0)));
      expect(seasons.size).toBe(4);
      for (const p of plantings) {
        for (const d of [p.emergedOn, p.firstHarvestOn, p.boltedOn]) if (d) expect(d >= p.startOn!).toBe(true);
      }
      expect(await PlantingLog.count({ where: { gardenId: garden.id } })).toBeGreaterThan(plantings.length);
      const lots = await SeedLot.findAll({ where: { gardenId: garden.id } });
      expect(new Set(lots.map((l) => l.packedForYear)).size).toBeGreaterThanOrEqual(3);
      expect(await GerminationTest.count({ where: { gardenId: garden.id } })).toBeGreaterThan(0);
    }
  });
});
