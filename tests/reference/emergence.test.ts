import { describe, expect, it } from 'vitest';
import { EMERGENCE_DAYS, EMERGENCE_TEMPS_F, emergenceDays, fToC, soilSowing } from '#shared/thermal';
import { CROP_LIBRARY } from '#shared/crops/library';

describe('days to emergence (Harrington & Minges 1954, as reprinted in Knott’s Handbook)', () => {
  it('when the soil is at one of the table’s temperatures, then the published whole-day figures come back (SCIENCE.md §7)', () => {
    // The handbook prints these cells to the whole day; our table keeps the decimals (from memory).
    for (const [crop, f, days] of [
      ['lettuce', 68, 3],
      ['tomato', 50, 43],
      ['onion', 32, 136],
      ['spinach', 50, 12],
      ['radish', 59, 6],
      ['sweet-corn', 59, 12],
    ] as const) {
      const e = emergenceDays(crop, fToC(f));
      expect(e, `${crop} at ${f} °F`).not.toBeNull();
      expect(Math.round(e!.days), `${crop} at ${f} °F`).toBe(days);
      expect(e!.interpolated).toBe(false);
    }
    // Pepper at 50 °F: no emergence in the table.
    expect(emergenceDays('pepper', fToC(50))).toBeNull();
  });

  it('when the soil is between two columns, then the days are interpolated linearly and marked so', () => {
    // Spinach: 11.7 days at 50 °F and 6.9 at 59 °F; 54.5 °F is halfway → 9.3 days.
    const e = emergenceDays('spinach', fToC(54.5))!;
    expect(e.days).toBeCloseTo((11.7 + 6.9) / 2, 6);
    expect(e.betweenF).toEqual([50, 59]);
    expect(e.interpolated).toBe(true);
    // 9 °C is 48.2 °F: between 41 (22.5 d) and 50 (11.7 d).
    expect(emergenceDays('spinach', 9)!.days).toBeCloseTo(22.5 + (11.7 - 22.5) * ((48.2 - 41) / 9), 6);
  });

  it('when the span touches a “no emergence” cell or leaves the table, then there is no figure', () => {
    expect(emergenceDays('tomato', fToC(45))).toBeNull(); // between 41 (none) and 50
    expect(emergenceDays('lettuce', fToC(100))).toBeNull(); // between 95 (none) and 104
    expect(emergenceDays('lettuce', fToC(20))).toBeNull(); // below the first column
    expect(emergenceDays('lettuce', fToC(110))).toBeNull(); // above the last
    expect(emergenceDays('arugula', 15)).toBeNull(); // not in the table
    expect(() => emergenceDays('lettuce', Number.NaN)).toThrow(RangeError);
  });

  it('when the table is read across, then each row has the nine columns, and days fall then rise around the optimum', () => {
    for (const [crop, row] of Object.entries(EMERGENCE_DAYS)) {
      expect(row, crop).toHaveLength(EMERGENCE_TEMPS_F.length);
      const known = row.filter((d): d is number => d !== null);
      const fastest = Math.min(...known);
      const at = row.indexOf(fastest);
      // Cold side: slower the colder it is.
      for (let i = 1; i <= at; i++) if (row[i - 1] !== null) expect(row[i - 1]!, `${crop} col ${i}`).toBeGreaterThan(row[i]!);
      expect(CROP_LIBRARY.some((c) => c.key === crop), `${crop} is a library crop`).toBe(true);
    }
  });
});

describe('whether the soil suits sowing now', () => {
  const bean = { cropKey: 'snap-bean', germMinC: fToC(60), germOptC: fToC(80), germMaxC: fToC(95) };
  const spinach = { cropKey: 'spinach', germMinC: fToC(35), germOptC: fToC(70), germMaxC: fToC(85) };

  it('when the soil is 9 °C, then spinach is in range and emerges in about 14 days (interpolated), and beans are too cold', () => {
    const s = soilSowing(spinach, 9);
    expect(s.status).toBe('cool');
    expect(Math.round(s.emergence!.days)).toBe(14);
    expect(soilSowing(bean, 9)).toEqual({ status: 'too-cold', emergence: null });
  });

  it('when the soil is warm, then good; past the maximum, then too warm; without a range, then unknown', () => {
    expect(soilSowing(bean, 25).status).toBe('good');
    expect(soilSowing(spinach, 31).status).toBe('too-warm');
    expect(soilSowing({ cropKey: 'arugula', germMinC: null, germOptC: null, germMaxC: null }, 12).status).toBe('unknown');
  });
});
