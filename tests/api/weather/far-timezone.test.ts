import { describe, expect, it } from 'vitest';
import { agent, testApp } from '../../helpers/test-app';
import { gardenWithMembers, signIn } from '../../helpers/factories';

// Calendar dates must not shift through Date objects: run this file in a zone 14 hours ahead of UTC.
process.env.TZ = 'Pacific/Kiritimati';

describe('date-only values under a far-off time zone', () => {
  it('when days are imported and read back with TZ=Pacific/Kiritimati, then every date is unchanged', async () => {
    expect(new Date('2025-01-01T00:00:00Z').getHours()).toBe(14);
    const app = testApp();
    const { garden, grower } = await gardenWithMembers();
    const c = agent(app);
    await signIn(c, grower.email);
    const csv = 'date,high,low\n2024-12-31,5,-2\n2025-01-01,6,-1\n2025-02-28,7,0\n2025-03-01,8,1\n';
    await c
      .post(`/api/gardens/${garden.id}/weather/imports`)
      .set('X-Requested-With', 'heatclock')
      .field('unit', 'C')
      .attach('file', Buffer.from(csv), { filename: 'x.csv', contentType: 'text/csv' })
      .expect(201);
    await c.patch(`/api/gardens/${garden.id}`).send({ units: 'C' }).expect(403);
    const res = await c.get(`/api/gardens/${garden.id}/weather?from=2024-12-31&to=2025-03-01`).expect(200);
    expect(res.body.days.map((d: { date: string }) => d.date)).toEqual(['2024-12-31', '2025-01-01', '2025-02-28', '2025-03-01']);
  });
});
