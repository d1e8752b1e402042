/**
 * Answers of garden reads kept in this process, keyed by what they were made from: the garden,
 * its change counters as this request's access check read them (GardenMembership.revision), its
 * calendar day and the request's own query. A change anywhere moves a counter in the change's
 * transaction (progress-invalidation.ts, weather-events.ts, the alerts repository), so the next
 * request on any instance reads the new revision and misses; nothing is ever served past a change
 * that committed before the request began. Least recently used answers go first past `maxBytes`.
 */
import { createHash } from 'node:crypto';
import { brotliCompressSync, constants } from 'node:zlib';
import { resolveDates } from '#shared/format/dates';
import { requestLocale, requestToday } from './locale';
import type { Request, Response } from 'express';
import { localDate } from './local-date';

interface Entry {
  body: Buffer;
  etag: string;
  /** Made the first time a client that accepts brotli asks, then kept with the answer. */
  br?: Buffer;
}

/** Below this, compressing costs more than it saves (the compression middleware's threshold too). */
const COMPRESS_FROM = 1024;

function entryOf(json: string): Entry {
  const body = Buffer.from(json);
  return { body, etag: `W/"${createHash('sha1').update(body).digest('base64url').slice(0, 27)}"` };
}

export class ReadCache {
  private readonly entries = new Map<string, Entry>();
  private bytes = 0;
  hits = 0;
  misses = 0;

  /** `now`: the clock every garden's "today" is read from (the weather service's, so tests can move it). */
  constructor(
    private readonly now: () => Date = () => new Date(),
    private readonly maxBytes = 64 * 1024 * 1024,
  ) {}

  private get(key: string): Entry | undefined {
    const entry = this.entries.get(key);
    if (entry === undefined) return undefined;
    // Refresh its place: Map keeps insertion order, the first key is the least recently used.
    this.entries.delete(key);
    this.entries.set(key, entry);
    return entry;
  }

  private set(key: string, entry: Entry) {
    const old = this.entries.get(key);
    if (old !== undefined) {
      this.bytes -= sizeOf(old);
      this.entries.delete(key);
    }
    if (entry.body.length > this.maxBytes / 4) return;
    this.entries.set(key, entry);
    this.bytes += sizeOf(entry);
    this.evict();
  }

  private evict() {
    for (const [k, v] of this.entries) {
      if (this.bytes <= this.maxBytes) break;
      this.entries.delete(k);
      this.bytes -= sizeOf(v);
    }
  }

  /**
   * Sends the answer for this garden read from the cache, or makes it with `make`, sends and keeps
   * it. Answers change at the garden's midnight: its day is part of the key.
   */
  async send<T>(req: Request, res: Response, name: string, make: () => Promise<T>) {
    await this.serve(req, res, name, async () => ({ json: JSON.stringify(await make()), keep: true }));
  }

  /** As `send`, for an answer that is already JSON text (a stored progress answer). */
  async sendText(req: Request, res: Response, name: string, make: () => Promise<string>) {
    await this.serve(req, res, name, async () => ({ json: await make(), keep: true }));
  }

  /**
   * The value made for this read, kept like an answer, for a route that adds something the
   * counters do not follow before it answers (the weather page's history status).
   */
  async remember<T>(req: Request, name: string, make: () => Promise<T>): Promise<T> {
    const key = this.keyOf(req, name);
    const entry = this.get(key);
    if (entry) {
      this.hits++;
      return JSON.parse(entry.body.toString()) as T;
    }
    this.misses++;
    const value = await make();
    this.set(key, entryOf(JSON.stringify(value)));
    return value;
  }

  private keyOf(req: Request, name: string) {
    const m = req.membership!;
    return `${name}|${m.gardenId}|${m.revision}|${localDate(m.garden.timeZone, this.now())}|${requestLocale()}|${req.originalUrl}`;
  }

  private async serve(req: Request, res: Response, name: string, make: () => Promise<{ json: string; keep: boolean }>) {
    const key = this.keyOf(req, name);
    let entry = this.get(key);
    if (entry === undefined) {
      this.misses++;
      const made = await make();
      entry = entryOf(resolveDates(made.json, requestLocale(), requestToday()));
      if (made.keep) this.set(key, entry);
    } else {
      this.hits++;
    }
    res.type('application/json');
    // The same answer again is a 304 (the client revalidates; API answers are never stored).
    res.set('ETag', entry.etag);
    // Dates in server-made sentences follow the reader's language (lib/locale.ts).
    res.vary('Accept-Language');
    if (req.fresh) {
      res.status(304).end();
      return;
    }
    if (entry.body.length >= COMPRESS_FROM && req.acceptsEncodings('br', 'identity') === 'br') {
      if (!entry.br) {
        entry.br = brotliCompressSync(entry.body, { params: { [constants.BROTLI_PARAM_QUALITY]: 5 } });
        if (this.entries.get(key) === entry) {
          this.bytes += entry.br.length;
          this.evict();
        }
      }
      res.set('Content-Encoding', 'br');
      res.vary('Accept-Encoding');
      res.send(entry.br);
      return;
    }
    res.send(entry.body);
  }
}

const sizeOf = (e: Entry) => e.body.length + (e.br?.length ?? 0);
