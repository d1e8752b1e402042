/**
 * Calendar arithmetic on 'YYYY-MM-DD' strings through day numbers (days since 1970-01-01),
 * never through `new Date()`, so no time zone can shift a date (STYLE: calendar dates stay strings).
 * Civil-from-days conversion after Howard Hinnant's public-domain algorithms.
 */

export interface CivilDate {
  year: number;
  month: number;
  day: number;
}

export function isLeapYear(year: number): boolean {
  return (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0;
}

export function daysInMonth(year: number, month: number): number {
  if (month === 2) return isLeapYear(year) ? 29 : 28;
  return [4, 6, 9, 11].includes(month) ? 30 : 31;
}

function digits(s: string, from: number, to: number): number {
  let v = 0;
  for (let k = from; k < to; k++) {
    const c = s.charCodeAt(k) - 48;
    if (c < 0 || c > 9) return NaN;
    v = v * 10 + c;
  }
  return v;
}

/** Hand-rolled rather than a RegExp: history loads parse tens of thousands of dates. */
export function parseIsoDate(date: string, name = 'date'): CivilDate {
  const ok = typeof date === 'string' && date.length === 10 && date[4] === '-' && date[7] === '-';
  const year = ok ? digits(date, 0, 4) : NaN;
  const month = ok ? digits(date, 5, 7) : NaN;
  const day = ok ? digits(date, 8, 10) : NaN;
  if (Number.isNaN(year + month + day)) throw new RangeError(`${name} (${String(date)}) is not a YYYY-MM-DD date`);
  if (month < 1 || month > 12 || day < 1 || day > daysInMonth(year, month)) {
    throw new RangeError(`${name} (${date}) is not a calendar date`);
  }
  return { year, month, day };
}

export function civilToDayNumber({ year, month, day }: CivilDate): number {
  const y = month <= 2 ? year - 1 : year;
  const era = Math.floor(y / 400);
  const yoe = y - era * 400;
  const mp = (month + 9) % 12;
  const doy = Math.floor((153 * mp + 2) / 5) + day - 1;
  const doe = yoe * 365 + Math.floor(yoe / 4) - Math.floor(yoe / 100) + doy;
  return era * 146097 + doe - 719468;
}

export function dayNumberToCivil(n: number): CivilDate {
  const z = n + 719468;
  const era = Math.floor(z / 146097);
  const doe = z - era * 146097;
  const yoe = Math.floor((doe - Math.floor(doe / 1460) + Math.floor(doe / 36524) - Math.floor(doe / 146096)) / 365);
  const doy = doe - (365 * yoe + Math.floor(yoe / 4) - Math.floor(yoe / 100));
  const mp = Math.floor((5 * doy + 2) / 153);
  const day = doy - Math.floor((153 * mp + 2) / 5) + 1;
  const month = mp < 10 ? mp + 3 : mp - 9;
  return { year: yoe + era * 400 + (month <= 2 ? 1 : 0), month, day };
}

const TWO = Array.from({ length: 32 }, (_, k) => (k < 10 ? `0${k}` : String(k)));

export function formatIsoDate({ year, month, day }: CivilDate): string {
  return `${year >= 1000 ? year : String(year).padStart(4, '0')}-${TWO[month]}-${TWO[day]}`;
}

export function toDayNumber(date: string, name = 'date'): number {
  return civilToDayNumber(parseIsoDate(date, name));
}

export function fromDayNumber(n: number): string {
  return formatIsoDate(dayNumberToCivil(n));
}

export function addDays(date: string, days: number): string {
  return fromDayNumber(toDayNumber(date) + days);
}

/** Whole days from `from` to `to` (positive when `to` is later). */
export function daysBetween(from: string, to: string): number {
  return toDayNumber(to, 'to') - toDayNumber(from, 'from');
}

/** Day of year, 1 = January 1. */
export function dayOfYear(date: string): number {
  return dayOfYearOfDayNumber(toDayNumber(date));
}

export function dayOfYearOfDayNumber(n: number): number {
  return n - civilToDayNumber({ year: dayNumberToCivil(n).year, month: 1, day: 1 }) + 1;
}

/**
 * The same month and day in another year; February 29 becomes February 28 where the other
 * year has none, so an analog year never skips its start.
 */
export function sameDayInYear(date: CivilDate, year: number): CivilDate {
  const day = date.month === 2 && date.day === 29 && !isLeapYear(year) ? 28 : date.day;
  return { year, month: date.month, day };
}
