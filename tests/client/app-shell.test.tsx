// @vitest-environment jsdom
import { describe, expect, it } from 'vitest';
import { screen, within } from '@testing-library/react';
import { http, HttpResponse } from 'msw';
import { seen, server, setupClientTests } from './helpers/msw-server';
import { aGarden, grower } from './helpers/data';
import { memberOf, quietToday, renderApp, signedInAs } from './helpers/render-app';

setupClientTests();

const north = aGarden();
const south = aGarden({
  id: 2,
  name: 'Wattle Creek School Garden',
  latitude: -37.81,
  longitude: 144.96,
  elevationM: 31,
  timeZone: 'Australia/Melbourne',
  units: 'C',
  hemisphere: 'S',
  role: 'viewer',
});

describe('app shell', () => {
  it('when a signed-in grower opens / for the first time, then they land on Today of their first garden', async () => {
    server.use(signedInAs(grower), ...memberOf([north, south]), quietToday);
    const { router } = renderApp('/');

    expect(await screen.findByRole('heading', { name: 'Today', level: 1 })).toBeTruthy();
    expect(router.state.location.pathname).toBe('/g/1');
    expect(screen.getAllByText('Hollowbrook Teaching Garden').length).toBeGreaterThan(0);
    expect(screen.getByText('Mara Quill')).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Today' }).getAttribute('aria-current')).toBe('page');
    expect(screen.getByRole('heading', { name: 'About this garden' })).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Change garden settings' })).toBeTruthy();
    expect(screen.getByText('Northern hemisphere: seasons run January–December.')).toBeTruthy();
  });

  it('when the grower picks another garden, then the same page opens for it with their role in words', async () => {
    server.use(signedInAs(grower), ...memberOf([north, south]));
    const { user, router } = renderApp('/g/1/settings');

    const switcher = await screen.findByRole('combobox', { name: 'Garden' });
    expect(await within(switcher).findByRole('option', { name: 'Wattle Creek School Garden (Viewer)' })).toBeTruthy();
    await user.selectOptions(switcher, '2');

    expect(await screen.findByText('Only the garden’s owner can change these settings.')).toBeTruthy();
    expect(router.state.location.pathname).toBe('/g/2/settings');
  });

  it('when a southern garden is shown, then its season and figures carry words and units', async () => {
    server.use(signedInAs(grower), ...memberOf([north, south]), quietToday);
    renderApp('/g/2');

    expect(await screen.findByText('Southern hemisphere: seasons run July–June.')).toBeTruthy();
    expect(screen.getByText('37.81° S, 144.96° E')).toBeTruthy();
    expect(screen.getByText('31 m')).toBeTruthy();
    expect(screen.getByText('°C (Celsius)')).toBeTruthy();
    expect(screen.getByText('Viewer')).toBeTruthy();
    expect(screen.queryByRole('link', { name: 'Change garden settings' })).toBeNull();
  });

  it('when the grower last opened another garden, then / opens that one again', async () => {
    server.use(signedInAs(grower), ...memberOf([north, south]), quietToday);
    const first = renderApp('/g/2');
    await screen.findByText('Southern hemisphere: seasons run July–June.');
    first.unmount();

    const { router } = renderApp('/');

    await screen.findByText('Southern hemisphere: seasons run July–June.');
    expect(router.state.location.pathname).toBe('/g/2');
  });

  it('when the last-opened garden is no longer one of mine, then / opens the first garden', async () => {
    server.use(signedInAs(grower), ...memberOf([north, south]), quietToday);
    const first = renderApp('/g/2');
    await screen.findByText('Southern hemisphere: seasons run July–June.');
    first.unmount();
    server.use(...memberOf([north]));

    const { router } = renderApp('/');

    await screen.findByText('Northern hemisphere: seasons run January–December.');
    expect(router.state.location.pathname).toBe('/g/1');
  });

  it('when another person signs in on the same browser, then their own first garden opens, not the last one of someone else', async () => {
    server.use(signedInAs(grower), ...memberOf([north, south]), quietToday);
    const first = renderApp('/g/2');
    await screen.findByText('Southern hemisphere: seasons run July–June.');
    first.unmount();
    server.use(signedInAs({ id: 8, email: 'ivo@example.org', name: 'Ivo Marsh' }));

    const { router } = renderApp('/');

    await screen.findByText('Northern hemisphere: seasons run January–December.');
    expect(router.state.location.pathname).toBe('/g/1');
  });

  it('when the garden is not one of mine, then a not-found page says so inside the shell', async () => {
    server.use(signedInAs(grower), ...memberOf([north]));
    renderApp('/g/99');

    expect(await screen.findByRole('heading', { name: 'Garden not found' })).toBeTruthy();
    expect(screen.getByRole('combobox', { name: 'Garden' })).toBeTruthy();
  });

  it('when the address is unknown, then the not-found page offers a way home', async () => {
    renderApp('/compost-heap');

    expect(await screen.findByRole('heading', { name: 'Page not found' })).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Go to your gardens' }).getAttribute('href')).toBe('/');
  });

  it('when the grower signs out, then the session ends on the server and the sign-in page opens', async () => {
    server.use(
      signedInAs(grower),
      ...memberOf([north]),
      quietToday,
      http.post('/api/auth/logout', () => new HttpResponse(null, { status: 204 })),
    );
    const { user, router } = renderApp('/g/1');

    await user.click(await screen.findByRole('button', { name: 'Sign out' }));

    expect(await screen.findByRole('heading', { name: 'Sign in' })).toBeTruthy();
    expect(router.state.location.pathname).toBe('/sign-in');
    const logout = seen.find((r) => r.path === '/api/auth/logout');
    expect(logout?.headers.get('x-requested-with')).toBe('heatclock');
    expect(logout?.headers.get('content-type')).toBeNull();
  });

  it('when the session expires mid-visit, then the grower is sent to sign in and back', async () => {
    server.use(
      signedInAs(grower),
      http.get('/api/gardens', () =>
        HttpResponse.json({ error: { code: 'unauthenticated', message: 'Please sign in.' } }, { status: 401 }),
      ),
    );
    const { router } = renderApp('/');

    expect(await screen.findByRole('heading', { name: 'Sign in' })).toBeTruthy();
    expect(router.state.location.pathname).toBe('/sign-in');
  });
});
