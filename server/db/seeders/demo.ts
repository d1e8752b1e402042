import type { Sequelize } from 'sequelize';
import { Garden, Membership, User } from '../models';
import { hashPassword } from '../../modules/auth/password';
import type { Role } from '#shared/schemas/gardens';
import { localDate } from '../../lib/local-date';
import { seedGardenRecords } from './demo-records';
import type { PendingOutcome } from './demo-records';
import { settleDemoOutcomes } from './demo-outcomes';
import type { WeatherService } from '../../modules/weather/weather.service';
import { retryOnConflict, withClusterLock } from '../migrate';

/** Invented demo scenario: every name and place here is fictional. */
export const DEMO_PASSWORD = 'heatclock-demo';

export const DEMO_USERS = [
  { email: 'coordinator@hollowbrook.example', name: 'Ada Marchetti', role: 'owner' },
  { email: 'grower.rosa@hollowbrook.example', name: 'Rosa Lindqvist', role: 'grower' },
  { email: 'grower.tomasz@hollowbrook.example', name: 'Tomasz Okafor', role: 'grower' },
  { email: 'volunteer@hollowbrook.example', name: 'Wren Abernathy', role: 'viewer' },
] as const satisfies ReadonlyArray<{ email: string; name: string; role: Role }>;

export const DEMO_GARDENS = [
  {
    name: 'Hollowbrook Teaching Garden',
    latitude: 42.28,
    longitude: -83.74,
    elevationM: 256,
    timeZone: 'America/Detroit',
    units: 'F' as const,
  },
  {
    name: 'Saltbush Lane School Garden',
    latitude: -37.82,
    longitude: 145.12,
    elevationM: 95,
    timeZone: 'Australia/Melbourne',
    units: 'C' as const,
  },
];

/** The demo is seeded into an empty database only: a real garden's accounts are never joined to it. */
export async function databaseIsEmpty(): Promise<boolean> {
  return (await User.count()) === 0;
}

/** The demo was seeded before (so seeding again only tops it up, changing nothing that exists). */
export async function demoAlreadySeeded(): Promise<boolean> {
  return (await User.count({ where: { email: DEMO_USERS[0].email } })) === 1;
}

/**
 * Idempotent: finds or creates each account, garden and membership by its natural key. With a
 * weather service, it also fetches the gardens' weather and lets it decide the lettuce and spinach
 * harvests and bolting of the past seasons (demo-outcomes.ts); without one they follow fixed days.
 */
export async function seedDemo(sequelize: Sequelize, opts: { weather?: WeatherService } = {}) {
  // Instances starting at once (on one server or on several Galera nodes) seed one after another;
  // a certification failure (1213) against another node's write runs the idempotent seed again.
  return withClusterLock(sequelize, 'demo-seed', () => retryOnConflict(() => seedDemoOnce(sequelize, opts)));
}

async function seedDemoOnce(sequelize: Sequelize, opts: { weather?: WeatherService }) {
  const hash = await hashPassword(DEMO_PASSWORD);
  const pending = new Map<number, PendingOutcome[]>();
  const seeded = await sequelize.transaction(async (transaction) => {
    const users = [];
    for (const u of DEMO_USERS) {
      const [user] = await User.findOrCreate({
        where: { email: u.email },
        defaults: { email: u.email, name: u.name, passwordHash: hash },
        transaction,
      });
      users.push({ user, role: u.role });
    }
    // A demo garden is the coordinator's garden of that name: a stranger's garden that happens to
    // share the name is never touched.
    const coordinator = users[0].user;
    const gardens = [];
    for (const g of DEMO_GARDENS) {
      const owned = await Garden.findOne({
        where: { name: g.name },
        include: [{ model: Membership, as: 'memberships', where: { userId: coordinator.id, role: 'owner' }, required: true }],
        transaction,
      });
      const garden = owned ?? (await Garden.create(g, { transaction }));
      gardens.push(garden);
      for (const { user, role } of users) {
        await Membership.findOrCreate({
          where: { userId: user.id, gardenId: garden.id },
          defaults: { userId: user.id, gardenId: garden.id, role },
          transaction,
        });
      }
      const waiting = await seedGardenRecords(
        garden,
        users.map((u) => u.user),
        localDate(garden.timeZone),
        transaction,
        { weatherDecides: opts.weather !== undefined },
      );
      pending.set(garden.id, waiting);
    }
    return { users: users.map((u) => u.user), gardens };
  });
  const { weather } = opts;
  if (weather) {
    for (const garden of seeded.gardens) {
      const cellId = (await weather.locateGarden(garden)) ?? garden.weatherCellId;
      if (cellId) await weather.prepareCell(cellId, garden.id);
    }
    await weather.backfillPending();
    for (const garden of seeded.gardens) {
      await garden.reload();
      await settleDemoOutcomes(sequelize, weather, garden, pending.get(garden.id) ?? []);
    }
  }
  return seeded;
}
