import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { parseRetryAfter } from '@/lib/api-client';
import { formatDayMonth, formatDayWindow, formatDegreeDays, formatElevation, formatHeat, formatLocation, formatReady, formatTemp, formatWait } from '@/lib/format';
import { parseId } from '@/lib/ids';
import { safeNextPath, signInPathFor } from '@/lib/safe-redirect';

describe('Retry-After', () => {
  it('when given delta-seconds, then returns them', () => {
    expect(parseRetryAfter('120')).toBe(120);
  });

  it('when given an HTTP date, then returns the seconds until it, rounded up', () => {
    const now = Date.parse('2025-05-01T12:00:00Z');
    expect(parseRetryAfter('Thu, 01 May 2025 12:00:30 GMT', now)).toBe(30);
  });

  it('when missing or garbled, then returns undefined', () => {
    expect(parseRetryAfter(null)).toBeUndefined();
    expect(parseRetryAfter('soon')).toBeUndefined();
  });
});

describe('wording and units', () => {
  it('when a wait is under a minute, then it is in seconds; otherwise whole minutes rounded up', () => {
    expect(formatWait(1)).toBe('1 second');
    expect(formatWait(45)).toBe('45 seconds');
    expect(formatWait(60)).toBe('1 minute');
    expect(formatWait(61)).toBe('2 minutes');
  });

  it('when coordinates are negative, then they read as south and west with degree signs', () => {
    expect(formatLocation({ latitude: -33.4489, longitude: -70.6693 })).toBe('33.4489° S, 70.6693° W');
    expect(formatLocation({ latitude: null, longitude: 10 })).toBeNull();
  });

  it('when elevation is known, then it carries metres', () => {
    expect(formatElevation(1520)).toBe('1,520 m');
    expect(formatElevation(null)).toBeNull();
    // 1 ft = 0.3048 m exactly (NIST Handbook 44, Appendix C): 1,520 m is 4,987 ft.
    expect(formatElevation(1520, 'F')).toBe('4,987 ft');
  });
});

describe('heat and dates', () => {
  // This file runs without a DOM; the reader's languages are those of an en-US browser.
  beforeEach(() => vi.stubGlobal('navigator', { languages: ['en-US'] }));
  afterEach(() => vi.unstubAllGlobals());

  it('when degree days are shown, then they carry their one unit and whole numbers, or tenths for a single day', () => {
    expect(formatDegreeDays(1204.4, 'F')).toBe('1,204 °F-days');
    expect(formatDegreeDays(12.44, 'C', 1)).toBe('12.4 °C-days');
    expect(formatHeat(412.2, 950, 43.4, 'F')).toBe('412 of 950 °F-days (43 %)');
    expect(formatHeat(233.5, null, null, 'C')).toBe('234 °C-days');
    expect(formatTemp(-1.5, 'C')).toBe('−1.5 °C');
  });

  it('when a date is written, then it is the calendar day of the string, in the browser language (en-US here)', () => {
    expect(formatDayMonth('2025-06-14')).toBe('Jun 14');
    expect(formatDayMonth('2025-01-01')).toBe('Jan 1');
    expect(formatDayWindow('2025-06-14', '2025-06-22')).toBe('Jun 14–22');
    expect(formatDayWindow('2025-05-28', '2025-06-03')).toBe('May 28\u2009–\u2009Jun 3');
    expect(formatDayWindow('2025-06-18', '2025-06-18')).toBe('Jun 18');
  });

  it('when a maturity window has a source, then it reads in words by that source', () => {
    expect(formatReady({ p10: '2025-06-14', p50: '2025-06-18', p90: '2025-06-22', kind: 'analog' })).toBe('Likely ready Jun 14–22');
    expect(formatReady({ p10: '2025-05-31', p50: '2025-05-31', p90: '2025-05-31', kind: 'observed' })).toBe('Target reached May 31');
    expect(formatReady({ p10: null, p50: null, p90: null, kind: 'none' })).toBe('No maturity window yet');
  });
});

describe('addresses', () => {
  it('when next is off-site or odd, then sign-in goes home instead', () => {
    expect(safeNextPath('/g/3/settings')).toBe('/g/3/settings');
    for (const bad of ['//evil.example', 'https://evil.example', '/\\evil.example', '', null]) {
      expect(safeNextPath(bad)).toBe('/');
    }
  });

  it('when sending a visitor to sign in, then the page they wanted travels along', () => {
    expect(signInPathFor({ pathname: '/g/3', search: '?x=1' })).toBe('/sign-in?next=%2Fg%2F3%3Fx%3D1');
    expect(signInPathFor({ pathname: '/', search: '' })).toBe('/sign-in');
  });

  it('when a route id is not a positive whole number, then it names no record', () => {
    expect(parseId('12')).toBe(12);
    for (const bad of ['0', '-1', '1.5', 'abc', '01', undefined]) expect(parseId(bad)).toBeNull();
  });
});
