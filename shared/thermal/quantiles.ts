/**
 * Nearest-rank percentile of ascending values: the smallest value v such that at least p % of
 * the values are ≤ v. Infinity stands for "never" and yields null, as does an empty list.
 * Chosen because it reads directly as "the date by which p % of seasons/scenarios got there".
 */
export function nearestRank(sortedAscending: readonly number[], p: number): number | null {
  const n = sortedAscending.length;
  if (n === 0) return null;
  const rank = Math.max(1, Math.ceil((p / 100) * n));
  const v = sortedAscending[rank - 1];
  return Number.isFinite(v) ? v : null;
}

export function median(values: readonly number[]): number {
  const s = [...values].sort((a, b) => a - b);
  const mid = s.length >> 1;
  return s.length % 2 ? s[mid] : (s[mid - 1] + s[mid]) / 2;
}
