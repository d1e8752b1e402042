/**
 * Runs the processors of the garden_events outbox. Any number of instances may run a worker:
 * a row is claimed by a conditional UPDATE of its lease and the affected-row count decides who
 * won (SKIP LOCKED and GET_LOCK are node-local on Galera). Processors reload what they need by
 * garden id, so a row handled twice (a lease that ran out) does no harm.
 */
import { hostname } from 'node:os';
import { randomUUID } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import type { Sequelize } from 'sequelize';
import type { Logger } from '../lib/logger';
import { createPollingLoop } from '../lib/polling-loop';

export interface GardenEvent {
  gardenId: number;
  from: string;
  to: string;
  version: number;
}

export interface Processor {
  /** The consumer name its rows carry (one of GARDEN_EVENT_CONSUMERS). */
  name: string;
  maxAttempts?: number;
  handle(event: GardenEvent): Promise<void>;
  onFailed?(event: GardenEvent, error: Error): Promise<void>;
}

export interface Worker {
  /** Polls every pollMs until stop(). */
  start(): void;
  /** Stops polling and waits for the row in hand. */
  stop(): Promise<void>;
  /** Looks for due rows now (after a commit that recorded events); a worker not started leaves them to drain(). */
  kick(): void;
  /** Processes until no due row is left. */
  drain(): Promise<void>;
  register(processor: Processor): void;
}

export interface WorkerOptions {
  sequelize: Sequelize;
  logger: Logger;
  processors?: Processor[];
  pollMs?: number;
  /** Rows processed at once by this worker (default 6: evaluations wait on the database most of the time). */
  concurrency?: number;
  /** Renewed while a handler runs, so only a vanished worker's rows are taken over. */
  leaseMs?: number;
  /** First retry delay; doubles per attempt up to maxBackoffMs. */
  backoffMs?: number;
  maxBackoffMs?: number;
}

const DEFAULT_MAX_ATTEMPTS = 5;
const CANDIDATES = 20;

interface Claimed extends GardenEvent {
  consumer: string;
  attempts: number;
  token: string;
}

export function createWorker(opts: WorkerOptions): Worker {
  const { sequelize: db, logger } = opts;
  const pollMs = opts.pollMs ?? 1000;
  const concurrency = opts.concurrency ?? 6;
  const leaseMs = opts.leaseMs ?? 60_000;
  const backoffMs = opts.backoffMs ?? 5_000;
  const maxBackoffMs = opts.maxBackoffMs ?? 60 * 60_000;
  const processors = new Map<string, Processor>();
  const instance = `${hostname()}:${process.pid}:${randomUUID().slice(0, 8)}`;

  const register = (p: Processor) => void processors.set(p.name, p);
  opts.processors?.forEach(register);

  async function claim(): Promise<Claimed | null> {
    if (!processors.size) return null;
    const candidates = await db.query<{ consumer: string; gardenId: number }>(
      `SELECT consumer, garden_id AS gardenId FROM garden_events
        WHERE consumer IN (?) AND status = 'pending' AND run_after <= UTC_TIMESTAMP(3)
          AND (lease_until IS NULL OR lease_until < UTC_TIMESTAMP(3))
        ORDER BY run_after, garden_id LIMIT ${CANDIDATES}`,
      { replacements: [[...processors.keys()]], type: QueryTypes.SELECT },
    );
    for (const c of candidates) {
      const token = `${instance}:${randomUUID().slice(0, 8)}`;
      const [, won] = await db.query(
        `UPDATE garden_events SET lease_owner = ?, lease_until = UTC_TIMESTAMP(3) + INTERVAL ? MICROSECOND
          WHERE consumer = ? AND garden_id = ? AND status = 'pending' AND run_after <= UTC_TIMESTAMP(3)
            AND (lease_until IS NULL OR lease_until < UTC_TIMESTAMP(3))`,
        { replacements: [token, leaseMs * 1000, c.consumer, c.gardenId], type: QueryTypes.UPDATE },
      );
      if (won !== 1) continue;
      // Read after the claim: a change that landed in between is part of what this run covers.
      const [row] = await db.query<Omit<Claimed, 'token'>>(
        `SELECT consumer, garden_id AS gardenId, from_date AS \`from\`, to_date AS \`to\`, version, attempts
           FROM garden_events WHERE consumer = ? AND garden_id = ? AND lease_owner = ?`,
        { replacements: [c.consumer, c.gardenId, token], type: QueryTypes.SELECT },
      );
      if (row) return { ...row, token };
    }
    return null;
  }

  const where = 'WHERE consumer = ? AND garden_id = ? AND lease_owner = ?';
  const keyOf = (e: Claimed) => [e.consumer, e.gardenId, e.token];

  async function release(e: Claimed) {
    await db.query(`UPDATE garden_events SET lease_owner = NULL, lease_until = NULL ${where}`, { replacements: keyOf(e) });
  }

  async function succeeded(e: Claimed) {
    // A newer change (higher version) keeps the row pending, so the garden is evaluated again.
    const deleted = await db.query(`DELETE FROM garden_events ${where} AND version = ?`, {
      replacements: [...keyOf(e), e.version],
      type: QueryTypes.BULKDELETE,
    });
    if (!deleted) await release(e);
  }

  async function failed(e: Claimed, processor: Processor, error: Error) {
    const attempts = e.attempts + 1;
    const final = attempts >= (processor.maxAttempts ?? DEFAULT_MAX_ATTEMPTS);
    const delayMs = Math.min(maxBackoffMs, backoffMs * 2 ** (attempts - 1));
    // Only for the version that failed: a newer change has reset the attempts and is due now.
    const [, affected] = await db.query(
      `UPDATE garden_events SET attempts = ?, status = ?, last_error = ?,
         run_after = UTC_TIMESTAMP(3) + INTERVAL ? MICROSECOND, lease_owner = NULL, lease_until = NULL,
         updated_at = UTC_TIMESTAMP(3)
       ${where} AND version = ?`,
      {
        replacements: [attempts, final ? 'failed' : 'pending', error.message.slice(0, 1000), final ? 0 : delayMs * 1000, ...keyOf(e), e.version],
        type: QueryTypes.UPDATE,
      },
    );
    if (affected !== 1) return release(e);
    logger.warn('garden event failed', { consumer: e.consumer, gardenId: e.gardenId, attempts, final, error: error.message });
    if (final && processor.onFailed) {
      await processor.onFailed(event(e), error).catch((err: Error) =>
        logger.error('garden event onFailed failed', { consumer: e.consumer, gardenId: e.gardenId, error: err.message }),
      );
    }
  }

  const event = (e: Claimed): GardenEvent => ({ gardenId: e.gardenId, from: e.from, to: e.to, version: e.version });

  async function processOne(): Promise<boolean> {
    const e = await claim();
    if (!e) return false;
    const processor = processors.get(e.consumer)!;
    const renew = setInterval(() => {
      void db
        .query(`UPDATE garden_events SET lease_until = UTC_TIMESTAMP(3) + INTERVAL ? MICROSECOND ${where}`, {
          replacements: [leaseMs * 1000, ...keyOf(e)],
        })
        .catch(() => undefined);
    }, leaseMs / 3);
    renew.unref();
    try {
      await processor.handle(event(e));
      clearInterval(renew);
      await succeeded(e);
    } catch (err) {
      clearInterval(renew);
      await failed(e, processor, err instanceof Error ? err : new Error(String(err)));
    }
    return true;
  }

  // Several steps at once hide the database round trips; claims keep them off each other's rows.
  const loop = createPollingLoop({ step: processOne, pollMs, concurrency, logger, name: 'garden event worker' });
  return { register, ...loop };
}
