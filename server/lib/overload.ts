/**
 * Bounded concurrency for API requests. Up to `maxInFlight` run at once; up to `maxQueue` more wait
 * their turn (first come, first served) for at most `maxWaitMs`. Anything beyond is answered at
 * once with 503 and Retry-After, so past capacity latency stays bounded and memory flat instead of
 * every request slowing down together until the database pool times out.
 */
import type { RequestHandler, Response } from 'express';

export interface OverloadSettings {
  maxInFlight: number;
  maxQueue: number;
  maxWaitMs: number;
  /** Seconds the client is asked to wait before trying again. */
  retryAfterS: number;
}

function shed(res: Response, retryAfterS: number) {
  if (res.headersSent) return;
  // Closing the connection spreads the retries over the clients instead of keeping them queued here.
  res.set({ 'Retry-After': String(retryAfterS), Connection: 'close' });
  res.status(503).json({
    error: {
      code: 'overloaded',
      message: `Heatclock is busier than it can answer right now. Please try again in ${retryAfterS} seconds.`,
      requestId: res.locals.requestId as string | undefined,
    },
  });
}

export function overloadShed(settings: OverloadSettings) {
  let inFlight = 0;
  const waiting: { start: () => void; timer: NodeJS.Timeout }[] = [];

  const release = () => {
    const next = waiting.shift();
    if (next) {
      clearTimeout(next.timer);
      next.start();
    } else {
      inFlight--;
    }
  };

  const middleware: RequestHandler = (_req, res, next) => {
    let done = false;
    const finish = () => {
      if (done) return;
      done = true;
      release();
    };
    const start = () => {
      res.once('finish', finish);
      res.once('close', finish);
      next();
    };
    if (inFlight < settings.maxInFlight) {
      inFlight++;
      return start();
    }
    if (waiting.length >= settings.maxQueue) return shed(res, settings.retryAfterS);
    const entry = {
      // The slot passes straight from the finished request to this one: inFlight is unchanged.
      start,
      timer: setTimeout(() => {
        const i = waiting.indexOf(entry);
        if (i >= 0) waiting.splice(i, 1);
        shed(res, settings.retryAfterS);
      }, settings.maxWaitMs),
    };
    waiting.push(entry);
    // A client that gives up while waiting leaves the queue.
    res.once('close', () => {
      const i = waiting.indexOf(entry);
      if (i >= 0) {
        waiting.splice(i, 1);
        clearTimeout(entry.timer);
      }
    });
  };
  return Object.assign(middleware, { stats: () => ({ inFlight, waiting: waiting.length }) });
}
