// @vitest-environment jsdom
import { afterEach, describe, expect, it } from 'vitest';
import { render, screen, waitFor, within } from '@testing-library/react';
import { QueryClientProvider, onlineManager, useQuery } from '@tanstack/react-query';
import { delay, http, HttpResponse } from 'msw';
import type { PlantingDto } from '#shared/schemas/plantings';
import { ApiError, api, requestSettings } from '@/lib/api-client';
import { createQueryClient, retryDelay, shouldRetry } from '@/lib/query-client';
import { mutationProblem } from '@/lib/problems';
import { LoadProblem } from '@/components/ui/load-problem';
import { draftStorageKey } from '@/features/plantings/components/quick-log';
import { seen, server, setupClientTests, useBrowserLanguages } from './helpers/msw-server';
import { CLIENT_WAIT_MS } from './helpers/waits';
import { aBed, aGarden, aPlanting, aProgress, grower } from './helpers/data';
import { memberOf, renderApp, signedInAs } from './helpers/render-app';

setupClientTests();
useBrowserLanguages(['en-GB']);

const page = (items: unknown[]) => ({ items, page: 1, pageSize: 200, total: items.length });

const OFFLINE = 'Can’t reach Heatclock. Check your connection and try again.';
const KEPT = 'Can’t reach Heatclock — your entry is kept, try again.';

function plantingPage(planting: PlantingDto, units: 'F' | 'C' = 'F') {
  return [
    signedInAs(grower),
    ...memberOf([aGarden({ units })]),
    http.get('/api/gardens/1/plantings/5', () => HttpResponse.json({ planting })),
    http.get('/api/gardens/1/plantings/5/progress', () => HttpResponse.json(aProgress())),
    http.get('/api/gardens/1/plantings/5/log', () => HttpResponse.json(page([]))),
    http.get('/api/gardens/1/plantings/5/photos', () => HttpResponse.json({ photos: [] })),
  ];
}

const quickLog = () => screen.findByRole('region', { name: 'Add to the log' });
const logPosts = () => seen.filter((r) => r.method === 'POST' && r.path === '/api/gardens/1/plantings/5/log');
const storedDraft = () => {
  const raw = localStorage.getItem(draftStorageKey(1, 5));
  return raw ? (JSON.parse(raw) as { note: string; key: string; kind: string }) : null;
};

afterEach(() => {
  requestSettings.timeoutMs = 15_000;
  onlineManager.setOnline(true);
});

describe('a query without a connection', () => {
  it('when the beds cannot be fetched, then the page says Heatclock cannot be reached, and Try again shows them once it answers', async () => {
    let online = false;
    server.use(
      signedInAs(grower),
      ...memberOf([aGarden()]),
      http.get('/api/gardens/1/beds', () => (online ? HttpResponse.json(page([aBed({ name: 'Orchard Row' })])) : HttpResponse.error())),
    );
    const { user } = renderApp('/g/1/beds');

    const alert = await screen.findByRole('alert');
    expect(within(alert).getByText('The beds could not be loaded — try again')).toBeTruthy();
    expect(within(alert).getByText(OFFLINE)).toBeTruthy();
    expect(screen.queryByText('Loading beds…')).toBeNull();

    online = true;
    await user.click(screen.getByRole('button', { name: 'Try again' }));

    expect(await screen.findByText('Orchard Row')).toBeTruthy();
    expect(screen.queryByText(OFFLINE)).toBeNull();
    expect(seen.filter((r) => r.path === '/api/gardens/1/beds')).toHaveLength(2);
  });

  it('when the server never answers, then the wait ends and the page says so instead of loading for ever', async () => {
    requestSettings.timeoutMs = 300;
    server.use(
      signedInAs(grower),
      ...memberOf([aGarden()]),
      http.get('/api/gardens/1/beds', async () => {
        await delay('infinite');
        return HttpResponse.json(page([]));
      }),
    );
    renderApp('/g/1/beds');

    const alert = await screen.findByRole('alert');
    expect(alert.textContent).toContain('Can’t reach Heatclock: no answer within 1 second.');
    expect(screen.getByRole('button', { name: 'Try again' })).toBeTruthy();
  });

  it('when a request has no answer in time, then it fails as a timeout; a caller that gives up still cancels it', async () => {
    requestSettings.timeoutMs = 100;
    server.use(
      http.get('/api/slow', async () => {
        await delay('infinite');
        return HttpResponse.json({});
      }),
    );
    const started = Date.now();
    const error = await api.get('/api/slow').catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ApiError);
    expect((error as ApiError).status).toBe(0);
    expect((error as ApiError).code).toBe('timeout');
    expect(Date.now() - started).toBeLessThan(2000);

    const caller = new AbortController();
    const cancelled = api.get('/api/slow', caller.signal).catch((e: unknown) => e);
    caller.abort();
    expect(await cancelled).not.toBeInstanceOf(ApiError);
    expect((await cancelled as Error).name).toBe('AbortError');
  });

  it('when the browser says it is offline, then the app’s own client still tries and shows the problem instead of waiting silently', async () => {
    onlineManager.setOnline(false);
    server.use(http.get('/api/probe', () => HttpResponse.error()));
    function Probe() {
      const q = useQuery({ queryKey: ['probe'], queryFn: ({ signal }) => api.get('/api/probe', signal) });
      if (q.isError) return <LoadProblem error={q.error} what="the probe" onRetry={() => q.refetch()} />;
      return <p>{q.isPending ? 'Waiting' : 'Done'}</p>;
    }
    render(
      <QueryClientProvider client={createQueryClient()}>
        <Probe />
      </QueryClientProvider>,
    );

    // Two retries, after the query client's own pauses (1 s, then 2 s), then the words.
    const pauses = retryDelay(0, null) + retryDelay(1, null);
    expect((await screen.findByRole('alert', {}, { timeout: pauses + CLIENT_WAIT_MS })).textContent).toContain(OFFLINE);
    expect(seen.filter((r) => r.path === '/api/probe')).toHaveLength(3);
  });

  it('retries only what is worth it and stays inside about 30 s', () => {
    const offline = new ApiError({ status: 0, code: 'offline', message: OFFLINE, elapsedMs: 20 });
    const timeout = new ApiError({ status: 0, code: 'timeout', message: 'late', elapsedMs: 15_000 });
    const slow500 = new ApiError({ status: 500, code: 'internal', message: 'x', elapsedMs: 9_000 });
    const busyLong = new ApiError({ status: 503, code: 'overloaded', message: 'x', retryAfterSeconds: 60 });
    const busyShort = new ApiError({ status: 503, code: 'overloaded', message: 'x', retryAfterSeconds: 2 });
    const notFound = new ApiError({ status: 404, code: 'not_found', message: 'x' });
    expect([0, 1, 2].map((n) => shouldRetry(n, offline))).toEqual([true, true, false]);
    expect(shouldRetry(0, timeout)).toBe(false);
    expect(shouldRetry(0, slow500)).toBe(false);
    expect(shouldRetry(0, busyLong)).toBe(false);
    expect(shouldRetry(0, busyShort)).toBe(true);
    expect(shouldRetry(0, notFound)).toBe(false);
    expect([retryDelay(0, offline), retryDelay(1, offline), retryDelay(0, busyShort)]).toEqual([1000, 2000, 2000]);
    expect(createQueryClient().getDefaultOptions().mutations?.retry).toBe(false);
  });

  it('when the server is busy, then the words say how long to wait, in words', async () => {
    server.use(
      signedInAs(grower),
      ...memberOf([aGarden()]),
      http.get('/api/gardens/1/beds', () =>
        HttpResponse.json({ error: { code: 'overloaded', message: 'Busy.' } }, { status: 503, headers: { 'Retry-After': '90' } }),
      ),
    );
    renderApp('/g/1/beds');

    expect((await screen.findByRole('alert')).textContent).toContain('Heatclock is busy right now. Try again in 2 minutes.');
    expect(mutationProblem(new ApiError({ status: 503, code: 'overloaded', message: 'Busy.', retryAfterSeconds: 5 }))).toBe(
      'Heatclock is busy right now — your entry is kept, try again in 5 seconds.',
    );
  });
});

describe('the quick log without a connection', () => {
  it('when an entry is typed while offline, then it is kept in the form and on the device, survives a reload, and Try again saves it once with the same key', async () => {
    let online = false;
    server.use(
      ...plantingPage(aPlanting()),
      http.post('/api/gardens/1/plantings/5/log', async ({ request }) => {
        if (!online) return HttpResponse.error();
        const body = (await request.json()) as Record<string, unknown>;
        return HttpResponse.json({ entry: { id: 90, ...body, photoId: null, by: 'Mara Quill' }, planting: aPlanting({ logCount: 15 }) }, { status: 201 });
      }),
    );
    const first = renderApp('/g/1/plantings/5');
    const log = await quickLog();
    await first.user.click(within(log).getByRole('button', { name: 'Watered' }));
    await first.user.type(within(log).getByLabelText('Note (optional)'), 'Soaked the north end');
    await first.user.click(within(log).getByRole('button', { name: 'Save “Watered”' }));

    expect((await within(log).findByRole('alert')).textContent).toContain(KEPT);
    expect((within(log).getByLabelText('Note (optional)') as HTMLInputElement).value).toBe('Soaked the north end');
    expect(storedDraft()).toMatchObject({ kind: 'watered', note: 'Soaked the north end' });
    const key = storedDraft()!.key;
    expect(key).toBeTruthy();

    // The tab is closed and opened again, still without a connection.
    first.unmount();
    const second = renderApp('/g/1/plantings/5');
    const again = await quickLog();
    expect((within(again).getByLabelText('Note (optional)') as HTMLInputElement).value).toBe('Soaked the north end');
    expect(within(again).getByRole('button', { name: 'Watered' }).getAttribute('aria-pressed')).toBe('true');
    expect(within(again).getByText('Not saved yet')).toBeTruthy();
    await second.user.click(within(again).getByRole('button', { name: 'Save “Watered”' }));
    expect((await within(again).findByRole('alert')).textContent).toContain(KEPT);

    online = true;
    await second.user.click(within(again).getByRole('button', { name: 'Try again' }));

    expect(await within(again).findByText(/^Watered logged for \d{1,2} [A-Z][a-z]{2}( \d{4})?\.$/)).toBeTruthy();
    expect(storedDraft()).toBeNull();
    const posts = logPosts();
    expect(posts).toHaveLength(3);
    expect(posts.map((p) => p.headers.get('idempotency-key'))).toEqual([key, key, key]);
    expect(posts.every((p) => (p.body as { note: string }).note === 'Soaked the north end')).toBe(true);
    // Only the last one reached a server; the form is empty again and nothing is sent by itself.
    expect(within(again).queryByLabelText('Note (optional)')).toBeNull();
    await new Promise((r) => setTimeout(r, 50));
    expect(logPosts()).toHaveLength(3);
  });

  it('when the entry is changed after a failed send, then it gets a new key (it is another entry)', async () => {
    server.use(...plantingPage(aPlanting()), http.post('/api/gardens/1/plantings/5/log', () => HttpResponse.error()));
    const { user } = renderApp('/g/1/plantings/5');
    const log = await quickLog();
    await user.click(within(log).getByRole('button', { name: 'Fed' }));
    await user.click(within(log).getByRole('button', { name: 'Save “Fed”' }));
    await within(log).findByRole('alert');
    const before = storedDraft()!.key;
    await user.type(within(log).getByLabelText('Note (optional)'), 'x');
    expect(storedDraft()!.key).not.toBe(before);
  });
});

describe('the quick log’s stages', () => {
  it('when a planned planting is marked Sown, then a PATCH sets its sowing date and starts it growing, and the date shows in words', async () => {
    let current = aPlanting({ status: 'planned', sownOn: null, emergedOn: null });
    server.use(
      // Before the page's own handlers, so the planting read back is the one the PATCH changed.
      http.get('/api/gardens/1/plantings/5', () => HttpResponse.json({ planting: current })),
      ...plantingPage(current),
      http.patch('/api/gardens/1/plantings/5', async ({ request }) => {
        current = { ...current, ...((await request.json()) as Partial<PlantingDto>) };
        return HttpResponse.json({ planting: current });
      }),
    );
    const { user } = renderApp('/g/1/plantings/5');
    const log = await quickLog();
    expect(within(log).getByText('No sowing, emergence or transplant date on record yet.')).toBeTruthy();

    await user.click(within(log).getByRole('button', { name: 'Sown' }));
    const date = within(log).getByLabelText('Date');
    await user.clear(date);
    await user.type(date, '2025-04-02');
    await user.click(within(log).getByRole('button', { name: 'Save “Sown”' }));

    expect(await within(log).findByText('Sown recorded for 2 Apr 2025.')).toBeTruthy();
    const patches = seen.filter((r) => r.method === 'PATCH');
    expect(patches).toHaveLength(1);
    expect(patches[0].body).toEqual({ sownOn: '2025-04-02', status: 'growing' });
    expect(await within(log).findByText('On record: Sown 2 Apr 2025.')).toBeTruthy();
    expect(within(log).getByRole('button', { name: 'Sown 2 Apr 2025' })).toBeTruthy();
    expect(logPosts()).toHaveLength(0);
  });

  it('when Emerged comes before Sown, then nothing is sent and the shared rule says why', async () => {
    server.use(...plantingPage(aPlanting({ sownOn: '2025-04-02', emergedOn: null })));
    const { user } = renderApp('/g/1/plantings/5');
    const log = await quickLog();

    await user.click(within(log).getByRole('button', { name: 'Emerged' }));
    const date = within(log).getByLabelText('Date');
    await user.clear(date);
    await user.type(date, '2025-03-30');
    await user.click(within(log).getByRole('button', { name: 'Save “Emerged”' }));

    expect((await within(log).findByRole('alert')).textContent).toContain('Emergence cannot come before sowing.');
    expect(seen.filter((r) => r.method === 'PATCH')).toHaveLength(0);
  });

  it('when the server refuses a stage date, then its message for that field shows, without a Try again', async () => {
    server.use(
      ...plantingPage(aPlanting({ transplantedOn: null })),
      http.patch('/api/gardens/1/plantings/5', () =>
        HttpResponse.json(
          { error: { code: 'validation_failed', message: 'Please check the fields: transplantedOn.', fields: { transplantedOn: 'Transplanting cannot come before sowing.' } } },
          { status: 400 },
        ),
      ),
    );
    const { user } = renderApp('/g/1/plantings/5');
    const log = await quickLog();

    await user.click(within(log).getByRole('button', { name: 'Transplanted' }));
    await user.click(within(log).getByRole('button', { name: 'Save “Transplanted”' }));

    const alert = await within(log).findByRole('alert');
    expect(alert.textContent).toContain('Transplanting cannot come before sowing.');
    expect(alert.textContent).not.toContain('transplantedOn');
    expect(within(log).queryByRole('button', { name: 'Try again' })).toBeNull();
  });
});

describe('the quick log’s harvest units follow the garden', () => {
  function harvestPage(units: 'F' | 'C') {
    server.use(
      ...plantingPage(aPlanting(), units),
      http.post('/api/gardens/1/plantings/5/log', () => HttpResponse.json({ entry: {}, planting: aPlanting() }, { status: 201 })),
    );
  }

  it('when a °F garden logs a harvest in ounces or pounds, then it is sent in kilograms', async () => {
    harvestPage('F');
    const { user } = renderApp('/g/1/plantings/5');
    const log = await quickLog();

    await user.click(within(log).getByRole('button', { name: 'Harvest' }));
    const unit = within(log).getByRole('combobox', { name: 'Amount unit' }) as HTMLSelectElement;
    expect(Array.from(unit.options, (o) => o.text)).toEqual(['lb', 'oz', 'pieces', 'bunches']);
    await user.type(within(log).getByLabelText('Amount (optional)'), '8');
    await user.selectOptions(unit, 'oz');
    await user.click(within(log).getByRole('button', { name: 'Save “Harvest”' }));
    await within(log).findByText(/^Harvest logged for/);

    await user.click(within(log).getByRole('button', { name: 'Harvest' }));
    await user.type(within(log).getByLabelText('Amount (optional)'), '2,5');
    await user.click(within(log).getByRole('button', { name: 'Save “Harvest”' }));
    await waitFor(() => expect(logPosts()).toHaveLength(2));

    const [oz, lb] = logPosts().map((p) => p.body as { amount: number; amountUnit: string });
    expect(oz).toMatchObject({ amount: 0.2268, amountUnit: 'kg' });
    expect(lb).toMatchObject({ amount: 1.134, amountUnit: 'kg' });
  });

  it('when a °C garden logs a harvest, then it offers metric units and counts, and sends grams as typed', async () => {
    harvestPage('C');
    const { user } = renderApp('/g/1/plantings/5');
    const log = await quickLog();

    await user.click(within(log).getByRole('button', { name: 'Harvest' }));
    const unit = within(log).getByRole('combobox', { name: 'Amount unit' }) as HTMLSelectElement;
    expect(Array.from(unit.options, (o) => o.text)).toEqual(['kg', 'g', 'pieces', 'bunches']);
    await user.type(within(log).getByLabelText('Amount (optional)'), '350');
    await user.selectOptions(unit, 'g');
    await user.click(within(log).getByRole('button', { name: 'Save “Harvest”' }));

    await waitFor(() => expect(logPosts()).toHaveLength(1));
    expect(logPosts()[0].body).toMatchObject({ kind: 'harvest', amount: 350, amountUnit: 'g' });
  });

  it('when the amount is not a number, then nothing is sent and the form says how to write it', async () => {
    harvestPage('C');
    const { user } = renderApp('/g/1/plantings/5');
    const log = await quickLog();

    await user.click(within(log).getByRole('button', { name: 'Harvest' }));
    await user.type(within(log).getByLabelText('Amount (optional)'), 'lots');
    await user.click(within(log).getByRole('button', { name: 'Save “Harvest”' }));

    expect((await within(log).findByRole('alert')).textContent).toContain('Enter the amount as a number, for example 1.5.');
    expect(logPosts()).toHaveLength(0);
  });
});
