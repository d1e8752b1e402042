import { civilToDayNumber, fromDayNumber, parseIsoDate } from './dates';
import type { CivilDate } from './dates';

export interface Season {
  /** '2025' north of the equator, '2025–26' south of it. */
  label: string;
  /** First and last calendar day, 'YYYY-MM-DD'. */
  start: string;
  end: string;
  /** Calendar year in which the season starts. */
  startYear: number;
}

/**
 * Growing seasons are hemisphere-aware: north of the equator (and on it) Jan 1 – Dec 31;
 * south of it Jul 1 – Jun 30, so one southern summer is never split (PRODUCT brief).
 */
export function isSouthern(latitude: number): boolean {
  if (!Number.isFinite(latitude) || latitude < -90 || latitude > 90) {
    throw new RangeError(`latitude (${latitude}) is outside −90…90`);
  }
  return latitude < 0;
}

export function seasonOfYear(startYear: number, latitude: number): Season {
  if (!isSouthern(latitude)) {
    return { label: String(startYear), start: `${startYear}-01-01`, end: `${startYear}-12-31`, startYear };
  }
  const next = String((startYear + 1) % 100).padStart(2, '0');
  return {
    label: `${startYear}–${next}`,
    start: `${startYear}-07-01`,
    end: `${startYear + 1}-06-30`,
    startYear,
  };
}

export function seasonStartYear(date: CivilDate, latitude: number): number {
  return isSouthern(latitude) && date.month < 7 ? date.year - 1 : date.year;
}

/** The growing season a calendar date belongs to at a latitude. */
export function seasonOf(date: string, latitude: number): Season {
  return seasonOfYear(seasonStartYear(parseIsoDate(date), latitude), latitude);
}

/**
 * A fixed 366-slot ordinal for a month-day within the season (0 = first day), counting
 * February 29 as its own slot, so the same month-day compares equal across leap and common years.
 */
export function seasonOrdinal(month: number, day: number, latitude: number): number {
  const south = isSouthern(latitude);
  // 2000 is a leap year: Jan 1 2000 anchors the north, Jul 1 1999 the south (its Feb 29 is 2000's).
  const anchorYear = south ? (month >= 7 ? 1999 : 2000) : 2000;
  const start = south ? civilToDayNumber({ year: 1999, month: 7, day: 1 }) : civilToDayNumber({ year: 2000, month: 1, day: 1 });
  return civilToDayNumber({ year: anchorYear, month, day }) - start;
}

/** Inverse of seasonOrdinal: 'MM-DD'. */
export function monthDayOfOrdinal(ordinal: number, latitude: number): string {
  const start = isSouthern(latitude) ? civilToDayNumber({ year: 1999, month: 7, day: 1 }) : civilToDayNumber({ year: 2000, month: 1, day: 1 });
  return fromDayNumber(start + ordinal).slice(5);
}
