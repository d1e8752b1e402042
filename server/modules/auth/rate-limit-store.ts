import { createHash } from 'node:crypto';
import type { Store, Options, ClientRateLimitInfo } from 'express-rate-limit';
import type { Sequelize } from 'sequelize';

/**
 * express-rate-limit store kept in MariaDB, so every app instance behind a load balancer
 * counts the same attempts. Keys are hashed: e-mail addresses never sit in this table.
 */
export class MariaDbRateLimitStore implements Store {
  windowMs = 60_000;
  readonly localKeys = false;
  readonly prefix: string;

  constructor(
    private readonly sequelize: Sequelize,
    prefix: string,
  ) {
    this.prefix = prefix;
  }

  init(options: Options) {
    this.windowMs = options.windowMs;
  }

  private hash(key: string) {
    return createHash('sha256').update(this.prefix + key).digest('hex');
  }

  async get(key: string): Promise<ClientRateLimitInfo | undefined> {
    const [rows] = (await this.sequelize.query(
      'SELECT hits, reset_at AS resetAt FROM rate_limits WHERE key_hash = ? AND reset_at > UTC_TIMESTAMP(3)',
      { replacements: [this.hash(key)] },
    )) as [Array<{ hits: number; resetAt: Date }>, unknown];
    const row = rows[0];
    return row ? { totalHits: Number(row.hits), resetTime: new Date(row.resetAt) } : undefined;
  }

  async increment(key: string): Promise<ClientRateLimitInfo> {
    const k = this.hash(key);
    const ms = Math.round(this.windowMs) * 1000; // MariaDB INTERVAL takes microseconds
    // Both assignments read the old reset_at, so an expired window restarts at one hit.
    await this.sequelize.query(
      `INSERT INTO rate_limits (key_hash, hits, reset_at)
         VALUES (?, 1, UTC_TIMESTAMP(3) + INTERVAL ? MICROSECOND)
       ON DUPLICATE KEY UPDATE
         hits = IF(reset_at <= UTC_TIMESTAMP(3), 1, hits + 1),
         reset_at = IF(reset_at <= UTC_TIMESTAMP(3), UTC_TIMESTAMP(3) + INTERVAL ? MICROSECOND, reset_at)`,
      { replacements: [k, ms, ms] },
    );
    return (await this.get(key)) ?? { totalHits: 1, resetTime: new Date(Date.now() + this.windowMs) };
  }

  async decrement(key: string): Promise<void> {
    await this.sequelize.query('UPDATE rate_limits SET hits = GREATEST(hits - 1, 0) WHERE key_hash = ?', {
      replacements: [this.hash(key)],
    });
  }

  async resetKey(key: string): Promise<void> {
    await this.sequelize.query('DELETE FROM rate_limits WHERE key_hash = ?', { replacements: [this.hash(key)] });
  }
}
