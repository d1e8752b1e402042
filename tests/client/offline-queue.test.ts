// @vitest-environment jsdom
import 'fake-indexeddb/auto';
import { beforeEach, describe, expect, it } from 'vitest';
import { http, HttpResponse } from 'msw';
import { seen, server, setupClientTests } from './helpers/msw-server';
import { CONFLICT_WORDS, QUEUED_PHOTO_MAX_BYTES, clearQueue, discardQueued, enqueue, flushQueue, listQueued, resend, setQueueOwner } from '@/lib/offline-queue';
import { grower } from './helpers/data';

setupClientTests();
const LOG = '*/api/gardens/1/plantings/7/log';
const entry = (id: string) => ({
  id,
  kind: 'log' as const,
  gardenId: 1,
  plantingId: 7,
  plantingName: 'Butterhead in Bed 3',
  idempotencyKey: `key-${id}`,
  body: { entryOn: '2026-06-01', kind: 'watered', amount: null, amountUnit: null, note: 'deep soak' },
});

// Entries belong to the account that made them; these tests act as the demo-like grower.
beforeEach(async () => {
  await setQueueOwner(grower.id);
  await clearQueue();
});

describe('the offline queue', () => {
  it('when there is no connection, then the entry keeps waiting and every retry carries the same key', async () => {
    await enqueue(entry('a'));
    server.use(http.post(LOG, () => HttpResponse.error()));
    await flushQueue();
    await flushQueue();
    const keys = seen.filter((r) => r.method === 'POST').map((r) => r.headers.get('Idempotency-Key'));
    expect(keys).toEqual(['key-a', 'key-a']);
    expect((await listQueued()).map((i) => i.status)).toEqual(['waiting']);
  });

  it('when the server stores it, then it leaves the queue; a 409 in progress waits for the next flush', async () => {
    await enqueue(entry('b'));
    server.use(http.post(LOG, () => HttpResponse.json({ error: { code: 'in_progress', message: 'Still storing.' } }, { status: 409 }), { once: true }));
    expect((await flushQueue()).waiting).toBe(1);
    server.use(http.post(LOG, () => HttpResponse.json({ entry: {}, planting: {} }, { status: 201 })));
    const { sent } = await flushQueue();
    expect(sent.map((i) => i.id)).toEqual(['b']);
    expect(await listQueued()).toEqual([]);
  });

  it('when the planting was deleted (404), then the entry is kept as a conflict in words', async () => {
    await enqueue(entry('c'));
    server.use(http.post(LOG, () => HttpResponse.json({ error: { code: 'not_found', message: 'No such planting.' } }, { status: 404 })));
    await flushQueue();
    expect(await listQueued()).toMatchObject([{ id: 'c', status: 'conflict', problem: CONFLICT_WORDS }]);
  });

  it('when the server refuses it (422), then the server’s words are kept with the entry and it is not resent', async () => {
    await enqueue(entry('d'));
    server.use(http.post(LOG, () => HttpResponse.json({ error: { code: 'key_reused', message: 'This key was used for another entry.' } }, { status: 422 })));
    await flushQueue();
    await flushQueue();
    expect(await listQueued()).toMatchObject([{ status: 'failed', problem: 'This key was used for another entry.' }]);
    expect(seen.filter((r) => r.method === 'POST')).toHaveLength(1);
  });

  it('when a photo is larger than a device may keep, then it is refused in words and not queued', async () => {
    const photo = new Blob([new Uint8Array(QUEUED_PHOTO_MAX_BYTES + 1)], { type: 'image/jpeg' });
    await expect(enqueue({ ...entry('e'), kind: 'photo', photo, caption: '', takenOn: '2026-06-01' })).rejects.toThrow(/up to 8 MB/);
    expect(await listQueued()).toEqual([]);
  });

  it('when another account signs in on the device, then the first one’s entries are neither shown nor sent, and come back for them', async () => {
    await enqueue(entry('f'));
    await setQueueOwner(grower.id + 1);
    expect(await listQueued()).toEqual([]);
    server.use(http.post(LOG, () => HttpResponse.json({ entry: { id: 1 } }, { status: 201 })));
    await flushQueue();
    expect(seen.filter((r) => r.method === 'POST')).toHaveLength(0);
    await setQueueOwner(grower.id);
    expect((await listQueued()).map((i) => i.id)).toEqual(['f']);
  });

  it('when the session has lapsed (401), then the entry waits for the next flush instead of failing', async () => {
    await enqueue(entry('g'));
    server.use(http.post(LOG, () => HttpResponse.json({ error: { code: 'unauthenticated', message: 'Please sign in.' } }, { status: 401 })));
    await flushQueue();
    expect((await listQueued()).map((i) => i.status)).toEqual(['waiting']);
  });

  it('when an entry is discarded while it is being sent, then it does not come back', async () => {
    await enqueue(entry('h'));
    server.use(
      http.post(LOG, async () => {
        await discardQueued('h');
        return HttpResponse.error();
      }),
    );
    await flushQueue();
    expect(await listQueued()).toEqual([]);
  });

  it('when a refused entry is sent again, then it goes with the next flush under its key', async () => {
    await enqueue(entry('i'));
    server.use(http.post(LOG, () => HttpResponse.json({ error: { code: 'validation_failed', message: 'No.', fields: { note: 'Too long.' } } }, { status: 422 }), { once: true }));
    await flushQueue();
    expect((await listQueued()).map((i) => i.status)).toEqual(['failed']);
    server.use(http.post(LOG, () => HttpResponse.json({ entry: { id: 2 } }, { status: 201 })));
    await resend('i');
    await flushQueue();
    expect(await listQueued()).toEqual([]);
    expect(seen.filter((r) => r.method === 'POST').map((r) => r.headers.get('Idempotency-Key'))).toEqual(['key-i', 'key-i']);
  });
});
