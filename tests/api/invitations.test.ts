import { describe, expect, it } from 'vitest';
import { createHash, randomBytes } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import { agent, testApp, testDb } from '../helpers/test-app';
import { createUser, signIn, uniqueEmail } from '../helpers/factories';
import { gardenWithClients } from '../helpers/garden-records';
import { accountMailFor } from '../helpers/registration';
import { Membership } from '../../server/db/models';
import { INVITES_PER_HOUR } from '../../server/modules/invitations/invitations.router';
import { fakeSmtp, sender } from './mail/mail-helpers';

const app = testApp();
const STRONG = 'lantern pebble orchard ninety';
const db = () => testDb().sequelize;

function tokenOf(text: string): string {
  const m = /\/invitations\/([A-Za-z0-9_-]{43})(?![A-Za-z0-9_-])/.exec(text);
  if (!m) throw new Error(`no invitation link in: ${text}`);
  return m[1];
}

/** The newest invitation mailed to an address: its message and the token in its link. */
async function mailedInvitation(email: string) {
  const mail = (await accountMailFor(email)).at(-1);
  if (!mail) throw new Error(`no mail for ${email}`);
  return { mail, token: tokenOf(mail.text_body) };
}

async function auditOf(gardenId: number) {
  return db().query<{ entity: string; entity_id: string; action: string; summary: string; changes: string; actor_user_id: number | null }>(
    'SELECT entity, entity_id, action, summary, changes, actor_user_id FROM audit_entries WHERE garden_id = ? ORDER BY id',
    { replacements: [gardenId], type: QueryTypes.SELECT },
  );
}

async function hashesOf(gardenId: number) {
  const rows = await db().query<{ token_hash: string }>('SELECT token_hash FROM garden_invitations WHERE garden_id = ?', { replacements: [gardenId], type: QueryTypes.SELECT });
  return rows.map((r) => r.token_hash);
}

const anonymous = () => agent(app).set('X-Requested-With', 'heatclock-test');

describe('invitations by e-mail', () => {
  it('when an owner invites a new address, then the mailed link shows the garden and creates the account, signed in, once', async () => {
    const g = await gardenWithClients(app);
    const email = uniqueEmail('invitee');

    const made = await g.clients.owner.post(`${g.base}/invitations`).send({ email: email.toUpperCase(), role: 'grower' });

    expect(made.status).toBe(201);
    expect(made.body.invitation).toMatchObject({ email, role: 'grower', invitedBy: 'Owner' });
    const days = (Date.parse(made.body.invitation.expiresAt) - Date.parse(made.body.invitation.createdAt)) / 86_400_000;
    expect(days).toBeCloseTo(7, 5);
    const listed = await g.clients.owner.get(`${g.base}/invitations`).expect(200);
    expect(listed.body.items).toEqual([made.body.invitation]);

    const { mail, token } = await mailedInvitation(email);
    expect(mail.subject).toContain(g.garden.name);
    expect(mail.text_body).toContain(`${testDb().config.mail.appUrl}/invitations/${token}`);
    expect(mail.text_body).toContain('Owner invited you');
    expect(mail.text_body).toContain('within 7 days');
    // Only the token's SHA-256 is stored.
    expect(await hashesOf(g.garden.id)).toEqual([createHash('sha256').update(token).digest('hex')]);

    const invitee = anonymous();
    const preview = await invitee.get(`/api/invitations/${token}`).expect(200);
    expect(preview.body).toEqual({
      garden: { name: g.garden.name },
      role: 'grower',
      email,
      invitedBy: 'Owner',
      expiresAt: made.body.invitation.expiresAt,
      accountExists: false,
      signedInMatches: false,
    });

    const accepted = await invitee.post(`/api/invitations/${token}/accept`).send({ name: 'Ines Marr', password: STRONG });

    expect(accepted.status).toBe(201);
    expect(accepted.body.user).toMatchObject({ email, name: 'Ines Marr' });
    expect(accepted.body.garden).toMatchObject({ id: g.garden.id, role: 'grower' });
    expect((await invitee.get('/api/auth/me').expect(200)).body.user.email).toBe(email);
    expect((await invitee.get(`${g.base}/plantings`)).status).toBe(200);
    expect(await Membership.findOne({ where: { userId: accepted.body.user.id, gardenId: g.garden.id } })).toMatchObject({ role: 'grower' });
    expect((await g.clients.owner.get(`${g.base}/invitations`).expect(200)).body.items).toEqual([]);

    // Single use: the same link again, even signed in as the new member.
    const again = await invitee.post(`/api/invitations/${token}/accept`).send({});
    expect(again.status).toBe(410);
    expect(again.body.error.code).toBe('invitation_used');
    expect(again.body.error.message).toMatch(/used already/);
    expect((await anonymous().get(`/api/invitations/${token}`)).status).toBe(410);

    const audit = await auditOf(g.garden.id);
    expect(audit.map((a) => `${a.entity} ${a.action}`)).toEqual(['invitation invited', 'member joined']);
    expect(audit[0].summary).toBe(`Invited ${email} as grower`);
    expect(audit[1]).toMatchObject({ entity_id: String(accepted.body.user.id), actor_user_id: accepted.body.user.id, summary: 'Ines Marr joined as grower (invited by Owner)' });
    const written = JSON.stringify(audit);
    expect(written).not.toContain(token);
    for (const hash of await hashesOf(g.garden.id)) expect(written).not.toContain(hash);
  });

  it('when the address already has an account, then that user joins signed in with an empty body, and nobody else can use the link', async () => {
    const g = await gardenWithClients(app);
    const user = await createUser({ name: 'Tova Renn' });
    await g.clients.owner.post(`${g.base}/invitations`).send({ email: user.email, role: 'viewer' }).expect(201);
    const { mail, token } = await mailedInvitation(user.email);
    expect(mail.user_id).toBe(user.id);

    // Signed out: the page says an account exists; joining needs signing in first.
    expect((await anonymous().get(`/api/invitations/${token}`).expect(200)).body).toMatchObject({ accountExists: true, signedInMatches: false, role: 'viewer' });
    const signedOut = await anonymous().post(`/api/invitations/${token}/accept`).send({});
    expect(signedOut.status).toBe(401);
    expect(signedOut.body.error.message).toContain(user.email);
    // An account cannot be made a second time for the address.
    const second = await anonymous().post(`/api/invitations/${token}/accept`).send({ name: 'Someone', password: STRONG });
    expect(second.status).toBe(409);
    expect(second.body.error.fields).toHaveProperty('email');
    // Someone else signed in cannot take it.
    const other = await g.clients.outsider.post(`/api/invitations/${token}/accept`).send({});
    expect(other.status).toBe(403);
    expect(other.body.error.message).toContain(user.email);

    const mine = agent(app).set('X-Requested-With', 'heatclock-test');
    await signIn(mine, user.email);
    expect((await mine.get(`/api/invitations/${token}`).expect(200)).body).toMatchObject({ accountExists: true, signedInMatches: true });
    const joined = await mine.post(`/api/invitations/${token}/accept`).send({});

    expect(joined.status).toBe(201);
    expect(joined.body.garden).toMatchObject({ id: g.garden.id, role: 'viewer' });
    expect((await mine.get(`${g.base}`)).status).toBe(200);
    expect((await mine.post(`${g.base}/beds`).send({ name: 'Mine now', kind: 'bed' })).status).toBe(403);
    expect((await auditOf(g.garden.id)).map((a) => `${a.entity} ${a.action}`)).toEqual(['invitation invited', 'member joined']);
  });

  it('when the sender delivers an invitation to the local fake, then the owner can read that copy (the new address has no mailbox yet) and its link works', async () => {
    const g = await gardenWithClients(app);
    const email = uniqueEmail('captured');
    const made = await g.clients.owner.post(`${g.base}/invitations`).send({ email, role: 'viewer' }).expect(201);
    const url = `${g.base}/invitations/${made.body.invitation.id}/test-mail`;
    expect((await g.clients.owner.get(url).expect(200)).body).toEqual({ message: null });

    const fake = await fakeSmtp();
    await sender(fake.port, g.garden.id).drain();

    const { message } = (await g.clients.owner.get(url).expect(200)).body;
    expect(message).toMatchObject({ to: email, subject: `You are invited to the garden “${g.garden.name}” on Heatclock` });
    expect(message.html).toContain('Open the invitation');
    const token = tokenOf(message.text);
    expect(token).toBe((await mailedInvitation(email)).token);
    expect((await g.clients.grower.get(url)).status).toBe(403);
    const joined = await anonymous().post(`/api/invitations/${token}/accept`).send({ name: 'Cap Tured', password: STRONG });
    expect(joined.status).toBe(201);
  });

  it('when an invitation has expired, then its link is refused with 410 saying so, and nothing is created', async () => {
    const g = await gardenWithClients(app);
    const email = uniqueEmail('late');
    await g.clients.owner.post(`${g.base}/invitations`).send({ email, role: 'grower' }).expect(201);
    const { token } = await mailedInvitation(email);
    await db().query('UPDATE garden_invitations SET expires_at = UTC_TIMESTAMP(3) - INTERVAL 1 SECOND WHERE garden_id = ?', { replacements: [g.garden.id] });

    const seen = await anonymous().get(`/api/invitations/${token}`);
    const used = await anonymous().post(`/api/invitations/${token}/accept`).send({ name: 'Late Comer', password: STRONG });

    for (const res of [seen, used]) {
      expect(res.status).toBe(410);
      expect(res.body.error.code).toBe('invitation_expired');
      expect(res.body.error.message).toMatch(/expired.*7 days/);
    }
    expect(await accountMailFor(email)).toHaveLength(1);
    expect((await db().query('SELECT id FROM users WHERE email = ?', { replacements: [email], type: QueryTypes.SELECT })).length).toBe(0);
    expect((await g.clients.owner.get(`${g.base}/invitations`).expect(200)).body.items).toEqual([]);
  });

  it('when an owner revokes an invitation, then its link is refused with 410, the trail says so, and revoking again is a 409', async () => {
    const g = await gardenWithClients(app);
    const email = uniqueEmail('revoked');
    const made = await g.clients.owner.post(`${g.base}/invitations`).send({ email, role: 'viewer' }).expect(201);
    const { token } = await mailedInvitation(email);

    await g.clients.owner.delete(`${g.base}/invitations/${made.body.invitation.id}`).expect(204);
    // Its mail was still waiting (no sender runs here): it is not sent with a dead link.
    expect(await accountMailFor(email)).toEqual([]);

    const res = await anonymous().post(`/api/invitations/${token}/accept`).send({ name: 'Not In', password: STRONG });
    expect(res.status).toBe(410);
    expect(res.body.error.code).toBe('invitation_revoked');
    expect(res.body.error.message).toMatch(/withdrawn/);
    expect((await anonymous().get(`/api/invitations/${token}`)).status).toBe(410);
    const again = await g.clients.owner.delete(`${g.base}/invitations/${made.body.invitation.id}`);
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('invitation_not_pending');
    const audit = await auditOf(g.garden.id);
    expect(audit.map((a) => `${a.entity} ${a.action}`)).toEqual(['invitation invited', 'invitation revoked']);
    expect(audit[1].summary).toBe(`Withdrew the invitation to ${email} (viewer)`);
    expect(JSON.stringify(audit)).not.toContain(token);
  });

  it('when an owner invites the same address again, then the first link stops working and the new one works', async () => {
    const g = await gardenWithClients(app);
    const email = uniqueEmail('twice');
    await g.clients.owner.post(`${g.base}/invitations`).send({ email, role: 'viewer' }).expect(201);
    const first = (await mailedInvitation(email)).token;
    await g.clients.owner.post(`${g.base}/invitations`).send({ email, role: 'grower' }).expect(201);
    const second = (await mailedInvitation(email)).token;

    expect((await anonymous().get(`/api/invitations/${first}`)).body.error.code).toBe('invitation_revoked');
    expect((await anonymous().get(`/api/invitations/${second}`).expect(200)).body.role).toBe('grower');
    expect((await g.clients.owner.get(`${g.base}/invitations`).expect(200)).body.items.map((i: { role: string }) => i.role)).toEqual(['grower']);
  });

  it('when a link is forged or mangled, then it is an unknown invitation (404), never a 500', async () => {
    for (const token of [randomBytes(32).toString('base64url'), 'short', `${randomBytes(32).toString('base64url')}x`, '%E2%80%AE']) {
      const seen = await anonymous().get(`/api/invitations/${token}`);
      const used = await anonymous().post(`/api/invitations/${token}/accept`).send({});
      for (const res of [seen, used]) {
        expect(res.status, token).toBe(404);
        expect(res.body.error.code, token).toBe('invitation_unknown');
      }
    }
  });

  it('when a grower or viewer tries to invite, list or revoke, then 403 and nothing is sent', async () => {
    const g = await gardenWithClients(app);
    const email = uniqueEmail('nope');
    for (const who of ['grower', 'viewer'] as const) {
      const c = g.clients[who];
      expect((await c.post(`${g.base}/invitations`).send({ email, role: 'viewer' })).status).toBe(403);
      expect((await c.get(`${g.base}/invitations`)).status).toBe(403);
      expect((await c.delete(`${g.base}/invitations/1`)).status).toBe(403);
    }
    expect(await accountMailFor(email)).toEqual([]);
  });

  it('when the address already belongs to a member, or the fields are wrong, then the refusal names the field', async () => {
    const g = await gardenWithClients(app);

    const member = await g.clients.owner.post(`${g.base}/invitations`).send({ email: g.grower.email, role: 'owner' });
    expect(member.status).toBe(409);
    expect(member.body.error.fields.email).toMatch(/already a member/);
    const bad = await g.clients.owner.post(`${g.base}/invitations`).send({ email: 'not-an-address', role: 'boss', gardenId: 3 });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['email', 'gardenId', 'role']);
    expect(await accountMailFor(g.grower.email)).toEqual([]);
  });

  it('when a new account is made with a weak password or no name, then 400 names the field and the link still works', async () => {
    const g = await gardenWithClients(app);
    const email = uniqueEmail('weak');
    await g.clients.owner.post(`${g.base}/invitations`).send({ email, role: 'grower' }).expect(201);
    const { token } = await mailedInvitation(email);

    const weak = await anonymous().post(`/api/invitations/${token}/accept`).send({ name: 'Weak One', password: 'password123' });
    expect(weak.status).toBe(400);
    expect(weak.body.error.fields).toHaveProperty('password');
    const strongButGuessable = await anonymous().post(`/api/invitations/${token}/accept`).send({ name: 'Weak One', password: email.split('@')[0] });
    expect(strongButGuessable.status).toBe(400);
    expect(strongButGuessable.body.error.fields.password).toMatch(/too easy to guess/);
    const noName = await anonymous().post(`/api/invitations/${token}/accept`).send({ password: STRONG });
    expect(noName.status).toBe(400);
    expect(noName.body.error.fields).toHaveProperty('name');
    const signedOutEmpty = await anonymous().post(`/api/invitations/${token}/accept`).send({});
    expect(signedOutEmpty.status).toBe(401);

    expect((await anonymous().get(`/api/invitations/${token}`)).status).toBe(200);
  });

  it(`when an owner sends more than ${INVITES_PER_HOUR} invitations in an hour, then the next is refused with 429 and Retry-After`, async () => {
    const g = await gardenWithClients(app);
    for (let i = 0; i < INVITES_PER_HOUR; i++) await g.clients.owner.post(`${g.base}/invitations`).send({ email: uniqueEmail(`many${i}`), role: 'viewer' }).expect(201);

    const res = await g.clients.owner.post(`${g.base}/invitations`).send({ email: uniqueEmail('one-too-many'), role: 'viewer' });

    expect(res.status).toBe(429);
    expect(res.headers['retry-after']).toBeDefined();
    expect(res.body.error.message).toMatch(/Too many invitations/);
  });

  it('when the accept body is not a JSON object, then 400 in words, and nothing is joined', async () => {
    const g = await gardenWithClients(app);
    const email = uniqueEmail('array-body');
    await g.clients.owner.post(`${g.base}/invitations`).send({ email, role: 'viewer' }).expect(201);
    const { token } = await mailedInvitation(email);
    const res = await anonymous().post(`/api/invitations/${token}/accept`).set('Content-Type', 'application/json').send('[]');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('malformed_body');
    expect((await anonymous().get(`/api/invitations/${token}`)).status).toBe(200);
  });
});
