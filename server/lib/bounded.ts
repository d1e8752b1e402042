/**
 * At most `concurrency` of one kind of costly work at once (password hashing), at most `queue`
 * more waiting their turn in order; beyond that the caller is refused at once with 503 and
 * Retry-After, so a flood of sign-ups or sign-ins cannot make every other request wait.
 */
import { AppError } from '../errors';

export class Bounded {
  private running = 0;
  private readonly waiting: (() => void)[] = [];

  constructor(
    private readonly concurrency: number,
    private readonly queue: number,
    private readonly what: string,
  ) {}

  /** Work waiting or running now (for tests and metrics). */
  get load(): number {
    return this.running + this.waiting.length;
  }

  async run<T>(work: () => Promise<T>): Promise<T> {
    if (this.running >= this.concurrency) {
      if (this.waiting.length >= this.queue) {
        throw new AppError(503, 'overloaded', `Too many ${this.what} at once. Please try again in 2 seconds.`, undefined, { 'Retry-After': '2' });
      }
      await new Promise<void>((resolve) => this.waiting.push(resolve));
    } else {
      this.running++;
    }
    try {
      return await work();
    } finally {
      const next = this.waiting.shift();
      if (next) next();
      else this.running--;
    }
  }
}
