// @vitest-environment jsdom
import 'fake-indexeddb/auto';
import { beforeEach, describe, expect, it } from 'vitest';
import { screen, waitFor } from '@testing-library/react';
import { http, HttpResponse } from 'msw';
import { seen, server, setupClientTests } from './helpers/msw-server';
import { aGarden, aPlanting, aProgress, grower } from './helpers/data';
import { memberOf, renderApp, signedInAs } from './helpers/render-app';
import { CONFLICT_WORDS, clearQueue, enqueue, flushQueue, listQueued, setQueueOwner } from '@/lib/offline-queue';

setupClientTests();

const base = '/api/gardens/1/plantings/5';
const other = aPlanting({ id: 6, bed: { id: 5, name: 'West 1' }, variety: { id: 8, name: 'Redvein Romaine', dtmDays: 60, dtmFrom: 'sowing', boltTolerance: 3 } });

/** An entry made offline for planting 9, which was deleted before the connection came back. */
async function keptConflict() {
  await enqueue({
    id: 'offline-1',
    kind: 'log',
    gardenId: 1,
    plantingId: 9,
    plantingName: 'Copperleaf Butterhead in South 2',
    idempotencyKey: 'key-first',
    body: { entryOn: '2026-06-01', kind: 'watered', amount: null, amountUnit: null, note: 'deep soak at dusk' },
  });
  server.use(http.post('*/api/gardens/1/plantings/9/log', () => HttpResponse.json({ error: { code: 'not_found', message: 'No such planting.' } }, { status: 404 }), { once: true }));
  await flushQueue();
  expect((await listQueued()).map((i) => i.status)).toEqual(['conflict']);
}

function plantingPage() {
  server.use(
    signedInAs(grower),
    ...memberOf([aGarden({ role: 'grower' })]),
    http.get(base, () => HttpResponse.json({ planting: aPlanting() })),
    http.get(`${base}/progress`, () => HttpResponse.json(aProgress())),
    http.get(`${base}/log`, () => HttpResponse.json({ items: [], page: 1, pageSize: 200, total: 0 })),
    http.get(`${base}/photos`, () => HttpResponse.json({ photos: [] })),
    http.get('*/api/gardens/1/plantings', () => HttpResponse.json({ items: [aPlanting(), other], page: 1, pageSize: 100, total: 2 })),
  );
  return renderApp('/g/1/plantings/5');
}

// Entries belong to the account that made them; these tests act as the demo-like grower.
beforeEach(async () => {
  await setQueueOwner(grower.id);
  await clearQueue();
});

describe('an entry whose planting was deleted while it waited', () => {
  it('when the garden opens, then it is shown in words with what was written, and it can go to another planting under a new key', async () => {
    await keptConflict();
    const { user } = plantingPage();
    await screen.findByText('Entry not sent: its planting is gone');
    expect(screen.getByText(CONFLICT_WORDS)).toBeTruthy();
    expect(screen.getByText(/Watered on .*2026 for Copperleaf Butterhead in South 2 — “deep soak at dusk”/)).toBeTruthy();

    server.use(http.post('*/api/gardens/1/plantings/6/log', () => HttpResponse.json({ entry: { id: 1 } }, { status: 201 })));
    await user.click(screen.getByRole('button', { name: 'Choose another planting' }));
    const select = await screen.findByRole('combobox', { name: 'Send it to' });
    await waitFor(() => expect(screen.getByRole('option', { name: 'Redvein Romaine in West 1' })).toBeTruthy());
    // The planting the page is about is offered too; the deleted one is not.
    expect(screen.queryByRole('option', { name: /South 2/ })).toBeNull();
    await user.selectOptions(select, 'Redvein Romaine in West 1');
    await waitFor(() => expect(seen.some((r) => r.method === 'POST' && r.path === '/api/gardens/1/plantings/6/log')).toBe(true));
    const sent = seen.find((r) => r.method === 'POST' && r.path === '/api/gardens/1/plantings/6/log')!;
    expect(sent.headers.get('Idempotency-Key')).not.toBe('key-first');
    await waitFor(() => expect(screen.queryByText('Entry not sent: its planting is gone')).toBeNull());
    expect(await listQueued()).toEqual([]);
  });

  it('when the grower discards it, then it leaves the device', async () => {
    await keptConflict();
    const { user } = plantingPage();
    await user.click(await screen.findByRole('button', { name: 'Discard it' }));
    await waitFor(() => expect(screen.queryByText('Entry not sent: its planting is gone')).toBeNull());
    expect(await listQueued()).toEqual([]);
  });
});

describe('signing out on a shared device', () => {
  it('when the grower signs out, then what waited on the device is gone with the session', async () => {
    await keptConflict();
    server.use(http.post('/api/auth/logout', () => new HttpResponse(null, { status: 204 })));
    const { user } = plantingPage();
    await screen.findByText('Entry not sent: its planting is gone');
    await user.click(screen.getByRole('button', { name: 'Sign out' }));
    expect(await screen.findByRole('heading', { name: 'Sign in' })).toBeTruthy();
    expect(await listQueued()).toEqual([]);
  });
});
