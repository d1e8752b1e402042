import { describe, expect, it } from 'vitest';
import { addMember, createGarden, createUser } from '../../helpers/factories';
import { enqueueDigests } from '../../../server/modules/notifications/digests';
import { testDb } from '../../helpers/test-app';
import { capturedFor, fakeSmtp, insertAlert, mailApp, outboxFor, sender, setPreference } from './mail-helpers';

// 01:15 UTC is 07:00 in Kathmandu (UTC+5:45), so the hour is decided in the garden's zone, not UTC.
const SEVEN_IN_KATHMANDU = new Date('2026-06-10T01:15:00Z');

async function kathmanduGarden() {
  const garden = await createGarden({ name: 'Terrace Beds', timeZone: 'Asia/Kathmandu' });
  const byDefault = await createUser({ name: 'Default Digest' });
  const frostOnly = await createUser();
  const immediate = await createUser();
  for (const u of [byDefault, frostOnly, immediate]) await addMember(u.id, garden.id, 'grower');
  await setPreference(frostOnly.id, garden.id, 'digest', ['frost']);
  await setPreference(immediate.id, garden.id, 'immediate');
  return { garden, byDefault, frostOnly, immediate };
}

describe('daily digests', () => {
  it('when it is the digest hour in the garden’s zone, then each digest member gets one summary of their types, once per local day', async () => {
    const fake = await fakeSmtp();
    mailApp(fake.port);
    const { garden, byDefault, frostOnly, immediate } = await kathmanduGarden();
    await insertAlert(garden.id, { type: 'bolt-risk' });
    await insertAlert(garden.id, { type: 'heat-stress', status: 'acknowledged' });
    const scope = { onlyGardens: [garden.id] };

    const first = await enqueueDigests(testDb().sequelize, SEVEN_IN_KATHMANDU, scope);
    const again = await enqueueDigests(testDb().sequelize, new Date('2026-06-10T01:59:00Z'), scope);
    await sender(fake.port, garden.id).drain();

    expect([first, again]).toEqual([1, 0]);
    expect((await outboxFor(garden.id)).map((r) => r.dedupe_key)).toEqual([`digest:${byDefault.id}:${garden.id}:2026-06-10`]);
    const [digest] = await capturedFor(byDefault.email);
    expect(digest.subject).toBe('Terrace Beds on 10 Jun: 1 open alert');
    expect(digest.text_body).toContain('Your daily summary for Terrace Beds: 1 open alert.');
    expect(digest.headers['list-unsubscribe-post']).toBe('List-Unsubscribe=One-Click');
    expect(await capturedFor(frostOnly.email)).toEqual([]);
    expect(await capturedFor(immediate.email)).toEqual([]);
  });

  it('when it is another hour, or the garden has no open alerts, then no digest is queued', async () => {
    const { garden } = await kathmanduGarden();
    const quiet = await kathmanduGarden();
    await insertAlert(garden.id);

    expect(await enqueueDigests(testDb().sequelize, new Date('2026-06-10T07:00:00Z'), { onlyGardens: [garden.id] })).toBe(0);
    expect(await enqueueDigests(testDb().sequelize, SEVEN_IN_KATHMANDU, { onlyGardens: [quiet.garden.id] })).toBe(0);
  });

  it('when the demo asks for any hour, then today’s digest is queued at once and still only once', async () => {
    const { garden, byDefault } = await kathmanduGarden();
    await insertAlert(garden.id, { type: 'frost' });
    const noon = new Date('2026-06-10T06:15:00Z');
    const opts = { onlyGardens: [garden.id], anyHour: true };

    expect(await enqueueDigests(testDb().sequelize, noon, opts)).toBe(2);
    expect(await enqueueDigests(testDb().sequelize, noon, opts)).toBe(0);
    expect(await enqueueDigests(testDb().sequelize, SEVEN_IN_KATHMANDU, { onlyGardens: [garden.id] })).toBe(0);
    expect((await outboxFor(garden.id)).map((r) => r.dedupe_key)).toContain(`digest:${byDefault.id}:${garden.id}:2026-06-10`);
  });
});
