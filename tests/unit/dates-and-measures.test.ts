import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { dayInContext, dayMonth, dayRange, fullDate, fullRange, weekdayDayMonth } from '#shared/format/dates';
import {
  CM_PER_INCH,
  KG_PER_POUND,
  M_PER_FOOT,
  formatMeasure,
  formatPounds,
  massInKg,
  measureSymbol,
  toShown,
  toStored,
  unitSystemOf,
} from '#shared/units/measures';
import type { MeasureKind, UnitSystem } from '#shared/units/measures';
import { formatHarvest } from '@/features/plantings/components/format-harvest';
import { alertHistory, formatAlertSpan } from '@/features/alerts/utils/alert-dates';
import type { AlertDto } from '#shared/schemas/alerts';

/** What Intl itself writes for a range of calendar days read at UTC: the expectation, computed apart. */
function intlRange(locale: string, from: [number, number, number], to: [number, number, number], options: Intl.DateTimeFormatOptions): string {
  const at = ([y, m, d]: [number, number, number]) => new Date(Date.UTC(y, m - 1, d));
  return new Intl.DateTimeFormat(locale, { ...options, timeZone: 'UTC' }).formatRange(at(from), at(to));
}

describe('dates in the reader’s language', () => {
  it('when a day is written in en-GB, then the day comes before the month; in en-US after it', () => {
    expect(dayMonth('2026-06-14', 'en-GB')).toBe('14 Jun');
    expect(dayMonth('2026-06-14', 'en-US')).toBe('Jun 14');
    expect(fullDate('2026-06-14', 'en-GB')).toBe('14 Jun 2026');
    expect(fullDate('2026-06-14', 'en-US')).toBe('Jun 14, 2026');
    expect(weekdayDayMonth('2026-06-14', 'en-GB')).toBe('Sun 14 Jun');
    expect(weekdayDayMonth('2026-06-14', 'en-US')).toBe('Sun, Jun 14');
  });

  it('when a range stays in one month, then the dash closes up between the days', () => {
    expect(dayRange('2026-06-14', '2026-06-22', 'en-GB')).toBe('14–22 Jun');
    expect(dayRange('2026-06-14', '2026-06-22', 'en-US')).toBe('Jun 14–22');
    expect(fullRange('2026-06-14', '2026-06-22', 'en-GB')).toBe('14–22 Jun 2026');
    expect(dayRange('2026-06-18', '2026-06-18', 'en-GB')).toBe('18 Jun');
  });

  it('when a range crosses a month, then it reads as Intl writes it', () => {
    for (const locale of ['en-GB', 'en-US']) {
      expect(dayRange('2026-05-28', '2026-06-03', locale)).toBe(intlRange(locale, [2026, 5, 28], [2026, 6, 3], { day: 'numeric', month: 'short' }));
    }
  });

  it('when a southern summer’s range crosses the new year, then both ends carry their own year, spaced as Intl spaces them', () => {
    const options: Intl.DateTimeFormatOptions = { day: 'numeric', month: 'short', year: 'numeric' };
    for (const locale of ['en-GB', 'en-US']) {
      const written = fullRange('2026-12-28', '2027-01-03', locale);
      expect(written).toBe(intlRange(locale, [2026, 12, 28], [2027, 1, 3], options));
      expect(written).toMatch(/2026.*2027/u);
    }
    // The dash between "2026" and "3 Jan" joins two dates, not two days of one month.
    expect(fullRange('2026-12-28', '2027-01-03', 'en-GB')).not.toMatch(/2026–3/u);
  });

  it('when a day lies in another year than today, then its year is written; in the same year it is not', () => {
    expect(dayInContext('2026-03-02', '2026-11-20', 'en-GB')).toBe('2 Mar');
    expect(dayInContext('2025-03-02', '2026-11-20', 'en-GB')).toBe('2 Mar 2025');
    expect(dayInContext('2027-01-03', '2026-12-30', 'en-US')).toBe('Jan 3, 2027');
  });

  it('when the process runs in any time zone, then a calendar day is never moved to the day before or after', () => {
    // Read at UTC from its own parts: under TZ=Pacific/Kiritimati (UTC+14) or Pacific/Pago_Pago
    // (UTC−11) a `new Date('2026-01-01')` would print 1 Jan or 31 Dec; these must not.
    expect(fullDate('2026-01-01', 'en-GB')).toBe('1 Jan 2026');
    expect(fullDate('2026-12-31', 'en-GB')).toBe('31 Dec 2026');
    expect(() => fullDate('2026-1-1', 'en-GB')).toThrow(RangeError);
  });

  it('when the language tag is malformed, then the default wording is used instead of failing', () => {
    expect(dayMonth('2026-06-14', 'not a tag!')).toBe('14 Jun');
  });
});

describe('lengths, areas and masses in the garden’s units', () => {
  it('when converting, then the factors are the exact international ones (NIST Handbook 44, Appendix C)', () => {
    expect(CM_PER_INCH).toBe(2.54);
    expect(M_PER_FOOT).toBe(0.3048);
    expect(KG_PER_POUND).toBe(0.45359237);
    expect(toShown('spacing', 2.54, 'us')).toBe(1);
    expect(toShown('bed', 0.3048, 'us')).toBe(1);
    expect(toShown('mass', 0.45359237, 'us')).toBe(1);
    expect(massInKg(1, 'lb')).toBe(0.45359237);
    expect(massInKg(16, 'oz')).toBeCloseTo(0.45359237, 12);
    expect(massInKg(250, 'g')).toBe(0.25);
    expect(massInKg(3, 'bunches')).toBeNull();
  });

  it('when a garden reads °F, then it measures in US units; °C in metric', () => {
    expect(unitSystemOf('F')).toBe('us');
    expect(unitSystemOf('C')).toBe('metric');
    expect(['bed', 'spacing', 'area', 'mass'].map((k) => measureSymbol(k as MeasureKind, 'us'))).toEqual(['ft', 'in', 'sq ft', 'lb']);
    expect(['bed', 'spacing', 'area', 'mass'].map((k) => measureSymbol(k as MeasureKind, 'metric'))).toEqual(['m', 'cm', 'm²', 'kg']);
  });

  it('when a stored value goes to a form and back, then it returns within 0.05 of a shown unit', () => {
    // Areas are worked out from length × width and never typed, so they have no form to go through.
    const cases: [MeasureKind, number[]][] = [
      ['bed', [0.1, 1.2, 3.048, 12.7, 999.9]],
      ['spacing', [0.5, 2.5, 30, 45.7]],
      ['mass', [0.01, 0.45359237, 1.25, 20]],
    ];
    for (const system of ['us', 'metric'] as UnitSystem[]) {
      for (const [kind, values] of cases) {
        for (const stored of values) {
          const back = toStored(kind, toShown(kind, stored, system), system);
          const shownUnit = toStored(kind, 1, system);
          expect(Math.abs(back - stored) / shownUnit, `${kind} ${stored} in ${system}`).toBeLessThanOrEqual(0.05);
        }
      }
    }
  });

  it('when a value is typed in feet, then it is stored as the metres it names', () => {
    expect(toStored('bed', 10, 'us')).toBe(3.048);
    expect(toStored('bed', 4, 'us')).toBe(1.2192);
    expect(toStored('bed', 1.5, 'metric')).toBe(1.5);
  });

  it('when a mass is shown in pounds, then it reads in pounds and whole ounces', () => {
    expect(formatPounds(1)).toBe('2 lb 3 oz');
    expect(formatPounds(0.45359237)).toBe('1 lb');
    expect(formatPounds(0.1)).toBe('4 oz');
    expect(formatMeasure('mass', 1.25, 'metric')).toBe('1.25 kg');
    expect(formatMeasure('mass', 1, 'us')).toBe('2 lb 3 oz');
  });

  it('when an area is shown in square feet, then 10 m² is about 108 sq ft', () => {
    expect(formatMeasure('area', 10, 'us')).toBe('108 sq ft');
    expect(toShown('area', 10, 'us')).toBeCloseTo(107.639, 0);
    expect(formatMeasure('area', 3.72, 'us')).toBe('40 sq ft');
    expect(formatMeasure('area', 3.72, 'metric')).toBe('3.7 m²');
  });
});

describe('harvest amounts in the log', () => {
  it('when a °F garden logged a mass in any unit, then it reads in pounds and ounces', () => {
    expect(formatHarvest(1, 'kg', 'us')).toBe('2 lb 3 oz');
    expect(formatHarvest(250, 'g', 'us')).toBe('9 oz');
    expect(formatHarvest(2, 'lb', 'us')).toBe('2 lb');
  });

  it('when a °C garden logged a mass, then it reads in kilograms, with grams under a kilogram kept', () => {
    expect(formatHarvest(1.25, 'kg', 'metric')).toBe('1.25 kg');
    expect(formatHarvest(2, 'lb', 'metric')).toBe('0.91 kg');
    expect(formatHarvest(250, 'g', 'metric')).toBe('250 g');
    expect(formatHarvest(1500, 'g', 'metric')).toBe('1.5 kg');
  });

  it('when a harvest is counted or too small to be an ounce, then it stays as typed', () => {
    expect(formatHarvest(12, 'count', 'us')).toBe('12 pieces');
    expect(formatHarvest(3, 'bunches', 'metric')).toBe('3 bunches');
    expect(formatHarvest(5, 'g', 'us')).toBe('5 g');
  });
});

describe('alert dates in the garden’s calendar', () => {
  beforeEach(() => {
    vi.stubGlobal('navigator', { languages: ['en-GB'] });
    vi.useFakeTimers({ toFake: ['Date'] });
    // Already 1 Jan 2027 in Melbourne, still 31 Dec 2026 in UTC.
    vi.setSystemTime(new Date('2026-12-31T20:00:00Z'));
  });
  afterEach(() => {
    vi.useRealTimers();
    vi.unstubAllGlobals();
  });

  it('when an alert lies in the garden’s current year, then its days carry no year; from last year they carry theirs', () => {
    expect(formatAlertSpan({ startsOn: '2027-01-01', endsOn: '2027-01-03' }, 'Australia/Melbourne')).toBe('For 1–3 Jan');
    expect(formatAlertSpan({ startsOn: '2026-12-30', endsOn: '2026-12-30' }, 'Australia/Melbourne')).toBe('On 30 Dec 2026');
    expect(formatAlertSpan({ startsOn: '2026-12-31', endsOn: null }, 'Australia/Melbourne')).toBe('From 31 Dec 2026');
    // In UTC it is still 2026 there, so the same day needs no year.
    expect(formatAlertSpan({ startsOn: '2026-12-31', endsOn: null }, 'UTC')).toBe('From 31 Dec');
  });

  it('when an alert was raised late on 31 Dec in UTC, then it reads as raised on the garden’s own day', () => {
    const alert = { createdAt: '2026-12-31T14:30:00.000Z', acknowledgedAt: null, acknowledgedBy: null, resolvedAt: null } as AlertDto;
    expect(alertHistory(alert, 'Australia/Melbourne')).toEqual(['Raised 1 Jan']);
    expect(alertHistory(alert, 'UTC')).toEqual(['Raised 31 Dec']);
  });
});

describe('date tokens in stored text', () => {
  it('when stored text is read, then a day of this year reads without its year, another year’s with it, and a day of any year never with one', async () => {
    const { dayToken, monthDayToken, rangeToken, resolveDates } = await import('#shared/format/dates');
    const text = `sown ${dayToken('2026-06-14')}, last year ${dayToken('2025-06-14')}, window ${monthDayToken('09-20')} to ${monthDayToken('02-29')}, spell ${rangeToken('2026-06-14', '2026-06-22')}`;
    expect(resolveDates(text, 'en-GB', '2026-12-02')).toBe('sown 14 Jun, last year 14 Jun 2025, window 20 Sept to 29 Feb, spell 14–22 Jun');
    expect(resolveDates(text, 'en-US', '2026-12-02')).toBe('sown Jun 14, last year Jun 14, 2025, window Sep 20 to Feb 29, spell Jun 14–22');
    // Not a real day: left as it was, never rolled over to another day.
    expect(resolveDates('⟦2026-02-30⟧', 'en-GB', '2026-12-02')).toBe('⟦2026-02-30⟧');
  });
});
