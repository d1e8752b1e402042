// @vitest-environment jsdom
import { describe, expect, it } from 'vitest';
import { screen, within } from '@testing-library/react';
import { http, HttpResponse } from 'msw';
import { seen, server, setupClientTests, useBrowserLanguages } from './helpers/msw-server';
import { aGarden, anAlert, aToday, grower } from './helpers/data';
import { memberOf, renderApp, signedInAs } from './helpers/render-app';

setupClientTests();
useBrowserLanguages(['en-GB']);

const openBolt = anAlert();

function gardenWithAlerts(openCount: number, garden = aGarden()) {
  // Before the garden's own handlers, which may answer alerts with none.
  return [
    http.get('/api/gardens/1/alerts/counts', () => HttpResponse.json({ open: openCount, byType: { 'bolt-risk': openCount } })),
    http.get('/api/gardens/1/alerts', () => HttpResponse.json({ items: [openBolt] })),
    http.get('/api/gardens/1/today', () => HttpResponse.json(aToday())),
    signedInAs(grower),
    ...memberOf([garden]),
  ];
}

describe('alerts in the garden navigation and on Today', () => {
  it('when the garden has open alerts, then the navigation shows their number beside Alerts and reads it out', async () => {
    server.use(...gardenWithAlerts(3));
    renderApp('/g/1');

    const nav = await screen.findByRole('navigation', { name: 'Garden' });
    const link = await within(nav).findByRole('link', { name: 'Alerts, 3 open' });
    expect(link.getAttribute('href')).toBe('/g/1/alerts');
    expect(within(link).getByText('3')).toBeTruthy();
  });

  it('when an alert is open, then Today shows it first in full with its caution, and its action is not listed twice', async () => {
    server.use(...gardenWithAlerts(1));
    renderApp('/g/1');

    const attention = await screen.findByRole('region', { name: 'Needs attention' });
    const alert = await within(attention).findByRole('article', { name: 'Bolt risk high from 9 Jun' });
    expect(within(alert).getByText('Bolt risk')).toBeTruthy();
    expect(within(alert).getByText('Warning').textContent).toBe('Severity: Warning');
    expect(within(alert).getByText('4 days ≥ 80 °F forecast 9–12 Jun')).toBeTruthy();
    expect(within(alert).getByText(/^Working outdoors in the heat/).textContent).toBe('Take care: Working outdoors in the heat: drink water often and rest in the shade.');
    expect(within(alert).getByRole('button', { name: 'Acknowledge: Bolt risk high from 9 Jun' })).toBeTruthy();
    // The bolt-high action is made from alert 42, shown above; the radish's open window is not an alert here.
    expect(within(attention).queryByRole('heading', { name: 'Lettuce: Copperleaf Butterhead may bolt' })).toBeNull();
    const headings = within(attention).getAllByRole('heading', { level: 3 }).map((h) => h.textContent);
    expect(headings).toEqual(['Bolt risk high from 9 Jun', 'Radish: Ember Globe is ready to pull']);
    expect(seen.find((r) => r.path === '/api/gardens/1/alerts')?.query.toString()).toBe('status=open&limit=30');
  });

  it('when a viewer opens Today, then the open alert is shown without an Acknowledge button', async () => {
    server.use(...gardenWithAlerts(1, aGarden({ role: 'viewer' })));
    renderApp('/g/1');

    expect(await screen.findByRole('article', { name: 'Bolt risk high from 9 Jun' })).toBeTruthy();
    expect(screen.queryByRole('button', { name: /Acknowledge/ })).toBeNull();
  });

  it('when the alerts cannot be loaded, then Today says so and still lists every action', async () => {
    server.use(
      http.get('/api/gardens/1/alerts', () => HttpResponse.json({ error: { code: 'internal', message: 'Something broke.' } }, { status: 500 })),
      ...gardenWithAlerts(1),
    );
    renderApp('/g/1');

    const attention = await screen.findByRole('region', { name: 'Needs attention' });
    expect(within(await within(attention).findByRole('alert')).getByText('Alerts could not be loaded — try again')).toBeTruthy();
    expect(within(attention).getByRole('heading', { name: 'Lettuce: Copperleaf Butterhead may bolt' })).toBeTruthy();
    expect(within(attention).getByRole('heading', { name: 'Radish: Ember Globe is ready to pull' })).toBeTruthy();
  });
});
