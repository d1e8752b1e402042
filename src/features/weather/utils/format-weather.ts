import { countOf } from '#shared/format/count-words';

const whole = new Intl.NumberFormat('en', { maximumFractionDigits: 0 });

/** A count with its noun in the right form (the one counting helper, shared/format/count-words.ts). */
export function formatCount(n: number, one: string, many: string): string {
  return countOf(n, one, many);
}

// Dates come from the one date language, src/lib/format.ts.

/** "4 min 12 s", "850 ms" */
export function formatDuration(ms: number): string {
  if (ms < 1_000) return `${whole.format(ms)} ms`;
  const seconds = Math.round(ms / 1_000);
  if (seconds < 60) return `${seconds} s`;
  return `${Math.floor(seconds / 60)} min ${seconds % 60} s`;
}
