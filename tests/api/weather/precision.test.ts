import { describe, expect, it } from 'vitest';
import { agent, testApp, testDb } from '../../helpers/test-app';
import { gardenWithMembers, signIn } from '../../helpers/factories';
import { stressEvents } from '#shared/thermal/stress';
import { loadGardenWeather } from '../../../server/modules/weather/garden-weather';

const { sequelize } = testDb();
const app = testApp();

async function uploadF(csv: string) {
  const { garden, grower } = await gardenWithMembers();
  const c = agent(app);
  await signIn(c, grower.email);
  await c
    .post(`/api/gardens/${garden.id}/weather/imports`)
    .set('X-Requested-With', 'heatclock')
    .field('unit', 'F')
    .attach('file', Buffer.from(csv), { filename: 'station.csv', contentType: 'text/csv' })
    .expect(201);
  return { garden, c };
}

describe('temperatures keep their precision from upload to reading', () => {
  it('when a °F station file has lows of exactly 24, 28 and 28.5 °F, then the stored lows grade severe, moderate and light', async () => {
    // Days apart, so each low is an event of its own.
    const { garden } = await uploadF('date,high,low\n2025-03-01,40,24\n2025-03-03,40,28\n2025-03-05,40,28.5\n');
    const { days } = await loadGardenWeather(sequelize, garden, { from: '2025-03-01', to: '2025-03-05' });
    const events = stressEvents(days, { hardiness: 'tender' }).filter((e) => e.kind === 'frost');
    // NWS freeze categories as SCIENCE.md §4 gives them: light 29–32 °F, moderate 25–28 °F, severe ≤ 24 °F.
    expect(events.map((e) => [e.start, e.severity])).toEqual([
      ['2025-03-01', 'severe'],
      ['2025-03-03', 'moderate'],
      ['2025-03-05', 'light'],
    ]);
  });

  it('when 60 °F is uploaded to a °F garden, then GET weather shows exactly 60', async () => {
    const { garden, c } = await uploadF('date,high,low\n2025-06-01,60,41\n');
    const res = await c.get(`/api/gardens/${garden.id}/weather?from=2025-06-01&to=2025-06-01`).expect(200);
    expect(res.body.unit).toBe('F');
    expect(res.body.days[0].tmax).toBeCloseTo(60, 2);
    expect(res.body.days[0].tmin).toBeCloseTo(41, 2);
  });
});
