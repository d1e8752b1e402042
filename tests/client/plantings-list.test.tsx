// @vitest-environment jsdom
import { describe, expect, it } from 'vitest';
import { screen, waitFor, within } from '@testing-library/react';
import { http, HttpResponse } from 'msw';
import { seen, server, setupClientTests, useBrowserLanguages } from './helpers/msw-server';
import { aGarden, aPlanting, aProgressSummary, grower } from './helpers/data';
import { memberOf, renderApp, signedInAs } from './helpers/render-app';

setupClientTests();
useBrowserLanguages(['en-GB']);

const lettuce = aPlanting({ progress: aProgressSummary(), nextEvent: { label: 'First harvest', on: '2025-06-18', basis: 'Middle estimate of the degree-day projection.' } });
const peas = aPlanting({
  id: 6,
  crop: { key: 'pea', name: 'Pea', season: 'cool' },
  variety: { id: 8, name: 'Lantern Snap', dtmDays: 60, dtmFrom: 'sowing', boltTolerance: null },
  progress: aProgressSummary({ plantingId: 6, accumulated: 300.4, target: null, percent: null, maturity: { p10: null, p50: null, p90: null, kind: 'none' }, boltLevel: 'none', boltHighFrom: null, boltReason: null }),
});
const planned = aPlanting({ id: 7, status: 'planned', sownOn: null, emergedOn: null, nextEvent: null, progress: null });

function listRequests() {
  return seen.filter((r) => r.path === '/api/gardens/1/plantings');
}

describe('plantings list', () => {
  it('when plantings have progress, then the rows show percent with °F-days, the ready window and bolt risk in words', async () => {
    server.use(
      signedInAs(grower),
      ...memberOf([aGarden()]),
      http.get('/api/gardens/1/plantings', () => HttpResponse.json({ items: [lettuce, peas, planned], page: 1, pageSize: 25, total: 3 })),
    );
    renderApp('/g/1/plantings');

    const table = await screen.findByRole('table');
    const headers = within(table).getAllByRole('columnheader').map((h) => h.textContent);
    expect(headers.slice(5)).toEqual(['Progress, sort', 'Ready, sort', 'Bolt risk, sort', 'Next event']);
    const [, first, second, third] = within(table).getAllByRole('row');
    expect(within(first).getByText('43 % · 412 of 950 °F-days')).toBeTruthy();
    expect(within(first).getByRole('progressbar', { name: 'Heat toward maturity of Lettuce: Copperleaf Butterhead' }).getAttribute('aria-valuenow')).toBe('43');
    expect(within(first).getByText('Likely ready 14–22 Jun')).toBeTruthy();
    expect(within(first).getByText('Elevated, high from 9 Jun')).toBeTruthy();
    expect(within(first).getByText('First harvest 18 Jun 2025')).toBeTruthy();
    expect(within(second).getByText('300 °F-days so far · no target')).toBeTruthy();
    expect(within(second).getByText('No maturity window yet')).toBeTruthy();
    expect(within(second).getByText('Not assessed')).toBeTruthy();
    expect(within(third).getAllByText('—')).toHaveLength(5);
  });

  it('when the Bolt risk header is chosen, then the list is asked for sort=risk, riskiest first, and again ascending', async () => {
    server.use(
      signedInAs(grower),
      ...memberOf([aGarden()]),
      http.get('/api/gardens/1/plantings', () => HttpResponse.json({ items: [lettuce], page: 1, pageSize: 25, total: 1 })),
    );
    const { user } = renderApp('/g/1/plantings');
    const table = await screen.findByRole('table');

    await user.click(within(table).getByRole('button', { name: 'Bolt risk, sort' }));

    await waitFor(() => expect(listRequests().at(-1)?.query.get('sort')).toBe('risk'));
    expect(listRequests().at(-1)?.query.get('order')).toBe('desc');
    expect(within(table).getByRole('columnheader', { name: 'Bolt risk, sorted descending' }).getAttribute('aria-sort')).toBe('descending');

    await user.click(within(table).getByRole('button', { name: 'Bolt risk, sorted descending' }));

    await waitFor(() => expect(listRequests().at(-1)?.query.get('order')).toBe('asc'));
  });

  it('when a phone sorts by Ready, then the list is asked for sort=ready, soonest first', async () => {
    server.use(
      signedInAs(grower),
      ...memberOf([aGarden()]),
      http.get('/api/gardens/1/plantings', () => HttpResponse.json({ items: [lettuce], page: 1, pageSize: 25, total: 1 })),
    );
    const { user } = renderApp('/g/1/plantings');
    await screen.findByRole('table');

    await user.selectOptions(screen.getByRole('combobox', { name: 'Sort by' }), 'ready');

    await waitFor(() => expect(listRequests().at(-1)?.query.get('sort')).toBe('ready'));
    expect(listRequests().at(-1)?.query.get('order')).toBe('asc');
  });
});

describe('plantings that need a look', () => {
  it('when a planting is overdue and nothing has been logged for weeks, then its row says both in words, not by colour', async () => {
    const overdue = aPlanting({ progress: aProgressSummary(), attention: { overdue: { due: '2025-06-22', days: 9 }, stale: { lastOn: '2025-06-01', days: 30 } } });
    server.use(
      signedInAs(grower),
      ...memberOf([aGarden()]),
      http.get('/api/gardens/1/plantings', () => HttpResponse.json({ items: [overdue], page: 1, pageSize: 25, total: 1 })),
    );
    renderApp('/g/1/plantings');
    const table = await screen.findByRole('table');
    const [, row] = within(table).getAllByRole('row');
    expect(within(row).getByText('Harvest overdue')).toBeTruthy();
    expect(within(row).getByText(': expected by 22 Jun, 9 days ago, and no harvest logged')).toBeTruthy();
    expect(within(row).getByText('Nothing logged for 4 weeks')).toBeTruthy();
  });
});
