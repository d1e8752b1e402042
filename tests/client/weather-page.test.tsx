// @vitest-environment jsdom
import { describe, expect, it } from 'vitest';
import { screen, within } from '@testing-library/react';
import { File as NodeFile } from 'node:buffer';
import { http, HttpResponse } from 'msw';
import type { JobRunDto, WeatherResponse } from '#shared/schemas/weather';
import type { Role } from '#shared/schemas/gardens';
import { seen, server, setupClientTests, useNodeFormData } from './helpers/msw-server';
import { aGarden, grower } from './helpers/data';
import { memberOf, renderApp, signedInAs } from './helpers/render-app';
import { formatDayMonth } from '@/lib/format';
import { HISTORY_POLL_MS } from '@/features/weather/api/get-weather';
import { CLIENT_WAIT_MS } from './helpers/waits';

setupClientTests();

function aWeather(overrides: Partial<WeatherResponse> = {}): WeatherResponse {
  return {
    unit: 'F',
    thresholds: [{ label: 'Base temperature – Lettuce', kind: 'base', value: 40 }],
    from: '2026-05-14',
    to: '2026-05-21',
    today: '2026-05-20',
    days: [
      { date: '2026-05-17', tmax: 68.2, tmin: 45.1, source: 'observed' },
      { date: '2026-05-18', tmax: 66.5, tmin: -2.5, source: 'filled', note: 'Linear interpolation between the readings of May 17 and May 19' },
      { date: '2026-05-19', tmax: 64.8, tmin: 41, source: 'imported' },
      { date: '2026-05-20', tmax: 71.3, tmin: 50.2, source: 'forecast' },
      { date: '2026-05-21', tmax: 74, tmin: 52.6, source: 'forecast' },
    ],
    gaps: [{ from: '2026-05-14', to: '2026-05-16', days: 3 }],
    history: {
      historyFrom: '2019-01-01',
      historyThrough: '2026-05-19',
      targetFrom: '2015-01-01',
      percent: 64,
      complete: false,
      error: null,
      refreshedAt: '2026-05-20T10:02:00.000Z',
      running: true,
    },
    ...overrides,
  };
}

function aRun(overrides: Partial<JobRunDto> = {}): JobRunDto {
  return {
    id: 1,
    kind: 'nightly',
    startedAt: '2026-05-20T06:00:00.000Z',
    finishedAt: '2026-05-20T06:00:04.000Z',
    status: 'ok',
    cellsOk: 2,
    cellsFailed: 0,
    cellsSkipped: 0,
    daysWritten: 34,
    daysRejected: 0,
    requests: 2,
    message: null,
    ...overrides,
  };
}

function gardenWithWeather(role: Role, weather = aWeather()) {
  return [
    signedInAs(grower),
    ...memberOf([aGarden({ role })]),
    http.get('/api/gardens/:gardenId/weather', () => HttpResponse.json(weather)),
  ];
}

function requested(path: string) {
  return seen.filter((r) => r.path === path);
}

describe('weather page', () => {
  it('when days carry soil temperatures, then a Soil column shows them with their unit, marking the grower’s own readings', async () => {
    const base = aWeather();
    const days = base.days.map((d) =>
      d.date === '2026-05-19' ? { ...d, soil: 55.4, soilSource: 'reading' as const } : d.date === '2026-05-20' ? { ...d, soil: 57.1, soilSource: 'forecast' as const } : d,
    );
    server.use(...gardenWithWeather('grower', { ...base, days }));
    renderApp('/g/1/weather');
    const table = await screen.findByRole('table', { name: 'Day by day, in °F' });
    expect(within(table).getByRole('columnheader', { name: 'Soil' })).toBeTruthy();
    const row = (day: string) => within(table).getByRole('row', { name: new RegExp(`^${day}`) });
    expect(within(row('Tue, May 19')).getByText('55.4 °F')).toBeTruthy();
    expect(within(row('Tue, May 19')).getByText('your reading')).toBeTruthy();
    expect(within(row('Wed, May 20')).getByText('57.1 °F')).toBeTruthy();
    expect(within(row('Sun, May 17')).getByText('—')).toBeTruthy();
  });

  it('when a grower opens Weather, then every day shows its high, low and source in words, each with its unit', async () => {
    server.use(...gardenWithWeather('grower'));
    renderApp('/g/1/weather');

    const table = await screen.findByRole('table', { name: 'Day by day, in °F' });
    const row = (day: string) => within(table).getByRole('row', { name: new RegExp(`^${day}`) });
    expect(within(row('Sun, May 17')).getByText('68.2 °F')).toBeTruthy();
    expect(within(row('Sun, May 17')).getByText('45.1 °F')).toBeTruthy();
    expect(within(row('Sun, May 17')).getByText('Observed')).toBeTruthy();
    expect(within(row('Mon, May 18')).getByText('Estimated (filled)')).toBeTruthy();
    expect(within(row('Mon, May 18')).getByText('−2.5 °F')).toBeTruthy();
    // The note shows in its own column on wide screens and under the source on phones.
    expect(within(row('Mon, May 18')).getAllByText(/^Linear interpolation between the readings of May 17 and May 19$/)).toHaveLength(2);
    expect(within(row('Tue, May 19')).getByText('Your station')).toBeTruthy();
    expect(within(row('Wed, May 20')).getByText('Forecast')).toBeTruthy();
    expect(row('Wed, May 20').getAttribute('aria-current')).toBe('date');

    expect(screen.getByText('May 14–16, 2026 (3 days)')).toBeTruthy();
    expect(screen.getByText('Base temperature – Lettuce: 40.0 °F')).toBeTruthy();
    expect(screen.getByText('Weather history: 64 % of 11 years fetched…')).toBeTruthy();
    expect(screen.getByRole('progressbar', { name: 'Weather history fetched' }).getAttribute('aria-valuenow')).toBe('64');
    expect(screen.getByRole('link', { name: 'Weather' }).getAttribute('aria-current')).toBe('page');
    // A grower may refresh and upload, but the job history is the owner's alone.
    expect(screen.getByRole('button', { name: 'Refresh now' })).toBeTruthy();
    expect(screen.getByRole('button', { name: 'Upload readings' })).toBeTruthy();
    expect(screen.queryByRole('heading', { name: 'Weather fetches' })).toBeNull();
    expect(requested('/api/gardens/1/weather/runs')).toHaveLength(0);
    // The lazily loaded chart has arrived once its fallback is gone.
    await screen.findByRole('figure', { name: /Daily highs and lows in °F/ });
    expect(await screen.findByText('Dashed: forecast')).toBeTruthy();
  });

  it('when a Celsius garden has no location yet, then the page says where to set it and offers no refresh', async () => {
    server.use(...gardenWithWeather('owner', aWeather({ unit: 'C', history: null, days: [], gaps: [], thresholds: [] })));
    server.use(http.get('/api/gardens/:gardenId/weather/runs', () => HttpResponse.json({ runs: [] })));
    renderApp('/g/1/weather');

    expect(await screen.findByText('No location yet')).toBeTruthy();
    expect(within(screen.getByRole('main')).getByRole('link', { name: 'Garden settings' }).getAttribute('href')).toBe('/g/1/settings');
    expect(screen.queryByRole('button', { name: 'Refresh now' })).toBeNull();
    expect(screen.getByText('No temperatures yet for May 14–21, 2026.')).toBeTruthy();
    expect(await screen.findByText('No fetches yet.')).toBeTruthy();
  });

  it('when an upload is rejected as invalid CSV, then every bad line and column is listed and nothing is said to be imported', async () => {
    server.use(
      ...gardenWithWeather('grower'),
      http.post('/api/gardens/:gardenId/weather/imports', () =>
        HttpResponse.json(
          {
            error: {
              code: 'csv_invalid',
              message: 'The file has 2 rows with problems.',
              rows: [
                { line: 3, column: 'high', message: '"warm" is not a number.' },
                { line: 5, column: 'date', message: '2026-02-30 is not a calendar date.' },
              ],
            },
          },
          { status: 422 },
        ),
      ),
    );
    await useNodeFormData();
    const { user } = renderApp('/g/1/weather');

    await user.click(await screen.findByRole('radio', { name: '°C (Celsius)' }));
    const csv = new NodeFile(['date,high,low\n2026-05-01,warm,7\n'], 'station.csv', { type: 'text/csv' });
    await user.upload(screen.getByLabelText('CSV file'), csv as unknown as File);
    await user.click(screen.getByRole('button', { name: 'Upload readings' }));

    const alert = await screen.findByRole('alert');
    expect(within(alert).getByText('Nothing was imported')).toBeTruthy();
    const report = within(alert).getByRole('table');
    const rows = within(report).getAllByRole('row').slice(1).map((r) => r.textContent);
    expect(rows).toEqual(['3high"warm" is not a number.', '5date2026-02-30 is not a calendar date.']);
    const [upload] = requested('/api/gardens/1/weather/imports');
    const form = upload.body as FormData;
    // Node's File, not jsdom's: compare by shape rather than instanceof.
    const file = form.get('file') as Blob & { name?: string };
    expect(form.get('unit')).toBe('C');
    expect(file.name).toBe('station.csv');
    expect(await file.text()).toBe('date,high,low\n2026-05-01,warm,7\n');
    expect(upload.headers.get('x-requested-with')).toBe('heatclock');
    expect(upload.headers.get('content-type')).toMatch(/^multipart\/form-data; boundary=/);
  });

  it('when no file is chosen, then the form says so and nothing is uploaded', async () => {
    server.use(...gardenWithWeather('owner'), http.get('/api/gardens/:gardenId/weather/runs', () => HttpResponse.json({ runs: [] })));
    const { user } = renderApp('/g/1/weather');

    await user.click(await screen.findByRole('button', { name: 'Upload readings' }));

    expect(await screen.findByText('Choose a CSV file to upload.')).toBeTruthy();
    expect(requested('/api/gardens/1/weather/imports')).toHaveLength(0);
  });

  it('when a viewer opens Weather, then the days show but there is no refresh, upload or job history', async () => {
    server.use(...gardenWithWeather('viewer'));
    renderApp('/g/1/weather');

    expect(await screen.findByRole('table', { name: 'Day by day, in °F' })).toBeTruthy();
    expect(screen.queryByRole('button', { name: 'Refresh now' })).toBeNull();
    expect(screen.queryByRole('button', { name: 'Upload readings' })).toBeNull();
    expect(screen.queryByLabelText('CSV file')).toBeNull();
    expect(screen.queryByRole('heading', { name: 'Weather fetches' })).toBeNull();
    expect(requested('/api/gardens/1/weather/runs')).toHaveLength(0);
    await screen.findByText('Dashed: forecast');
  });

  it('when an owner opens Weather, then the job history lists each fetch with its result in words', async () => {
    server.use(
      ...gardenWithWeather('owner'),
      http.get('/api/gardens/:gardenId/weather/runs', () =>
        HttpResponse.json({
          runs: [
            aRun({ id: 3, kind: 'manual', status: 'failed', cellsOk: 0, cellsFailed: 1, daysWritten: 0, message: 'The weather service answered 503' }),
            aRun({ id: 2, status: 'partial', cellsOk: 1, cellsFailed: 1, daysWritten: 17 }),
            aRun({ id: 1 }),
          ],
        }),
      ),
    );
    renderApp('/g/1/weather');

    const history = await screen.findByRole('region', { name: 'Weather fetches' });
    const rows = await within(history).findAllByRole('row');
    expect(rows).toHaveLength(4);
    expect(within(rows[1]).getByText('Refresh now')).toBeTruthy();
    expect(within(rows[1]).getByText('Failed')).toBeTruthy();
    expect(within(rows[1]).getByText('The weather service answered 503')).toBeTruthy();
    expect(within(rows[2]).getByText('Partly done')).toBeTruthy();
    expect(within(rows[2]).getByText('1 of 2 weather areas could not be fetched')).toBeTruthy();
    expect(within(rows[3]).getByText('Nightly')).toBeTruthy();
    expect(within(rows[3]).getByText('Done')).toBeTruthy();
    expect(within(rows[3]).getByText('34')).toBeTruthy();
    expect(within(rows[3]).getByText('4 s')).toBeTruthy();
    // Times are in the garden's zone (America/New_York), not the browser's.
    expect(within(rows[3]).getByText('May 20, 2026, 2:00 AM')).toBeTruthy();
  });

  it('when Refresh now finds the weather fetched moments ago, then it says so instead of claiming new days', async () => {
    server.use(
      ...gardenWithWeather('grower'),
      http.post('/api/gardens/:gardenId/weather/refresh', () =>
        HttpResponse.json({
          run: { runId: 9, cellsOk: 0, cellsFailed: 0, cellsSkipped: 1, daysWritten: 0, daysRejected: 0, requests: 0 },
        }),
      ),
    );
    const { user } = renderApp('/g/1/weather');

    await user.click(await screen.findByRole('button', { name: 'Refresh now' }));

    expect(await screen.findByText('Already up to date')).toBeTruthy();
    expect(requested('/api/gardens/1/weather/refresh')).toHaveLength(1);
  });

  it('when Refresh now asks and the service has nothing newer, then it says the days are already up to date through their last day', async () => {
    server.use(
      ...gardenWithWeather('grower'),
      http.post('/api/gardens/:gardenId/weather/refresh', () =>
        HttpResponse.json({
          run: { runId: 10, cellsOk: 1, cellsFailed: 0, cellsSkipped: 0, daysWritten: 0, daysRejected: 0, requests: 1 },
        }),
      ),
    );
    const { user } = renderApp('/g/1/weather');

    await user.click(await screen.findByRole('button', { name: 'Refresh now' }));

    const notice = await screen.findByText('Already up to date');
    const through = aWeather().history!.historyThrough!;
    expect(notice.closest('[role="status"]')?.textContent).toContain(`already run through ${formatDayMonth(through)}`);
    expect(screen.queryByText(/0 days saved/)).toBeNull();
  });

  it('when the history is still being fetched, then the page asks again until it is complete', async () => {
    const running = aWeather();
    const done = aWeather({ history: { ...running.history!, percent: 100, complete: true, running: false, historyFrom: '2015-01-01' } });
    let calls = 0;
    server.use(
      // First in the list, so it answers before gardenWithWeather's fixed reply.
      http.get('/api/gardens/:gardenId/weather', () => HttpResponse.json(++calls === 1 ? running : done)),
      ...gardenWithWeather('viewer'),
    );
    renderApp('/g/1/weather');

    expect(await screen.findByText('Weather history: 64 % of 11 years fetched…')).toBeTruthy();
    // The page asks again after its poll interval; then the usual wait for the words.
    expect(
      await screen.findByText('Weather history: complete, 11 years back to Jan 1, 2015.', undefined, { timeout: HISTORY_POLL_MS + CLIENT_WAIT_MS }),
    ).toBeTruthy();
    expect(calls).toBe(2);
  });
});
