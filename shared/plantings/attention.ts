/**
 * Two things a "Growing" badge alone hides, worded the same on every page (plantings list,
 * planting page, Today): a harvest past its expected window, and a planting nobody has written
 * about for weeks. Both come from this one rule; the server adds them to its answers.
 */
import { addDays, daysBetween } from '../thermal/dates';

/** Three weeks without a log entry or a stage date: common practice, no source (a weekly round missed twice). */
export const STALE_AFTER_DAYS = 21;

/**
 * A target reached in recorded weather or in the forecast is a single day, not a window: a week
 * past it without a harvest is overdue (common practice, no source). A projected window is
 * overdue the day after its late end (p90).
 */
export const OVERDUE_AFTER_READY_DAYS = 7;

export interface AttentionInput {
  status: string;
  firstHarvestOn: string | null;
  /** Every date the grower recorded: the planting's stage dates and its latest log entry. */
  recordedOn: (string | null)[];
  maturity: { p10: string | null; p50: string | null; p90: string | null; kind: string } | null;
}

export interface AttentionDto {
  /** Harvest expected by `due` and none recorded; `days` past it. */
  overdue: { due: string; days: number } | null;
  /** Nothing recorded since `lastOn`, `days` ago. (A growing planting always has a start date on record.) */
  stale: { lastOn: string; days: number } | null;
}

export const NO_ATTENTION: AttentionDto = { overdue: null, stale: null };

/** The day by which a growing planting should have given a first harvest, or null when none is expected. */
export function harvestDue(maturity: AttentionInput['maturity']): string | null {
  if (!maturity) return null;
  if (maturity.kind === 'analog') return maturity.p90 ?? maturity.p50;
  if (maturity.kind === 'observed' || maturity.kind === 'forecast') {
    const ready = maturity.p50 ?? maturity.p10;
    return ready ? addDays(ready, OVERDUE_AFTER_READY_DAYS) : null;
  }
  return null; // recorded (a harvest is on record) or no window at all
}

/** What needs a look, for a planting in the garden's `today`. Only growing plantings are flagged. */
export function plantingAttention(p: AttentionInput, today: string): AttentionDto {
  if (p.status !== 'growing') return NO_ATTENTION;
  let overdue: AttentionDto['overdue'] = null;
  const due = p.firstHarvestOn ? null : harvestDue(p.maturity);
  if (due && today > due) overdue = { due, days: daysBetween(due, today) };
  const recorded = p.recordedOn.filter((d): d is string => d !== null && d <= today);
  const lastOn = recorded.length ? recorded.reduce((a, b) => (a > b ? a : b)) : null;
  let stale: AttentionDto['stale'] = null;
  if (lastOn && daysBetween(lastOn, today) > STALE_AFTER_DAYS) stale = { lastOn, days: daysBetween(lastOn, today) };
  return { overdue, stale };
}
