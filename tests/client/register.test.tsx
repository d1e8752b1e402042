// @vitest-environment jsdom
import { describe, expect, it } from 'vitest';
import { screen, waitFor } from '@testing-library/react';
import { http, HttpResponse } from 'msw';
import { seen, server, setupClientTests } from './helpers/msw-server';
import { aGarden, grower } from './helpers/data';
import { memberOf, quietToday, renderApp, signedOut } from './helpers/render-app';

setupClientTests();

async function fillAndSubmit(user: ReturnType<typeof renderApp>['user']) {
  await user.type(screen.getByLabelText('Your name'), 'Mara Quill');
  await user.type(screen.getByLabelText('E-mail'), 'mara@example.org');
  await user.type(screen.getByLabelText('Password'), 'ten or more letters');
  await user.type(screen.getByLabelText('Garden name'), 'Hollowbrook Teaching Garden');
  await user.click(screen.getByRole('button', { name: 'Create account' }));
}

describe('register form', () => {
  it('when the server refuses the e-mail, then its message appears under the e-mail field', async () => {
    server.use(
      signedOut,
      http.post('/api/auth/register', () =>
        HttpResponse.json(
          {
            error: {
              code: 'validation_failed',
              message: 'Some fields need attention.',
              fields: { email: 'Enter a valid e-mail address, like name@example.org.' },
            },
          },
          { status: 400 },
        ),
      ),
    );
    const { user } = renderApp('/register');
    await screen.findByRole('heading', { name: 'Create an account' });

    await fillAndSubmit(user);

    const message = await screen.findByText('Enter a valid e-mail address, like name@example.org.');
    const email = screen.getByLabelText('E-mail');
    expect(email.getAttribute('aria-invalid')).toBe('true');
    expect(email.getAttribute('aria-describedby')).toContain(message.id);
    expect(document.activeElement).toBe(email);
    expect(screen.queryByRole('alert')).toBeNull();
  });

  it('when the server rejects several fields, then each message lands under its own field', async () => {
    server.use(
      signedOut,
      http.post('/api/auth/register', () =>
        HttpResponse.json(
          {
            error: {
              code: 'validation_failed',
              message: 'Some fields need attention.',
              fields: { gardenName: 'Garden name is taken in your account.', password: 'Password is too common.' },
            },
          },
          { status: 400 },
        ),
      ),
    );
    const { user } = renderApp('/register');
    await screen.findByRole('heading', { name: 'Create an account' });

    await fillAndSubmit(user);

    const gardenMessage = await screen.findByText('Garden name is taken in your account.');
    expect(screen.getByLabelText('Garden name').getAttribute('aria-describedby')).toContain(gardenMessage.id);
    const passwordMessage = screen.getByText('Password is too common.');
    expect(screen.getByLabelText('Password').getAttribute('aria-describedby')).toContain(passwordMessage.id);
  });

  it('when the password is short, then the shared rule explains it and nothing is sent', async () => {
    server.use(signedOut);
    const { user } = renderApp('/register');
    await screen.findByRole('heading', { name: 'Create an account' });

    await user.type(screen.getByLabelText('Password'), 'short');
    await user.click(screen.getByRole('button', { name: 'Create account' }));

    expect(await screen.findByText('Password must be at least 10 characters.')).toBeTruthy();
    expect(screen.getByText('Your name is required.')).toBeTruthy();
    expect(seen.filter((r) => r.path === '/api/auth/register')).toHaveLength(0);
  });

  it('when registration is sent, then a check-e-mail panel names the address and the 24-hour link, takes focus, and nobody is signed in', async () => {
    server.use(
      signedOut,
      http.post('/api/auth/register', () =>
        HttpResponse.json({ status: 'check-email', message: 'Check your e-mail: we sent a link to finish creating your account.' }, { status: 202 }),
      ),
      // A server that sends real e-mail has no local mailbox.
      http.get('/api/dev/mail/sign-up', () => HttpResponse.json({ error: { code: 'not_found', message: 'No such API route.' } }, { status: 404 })),
    );
    const { user, router } = renderApp('/register');
    await screen.findByRole('heading', { name: 'Create an account' });

    await fillAndSubmit(user);

    const heading = await screen.findByRole('heading', { name: 'Check your e-mail', level: 2 });
    expect(document.activeElement).toBe(heading);
    const status = screen.getByRole('status');
    expect(status.textContent).toContain('We sent a message to mara@example.org with a link to finish creating your account');
    expect(screen.getByText(/The link works for 24 hours, once\./)).toBeTruthy();
    expect(screen.getByText(/If this address already has a Heatclock account, the message says so instead/)).toBeTruthy();
    expect(screen.queryByRole('button', { name: 'Create account' })).toBeNull();
    expect(router.state.location.pathname).toBe('/register');
    expect(seen.filter((r) => r.path === '/api/auth/register')).toHaveLength(1);

    // Back to the form, with what was typed, to fix the address or send again.
    await user.click(screen.getByRole('button', { name: 'Use a different e-mail or send again' }));
    const email = screen.getByLabelText('E-mail') as HTMLInputElement;
    expect(email.value).toBe('mara@example.org');
    expect(document.activeElement).toBe(email);
    expect(screen.queryByRole('heading', { name: 'Check your e-mail' })).toBeNull();
  });
});

describe('the local test mailbox after signing up', () => {
  it('when mail is caught locally, then the panel shows the caught message with its link once it arrives', async () => {
    let asked = 0;
    server.use(
      signedOut,
      http.post('/api/auth/register', () => HttpResponse.json({ status: 'check-email', message: 'Check your e-mail.' }, { status: 202 })),
      http.get('/api/dev/mail/sign-up', ({ request }) => {
        expect(new URL(request.url).searchParams.get('email')).toBe('mara@example.org');
        asked++;
        // The first look finds nothing yet: the message is queued and sent a moment later.
        const messages = asked === 1 ? [] : [{ to: 'mara@example.org', subject: 'Finish creating your Heatclock account', text: 'Open http://127.0.0.1:3000/register/confirm/tok_123 to finish.', html: null, receivedAt: '2026-12-02T01:00:00.000Z' }];
        return HttpResponse.json({ messages });
      }),
    );
    const { user } = renderApp('/register');
    await screen.findByRole('heading', { name: 'Create an account' });
    await fillAndSubmit(user);
    expect(await screen.findByRole('heading', { name: 'Local test mailbox' })).toBeTruthy();
    const link = await screen.findByRole('link', { name: 'Open the link in the message' });
    expect(link.getAttribute('href')).toBe('/register/confirm/tok_123');
  });
});

describe('finishing an account from the e-mail link', () => {
  const TOKEN = 'Zm9vYmFyYmF6cXV1eGNvcmdlZ3JhdWx0Z2FycGx5d2FsZG8';

  it('when the link is opened, then nothing is sent until the button is pressed; then the grower lands on their new garden', async () => {
    const garden = aGarden({ id: 12, latitude: null, longitude: null, elevationM: null });
    server.use(
      signedOut,
      http.post('/api/auth/register/confirm/:token', () => HttpResponse.json({ user: grower, garden }, { status: 201 })),
      ...memberOf([garden]),
      quietToday,
    );
    const { user, router } = renderApp(`/register/confirm/${TOKEN}`);

    await screen.findByRole('heading', { name: 'Finish creating your account', level: 1 });
    expect(seen.filter((r) => r.path.startsWith('/api/auth/register/confirm/'))).toHaveLength(0);
    await user.click(screen.getByRole('button', { name: 'Finish creating my account' }));

    expect(await screen.findByRole('heading', { name: 'Today', level: 1 })).toBeTruthy();
    expect(router.state.location.pathname).toBe('/g/12');
    expect(screen.getByText(/find the garden by town or US ZIP code/)).toBeTruthy();
    expect(seen.filter((r) => r.path === `/api/auth/register/confirm/${TOKEN}` && r.method === 'POST')).toHaveLength(1);
  });

  it('when the link has expired, then the refusal is shown in words with a way to register again, and no button to retry', async () => {
    server.use(
      signedOut,
      http.post('/api/auth/register/confirm/:token', () =>
        HttpResponse.json(
          { error: { code: 'link_expired', message: 'This link has expired: links to finish an account work for 24 hours. Register again to get a new one.' } },
          { status: 410 },
        ),
      ),
    );
    const { user } = renderApp(`/register/confirm/${TOKEN}`);
    await user.click(await screen.findByRole('button', { name: 'Finish creating my account' }));

    const alert = await screen.findByRole('alert');
    expect(alert.textContent).toContain('This link has expired');
    expect(alert.textContent).toContain('work for 24 hours');
    expect(screen.getByRole('link', { name: 'Register again' }).getAttribute('href')).toBe('/register');
    expect(screen.queryByRole('button', { name: 'Finish creating my account' })).toBeNull();
  });

  it('when the address got an account meanwhile, then the page says so and links to sign-in', async () => {
    server.use(
      signedOut,
      http.post('/api/auth/register/confirm/:token', () =>
        HttpResponse.json(
          { error: { code: 'email_taken', message: 'An account with this e-mail already exists, so no new one was created. Sign in instead.' } },
          { status: 409 },
        ),
      ),
    );
    const { user } = renderApp(`/register/confirm/${TOKEN}`);
    await user.click(await screen.findByRole('button', { name: 'Finish creating my account' }));

    const alert = await screen.findByRole('alert');
    expect(alert.textContent).toContain('You already have an account');
    expect(alert.querySelector('a')?.getAttribute('href')).toBe('/sign-in');
  });

  it('when the server cannot be reached, then the button stays to try again', async () => {
    let calls = 0;
    server.use(
      signedOut,
      http.post('/api/auth/register/confirm/:token', () => {
        calls++;
        return HttpResponse.json({ error: { code: 'unavailable', message: 'The database is not answering. Try again in a moment.' } }, { status: 503 });
      }),
    );
    const { user } = renderApp(`/register/confirm/${TOKEN}`);
    await user.click(await screen.findByRole('button', { name: 'Finish creating my account' }));

    expect((await screen.findByRole('alert')).textContent).toContain('The link has not been used yet, so you can try again.');
    await user.click(screen.getByRole('button', { name: 'Finish creating my account' }));
    await waitFor(() => expect(calls).toBe(2));
  });
});
