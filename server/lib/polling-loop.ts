/**
 * A queue drained by polling: `step` handles one due item and says whether there was one.
 * One pass at a time per loop (a kick during a pass asks for one more pass, never a second
 * loop); `concurrency` steps run side by side within a pass, their claims keeping them apart.
 */
import type { Logger } from './logger';

export interface PollingLoop {
  start(): void;
  /** Stops polling and waits for the pass in hand. */
  stop(): Promise<void>;
  /** A pass now, if started (after a commit that queued work). */
  kick(): void;
  /** Runs passes until nothing is due (tests, the demo); works whether or not started. */
  drain(): Promise<void>;
}

export function createPollingLoop(opts: { step: () => Promise<boolean>; pollMs: number; concurrency?: number; logger: Logger; name: string }): PollingLoop {
  const concurrency = opts.concurrency ?? 1;
  let timer: NodeJS.Timeout | null = null;
  let running: Promise<void> | null = null;
  let again = false;
  let started = false;
  let stopped = false;

  function run(): Promise<void> {
    if (running) {
      again = true;
      return running;
    }
    running = (async () => {
      do {
        again = false;
        await Promise.all(
          Array.from({ length: concurrency }, async () => {
            while (!stopped && (await opts.step()));
          }),
        );
      } while (again && !stopped);
    })().finally(() => {
      running = null;
    });
    return running;
  }

  const pass = () => void run().catch((err: Error) => opts.logger.error(`${opts.name} failed`, { error: err.message }));

  return {
    kick() {
      if (started && !stopped) pass();
    },
    start() {
      started = true;
      stopped = false;
      timer ??= setInterval(pass, opts.pollMs);
      timer.unref();
      pass();
    },
    async stop() {
      stopped = true;
      started = false;
      if (timer) clearInterval(timer);
      timer = null;
      await running?.catch(() => undefined);
    },
    async drain() {
      await running?.catch(() => undefined);
      await run();
    },
  };
}
