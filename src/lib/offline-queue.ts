import { useSyncExternalStore } from 'react';
import { createStore, del, entries, get, set, clear } from 'idb-keyval';
import { ApiError, api, isNetworkError } from '@/lib/api-client';

/**
 * Entries made with no signal wait here, in IndexedDB on this device, until Heatclock has them.
 * Each keeps the Idempotency-Key it was first sent with, so however often a flush is retried
 * (a flaky reconnect, two tabs) the server stores it once.
 */
export type QueuedStatus = 'waiting' | 'sending' | 'conflict' | 'failed';

interface QueuedBase {
  id: string;
  /** The account that made it: only that account's session sends it or sees it. */
  ownerId: number;
  gardenId: number;
  plantingId: number;
  /** Shown with the entry so the grower knows which planting it was meant for. */
  plantingName: string;
  idempotencyKey: string;
  createdAt: string;
  status: QueuedStatus;
  problem: string | null;
}
export interface QueuedLog extends QueuedBase {
  kind: 'log';
  body: { entryOn: string; kind: string; amount: number | null; amountUnit: string | null; note: string };
}
export interface QueuedPhoto extends QueuedBase {
  kind: 'photo';
  photo: Blob;
  caption: string;
  /** The garden's day it was taken, sent with it (a photo sent days later keeps its own day). */
  takenOn: string;
}
export type QueuedItem = QueuedLog | QueuedPhoto;

/** Below the server's 12 MB: a phone's storage for a whole day of photos is not unlimited. */
export const QUEUED_PHOTO_MAX_BYTES = 8 * 1024 * 1024;

export const CONFLICT_WORDS =
  'This planting was deleted before your entry was sent. Your entry is kept: copy it or choose another planting.';

/** A browser without IndexedDB (some private modes) keeps nothing: entries are then sent or refused at once. */
const hasStorage = () => typeof indexedDB !== 'undefined';
let opened: ReturnType<typeof createStore> | null = null;
const store = () => (opened ??= createStore('heatclock-offline', 'queue'));

const listeners = new Set<() => void>();
let snapshot: QueuedItem[] = [];

/** Who is signed in on this device (the garden frame says); null until known. */
let owner: number | null = null;
const LAST_OWNER_KEY = 'heatclock.offline-owner';

/**
 * Called by the garden frame with the signed-in account. When it is another account than last
 * time on this device (a lapsed session, then someone else signing in), the service worker's copy
 * of the last one's pages is deleted; their waiting entries stay, unseen, for them.
 */
export async function setQueueOwner(userId: number | null) {
  if (owner === userId) return;
  owner = userId;
  if (userId !== null && typeof localStorage !== 'undefined') {
    const last = localStorage.getItem(LAST_OWNER_KEY);
    if (last !== null && last !== String(userId) && typeof caches !== 'undefined') await caches.delete(API_CACHE_NAME).catch(() => false);
    localStorage.setItem(LAST_OWNER_KEY, String(userId));
  }
  await refresh().catch(() => undefined);
}

async function refresh() {
  const all = hasStorage() ? (await entries<string, QueuedItem>(store())).map(([, item]) => item) : [];
  snapshot = all.filter((i) => owner !== null && i.ownerId === owner).sort((a, b) => a.createdAt.localeCompare(b.createdAt));
  listeners.forEach((l) => l());
}

export async function listQueued(): Promise<QueuedItem[]> {
  await refresh();
  return snapshot;
}

async function put(item: QueuedItem) {
  await set(item.id, item, store());
  await refresh();
}

/** A status change during a flush: an entry discarded (or cleared by sign-out) meanwhile stays gone. */
async function update(item: QueuedItem) {
  if (!(await get<QueuedItem>(item.id, store()))) return;
  await put(item);
}

export class PhotoTooLargeError extends Error {}

type NewItem<T> = Omit<T, 'status' | 'problem' | 'createdAt' | 'ownerId'>;

export async function enqueue(item: NewItem<QueuedLog> | NewItem<QueuedPhoto>) {
  if (owner === null) throw new Error('Nobody is signed in on this device yet.');
  if (item.kind === 'photo' && item.photo.size > QUEUED_PHOTO_MAX_BYTES) {
    const mb = (item.photo.size / 1024 / 1024).toFixed(1);
    throw new PhotoTooLargeError(
      `This photo is ${mb} MB; only photos up to ${QUEUED_PHOTO_MAX_BYTES / 1024 / 1024} MB can wait on this device. Upload it when you have signal.`,
    );
  }
  await put({ ...item, ownerId: owner, createdAt: new Date().toISOString(), status: 'waiting', problem: null } as QueuedItem);
}

export async function discardQueued(id: string) {
  await del(id, store());
  await refresh();
}

/** Sends a kept entry to another planting of the garden: a new target is a new entry, with a key of its own. */
export async function retarget(id: string, plantingId: number, plantingName: string, idempotencyKey: string) {
  const item = await get<QueuedItem>(id, store());
  if (!item) return;
  await put({ ...item, plantingId, plantingName, idempotencyKey, status: 'waiting', problem: null });
}

/** "Send again" for an entry the server refused: it goes with the next flush, under its own key. */
export async function resend(id: string) {
  const item = await get<QueuedItem>(id, store());
  if (!item) return;
  await put({ ...item, status: 'waiting', problem: null });
}

/** On sign-out: nothing of one grower waits on a shared device for the next. */
export async function clearQueue() {
  if (hasStorage()) await clear(store());
  await refresh();
}

function send(item: QueuedItem) {
  const base = `/api/gardens/${item.gardenId}/plantings/${item.plantingId}`;
  const headers = { 'Idempotency-Key': item.idempotencyKey };
  if (item.kind === 'log') return api.post(`${base}/log`, item.body, headers);
  const form = new FormData();
  form.append('photo', item.photo, 'photo');
  if (item.caption) form.append('caption', item.caption);
  form.append('takenOn', item.takenOn);
  return api.post(`${base}/photos`, form, headers);
}

export type FlushOutcome = { sent: QueuedItem[]; waiting: number };

let flushing: Promise<FlushOutcome> | null = null;

/**
 * Sends each waiting entry once; one flush at a time in this tab. No answer or a 409 (the same
 * key still being stored) leaves it waiting for the next flush; a deleted planting keeps it as a
 * conflict; any other refusal keeps it with the server's words.
 */
export function flushQueue(): Promise<FlushOutcome> {
  flushing ??= runFlush().finally(() => {
    flushing = null;
  });
  return flushing;
}

async function runFlush(): Promise<FlushOutcome> {
  const sent: QueuedItem[] = [];
  // Only the signed-in account's entries (listQueued shows no one else's).
  const items = (await listQueued()).filter((i) => i.status === 'waiting' || i.status === 'sending');
  for (const item of items) {
    await update({ ...item, status: 'sending' });
    try {
      await send(item);
      await discardQueued(item.id);
      sent.push(item);
    } catch (error) {
      // No answer, busy, or not signed in (yet) here: it waits for the next flush. A 409 is the same key still being stored.
      const status = error instanceof ApiError ? error.status : null;
      const later = isNetworkError(error) || (status !== null && ([401, 403, 409, 429].includes(status) || status >= 500));
      if (later) {
        await update({ ...item, status: 'waiting', problem: null });
        // No connection or no session: the rest would fail the same way.
        if (isNetworkError(error) || status === 401) break;
      } else if (status === 404 || status === 410) {
        await update({ ...item, status: 'conflict', problem: CONFLICT_WORDS });
      } else {
        const words = error instanceof ApiError ? (Object.values(error.fields)[0] ?? error.message) : 'Heatclock could not store this entry.';
        await update({ ...item, status: 'failed', problem: words });
      }
    }
  }
  return { sent, waiting: snapshot.filter((i) => i.status === 'waiting').length };
}

function subscribe(listener: () => void) {
  listeners.add(listener);
  // A store that cannot be read shows nothing waiting rather than breaking the page.
  if (listeners.size === 1) refresh().catch(() => undefined);
  return () => listeners.delete(listener);
}

/** What waits on this device, kept current as entries are queued and sent. */
export function useQueuedItems(): QueuedItem[] {
  return useSyncExternalStore(subscribe, () => snapshot, () => snapshot);
}

/** The service worker's copy of what the grower last saw (vite.config.ts names it). */
export const API_CACHE_NAME = 'heatclock-api';

/** Sign-out on a shared device: the last-seen records and the waiting entries both go. */
export async function clearOfflineData() {
  if (typeof caches !== 'undefined') await caches.delete(API_CACHE_NAME);
  await clearQueue();
}
