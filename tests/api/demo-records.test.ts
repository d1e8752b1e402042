import { describe, expect, it } from 'vitest';
import { testDb } from '../helpers/test-app';
import { createGarden, createUser } from '../helpers/factories';
import { DEMO_GARDENS, DEMO_USERS, seedDemo } from '../../server/db/seeders/demo';
import { seedGardenRecords } from '../../server/db/seeders/demo-records';
import { Bed, Garden, GerminationTest, Membership, Planting, PlantingLog, SeedLot, User, Variety } from '../../server/db/models';
import { localDate } from '../../server/lib/local-date';

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
  it('when the demo is seeded twice, then its accounts, gardens and memberships are not duplicated', async () => {
    const { sequelize } = testDb();
    await seedDemo(sequelize);
    await seedDemo(sequelize);
    const users = await User.findAll({ where: { email: DEMO_USERS.map((u) => u.email) } });
    expect(users).toHaveLength(DEMO_USERS.length);
    const coordinator = users.find((u) => u.email === DEMO_USERS[0].email)!;
    const owned = await Membership.findAll({ where: { userId: coordinator.id, role: 'owner' } });
    const gardens = await Garden.findAll({ where: { id: owned.map((m) => m.gardenId), name: DEMO_GARDENS.map((g) => g.name) } });
    expect(gardens.map((g) => g.name).sort()).toEqual(DEMO_GARDENS.map((g) => g.name).sort());
    expect(await Membership.count({ where: { gardenId: gardens.map((g) => g.id), userId: users.map((u) => u.id) } })).toBe(DEMO_USERS.length * DEMO_GARDENS.length);
  });

  // The records are laid out into copies of the demo gardens (same places), because the browser
  // tests add their own beds and plantings to the demo gardens while this file runs.
  it('when a garden’s records are seeded twice, then nothing is duplicated and both hemispheres have a full history', async () => {
    const { sequelize } = testDb();
    const users = [await createUser(), await createUser(), await createUser()];
    const gardens: Garden[] = [];
    for (const demo of DEMO_GARDENS) gardens.push(await createGarden({ name: `Copy of ${demo.name} ${gardens.length}-${Date.now()}`, latitude: demo.latitude, longitude: demo.longitude, timeZone: demo.timeZone }));
    const seed = () => sequelize.transaction(async (t) => {
      for (const g of gardens) await seedGardenRecords(g, users, localDate(g.timeZone), t);
    });
    await seed();
    const ids = gardens.map((g) => g.id);
    const first = await counts(ids);
    await seed();
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
