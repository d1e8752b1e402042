import { describe, expect, it } from 'vitest';
import { testApp, agent } from '../helpers/test-app';
import { addMember, createGarden, createUser, gardenWithMembers, signIn } from '../helpers/factories';
import { Membership } from '../../server/db/models';

const app = testApp();

describe('garden access by role', () => {
  it('when a member of garden A asks for garden B, then 404 as if it did not exist', async () => {
    const a = await gardenWithMembers();
    const b = await createGarden();
    const client = agent(app);
    await signIn(client, a.owner.email);
    expect((await client.get(`/api/gardens/${b.id}`)).status).toBe(404);
    expect((await client.patch(`/api/gardens/${b.id}`).send({ name: 'Mine now' })).status).toBe(404);
    expect((await client.get(`/api/gardens/999999999`)).status).toBe(404);
    expect((await client.get(`/api/gardens/abc`)).status).toBe(404);
    const list = await client.get('/api/gardens');
    expect(list.body.gardens.map((g: { id: number }) => g.id)).toEqual([a.garden.id]);
  });

  it('when a viewer or grower edits garden settings, then 403; when the owner does, then it is saved', async () => {
    const { garden, owner, grower, viewer } = await gardenWithMembers();
    for (const user of [viewer, grower]) {
      const c = agent(app);
      await signIn(c, user.email);
      const res = await c.patch(`/api/gardens/${garden.id}`).send({ name: 'Renamed' });
      expect(res.status).toBe(403);
      expect(res.body.error.code).toBe('forbidden');
      expect((await c.get(`/api/gardens/${garden.id}`)).status).toBe(200);
    }
    const o = agent(app);
    await signIn(o, owner.email);
    const ok = await o
      .patch(`/api/gardens/${garden.id}`)
      .send({ name: 'Renamed', latitude: -33.9, longitude: 151.2, timeZone: 'Australia/Sydney', units: 'C', elevationM: 40 });
    expect(ok.status).toBe(200);
    expect(ok.body.garden).toMatchObject({ name: 'Renamed', units: 'C', hemisphere: 'S', timeZone: 'Australia/Sydney', role: 'owner' });
  });

  it('when an owner is demoted, then the very next request is refused', async () => {
    const { garden, owner } = await gardenWithMembers();
    const c = agent(app);
    await signIn(c, owner.email);
    expect((await c.patch(`/api/gardens/${garden.id}`).send({ name: 'One' })).status).toBe(200);
    await Membership.update({ role: 'viewer' }, { where: { userId: owner.id, gardenId: garden.id } });
    expect((await c.patch(`/api/gardens/${garden.id}`).send({ name: 'Two' })).status).toBe(403);
  });

  it('when settings are invalid, then 400 names each field and nothing is saved', async () => {
    const { garden, owner } = await gardenWithMembers();
    const c = agent(app);
    await signIn(c, owner.email);
    const res = await c.patch(`/api/gardens/${garden.id}`).send({ name: 'X', latitude: 95, timeZone: 'Mars/Olympus', units: 'K' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['latitude', 'timeZone', 'units']);
    expect((await c.get(`/api/gardens/${garden.id}`)).body.garden.name).toBe(garden.name);
  });

  it('when privileged fields are sent, then 400 names them', async () => {
    const { garden, owner } = await gardenWithMembers();
    const c = agent(app);
    await signIn(c, owner.email);
    const res = await c.patch(`/api/gardens/${garden.id}`).send({ name: 'X', id: 5, role: 'owner', gardenId: 3 });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['gardenId', 'id', 'role']);
  });

  it('when a user belongs to two gardens, then each shows its own role', async () => {
    const user = await createUser();
    const g1 = await createGarden({ name: 'Alpha plot' });
    const g2 = await createGarden({ name: 'Beta plot' });
    await addMember(user.id, g1.id, 'grower');
    await addMember(user.id, g2.id, 'viewer');
    const c = agent(app);
    await signIn(c, user.email);
    const roles = (await c.get('/api/gardens')).body.gardens.map((g: { name: string; role: string }) => `${g.name}:${g.role}`);
    expect(roles).toEqual(['Alpha plot:grower', 'Beta plot:viewer']);
  });
});
