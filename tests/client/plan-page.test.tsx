// @vitest-environment jsdom
import { describe, expect, it } from 'vitest';
import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { http, HttpResponse } from 'msw';
import type { PlanDto } from '#shared/schemas/plan';
import type { VarietyDto } from '#shared/schemas/varieties';
import { seen, server, setupClientTests } from './helpers/msw-server';
import { aGarden, grower } from './helpers/data';
import { memberOf, renderApp, signedInAs } from './helpers/render-app';
import { CLIENT_WAIT_MS } from './helpers/waits';
import { formatDayMonth } from '@/lib/format';

setupClientTests();

// An invented variety, in the spirit of the demo garden.
const variety = {
  id: 7,
  crop: { key: 'lettuce', name: 'Lettuce', season: 'cool' },
  name: 'Copperleaf Butterhead',
  dtmDays: 55,
  dtmFrom: 'sowing',
  emergenceDaysMin: 4,
  emergenceDaysMax: 8,
  boltTolerance: 4,
  heatTolerance: 2,
  traits: [],
  containerFriendly: false,
  sunHours: 6,
  waterCmPerWeek: 2.54,
  sowDepthCm: 1.27,
  spacingCm: 30.48,
  thinSpacingCm: null,
  gddTargetOverrideC: null,
  gddTargetBasis: null,
  notes: '',
  guidance: [],
  gddTarget: { valueC: 600, basis: 'derived', countsFrom: 'sowing', explanation: '55 days from sowing.', p10C: 560, p90C: 650, stale: false },
} as unknown as VarietyDto;

function aPlan(frostRisk: PlanDto['frostRisk']): PlanDto {
  return {
    variety: { id: 7, name: 'Copperleaf Butterhead', cropName: 'Lettuce' },
    season: { label: '2027', from: '2027-01-01', to: '2027-12-31' },
    frostRisk,
    startKind: 'sowing',
    tender: false,
    frost: { lastSpring: '2027-04-01', firstFall: '2027-10-29', seasons: 12 },
    candidates: [
      { sowOn: '2027-03-05', harvest: { p10: '2027-05-20', p50: '2027-05-24', p90: '2027-05-30' }, boltHighShare: 0, frostOk: true, years: 12, recommended: true, reason: 'Sown 5 Mar: ready 20–30 May in 12 past years; high bolt risk at harvest in 0 of 12 past years.' },
      { sowOn: '2027-07-02', harvest: { p10: '2027-08-01', p50: '2027-08-04', p90: '2027-08-08' }, boltHighShare: 0.75, frostOk: true, years: 12, recommended: false, reason: 'Sown 2 Jul: ready 1–8 Aug in 12 past years, but high bolt risk while ready to pick in 9 of 12 past years.' },
    ],
    windows: [
      { from: '2027-02-19', to: '2027-05-07', name: 'Spring window', reason: 'Sow 19 Feb – 7 May to pick from about 28 May – 14 Jun: no high bolt risk at harvest in past years.' },
      { from: '2027-07-16', to: '2027-08-27', name: 'Autumn window', reason: 'Sow 16 Jul – 27 Aug to pick from about 13 Aug – 14 Oct.' },
    ],
    excluded: [{ from: '2027-05-14', to: '2027-07-09', name: 'late spring to midsummer', reason: 'Late spring to midsummer (14 May – 9 Jul): high bolt risk while ready to pick in 9 of 12 past years.' }],
    succession: { everyDays: 14, from: '2027-02-19', to: '2027-04-30', words: 'For a steady harvest, sow every 14 days from 19 Feb to 30 Apr (6 sowings).' },
    summary: 'Spring window: sow 19 Feb – 7 May. Autumn window: sow 16 Jul – 27 Aug.',
    method: 'One start day every 7 days.',
  };
}

describe('plan page', () => {
  it('when a variety is planned, then the windows are named in words, the table repeats the chart, and the frost risk choice changes the query', async () => {
    server.use(
      signedInAs(grower),
      ...memberOf([aGarden({ role: 'viewer' })]),
      http.get('/api/gardens/1/varieties', () => HttpResponse.json({ items: [variety], page: 1, pageSize: 200, total: 1 })),
      http.get('/api/gardens/1/plan', ({ request }) => HttpResponse.json(aPlan((new URL(request.url).searchParams.get('frostRisk') ?? '50') as PlanDto['frostRisk']))),
    );
    renderApp('/g/1/plan');

    expect(await screen.findByText('Spring window', {}, { timeout: CLIENT_WAIT_MS })).toBeTruthy();
    expect(screen.getByText('Autumn window')).toBeTruthy();
    expect(screen.getByText(/Late spring to midsummer \(14 May – 9 Jul\): high bolt risk/)).toBeTruthy();
    expect(screen.getByText(/^For a steady harvest, sow every 14 days/)).toBeTruthy();
    const table = screen.getByRole('table');
    expect(within(table).getAllByRole('row')).toHaveLength(3);
    expect(within(table).getByText('9 of 12 years')).toBeTruthy();
    expect(screen.getByText(`At this frost risk: last spring frost ${formatDayMonth('2027-04-01')}, first autumn frost ${formatDayMonth('2027-10-29')} (from 12 past seasons).`)).toBeTruthy();
    expect(within(table).getByText(/^no: Sown 2 Jul/)).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Plan' }).getAttribute('aria-current')).toBe('page');
    await screen.findByRole('figure', { name: /Start days of 2027/ }, { timeout: CLIENT_WAIT_MS });

    const plans = () => seen.filter((r) => r.path === '/api/gardens/1/plan');
    expect(plans().at(-1)!.query.get('frostRisk')).toBe('50');
    expect(plans().at(-1)!.query.get('varietyId')).toBe('7');
    fireEvent.click(screen.getByRole('radio', { name: /1 year in 10/ }));
    await waitFor(() => expect(plans().at(-1)!.query.get('frostRisk')).toBe('10'));
    expect(screen.getByRole('radio', { name: /1 year in 10/ })).toHaveProperty('checked', true);
  });

  it('when a second variety is chosen, then both plans are shown side by side, each under its own name', async () => {
    const other = { ...variety, id: 8, name: 'Tealshield', crop: { ...variety.crop, key: 'spinach', name: 'Spinach' } } as typeof variety;
    server.use(
      signedInAs(grower),
      ...memberOf([aGarden({ role: 'viewer' })]),
      http.get('/api/gardens/1/varieties', () => HttpResponse.json({ items: [variety, other], page: 1, pageSize: 200, total: 2 })),
      http.get('/api/gardens/1/plan', ({ request }) => {
        const id = Number(new URL(request.url).searchParams.get('varietyId'));
        const plan = aPlan('50');
        return HttpResponse.json(id === 8 ? { ...plan, variety: { id: 8, name: 'Tealshield', cropName: 'Spinach' } } : plan);
      }),
    );
    renderApp('/g/1/plan');
    await screen.findByRole('heading', { name: 'When to sow Copperleaf Butterhead, 2027' }, { timeout: CLIENT_WAIT_MS });
    const withSelect = screen.getByRole('combobox', { name: 'Side by side with' });
    // The second list leaves out the variety already planned.
    expect(within(withSelect).getAllByRole('option').map((o) => o.textContent)).toEqual(['No second variety', 'Tealshield (Spinach)']);
    fireEvent.change(withSelect, { target: { value: '8' } });
    await screen.findByRole('heading', { name: 'When to sow Tealshield, 2027' }, { timeout: CLIENT_WAIT_MS });
    expect(screen.getByRole('heading', { name: 'When to sow Copperleaf Butterhead, 2027' })).toBeTruthy();
    const plans = seen.filter((r) => r.path === '/api/gardens/1/plan').map((r) => r.query.get('varietyId'));
    expect(new Set(plans)).toEqual(new Set(['7', '8']));
    fireEvent.change(withSelect, { target: { value: '' } });
    await waitFor(() => expect(screen.queryByRole('heading', { name: 'When to sow Tealshield, 2027' })).toBeNull());
  });
});
