// @vitest-environment jsdom
import { describe, expect, it } from 'vitest';
import { screen, within } from '@testing-library/react';
import { http, HttpResponse } from 'msw';
import type { AccountSessionDto } from '#shared/schemas/account';
import { seen, server, setupClientTests } from './helpers/msw-server';
import { aGarden, grower } from './helpers/data';
import { memberOf, renderApp, signedInAs, signedOut } from './helpers/render-app';

setupClientTests();

const HERE: AccountSessionDto = { id: 'aaaaaaaaaaaaaaaa', device: 'Chrome on Linux', signedInAt: '2026-06-14T06:00:00.000Z', lastSeenAt: '2026-06-14T06:10:00.000Z', current: true };
const PHONE: AccountSessionDto = { id: 'bbbbbbbbbbbbbbbb', device: 'Safari on iPhone', signedInAt: '2026-06-10T08:00:00.000Z', lastSeenAt: '2026-06-13T19:45:00.000Z', current: false };

function accountApi(sessions: AccountSessionDto[]) {
  let live = [...sessions];
  return [
    signedInAs(grower),
    ...memberOf([aGarden({ id: 1, name: 'Back plot' })]),
    http.get('/api/me/sessions', () => HttpResponse.json({ items: live })),
    http.delete('/api/me/sessions/:id', ({ params }) => {
      live = live.filter((s) => s.id !== params.id);
      return new HttpResponse(null, { status: 204 });
    }),
    http.post('/api/me/sessions/sign-out-others', () => {
      const ended = live.filter((s) => !s.current).length;
      live = live.filter((s) => s.current);
      return HttpResponse.json({ ended });
    }),
  ];
}

async function openAccount() {
  const app = renderApp('/account');
  await screen.findByRole('heading', { name: 'Your account' });
  return app;
}

describe('account page', () => {
  it('when opened, then it lists the devices in words with this one marked, and links each garden’s settings for units and alert e-mails', async () => {
    server.use(...accountApi([HERE, PHONE]));
    await openAccount();

    const list = await screen.findByRole('list', { name: 'Signed-in devices' });
    const rows = within(list).getAllByRole('listitem');
    expect(rows[0].textContent).toContain('Chrome on Linux');
    expect(rows[0].textContent).toContain('This device');
    expect(within(rows[0]).queryByRole('button')).toBeNull();
    expect(rows[1].textContent).toContain('Safari on iPhone');
    expect(rows[1].textContent).toMatch(/Last active/);
    expect((screen.getByLabelText('Your name') as HTMLInputElement).value).toBe(grower.name);
    expect(screen.getByText(grower.email)).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Back plot: settings and alert e-mails' }).getAttribute('href')).toBe('/g/1/settings');
  });

  it('when one device is signed out, then that request goes out and the device leaves the list; "everywhere else" ends the rest', async () => {
    server.use(...accountApi([HERE, PHONE, { ...PHONE, id: 'cccccccccccccccc', device: 'Firefox on Windows' }]));
    const { user } = await openAccount();
    await screen.findByText('Safari on iPhone');

    await user.click(screen.getByRole('button', { name: 'Sign out Safari on iPhone' }));

    expect(await screen.findByText('Firefox on Windows')).toBeTruthy();
    await expect.poll(() => screen.queryByText('Safari on iPhone')).toBeNull();
    expect(seen.some((r) => r.method === 'DELETE' && r.path === '/api/me/sessions/bbbbbbbbbbbbbbbb')).toBe(true);

    await user.click(screen.getByRole('button', { name: 'Sign out everywhere else' }));

    expect(await screen.findByText('Only this device is signed in now.')).toBeTruthy();
    await expect.poll(() => screen.queryByText('Firefox on Windows')).toBeNull();
  });

  it('when the password change is refused, then the server’s words sit under the field it names', async () => {
    server.use(
      ...accountApi([HERE]),
      http.post('/api/me/password', () =>
        HttpResponse.json(
          { error: { code: 'validation_failed', message: 'Please check the fields: currentPassword.', fields: { currentPassword: 'This is not your current password.' } } },
          { status: 400 },
        ),
      ),
    );
    const { user } = await openAccount();
    const section = screen.getByRole('region', { name: 'Password' });

    await user.type(within(section).getByLabelText('Current password'), 'not my password');
    await user.type(within(section).getByLabelText('New password'), 'lantern otter quarry maple');
    await user.click(within(section).getByRole('button', { name: 'Change password' }));

    const message = await within(section).findByText('This is not your current password.');
    expect(within(section).getByLabelText('Current password').getAttribute('aria-describedby')).toContain(message.id);
    expect(seen.find((r) => r.path === '/api/me/password')?.body).toEqual({ currentPassword: 'not my password', password: 'lantern otter quarry maple' });
  });

  it('when a new e-mail is asked for, then the page says the change waits for the link and still shows the old address', async () => {
    server.use(
      ...accountApi([HERE]),
      http.post('/api/me/email-change', () => HttpResponse.json({ status: 'check-email', message: 'We sent a link.' }, { status: 202 })),
    );
    const { user } = await openAccount();
    const section = screen.getByRole('region', { name: 'E-mail' });

    await user.type(within(section).getByLabelText('New e-mail'), 'new@example.org');
    await user.type(within(section).getByLabelText('Current password'), 'correct horse battery');
    await user.click(within(section).getByRole('button', { name: 'Send a link to the new e-mail' }));

    const notice = await within(section).findByRole('status');
    expect(notice.textContent).toContain('new@example.org');
    expect(notice.textContent).toMatch(/changes only when that link is opened/);
    expect(within(section).getAllByText(grower.email).length).toBeGreaterThan(0);
  });

  it('when the name is saved, then the header’s me follows it', async () => {
    server.use(
      ...accountApi([HERE]),
      http.patch('/api/me', async ({ request }) => HttpResponse.json({ user: { ...grower, ...((await request.json()) as object) } })),
    );
    const { user, queryClient } = await openAccount();
    const field = screen.getByLabelText('Your name');

    await user.clear(field);
    await user.type(field, 'Mara Q.');
    await user.click(screen.getByRole('button', { name: 'Save name' }));

    expect(await screen.findByText('Name saved.')).toBeTruthy();
    expect(queryClient.getQueryData(['auth', 'me'])).toEqual({ ...grower, name: 'Mara Q.' });
  });
});

describe('password reset pages', () => {
  it('when the sign-in page is open, then "Forgot password?" leads to a form whose answer reads the same for any address', async () => {
    server.use(
      signedOut,
      http.post('/api/auth/password-reset', () => HttpResponse.json({ status: 'check-email', message: 'If an account uses this e-mail…' }, { status: 202 })),
    );
    const { user } = renderApp('/sign-in');
    await user.click(await screen.findByRole('link', { name: 'Forgot password?' }));
    await screen.findByRole('heading', { name: 'Forgot your password?' });

    await user.type(screen.getByLabelText('E-mail'), 'someone@example.org');
    await user.click(screen.getByRole('button', { name: 'Send me a link' }));

    expect((await screen.findByRole('status')).textContent).toContain('If an account uses someone@example.org');
  });

  it('when a used link is opened, then it says so in words with a way to a new link, and no form', async () => {
    server.use(
      signedOut,
      http.get('/api/auth/password-reset/:token', () =>
        HttpResponse.json({ error: { code: 'link_used', message: 'This link has been used already: each link works once.' } }, { status: 410 }),
      ),
    );
    renderApp(`/reset-password/${'A'.repeat(43)}`);

    expect((await screen.findByRole('alert')).textContent).toContain('used already');
    expect(screen.getByRole('link', { name: 'Send me a new link' }).getAttribute('href')).toBe('/forgot-password');
    expect(screen.queryByLabelText('New password')).toBeNull();
  });

  it('when a new password is saved from the link, then the page says so and offers sign-in', async () => {
    server.use(
      signedOut,
      http.get('/api/auth/password-reset/:token', () => HttpResponse.json({ status: 'usable' })),
      http.post('/api/auth/password-reset/:token', () => HttpResponse.json({ status: 'password-changed', message: 'Changed.' })),
    );
    const { user } = renderApp(`/reset-password/${'A'.repeat(43)}`);

    await user.type(await screen.findByLabelText('New password'), 'lantern otter quarry maple');
    await user.click(screen.getByRole('button', { name: 'Save the new password' }));

    expect((await screen.findByRole('status')).textContent).toContain('signed out on every device');
    expect(screen.getByRole('link', { name: 'Sign in with the new password' }).getAttribute('href')).toBe('/sign-in');
  });
});
