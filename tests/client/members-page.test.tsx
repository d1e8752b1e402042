// @vitest-environment jsdom
import { describe, expect, it, vi } from 'vitest';
import { screen, within } from '@testing-library/react';
import { http, HttpResponse } from 'msw';
import type { MemberDto } from '#shared/schemas/members';
import type { InvitationDto } from '#shared/schemas/invitations';
import { seen, server, setupClientTests, useBrowserLanguages } from './helpers/msw-server';
import { aGarden, grower } from './helpers/data';
import { memberOf, renderApp, signedInAs } from './helpers/render-app';

setupClientTests();
useBrowserLanguages(['en-GB']);

const me: MemberDto = { userId: grower.id, name: grower.name, email: grower.email, role: 'owner', joinedAt: '2026-03-01T09:00:00.000Z' };
const ines: MemberDto = { userId: 21, name: 'Ines Marr', email: 'ines@example.org', role: 'grower', joinedAt: '2026-04-02T09:00:00.000Z' };
const tova: MemberDto = { userId: 22, name: 'Tova Renn', email: 'tova@example.org', role: 'viewer', joinedAt: '2026-05-03T09:00:00.000Z' };

const waiting: InvitationDto = {
  id: 5,
  email: 'oskar@example.org',
  role: 'viewer',
  invitedBy: 'Mara Quill',
  createdAt: '2026-06-01T10:00:00.000Z',
  expiresAt: '2026-06-08T10:00:00.000Z',
};

function withMembers(members: MemberDto[], invitations: InvitationDto[] = []) {
  return [
    http.get('/api/gardens/:gardenId/members', () => HttpResponse.json({ items: members })),
    http.get('/api/gardens/:gardenId/invitations', () => HttpResponse.json({ items: invitations })),
  ];
}

const writes = () => seen.filter((r) => r.method !== 'GET');

describe('members page', () => {
  it('when an owner opens it, then each member is listed with a role select and Remove, and the only owner cannot step down or leave', async () => {
    server.use(signedInAs(grower), ...memberOf([aGarden()]), ...withMembers([me, ines, tova], [waiting]));
    renderApp('/g/1/members');

    const table = await screen.findByRole('table', { name: 'Members of this garden and their roles' });
    const rows = within(table).getAllByRole('row').slice(1);
    expect(rows.map((r) => within(r).getAllByRole('cell')[0].textContent)).toEqual(['Mara Quill (you)mara@example.org', 'Ines Marrines@example.org', 'Tova Renntova@example.org']);
    const own = screen.getByRole('combobox', { name: 'Role of Mara Quill' });
    expect((own as HTMLSelectElement).disabled).toBe(true);
    expect(screen.getAllByText('The only owner keeps the owner role: make someone else an owner first.').length).toBeGreaterThan(0);
    expect((screen.getByRole('combobox', { name: 'Role of Ines Marr' }) as HTMLSelectElement).value).toBe('grower');
    expect(screen.getByRole('button', { name: 'Remove Ines Marr' })).toBeTruthy();
    expect(screen.queryByRole('button', { name: 'Remove Mara Quill' })).toBeNull();
    expect(screen.getByText('You are the only owner')).toBeTruthy();
    expect(screen.queryByRole('button', { name: 'Leave this garden' })).toBeNull();
    expect(await screen.findByText('oskar@example.org')).toBeTruthy();
    expect(screen.getByText(/Viewer · invited by Mara Quill · link works until/)).toBeTruthy();
  });

  it('when an owner opens the test copy of a waiting invitation, then its text with the link shows', async () => {
    const text = 'Hello,\n\nMara Quill invited you to join the garden.\n\nhttp://127.0.0.1:3000/invitations/abc';
    server.use(
      signedInAs(grower),
      ...memberOf([aGarden()]),
      ...withMembers([me], [waiting]),
      http.get('/api/gardens/:gardenId/invitations/:id/test-mail', () =>
        HttpResponse.json({ message: { to: waiting.email, subject: 'You are invited', text, html: null, receivedAt: '2026-06-01T10:00:01.000Z' } }),
      ),
    );
    const { user } = renderApp('/g/1/members');

    await user.click(await screen.findByRole('button', { name: 'Show the test e-mail' }));

    expect((await screen.findByLabelText('The invitation e-mail')).textContent).toBe(text);
    expect(seen.some((r) => r.path === '/api/gardens/1/invitations/5/test-mail')).toBe(true);
  });

  it('when an owner picks another role, then nothing is sent until they confirm, and one PATCH carries the role', async () => {
    let members = [me, ines, tova];
    server.use(
      signedInAs(grower),
      ...memberOf([aGarden()]),
      http.get('/api/gardens/:gardenId/members', () => HttpResponse.json({ items: members })),
      http.get('/api/gardens/:gardenId/invitations', () => HttpResponse.json({ items: [] })),
      http.patch('/api/gardens/:gardenId/members/:userId', async ({ request, params }) => {
        const { role } = (await request.json()) as { role: MemberDto['role'] };
        members = members.map((m) => (String(m.userId) === params.userId ? { ...m, role } : m));
        return HttpResponse.json({ member: members.find((m) => String(m.userId) === params.userId) });
      }),
    );
    const { user } = renderApp('/g/1/members');

    await user.selectOptions(await screen.findByRole('combobox', { name: 'Role of Tova Renn' }), 'owner');
    expect(writes()).toEqual([]);
    const ask = screen.getByRole('group', { name: 'Change the role of Tova Renn' });
    expect(within(ask).getByText('Make Tova Renn owner?')).toBeTruthy();
    await user.click(within(ask).getByRole('button', { name: 'Change role' }));

    await vi.waitFor(() => expect((screen.getByRole('combobox', { name: 'Role of Tova Renn' }) as HTMLSelectElement).value).toBe('owner'));
    const [patch, ...more] = writes();
    expect(more).toEqual([]);
    expect(patch).toMatchObject({ method: 'PATCH', path: '/api/gardens/1/members/22', body: { role: 'owner' } });
    // Two owners now: the signed-in owner may step down and leave.
    expect(((await screen.findByRole('combobox', { name: 'Role of Mara Quill' })) as HTMLSelectElement).disabled).toBe(false);
    expect(await screen.findByRole('button', { name: 'Leave this garden' })).toBeTruthy();
  });

  it('when an owner removes a member, then it asks first and the server’s refusal is shown in words', async () => {
    server.use(
      signedInAs(grower),
      ...memberOf([aGarden()]),
      ...withMembers([me, ines]),
      http.delete('/api/gardens/:gardenId/members/:userId', () =>
        HttpResponse.json({ error: { code: 'forbidden', message: 'Only the garden owner can do this. Your role in this garden has just changed.' } }, { status: 403 }),
      ),
    );
    const { user } = renderApp('/g/1/members');

    await user.click(await screen.findByRole('button', { name: 'Remove Ines Marr' }));
    expect(writes()).toEqual([]);
    const ask = screen.getByRole('group', { name: 'Remove Ines Marr' });
    expect(within(ask).getByText('Remove Ines Marr from this garden?')).toBeTruthy();
    await user.click(within(ask).getByRole('button', { name: 'Remove' }));

    expect(await within(ask).findByText('Only the garden owner can do this. Your role in this garden has just changed.')).toBeTruthy();
    expect(writes().map((r) => `${r.method} ${r.path}`)).toEqual(['DELETE /api/gardens/1/members/21']);
  });

  it('when an owner invites with a bad address or one already in the garden, then the error is under the E-mail field', async () => {
    server.use(
      signedInAs(grower),
      ...memberOf([aGarden()]),
      ...withMembers([me, ines]),
      http.post('/api/gardens/:gardenId/invitations', () =>
        HttpResponse.json(
          { error: { code: 'already_member', message: 'This e-mail already belongs to a member of this garden.', fields: { email: 'This person is already a member of this garden.' } } },
          { status: 409 },
        ),
      ),
    );
    const { user } = renderApp('/g/1/members');
    const form = await screen.findByRole('form', { name: 'Invite someone' });

    await user.type(within(form).getByLabelText('E-mail'), 'not an address');
    await user.click(within(form).getByRole('button', { name: 'Send invitation' }));
    expect(await within(form).findByText('Enter a valid e-mail address, like name@example.org.')).toBeTruthy();
    expect(writes()).toEqual([]);

    await user.clear(within(form).getByLabelText('E-mail'));
    await user.type(within(form).getByLabelText('E-mail'), 'ines@example.org');
    await user.selectOptions(within(form).getByLabelText('Role'), 'owner');
    expect(within(form).getByText(/An owner changes the garden’s settings/)).toBeTruthy();
    await user.click(within(form).getByRole('button', { name: 'Send invitation' }));

    const field = within(form).getByLabelText('E-mail');
    expect(await within(form).findByText('This person is already a member of this garden.')).toBeTruthy();
    expect(field.getAttribute('aria-invalid')).toBe('true');
    const [post] = writes();
    expect(post).toMatchObject({ method: 'POST', path: '/api/gardens/1/invitations', body: { email: 'ines@example.org', role: 'owner' } });
    expect(post.headers.get('idempotency-key')).toBeTruthy();
  });

  it('when a grower opens it, then they see names and roles without e-mails, no invite form, and can leave after confirming', async () => {
    const noEmail = (m: MemberDto) => ({ ...m, email: null });
    let gardens = [aGarden({ role: 'grower' })];
    server.use(
      signedInAs(grower),
      http.get('/api/gardens', () => HttpResponse.json({ gardens })),
      ...memberOf(gardens),
      http.get('/api/gardens/:gardenId/members', () => HttpResponse.json({ items: [noEmail(ines), noEmail({ ...me, role: 'grower' }), noEmail(tova)] })),
      http.delete('/api/gardens/:gardenId/members/me', () => {
        gardens = [];
        return new HttpResponse(null, { status: 204 });
      }),
    );
    const { user, router } = renderApp('/g/1/members');

    const table = await screen.findByRole('table');
    expect(within(table).queryByRole('combobox')).toBeNull();
    expect(within(table).getAllByRole('row').slice(1).map((r) => within(r).getAllByRole('cell')[1].textContent)).toEqual(['Grower', 'Grower', 'Viewer']);
    expect(screen.queryByRole('form', { name: 'Invite someone' })).toBeNull();
    expect(screen.queryByText(/@example\.org/)).toBeNull();
    expect(seen.some((r) => r.path.endsWith('/invitations'))).toBe(false);

    await user.click(screen.getByRole('button', { name: 'Leave this garden' }));
    expect(writes()).toEqual([]);
    await user.click(within(screen.getByRole('group', { name: 'Leave this garden' })).getByRole('button', { name: 'Leave' }));

    expect(await screen.findByText('No gardens yet')).toBeTruthy();
    expect(router.state.location.pathname).toBe('/');
    expect(writes().map((r) => `${r.method} ${r.path}`)).toEqual(['DELETE /api/gardens/1/members/me']);
  });
});
