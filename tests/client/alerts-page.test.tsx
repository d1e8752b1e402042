// @vitest-environment jsdom
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { screen, waitFor, within } from '@testing-library/react';
import { http, HttpResponse } from 'msw';
import type { AlertDto } from '#shared/schemas/alerts';
import type { GardenDto } from '#shared/schemas/gardens';
import { seen, server, setupClientTests, useBrowserLanguages } from './helpers/msw-server';
import { aGarden, anAlert, grower } from './helpers/data';
import { memberOf, renderApp, signedInAs } from './helpers/render-app';

setupClientTests();
useBrowserLanguages(['en-GB']);

// Only Date is faked, so "this year" is 2025 and the alerts' dates read without a year.
beforeEach(() => {
  vi.useFakeTimers({ toFake: ['Date'] });
  vi.setSystemTime(new Date('2025-06-03T12:00:00Z'));
});
afterEach(() => vi.useRealTimers());

const openBolt = anAlert();
const seenHeat = anAlert({
  id: 43,
  type: 'heat-stress',
  severity: 'watch',
  status: 'acknowledged',
  plantingId: 12,
  subject: 'Tomato: Sunmark Plum (South 2)',
  title: 'Heat above 90 °F may drop blossoms',
  reasons: ['2 days ≥ 90 °F forecast 10–11 Jun'],
  action: 'Water deeply in the morning and shade the plants in the afternoon.',
  acknowledgedAt: '2025-06-02T14:00:00.000Z',
  acknowledgedBy: 'Ivo Brandt',
});
// Resolved at 02:00 UTC on 5 June, which is still 4 June in the garden's New York time.
const pastFrost = anAlert({
  id: 40,
  type: 'frost',
  severity: 'severe',
  status: 'resolved',
  plantingId: null,
  subject: 'Hollowbrook Teaching Garden',
  title: 'Hard frost forecast',
  startsOn: '2025-05-21',
  endsOn: '2025-05-21',
  reasons: ['Low of 27.0 °F forecast 21 May'],
  action: 'Cover tender plantings before dusk.',
  caution: 'Frost-protection heaters: keep fuel away from covers and follow the maker’s label and local codes.',
  createdAt: '2025-05-19T10:00:00.000Z',
  acknowledgedAt: '2025-05-20T09:00:00.000Z',
  acknowledgedBy: 'Mara Quill',
  resolvedAt: '2025-06-05T02:00:00.000Z',
});

/** The alerts API over a list it changes as alerts are acknowledged; open first, like the server. */
function alertsApi(items: AlertDto[], garden: GardenDto = aGarden()) {
  let alerts = [...items];
  const rank = { open: 0, acknowledged: 1, resolved: 2 } as const;
  // Before the garden's own handlers, which may answer alerts with none.
  return [
    http.get('/api/gardens/1/alerts/counts', () => HttpResponse.json({ open: alerts.filter((a) => a.status === 'open').length, byType: {} })),
    http.get('/api/gardens/1/alerts', ({ request }) => {
      const query = new URL(request.url).searchParams;
      const matching = alerts.filter((a) => (!query.get('status') || a.status === query.get('status')) && (!query.get('type') || a.type === query.get('type')));
      return HttpResponse.json({ items: matching.sort((a, b) => rank[a.status] - rank[b.status]) });
    }),
    http.post('/api/gardens/1/alerts/:alertId/acknowledge', ({ params }) => {
      const alert: AlertDto = { ...alerts.find((a) => String(a.id) === params.alertId)!, status: 'acknowledged', acknowledgedAt: '2025-06-03T12:00:00.000Z', acknowledgedBy: grower.name };
      alerts = alerts.map((a) => (a.id === alert.id ? alert : a));
      return HttpResponse.json({ alert });
    }),
    signedInAs(grower),
    ...memberOf([garden]),
  ];
}

const section = (name: RegExp) => screen.getByRole('region', { name });
const card = (title: string) => screen.getByRole('article', { name: title });

describe('Alerts page', () => {
  it('when the garden has alerts, then open ones come first with type, severity, reasons and what to do, then acknowledged, then history with dates in words', async () => {
    server.use(...alertsApi([pastFrost, openBolt, seenHeat]));
    renderApp('/g/1/alerts');

    expect(await screen.findByRole('heading', { name: 'Bolt risk high from 9 Jun' })).toBeTruthy();
    expect(screen.getAllByRole('heading', { level: 2 }).map((h) => h.textContent)).toEqual(['Open (1)', 'Acknowledged (1)', 'History (1)']);

    const bolt = within(section(/^Open/)).getByRole('article');
    expect(within(bolt).getByText('Bolt risk')).toBeTruthy();
    expect(within(bolt).getByText('Warning').textContent).toBe('Severity: Warning');
    expect(within(bolt).getByRole('link', { name: 'Lettuce: Copperleaf Butterhead (North 1)' }).getAttribute('href')).toBe('/g/1/plantings/5');
    expect(within(bolt).getAllByRole('listitem').map((li) => li.textContent)).toEqual(['4 days ≥ 80 °F forecast 9–12 Jun', 'Day length 15.1 h']);
    expect(within(bolt).getByText('Harvest early or shade the bed, and keep it watered.').textContent).toBe('What to do: Harvest early or shade the bed, and keep it watered.');
    expect(within(bolt).getByText(/^Working outdoors in the heat/).textContent).toBe('Take care: Working outdoors in the heat: drink water often and rest in the shade.');
    expect(within(bolt).getByText('For 9–12 Jun · Raised 2 Jun')).toBeTruthy();

    const heat = within(section(/^Acknowledged/)).getByRole('article');
    expect(within(heat).getByText('Heat stress')).toBeTruthy();
    expect(within(heat).getByText('Watch').textContent).toBe('Severity: Watch');
    expect(within(heat).getByText('For 9–12 Jun · Raised 2 Jun · Acknowledged 2 Jun by Ivo Brandt')).toBeTruthy();
    expect(within(heat).queryByRole('button', { name: /Acknowledge/ })).toBeNull();

    const frost = within(section(/^History/)).getByRole('article');
    expect(within(frost).getByText('Frost')).toBeTruthy();
    expect(within(frost).getByText('Severe').textContent).toBe('Severity: Severe');
    expect(within(frost).getByText('Hollowbrook Teaching Garden')).toBeTruthy();
    expect(within(frost).queryByRole('link')).toBeNull();
    expect(within(frost).getByText('On 21 May · Raised 19 May · Acknowledged 20 May by Mara Quill · Resolved 4 Jun')).toBeTruthy();
  });

  it('when the grower picks a type, then the list is asked for with ?type= and the address keeps the filter', async () => {
    server.use(...alertsApi([pastFrost, openBolt, seenHeat]));
    const { user, router } = renderApp('/g/1/alerts?status=resolved');

    expect(await screen.findByRole('heading', { name: 'Hard frost forecast' })).toBeTruthy();
    expect(screen.getAllByRole('heading', { level: 2 }).map((h) => h.textContent)).toEqual(['History (1)']);
    expect(seen.find((r) => r.path === '/api/gardens/1/alerts')?.query.toString()).toBe('status=resolved');

    await user.selectOptions(screen.getByRole('combobox', { name: 'Status' }), '');
    await user.selectOptions(screen.getByRole('combobox', { name: 'Type' }), 'frost');

    await waitFor(() => expect(router.state.location.search).toBe('?type=frost'));
    await waitFor(() => expect(seen.some((r) => r.path === '/api/gardens/1/alerts' && r.query.toString() === 'type=frost')).toBe(true));
    expect(await screen.findByText('No open alerts.')).toBeTruthy();
    expect(within(section(/^History/)).getByRole('heading', { name: 'Hard frost forecast' })).toBeTruthy();
    expect(screen.queryByRole('heading', { name: 'Bolt risk high from 9 Jun' })).toBeNull();
  });

  it('when a grower acknowledges an open alert, then it is posted once and the alert moves to Acknowledged with who and when', async () => {
    server.use(...alertsApi([openBolt, seenHeat]));
    const { user } = renderApp('/g/1/alerts');

    await user.click(await within(await screen.findByRole('article', { name: 'Bolt risk high from 9 Jun' })).findByRole('button', { name: 'Acknowledge: Bolt risk high from 9 Jun' }));

    expect(await within(section(/^Open/)).findByText('No open alerts.')).toBeTruthy();
    const moved = within(section(/^Acknowledged/)).getByRole('article', { name: 'Bolt risk high from 9 Jun' });
    expect(within(moved).getByText(/Acknowledged 3 Jun by Mara Quill/)).toBeTruthy();
    const posts = seen.filter((r) => r.method === 'POST');
    expect(posts.map((r) => r.path)).toEqual(['/api/gardens/1/alerts/42/acknowledge']);
    expect(posts[0].headers.get('X-Requested-With')).toBe('heatclock');
    expect(await screen.findByRole('link', { name: 'Alerts' })).toBeTruthy();
  });

  it('when a viewer opens the page, then every alert is readable and none can be acknowledged', async () => {
    server.use(...alertsApi([openBolt, seenHeat], aGarden({ role: 'viewer' })));
    renderApp('/g/1/alerts');

    expect(await screen.findByRole('heading', { name: 'Bolt risk high from 9 Jun' })).toBeTruthy();
    expect(card('Bolt risk high from 9 Jun')).toBeTruthy();
    expect(screen.getByText('Viewers see every alert; growers and owners acknowledge them.')).toBeTruthy();
    expect(screen.queryByRole('button', { name: /Acknowledge/ })).toBeNull();
  });

  it('when the garden has no alerts, then the page says so in words', async () => {
    server.use(...alertsApi([]));
    renderApp('/g/1/alerts');

    expect(await screen.findByText('No alerts yet. One is raised when the forecast or a planting’s progress calls for action.')).toBeTruthy();
  });

  it('when the alerts cannot be loaded, then the page says so with a way to try again', async () => {
    let calls = 0;
    // The first handler given wins, so the failing one goes before the working API.
    server.use(
      http.get('/api/gardens/1/alerts', () =>
        ++calls === 1 ? HttpResponse.json({ error: { code: 'internal', message: 'Something broke.' } }, { status: 500 }) : HttpResponse.json({ items: [openBolt] }),
      ),
      ...alertsApi([openBolt]),
    );
    const { user } = renderApp('/g/1/alerts');

    expect(within(await screen.findByRole('alert')).getByText('Alerts could not be loaded — try again')).toBeTruthy();
    await user.click(screen.getByRole('button', { name: 'Try again' }));

    expect(await screen.findByRole('heading', { name: 'Bolt risk high from 9 Jun' })).toBeTruthy();
  });
});
