/**
 * Answers of garden reads kept in this process, keyed by what they were made from: the garden,
 * its change counters as this request's access check read them (GardenMembership.revision), its
 * calendar day and the request's own query. A change anywhere moves a counter in the change's
 * transaction (progress-invalidation.ts, weather-events.ts, the alerts repository), so the next
 * request on any instance reads the new revision and misses; nothing is ever served past a change
 * that committed before the request began. Least recently used answers go first past `maxBytes`.
 */
import type { Request, Response } from 'express';

export class ReadCache {
  private readonly entries = new Map<string, string>();
  private bytes = 0;
  hits = 0;
  misses = 0;

  constructor(private readonly maxBytes = 64 * 1024 * 1024) {}

  get(key: string): string | undefined {
    const body = this.entries.get(key);
    if (body === undefined) return undefined;
    // Refresh its place: Map keeps insertion order, the first key is the least recently used.
    this.entries.delete(key);
    this.entries.set(key, body);
    return body;
  }

  set(key: string, body: string) {
    const old = this.entries.get(key);
    if (old !== undefined) {
      this.bytes -= old.length;
      this.entries.delete(key);
    }
    if (body.length > this.maxBytes / 4) return;
    this.entries.set(key, body);
    this.bytes += body.length;
    for (const [k, v] of this.entries) {
      if (this.bytes <= this.maxBytes) break;
      this.entries.delete(k);
      this.bytes -= v.length;
    }
  }

  /**
   * Sends the answer for this garden read from the cache, or makes it with `make`, sends and keeps
   * it. `day` is the garden's today (answers change at its midnight). An answer that also
   * depends on something the counters do not follow (`keep` false) is sent but not kept.
   */
  async send<T>(req: Request, res: Response, name: string, day: string, make: () => Promise<T>, keep: (value: T) => boolean = () => true) {
    const m = req.membership!;
    const key = `${name}|${m.gardenId}|${m.revision}|${day}|${req.originalUrl}`;
    let body = this.get(key);
    if (body === undefined) {
      this.misses++;
      const value = await make();
      body = JSON.stringify(value);
      if (keep(value)) this.set(key, body);
    } else {
      this.hits++;
    }
    res.type('application/json').send(body);
  }
}
