import { describe, expect, it } from 'vitest';
import { frostDates, seasonOf } from '#shared/thermal';
import type { DailyTemp } from '#shared/thermal';
import { noaaDaily, syntheticWeather } from './thermal-fixtures';

describe('seasons are hemisphere-aware (PRODUCT brief)', () => {
  it('north: the calendar year; south: July–June', () => {
    expect(seasonOf('2025-03-15', 52)).toEqual({ label: '2025', start: '2025-01-01', end: '2025-12-31', startYear: 2025 });
    expect(seasonOf('2025-03-15', -35)).toEqual({ label: '2024–25', start: '2024-07-01', end: '2025-06-30', startYear: 2024 });
    expect(seasonOf('2025-07-01', -35).label).toBe('2025–26');
    expect(seasonOf('1999-12-31', -35).label).toBe('1999–00');
  });
});

describe('frost dates (SCIENCE §4: Tn ≤ 32 °F; NOAA freeze-probability practice)', () => {
  it('NOAA New York 2012–2015 (vega-datasets): last spring frosts in Mar–Apr, first fall frosts in Oct–Dec', () => {
    const f = frostDates(noaaDaily('New York'), 40.7);
    const seasons = f.seasons.filter((s) => s.springComplete && s.fallComplete);
    expect(seasons.map((s) => s.season)).toEqual(['2012', '2013', '2014', '2015']);
    for (const s of seasons) {
      expect(s.lastSpringFrost! >= `${s.season}-02-15` && s.lastSpringFrost! <= `${s.season}-05-15`).toBe(true);
      expect(s.firstFallFrost! >= `${s.season}-10-01` && s.firstFallFrost! <= `${s.season}-12-31`).toBe(true);
    }
    expect(f.lastSpring.p10!.ordinal).toBeLessThanOrEqual(f.lastSpring.p90!.ordinal);
    expect(f.firstFall.p10!.ordinal).toBeLessThanOrEqual(f.firstFall.p90!.ordinal);
    expect(f.extremeMinimum.estimate).toBe(true);
    expect(f.extremeMinimum.reason).toMatch(/fewer than 10/);
    expect(f.extremeMinimum.zone).toMatch(/^(6|7|8)[ab]$/);
  });

  it('percentiles read "by this date p % of seasons had it", computed by nearest rank', () => {
    const history: DailyTemp[] = [];
    const lastFrost = ['03-10', '03-20', '03-30', '04-09', '04-19'];
    lastFrost.forEach((md, k) => {
      const year = 2010 + k;
      for (const d of syntheticWeather(`${year}-01-01`, year % 4 ? 365 : 366, { seed: k, meanC: 30, swingC: 0 })) {
        history.push({ ...d, tmin: d.date === `${year}-${md}` || d.date === `${year}-10-2${k}` ? -1 : Math.max(d.tmin, 5) });
      }
    });
    const f = frostDates(history, 45);
    expect(f.lastSpring.p10!.monthDay).toBe('03-10');
    expect(f.lastSpring.p50!.monthDay).toBe('03-30');
    expect(f.lastSpring.p90!.monthDay).toBe('04-19');
    expect(f.firstFall.p10!.monthDay).toBe('10-20');
    expect(f.firstFall.p90!.monthDay).toBe('10-24');
  });

  it('south (35 °S): spring frosts fall in Sep–Oct of the July–June season, the coldest days in July', () => {
    const history = syntheticWeather('2000-07-01', 365 * 12 + 3, { seed: 7, southern: true, meanC: 12, swingC: 9 });
    const f = frostDates(history, -35);
    const complete = f.seasons.filter((s) => s.springComplete && s.fallComplete);
    expect(complete.length).toBe(12);
    expect(complete[0].season).toBe('2000–01');
    for (const s of complete) {
      if (s.lastSpringFrost) expect(['07', '08', '09', '10', '11']).toContain(s.lastSpringFrost.slice(5, 7));
      if (s.firstFallFrost) expect(['03', '04', '05', '06']).toContain(s.firstFallFrost.slice(5, 7));
    }
    expect(['08', '09', '10']).toContain(f.lastSpring.p50!.monthDay.slice(0, 2));
    expect(['04', '05', '06']).toContain(f.firstFall.p50!.monthDay.slice(0, 2));
    expect(f.extremeMinimum.winters.length).toBeGreaterThanOrEqual(10);
    expect(f.extremeMinimum.estimate).toBe(false);
    expect(f.extremeMinimum.winters[0].label).toBe('2001');
  });

  it('a frost-free season gives null percentiles rather than a made-up date', () => {
    const warm = syntheticWeather('2010-01-01', 365 * 3, { seed: 3, meanC: 25, swingC: 2 });
    const f = frostDates(warm, 20);
    expect(f.lastSpring).toMatchObject({ p10: null, p50: null, p90: null, seasons: 3 });
    expect(f.firstFall.p50).toBeNull();
  });
});
