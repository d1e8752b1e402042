// @vitest-environment jsdom
import { describe, expect, it } from 'vitest';
import { screen, waitFor, within } from '@testing-library/react';
import { http, HttpResponse } from 'msw';
import type { ProgressDto } from '#shared/schemas/progress';
import { seen, server, setupClientTests, useBrowserLanguages } from './helpers/msw-server';
import { aCelsiusProgress, aGarden, aPlanting, aProgress, grower } from './helpers/data';
import { memberOf, renderApp, signedInAs } from './helpers/render-app';

setupClientTests();
useBrowserLanguages(['en-GB']);

const north = aGarden();
const south = aGarden({ id: 2, name: 'Wattle Creek School Garden', timeZone: 'Australia/Melbourne', units: 'C', hemisphere: 'S', latitude: -37.81, longitude: 144.96 });
const page = { items: [], page: 1, pageSize: 200, total: 0 };

function plantingWith(progress: ProgressDto | (() => Response), gardenId = 1, plantingId = 5) {
  const base = `/api/gardens/${gardenId}/plantings/${plantingId}`;
  return [
    signedInAs(grower),
    ...memberOf([north, south]),
    http.get(base, () => HttpResponse.json({ planting: aPlanting({ id: plantingId, nextEvent: { label: 'First harvest', on: '2025-06-18', basis: 'Calendar days from the packet; the degree-day projection will refine it.' } }) })),
    http.get(`${base}/progress`, typeof progress === 'function' ? progress : () => HttpResponse.json(progress)),
    http.get(`${base}/log`, () => HttpResponse.json(page)),
    http.get(`${base}/photos`, () => HttpResponse.json({ photos: [] })),
  ];
}

const findWords = () => screen.findByRole('region', { name: 'In words' });
const fact = (term: string) => screen.getByText(term, { selector: 'dt' }).nextElementSibling as HTMLElement;

describe('planting progress', () => {
  it('when a °F planting is opened, then the summary gives every figure with °F-days and the window in words', async () => {
    server.use(...plantingWith(aProgress()));
    renderApp('/g/1/plantings/5');

    const words = await findWords();
    expect(within(words).getByText('412 of 950 °F-days (43 %); likely ready 14–22 June; bolt risk high from 9 June.')).toBeTruthy();
    expect(fact('Heat so far').textContent).toBe('412 of 950 °F-days (43 %), counted from sowing on 1 May');
    expect(fact('Target').textContent).toBe('950 °F-days. From the packet’s 55 days to maturity over this garden’s past seasons.');
    expect(within(fact('Ready')).getByText('Likely ready 14–22 Jun (middle estimate 18 Jun)')).toBeTruthy();
    expect(within(fact('Ready')).getByText('32 recorded days and 11 forecast days, then 10 past seasons of this garden.')).toBeTruthy();
    expect(fact('Packet date').textContent).toBe('12 Jun');
    expect(within(fact('Bolt risk')).getByText(/Elevated, high from 9 Jun/)).toBeTruthy();
    expect(within(fact('Bolt risk')).getAllByRole('listitem').map((li) => li.textContent)).toEqual([
      '4 days above 80.0 °F in a row are forecast.',
      'Days are longer than 14 h 30 min.',
    ]);
    expect(fact('Stress in the forecast').textContent).toBe('Blossom drop, watch 10–11 Jun (forecast): Heat above 90.0 °F is forecast. (high 91.4 °F; threshold 90.0 °F)');
    expect(words.textContent).not.toMatch(/°C/);
  });

  it('when a °F planting is opened, then the chart has its bolt-risk strip in words and a day-by-day table with units', async () => {
    server.use(...plantingWith(aProgress()));
    renderApp('/g/1/plantings/5');

    expect(await screen.findByText('Bolt risk high from 9 Jun')).toBeTruthy();
    const strip = screen.getByRole('list', { name: 'Bolt risk by day' });
    expect(within(strip).getAllByRole('listitem').map((li) => li.textContent)).toEqual([
      'Low: 1–25 May',
      // The browser's own range form, with thin spaces around the dash.
      'Elevated: 26 May\u2009–\u20091 Jun',
      'Elevated: 2–8 Jun (forecast)',
      'High: 9–12 Jun (forecast)',
    ]);
    const legend = screen.getByRole('list', { name: 'Bolt-risk levels' });
    expect(within(legend).getAllByRole('listitem').map((li) => li.textContent)).toEqual(['Low', 'Elevated', 'High', 'Striped: forecast']);
    const table = screen.getByRole('table', { name: 'Day by day: temperatures in °F, degree days in °F-days' });
    const today = within(table).getByRole('row', { name: /^Mon 2 Jun \(today\)/ });
    expect(today.getAttribute('aria-current')).toBe('date');
    expect(within(today).getByText('16.0 °F-days')).toBeTruthy();
    expect(within(today).getByText('428 °F-days')).toBeTruthy();
    expect(within(today).getByText('Elevated (forecast)')).toBeTruthy();
    const projected = within(table).getByRole('row', { name: /^Sat 14 Jun/ });
    expect(within(projected).getByText('604 °F-days – 615 °F-days (609 °F-days)')).toBeTruthy();
    expect(screen.queryByText(/Calendar days from the packet/)).toBeNull();
  });

  it('when a °C planting is opened, then every figure is in °C and °C-days, with the gaps and frost in words', async () => {
    server.use(...plantingWith(aCelsiusProgress(), 2, 8));
    renderApp('/g/2/plantings/8');

    const words = await findWords();
    expect(fact('Heat so far').textContent).toBe('234 of 520 °C-days (45 %), counted from sowing on 20 Jul');
    expect(within(fact('Ready')).getByText('Likely ready 3–11 Oct (middle estimate 7 Oct)')).toBeTruthy();
    expect(within(fact('Ready')).getByText('10 % of past seasons did not reach the target within a year.')).toBeTruthy();
    expect(fact('Packet date').textContent).toBe('5 Oct');
    expect(fact('Target').textContent).toBe('520 °C-days. Calibrated from 3 harvests of this variety in this garden.');
    expect(within(fact('Bolt risk')).getByText('Low')).toBeTruthy();
    expect(fact('Stress in the forecast').textContent).toBe('Frost, light 1 Sept (forecast): A light frost is forecast. (low −1.5 °C; threshold 0.0 °C)');
    expect(fact('Days without readings').textContent).toMatch(/^1 since the start \(12 Aug\)/);
    expect(screen.getByText('No high bolt risk through 1 Sept')).toBeTruthy();
    expect(screen.getByRole('table', { name: 'Day by day: temperatures in °C, degree days in °C-days' })).toBeTruthy();
    expect(words.textContent).not.toMatch(/°F/);
  });

  it('when the planting has no target, then the heat stands alone and the note says why', async () => {
    const noTarget = aProgress({
      target: null,
      percent: null,
      targetBasis: null,
      targetNote: 'The packet gives no days to maturity and this garden has no past seasons yet.',
      maturity: { p10: null, p50: null, p90: null, basis: { kind: 'none', observedDays: 32, forecastDays: 11, analogYears: 0, neverMatureShare: 0, note: 'Without a target there is no window.' } },
      projection: [],
    });
    server.use(...plantingWith(noTarget));
    renderApp('/g/1/plantings/5');

    await findWords();
    expect(fact('Heat so far').textContent).toBe('412 °F-days, counted from sowing on 1 May');
    expect(fact('Target').textContent).toBe('No degree-day target. The packet gives no days to maturity and this garden has no past seasons yet.');
    expect(within(fact('Ready')).getByText('No maturity window yet')).toBeTruthy();
    expect(within(fact('Ready')).getByText('Without a target there is no window.')).toBeTruthy();
  });

  it('when a harvest is on record, then the window gives way to the record', async () => {
    const harvested = aProgress({
      status: 'harvested',
      maturity: { p10: '2025-06-16', p50: '2025-06-16', p90: '2025-06-16', basis: { kind: 'recorded', observedDays: 46, forecastDays: 0, analogYears: 0, neverMatureShare: 0, note: 'The first harvest is on record.' } },
      recorded: { firstHarvestOn: '2025-06-16', boltedOn: null },
      projection: [],
    });
    server.use(...plantingWith(harvested));
    renderApp('/g/1/plantings/5');

    await findWords();
    expect(within(fact('Ready')).getByText('First harvest on record 16 Jun')).toBeTruthy();
  });

  it('when progress cannot be loaded, then it says so and Try again asks once more', async () => {
    let calls = 0;
    server.use(
      ...plantingWith(() =>
        ++calls === 1
          ? HttpResponse.json({ error: { code: 'internal', message: 'The server could not work out the progress.' } }, { status: 500 })
          : HttpResponse.json(aProgress()),
      ),
    );
    const { user } = renderApp('/g/1/plantings/5');

    const alert = await screen.findByRole('alert');
    expect(within(alert).getByText('Progress could not be loaded — try again')).toBeTruthy();
    await user.click(screen.getByRole('button', { name: 'Try again' }));

    expect(await findWords()).toBeTruthy();
    expect(seen.filter((r) => r.path === '/api/gardens/1/plantings/5/progress')).toHaveLength(2);
  });

  it('when a log entry is added, then the progress is asked for again', async () => {
    server.use(
      ...plantingWith(aProgress()),
      http.post('/api/gardens/1/plantings/5/log', () =>
        HttpResponse.json({ entry: { id: 1, entryOn: '2025-06-02', kind: 'harvest', amount: null, amountUnit: null, note: '', photoId: null, by: 'Mara Quill', createdAt: '2025-06-02T08:00:00.000Z' }, planting: aPlanting() }),
      ),
    );
    const { user } = renderApp('/g/1/plantings/5');
    await findWords();

    await user.click(screen.getByRole('button', { name: 'Harvest' }));
    await user.click(screen.getByRole('button', { name: 'Save “Harvest”' }));

    await waitFor(() => expect(seen.filter((r) => r.path === '/api/gardens/1/plantings/5/progress')).toHaveLength(2));
  });
});
