import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { cDaysToFDays, dailyDegreeDays, fToC } from '#shared/thermal';
import type { Cutoff, DegreeDayMethodName } from '#shared/thermal';
import { readCsv, validationDir } from './thermal-fixtures';

const METHOD: Record<string, DegreeDayMethodName> = {
  sngsine: 'single-sine',
  dblsine: 'double-sine',
  sngtri: 'single-triangle',
  dbltri: 'double-triangle',
};
const CUTOFF: Record<string, Cutoff> = { horiz: 'horizontal', vert: 'vertical', intrmd: 'intermediate' };

describe('UC ANR IGIS Degree Days Validation Challenge (answers from the UC IPM calculators), Esparto-A 2020, 50/70 °F', () => {
  const rows = readCsv(path.join(validationDir, 'reference-results-low50-high70.csv'));
  const weather = readCsv(path.join(validationDir, 'espartoa-weather-2020.csv'));
  const columns = Object.keys(rows[0]).filter((c) => c.includes('_'));

  it('has the whole year and the weather file agrees with the results file', () => {
    expect(rows).toHaveLength(366);
    expect(columns).toHaveLength(12);
    rows.forEach((r, i) => {
      expect(Number(weather[i].tmin)).toBe(Number(r.tmin));
      expect(Number(weather[i].tmax)).toBe(Number(r.tmax));
    });
  });

  for (const column of columns) {
    const [m, c] = column.split('_');
    it(`${column}: all 366 days within ±0.01 (double methods use the next day's tmin; the last day its own)`, () => {
      const off: string[] = [];
      rows.forEach((r, i) => {
        const next = i + 1 < rows.length ? Number(rows[i + 1].tmin) : undefined;
        const got = dailyDegreeDays(Number(r.tmax), Number(r.tmin), { base: 50, upper: 70, method: METHOD[m], cutoff: CUTOFF[c], tminNext: next });
        if (Math.abs(got - Number(r[column])) > 0.01 + 1e-9) off.push(`${r.date}: ${got} vs ${r[column]}`);
      });
      expect(off).toEqual([]);
    });
  }

  it('needs the intermediate floor at the vertical value (SCIENCE §1 inferred it from this data): 7/11 and 8/15 prove it', () => {
    const sineAboveUpper = (tx: number, tn: number, u: number) => {
      const mean = (tx + tn) / 2;
      const amp = (tx - tn) / 2;
      const t2 = Math.asin(Math.max(-1, Math.min(1, (u - mean) / amp)));
      return ((mean - u) * (Math.PI / 2 - t2) + amp * Math.cos(t2)) / Math.PI;
    };
    const binding = rows.filter((r) => {
      const tx = Number(r.tmax);
      const tn = Number(r.tmin);
      const unfloored = dailyDegreeDays(tx, tn, { base: 50, upper: 70, method: 'single-sine' }) - sineAboveUpper(tx, tn, 70);
      return Math.abs(unfloored - Number(r.sngsine_intrmd)) > 0.01;
    });
    expect(binding.map((r) => r.date)).toEqual(['7/11/2020', '8/15/2020']);
    for (const r of binding) expect(Number(r.sngsine_intrmd)).toBeCloseTo(Number(r.sngsine_vert), 2);
  });
});

describe('worked values, SCIENCE §1 (°F, L 50, U 86; Zalom et al. 1983; Baskerville & Emin 1969)', () => {
  const dd = (tx: number, tn: number, method: DegreeDayMethodName, cutoff: Cutoff = 'horizontal') =>
    dailyDegreeDays(tx, tn, { base: 50, upper: 86, method, cutoff });
  it.each([
    [70, 40, 'single-sine', 'horizontal', 7.5424],
    [70, 40, 'single-triangle', 'horizontal', 6.6667],
    [95, 60, 'single-sine', 'horizontal', 25.5086],
    [95, 60, 'single-sine', 'vertical', 13.3204],
    [95, 60, 'single-sine', 'intermediate', 23.5171],
    [95, 60, 'single-triangle', 'horizontal', 26.3429],
    [95, 60, 'single-triangle', 'vertical', 17.0857],
    [95, 45, 'single-sine', 'horizontal', 19.0264],
    [95, 45, 'single-sine', 'vertical', 8.9848],
    [95, 45, 'single-triangle', 'horizontal', 19.44],
    [95, 45, 'single-triangle', 'vertical', 12.96],
    [100, 88, 'single-sine', 'horizontal', 36],
    [100, 88, 'single-sine', 'vertical', 0],
    [100, 88, 'single-sine', 'intermediate', 28],
    [48, 35, 'single-sine', 'horizontal', 0],
    [48, 35, 'single-triangle', 'horizontal', 0],
  ] as const)('%d/%d %s %s → %d', (tx, tn, method, cutoff, want) => {
    expect(dd(tx, tn, method, cutoff)).toBeCloseTo(want, 4);
  });

  it('°C: sine 25/5, L 10, U 30 → 6.0900 °C-days = 10.962 °F-days (factor 1.8, thresholds converted)', () => {
    const c = dailyDegreeDays(25, 5, { base: 10, upper: 30, method: 'single-sine' });
    expect(c).toBeCloseTo(6.09, 4);
    expect(cDaysToFDays(c)).toBeCloseTo(10.962, 3);
    const f = dailyDegreeDays(77, 41, { base: 50, upper: 86, method: 'single-sine' });
    expect(f).toBeCloseTo(1.8 * c, 9);
    expect(fToC(86)).toBeCloseTo(30, 12);
  });
});

describe('averages, McMaster & Wilhelm 1997; modified corn heat units (AMS glossary, Ohio State AGF-101)', () => {
  it.each([
    [95, 60, 23],
    [90, 70, 28],
    [60, 40, 5],
    [80, 60, 20],
  ])('clamped-average %d/%d → %d', (tx, tn, want) => {
    expect(dailyDegreeDays(tx, tn, { base: 50, upper: 86, method: 'clamped-average' })).toBeCloseTo(want, 10);
  });

  it('method 1 caps the mean: min(max(M, L), U) − L', () => {
    expect(dailyDegreeDays(95, 60, { base: 50, upper: 86, method: 'average' })).toBeCloseTo(27.5, 10);
    expect(dailyDegreeDays(60, 40, { base: 50, upper: 86, method: 'average' })).toBe(0);
    expect(dailyDegreeDays(100, 90, { base: 50, upper: 86, method: 'average' })).toBe(36);
    expect(dailyDegreeDays(60, 40, { base: 50, method: 'average' })).toBe(0);
    expect(dailyDegreeDays(80, 60, { base: 50, method: 'average' })).toBe(20);
  });

  it('methods 1 and 2 differ when the low is below the base (McMaster & Wilhelm 1997: totals are not comparable)', () => {
    expect(dailyDegreeDays(60, 40, { base: 50, method: 'clamped-average' })).not.toBe(dailyDegreeDays(60, 40, { base: 50, method: 'average' }));
  });
});

describe('input checks', () => {
  it('throws RangeErrors naming the problem', () => {
    expect(() => dailyDegreeDays(20, 30, { base: 10, method: 'single-sine' })).toThrow(new RangeError('tmin (30) is above tmax (20)'));
    expect(() => dailyDegreeDays(NaN, 3, { base: 10, method: 'single-sine' })).toThrow(/tmax/);
    expect(() => dailyDegreeDays(20, 3, { base: Infinity, method: 'single-sine' })).toThrow(/base/);
    expect(() => dailyDegreeDays(20, 3, { base: 10, upper: 5, method: 'single-sine' })).toThrow(/upper/);
    expect(() => dailyDegreeDays(20, 3, { base: 10, method: 'single-sine', tminNext: NaN })).toThrow(/tminNext/);
    expect(() => dailyDegreeDays(20, 3, { base: 10, method: 'hourly' as DegreeDayMethodName })).toThrow(/method/);
  });

  it('double methods fall back to today’s low without tminNext (SCIENCE §1)', () => {
    expect(dailyDegreeDays(80, 50, { base: 50, method: 'double-sine' })).toBeCloseTo(dailyDegreeDays(80, 50, { base: 50, method: 'single-sine' }), 12);
    expect(dailyDegreeDays(80, 50, { base: 50, method: 'double-triangle' })).toBeCloseTo(dailyDegreeDays(80, 50, { base: 50, method: 'single-triangle' }), 12);
  });
});
