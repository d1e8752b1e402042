import { describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { agent, testApp, testDb } from '../helpers/test-app';
import type { TestAgent } from '../helpers/test-app';
import { addMember, createUser, signIn } from '../helpers/factories';
import { gardenWithClients } from '../helpers/garden-records';
import { Membership } from '../../server/db/models';

const app = testApp();
const db = () => testDb().sequelize;

async function auditOf(gardenId: number) {
  return db().query<{ entity: string; entity_id: string; action: string; summary: string; changes: string }>(
    'SELECT entity, entity_id, action, summary, changes FROM audit_entries WHERE garden_id = ? ORDER BY id',
    { replacements: [gardenId], type: QueryTypes.SELECT },
  );
}

async function signedIn(email: string): Promise<TestAgent> {
  const c = agent(app).set('X-Requested-With', 'heatclock-test');
  await signIn(c, email);
  return c;
}

/** A garden with two owners (plus the usual grower, viewer and outsider), all signed in. */
async function twoOwners() {
  const g = await gardenWithClients(app);
  const second = await createUser({ name: 'Second Owner' });
  await addMember(second.id, g.garden.id, 'owner');
  return { ...g, second, secondClient: await signedIn(second.email) };
}

const ownersOf = (gardenId: number) => Membership.count({ where: { gardenId, role: 'owner' } });

describe('garden members', () => {
  it('when members list the garden’s people, then everyone sees names and roles and only owners see e-mails', async () => {
    const g = await gardenWithClients(app);

    const asOwner = await g.clients.owner.get(`${g.base}/members`).expect(200);
    const asGrower = await g.clients.grower.get(`${g.base}/members`).expect(200);

    expect(asOwner.body.items.map((m: { name: string; role: string; email: string }) => [m.name, m.role, m.email])).toEqual([
      ['Owner', 'owner', g.owner.email],
      ['Grower', 'grower', g.grower.email],
      ['Viewer', 'viewer', g.viewer.email],
    ]);
    expect(asOwner.body.items[0]).toEqual({ userId: g.owner.id, name: 'Owner', email: g.owner.email, role: 'owner', joinedAt: expect.stringMatching(/^\d{4}-\d\d-\d\dT/) });
    expect(asGrower.body.items.map((m: { email: string | null }) => m.email)).toEqual([null, null, null]);
    expect((await g.clients.outsider.get(`${g.base}/members`)).status).toBe(404);
  });

  it('when a grower or viewer tries to change a role or remove someone, then 403 and nothing changes', async () => {
    const g = await gardenWithClients(app);
    for (const who of ['grower', 'viewer'] as const) {
      const c = g.clients[who];
      expect((await c.patch(`${g.base}/members/${g.viewer.id}`).send({ role: 'owner' })).status).toBe(403);
      expect((await c.patch(`${g.base}/members/${g.owner.id}`).send({ role: 'viewer' })).status).toBe(403);
      expect((await c.delete(`${g.base}/members/${g.owner.id}`)).status).toBe(403);
    }
    expect(await Membership.count({ where: { gardenId: g.garden.id } })).toBe(3);
    expect(await auditOf(g.garden.id)).toEqual([]);
  });

  it('when an owner changes a role, then the answer and the trail show it, and a wrong role or body names the field', async () => {
    const g = await gardenWithClients(app);

    const res = await g.clients.owner.patch(`${g.base}/members/${g.viewer.id}`).send({ role: 'grower' });

    expect(res.status).toBe(200);
    expect(res.body.member).toMatchObject({ userId: g.viewer.id, role: 'grower', email: g.viewer.email });
    expect((await g.clients.viewer.post(`${g.base}/beds`).send({ name: 'Now I can', kind: 'bed' })).status).toBe(201);
    const [entry, ...rest] = (await auditOf(g.garden.id)).filter((a) => a.entity === 'member');
    expect(rest).toEqual([]);
    expect(entry).toMatchObject({ action: 'changed', entity_id: String(g.viewer.id), summary: 'Role of Viewer: viewer → grower' });
    expect(JSON.parse(entry.changes)).toEqual({ role: { from: 'viewer', to: 'grower' } });

    const bad = await g.clients.owner.patch(`${g.base}/members/${g.viewer.id}`).send({ role: 'admin', userId: 1 });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['role', 'userId']);
    expect((await g.clients.owner.patch(`${g.base}/members/${g.outsider.id}`).send({ role: 'viewer' })).status).toBe(404);
    expect((await g.clients.owner.patch(`${g.base}/members/abc`).send({ role: 'viewer' })).status).toBe(400);
  });

  it('when the only owner tries to step down, be removed or leave, then 409 says why and they stay owner', async () => {
    const g = await gardenWithClients(app);

    const demote = await g.clients.owner.patch(`${g.base}/members/${g.owner.id}`).send({ role: 'grower' });
    const remove = await g.clients.owner.delete(`${g.base}/members/${g.owner.id}`);
    const leave = await g.clients.owner.delete(`${g.base}/members/me`);

    for (const res of [demote, remove, leave]) {
      expect(res.status).toBe(409);
      expect(res.body.error.code).toBe('last_owner');
      expect(res.body.error.message).toMatch(/at least one owner/);
      expect(Object.keys(res.body.error.fields)).toHaveLength(1);
    }
    expect(demote.body.error.fields).toHaveProperty('role');
    expect(await ownersOf(g.garden.id)).toBe(1);
  });

  it('when the last two owners demote each other at the same moment, then exactly one succeeds and one owner is left', async () => {
    for (let round = 0; round < 3; round++) {
      const g = await twoOwners();

      const [a, b] = await Promise.all([
        g.clients.owner.patch(`${g.base}/members/${g.second.id}`).send({ role: 'viewer' }),
        g.secondClient.patch(`${g.base}/members/${g.owner.id}`).send({ role: 'viewer' }),
      ]);

      expect([a.status, b.status].filter((s) => s === 200)).toHaveLength(1);
      // The loser was demoted before its own change ran: refused as no longer an owner (or as the last one).
      expect([403, 409]).toContain(a.status === 200 ? b.status : a.status);
      expect(await ownersOf(g.garden.id)).toBe(1);
    }
  });

  it('when two owners remove each other at the same moment, then one owner is left', async () => {
    const g = await twoOwners();

    const [a, b] = await Promise.all([g.clients.owner.delete(`${g.base}/members/${g.second.id}`), g.secondClient.delete(`${g.base}/members/${g.owner.id}`)]);

    expect([a.status, b.status].filter((s) => s === 204)).toHaveLength(1);
    expect(await ownersOf(g.garden.id)).toBe(1);
  });

  it('when an owner is demoted, then their very next owner write is refused with 403', async () => {
    const g = await twoOwners();
    // Owner-only reads and writes work before.
    expect((await g.secondClient.get(`${g.base}/invitations`)).status).toBe(200);
    expect((await g.secondClient.patch(`${g.base}`).send({ name: 'Renamed by second' })).status).toBe(200);

    await g.clients.owner.patch(`${g.base}/members/${g.second.id}`).send({ role: 'grower' }).expect(200);

    const write = await g.secondClient.patch(`${g.base}`).send({ name: 'Renamed again' });
    expect(write.status).toBe(403);
    expect((await g.secondClient.post(`${g.base}/invitations`).send({ email: 'x@test.example', role: 'viewer' })).status).toBe(403);
    expect((await g.secondClient.get(`${g.base}/invitations`)).status).toBe(403);
    expect((await g.secondClient.get(`${g.base}/members`).expect(200)).body.items.every((m: { email: string | null }) => m.email === null)).toBe(true);
  });

  it('when a member is removed, then their sessions end (RELIABILITY.md), and signed in again their very next read of the garden is 404, cached answers included; the trail says who removed whom', async () => {
    const g = await gardenWithClients(app);
    // Warm the read cache for this garden's lists with the grower's own reads.
    for (let i = 0; i < 2; i++) expect((await g.clients.grower.get(`${g.base}/plantings`)).status).toBe(200);
    expect((await g.clients.grower.get(`${g.base}/beds`)).status).toBe(200);
    const elsewhere = agent(app).set('X-Requested-With', 'heatclock-test');
    await signIn(elsewhere, g.grower.email);

    await g.clients.owner.delete(`${g.base}/members/${g.grower.id}`).expect(204);

    // Every session of the removed member is over, on every device.
    expect((await g.clients.grower.get(`${g.base}/plantings`)).status).toBe(401);
    expect((await elsewhere.get('/api/auth/me')).status).toBe(401);
    // The owner who removed them stays signed in.
    expect((await g.clients.owner.get('/api/auth/me')).status).toBe(200);
    await signIn(g.clients.grower, g.grower.email);
    for (const path of ['', '/plantings', '/beds', '/today', '/members']) {
      const res = await g.clients.grower.get(`${g.base}${path}`);
      expect(res.status, path).toBe(404);
    }
    expect((await g.clients.grower.get('/api/gardens').expect(200)).body.gardens).toEqual([]);
    // Still cached for those who remain.
    expect((await g.clients.viewer.get(`${g.base}/plantings`)).status).toBe(200);
    const [entry] = (await auditOf(g.garden.id)).filter((a) => a.entity === 'member');
    expect(entry).toMatchObject({ action: 'removed', entity_id: String(g.grower.id), summary: 'Grower was removed from the garden (was grower)' });
  });

  it('when a viewer leaves, then they are gone from the list, can no longer read the garden, and the trail says they left', async () => {
    const g = await gardenWithClients(app);

    await g.clients.viewer.delete(`${g.base}/members/me`).expect(204);

    expect((await g.clients.viewer.get(`${g.base}`)).status).toBe(404);
    const names = (await g.clients.owner.get(`${g.base}/members`).expect(200)).body.items.map((m: { name: string }) => m.name);
    expect(names).toEqual(['Owner', 'Grower']);
    const [entry] = await auditOf(g.garden.id);
    expect(entry).toMatchObject({ entity: 'member', action: 'left', entity_id: String(g.viewer.id), summary: 'Viewer left the garden (was viewer)' });
  });

  it('when an owner hands over ownership and then leaves, then the other owner remains', async () => {
    const g = await gardenWithClients(app);
    await g.clients.owner.patch(`${g.base}/members/${g.grower.id}`).send({ role: 'owner' }).expect(200);

    await g.clients.owner.delete(`${g.base}/members/me`).expect(204);

    expect(await Membership.findOne({ where: { gardenId: g.garden.id, userId: g.grower.id } })).toMatchObject({ role: 'owner' });
    expect((await g.clients.grower.patch(`${g.base}`).send({ name: 'Handed over' })).status).toBe(200);
  });
});
