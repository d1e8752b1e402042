// @vitest-environment jsdom
import { describe, expect, it } from 'vitest';
import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { delay, http, HttpResponse } from 'msw';
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

  it('when a garden opens, then its navigation lists Today, Plantings and Alerts first and the switcher carries the full name', async () => {
    server.use(signedInAs(grower), ...memberOf([north, south]), quietToday);
    renderApp('/g/1');

    await screen.findByRole('heading', { name: 'Today', level: 1 });
    const nav = screen.getByRole('navigation', { name: 'Garden' });
    const pages = within(nav).getAllByRole('link').map((link) => link.textContent);
    expect(pages.slice(0, 3)).toEqual(['Today', 'Plantings', 'Alerts']);
    expect(pages).toEqual(expect.arrayContaining(['Varieties', 'Seed lots', 'Beds', 'Crops', 'Weather', 'Garden settings']));
    const switcher = screen.getByRole('combobox', { name: 'Garden' });
    await waitFor(() => expect(switcher.getAttribute('title')).toBe('Hollowbrook Teaching Garden (Owner)'));
    expect(screen.getByRole('link', { name: 'Skip to main content' }).getAttribute('href')).toBe('#main');
  });

  it('when the grower opens More, then it offers the other pages and the account, and Escape closes it back onto the button', async () => {
    server.use(signedInAs(grower), ...memberOf([north]), quietToday);
    const { user } = renderApp('/g/1');

    const more = await within(await screen.findByRole('navigation', { name: 'Garden' })).findByRole('button', { name: 'More' });
    expect(more.getAttribute('aria-expanded')).toBe('false');
    expect(document.getElementById(more.getAttribute('aria-controls')!)).toBeNull();
    await user.click(more);

    expect(more.getAttribute('aria-expanded')).toBe('true');
    const panel = within(document.getElementById(more.getAttribute('aria-controls')!)!);
    expect(panel.getAllByRole('link').map((link) => link.textContent)).toEqual([
      'Varieties',
      'Seed lots',
      'Beds',
      'Crops',
      'Weather',
      'Plan',
      'Compare',
      'Garden settings',
      'Members',
      // The garden in this test is the grower's own (aGarden is an owner's by default): owners see the trail.
      'Audit',
      'Account',
      'Test mailbox',
    ]);
    expect(panel.getByRole('button', { name: 'Sign out' })).toBeTruthy();
    expect(panel.getByText('Mara Quill')).toBeTruthy();

    await user.keyboard('{Escape}');
    expect(more.getAttribute('aria-expanded')).toBe('false');
    expect(document.activeElement).toBe(more);
  });

  it('when a page is chosen in More, then it opens, is marked current, and the list closes', async () => {
    server.use(signedInAs(grower), ...memberOf([north]), quietToday);
    const { user, router } = renderApp('/g/1');

    const more = await within(await screen.findByRole('navigation', { name: 'Garden' })).findByRole('button', { name: 'More' });
    await user.click(more);
    const panel = document.getElementById(more.getAttribute('aria-controls')!)!;
    await user.click(within(panel).getByRole('link', { name: 'Garden settings' }));

    expect(await screen.findByRole('heading', { name: 'Garden settings', level: 1 })).toBeTruthy();
    expect(router.state.location.pathname).toBe('/g/1/settings');
    expect(more.getAttribute('aria-expanded')).toBe('false');
    expect(screen.getByRole('link', { name: 'Garden settings' }).getAttribute('aria-current')).toBe('page');
  });

  it('when the grower taps outside the open More list, then it closes', async () => {
    server.use(signedInAs(grower), ...memberOf([north]), quietToday);
    const { user } = renderApp('/g/1');

    const more = await within(await screen.findByRole('navigation', { name: 'Garden' })).findByRole('button', { name: 'More' });
    await user.click(more);
    fireEvent.pointerDown(screen.getByRole('heading', { name: 'Today', level: 1 }));

    expect(more.getAttribute('aria-expanded')).toBe('false');
  });

  it('while the session is being checked, then the wait is shown in the page frame, not alone at the edge', async () => {
    server.use(
      http.get('/api/auth/me', async () => {
        await delay('infinite');
        return HttpResponse.json({ user: grower });
      }),
    );
    renderApp('/g/1');

    const waiting = await screen.findByRole('status');
    expect(waiting.textContent).toBe('Checking your session…');
    expect(waiting.closest('main')).toBeTruthy();
    expect(screen.getByRole('banner').textContent).toContain('Heatclock');
  });

  it('while the sign-in page checks the session, then the wait is shown in the same page frame', async () => {
    server.use(
      http.get('/api/auth/me', async () => {
        await delay('infinite');
        return HttpResponse.json({ user: null });
      }),
    );
    renderApp('/sign-in');

    const waiting = await screen.findByRole('status');
    expect(waiting.textContent).toBe('Checking your session…');
    expect(waiting.closest('main')).toBeTruthy();
    expect(screen.getByRole('banner').textContent).toContain('Heatclock');
  });
});
