// @vitest-environment jsdom
import { describe, expect, it } from 'vitest';
import { screen } from '@testing-library/react';
import { http, HttpResponse } from 'msw';
import { seen, server, setupClientTests } from './helpers/msw-server';
import { rememberGarden } from '@/lib/last-garden';
import { aGarden, grower } from './helpers/data';
import { memberOf, quietToday, renderApp, signedOut } from './helpers/render-app';

setupClientTests();

function loginRequests() {
  return seen.filter((r) => r.path === '/api/auth/login');
}

async function openSignIn(path = '/sign-in') {
  const app = renderApp(path);
  await screen.findByRole('heading', { name: 'Sign in' });
  return app;
}

describe('sign-in form', () => {
  it('when submitted empty, then each field says what is missing and nothing is sent', async () => {
    server.use(signedOut);
    const { user } = await openSignIn();

    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByText('E-mail is required.')).toBeTruthy();
    expect(screen.getByText('Password is required.')).toBeTruthy();
    expect(screen.getByLabelText('E-mail').getAttribute('aria-invalid')).toBe('true');
    expect(loginRequests()).toHaveLength(0);
  });

  it('when the e-mail is malformed, then the message sits under the e-mail field and nothing is sent', async () => {
    server.use(signedOut);
    const { user } = await openSignIn();

    await user.type(screen.getByLabelText('E-mail'), 'mara-at-example');
    await user.type(screen.getByLabelText('Password'), 'long enough password');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    const email = screen.getByLabelText('E-mail');
    const message = await screen.findByText('Enter a valid e-mail address, like name@example.org.');
    expect(email.getAttribute('aria-describedby')).toContain(message.id);
    expect(loginRequests()).toHaveLength(0);
  });

  it('when the server answers 401, then the grower reads that the e-mail or password is wrong', async () => {
    server.use(
      signedOut,
      http.post('/api/auth/login', () =>
        HttpResponse.json(
          { error: { code: 'invalid_credentials', message: 'E-mail or password is incorrect.' } },
          { status: 401 },
        ),
      ),
    );
    const { user } = await openSignIn();

    await user.type(screen.getByLabelText('E-mail'), 'Mara@Example.org ');
    await user.type(screen.getByLabelText('Password'), 'not the password');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    expect((await screen.findByRole('alert')).textContent).toContain('E-mail or password is incorrect.');
    const [request] = loginRequests();
    expect(request.body).toEqual({ email: 'mara@example.org', password: 'not the password' });
    expect(request.headers.get('x-requested-with')).toBe('heatclock');
    expect(request.headers.get('content-type')).toBe('application/json');
  });

  it('when the server answers 429 with Retry-After, then the grower is told how long to wait', async () => {
    server.use(
      signedOut,
      http.post('/api/auth/login', () =>
        HttpResponse.json(
          { error: { code: 'rate_limited', message: 'Too many attempts.' } },
          { status: 429, headers: { 'Retry-After': '90' } },
        ),
      ),
    );
    const { user } = await openSignIn();

    await user.type(screen.getByLabelText('E-mail'), 'mara@example.org');
    await user.type(screen.getByLabelText('Password'), 'guess number six');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    expect((await screen.findByRole('alert')).textContent).toContain('Please wait 2 minutes, then try again.');
  });

  it('when a signed-out grower opens a garden page, then after signing in they land back on it', async () => {
    let signedIn = false;
    server.use(
      http.get('/api/auth/me', () =>
        signedIn
          ? HttpResponse.json({ user: grower })
          : HttpResponse.json({ error: { code: 'unauthenticated', message: 'Please sign in.' } }, { status: 401 }),
      ),
      http.post('/api/auth/login', () => {
        signedIn = true;
        return HttpResponse.json({ user: grower });
      }),
      ...memberOf([aGarden()]),
    );
    const { user, router } = renderApp('/g/1/settings');

    await screen.findByRole('heading', { name: 'Sign in' });
    expect(router.state.location.search).toBe('?next=%2Fg%2F1%2Fsettings');
    await user.type(screen.getByLabelText('E-mail'), 'mara@example.org');
    await user.type(screen.getByLabelText('Password'), 'correct horse battery');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByRole('heading', { name: 'Garden settings' })).toBeTruthy();
    expect(router.state.location.pathname).toBe('/g/1/settings');
  });

  it('when next points off-site, then signing in goes home instead', async () => {
    server.use(
      signedOut,
      http.post('/api/auth/login', () => HttpResponse.json({ user: grower })),
      ...memberOf([aGarden()]),
      quietToday,
    );
    const { user, router } = await openSignIn('/sign-in?next=//evil.example/steal');
    server.use(http.get('/api/auth/me', () => HttpResponse.json({ user: grower })));

    await user.type(screen.getByLabelText('E-mail'), 'mara@example.org');
    await user.type(screen.getByLabelText('Password'), 'correct horse battery');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    await screen.findByRole('heading', { name: 'Today', level: 1 });
    expect(router.state.location.pathname).toBe('/g/1');
  });

  it('when a grower signs in, then the garden they last opened in this browser opens', async () => {
    server.use(
      signedOut,
      http.post('/api/auth/login', () => HttpResponse.json({ user: grower })),
      ...memberOf([aGarden(), aGarden({ id: 2, name: 'Wattle Creek School Garden', units: 'C', hemisphere: 'S' })]),
      quietToday,
    );
    rememberGarden(grower.id, 2);
    const { user, router } = await openSignIn();
    server.use(http.get('/api/auth/me', () => HttpResponse.json({ user: grower })));

    await user.type(screen.getByLabelText('E-mail'), 'mara@example.org');
    await user.type(screen.getByLabelText('Password'), 'correct horse battery');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    await screen.findByRole('heading', { name: 'Today', level: 1 });
    expect(router.state.location.pathname).toBe('/g/2');
  });
});
