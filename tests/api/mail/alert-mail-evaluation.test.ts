import { describe, expect, it } from 'vitest';
import { testApp, testDb, testWeather } from '../../helpers/test-app';
import { gardenWithClients, makePlanting, makeVariety } from '../../helpers/garden-records';
import { giveGardenWeather, steadyDays } from '../../helpers/garden-weather';
import { addDays } from '#shared/thermal/dates';
import type { AlertService } from '../../../server/modules/alerts/alerts.service';
import { capturedFor, fakeSmtp, outboxFor, sender, setPreference } from './mail-helpers';

const TODAY = '2026-06-10';
const now = () => new Date(`${TODAY}T17:00:00Z`);
const { sequelize } = testDb();

describe('alerts reach members by e-mail exactly once', () => {
  it('when a garden is evaluated again and twice at once from two app instances, then one message per member arrives over SMTP', async () => {
    const fake = await fakeSmtp();
    const a = testApp({}, testWeather({}, now));
    const b = testApp({}, testWeather({}, now));
    const { garden, grower, viewer } = await gardenWithClients(a);
    await setPreference(grower.id, garden.id, 'immediate');
    await setPreference(viewer.id, garden.id, 'off');
    await giveGardenWeather(sequelize, garden, [...steadyDays('2021-01-01', addDays(TODAY, -1), 18, 9), ...steadyDays(TODAY, addDays(TODAY, 6), 31, 18, 'forecast')]);
    await makePlanting(garden.id, { varietyId: (await makeVariety(garden.id, { dtmDays: 55, boltTolerance: 1 })).id, sownOn: '2026-05-01' });

    await (a.locals.alerts as AlertService).evaluate(garden.id);
    await Promise.all([(a.locals.alerts as AlertService).evaluate(garden.id), (b.locals.alerts as AlertService).evaluate(garden.id)]);
    expect(await outboxFor(garden.id)).toHaveLength(1);

    const one = sender(fake.port, garden.id);
    const two = sender(fake.port, garden.id);
    await Promise.all([one.drain(), two.drain(), one.drain()]);
    const mail = await capturedFor(grower.email);
    expect(mail).toHaveLength(1);
    expect(mail[0].subject).toMatch(/bolt risk/i);
    expect(mail[0].text_body).toMatch(/heat-safety/);
    expect(mail[0].headers['list-unsubscribe-post']).toBe('List-Unsubscribe=One-Click');
    expect(await capturedFor(viewer.email)).toEqual([]);
  });
});
