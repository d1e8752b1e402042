// @vitest-environment jsdom
import { describe, expect, it } from 'vitest';
import { screen } from '@testing-library/react';
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
  it('when the e-mail is taken, then the server message appears under the e-mail field', async () => {
    server.use(
      signedOut,
      http.post('/api/auth/register', () =>
        HttpResponse.json(
          {
            error: {
              code: 'email_taken',
              message: 'That e-mail already has an account.',
              fields: { email: 'An account with this e-mail already exists. Try signing in.' },
            },
          },
          { status: 409 },
        ),
      ),
    );
    const { user } = renderApp('/register');
    await screen.findByRole('heading', { name: 'Create an account' });

    await fillAndSubmit(user);

    const message = await screen.findByText('An account with this e-mail already exists. Try signing in.');
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

  it('when registration succeeds, then the grower lands on their new garden', async () => {
    const garden = aGarden({ id: 12, latitude: null, longitude: null, elevationM: null });
    server.use(
      signedOut,
      http.post('/api/auth/register', () => HttpResponse.json({ user: grower, garden }, { status: 201 })),
      ...memberOf([garden]),
      quietToday,
    );
    const { user, router } = renderApp('/register');
    await screen.findByRole('heading', { name: 'Create an account' });

    await fillAndSubmit(user);

    expect(await screen.findByRole('heading', { name: 'Today', level: 1 })).toBeTruthy();
    expect(router.state.location.pathname).toBe('/g/12');
    expect(screen.getByText(/Add the garden’s latitude and longitude/)).toBeTruthy();
  });
});
