/** Gap rules of the weather pipeline, free of I/O so they can be tested and reused on their own. */
import { dayToken } from '#shared/format/dates';
import { addDays, daysBetween } from '#shared/thermal/dates';

export interface Gap {
  from: string;
  to: string;
  days: number;
}

export interface KnownDay {
  date: string;
  tmax: number;
  tmin: number;
}

export interface PlannedFill {
  date: string;
  tmax: number;
  tmin: number;
  source: 'filled';
  note: string;
}

/** Holes longer than this are real gaps: a straight line across them would invent weather. */
export const MAX_FILL_RUN = 2;

/** Runs of consecutive dates in [from, to] that have no value. */
export function findGaps(have: ReadonlySet<string>, from: string, to: string): Gap[] {
  const gaps: Gap[] = [];
  let start: string | null = null;
  for (let d = from; daysBetween(d, to) >= 0; d = addDays(d, 1)) {
    if (!have.has(d)) start ??= d;
    else if (start) {
      gaps.push({ from: start, to: addDays(d, -1), days: daysBetween(start, d) });
      start = null;
    }
  }
  if (start) gaps.push({ from: start, to, days: daysBetween(start, to) + 1 });
  return gaps;
}

// Fills are estimates: 0.1 °C is all the precision a straight line between two days deserves.
const tenth = (x: number) => Math.round(x * 10) / 10;

/**
 * One- and two-day holes in [from, to] between known days get a straight line between the
 * neighbours, with a note saying so; longer holes, and holes at either end, stay gaps.
 */
export function planFills(known: ReadonlyMap<string, KnownDay>, from: string, to: string): PlannedFill[] {
  const fills: PlannedFill[] = [];
  for (const gap of findGaps(new Set(known.keys()), from, to)) {
    const before = known.get(addDays(gap.from, -1));
    const after = known.get(addDays(gap.to, 1));
    if (gap.days > MAX_FILL_RUN || !before || !after) continue;
    const span = gap.days + 1;
    for (let k = 1; k <= gap.days; k++) {
      const f = k / span;
      fills.push({
        date: addDays(gap.from, k - 1),
        tmax: tenth(before.tmax + (after.tmax - before.tmax) * f),
        tmin: tenth(before.tmin + (after.tmin - before.tmin) * f),
        source: 'filled',
        note: `Linear interpolation between the readings of ${dayToken(before.date)} and ${dayToken(after.date)}`,
      });
    }
  }
  return fills;
}
