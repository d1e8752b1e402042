import { describe, expect, it } from 'vitest';
import { projectMaturity } from '#shared/thermal/index';
import { addDays } from '#shared/thermal/dates';
import type { DailyTemp } from '#shared/thermal/types';

const steady = (from: string, n: number, t: number, source: DailyTemp['source'] = 'observed'): DailyTemp[] =>
  Array.from({ length: n }, (_, k) => ({ date: addDays(from, k), tmax: t, tmin: t, source }));
const method = { base: 10, method: 'average' as const };

describe('maturity projection at its edges', () => {
  it('when one day is missing but the target is passed, then the planting has matured and the gap is reported', () => {
    const observed = steady('2026-05-02', 20, 20).filter((d) => d.date !== '2026-05-05');
    const p = projectMaturity({ start: '2026-05-01', target: 100, method, observed, history: [], latitude: 45 });
    // 10 °C-days a day from 2 May; without 5 May the 100th degree day comes on 12 May.
    expect(p.maturedOn).toBe('2026-05-12');
    expect(p.missingDates).toEqual(['2026-05-05']);
  });

  it('when only forecast days reach the target, then the date is a projection, not a maturity', () => {
    const p = projectMaturity({ start: '2026-05-01', target: 100, method, observed: steady('2026-05-02', 5, 20), forecast: steady('2026-05-07', 10, 20, 'forecast'), history: [], latitude: 45 });
    expect(p.maturedOn).toBeNull();
    expect(p.forecastMaturity).toBe('2026-05-11');
  });

  it('when the garden has no past weather, then it says so instead of scanning back through empty years', () => {
    const p = projectMaturity({ start: '2026-05-01', target: 1000, method, observed: steady('2026-05-02', 5, 20), history: [], latitude: 45 });
    expect(p.hasHistory).toBe(false);
    expect(p.scenarios).toEqual([]);
    expect(p.skippedSeasons).toEqual([]);
    expect(p.window).toEqual({ p10: null, p50: null, p90: null });
  });

  it('when a band is asked for, then it gives the spread of cumulative degree days per day across the analog years', () => {
    const history = [...steady('2024-01-01', 366, 15), ...steady('2025-01-01', 365, 25)];
    const p = projectMaturity({ start: '2026-05-01', target: 300, method, observed: [], history, latitude: 45, bandThrough: '2026-05-05' });
    expect(p.band.map((b) => b.date)).toEqual(['2026-05-02', '2026-05-03', '2026-05-04', '2026-05-05']);
    expect(p.band[0]).toEqual({ date: '2026-05-02', p10: 5, p50: 5, p90: 15 });
    expect(p.band[3]).toMatchObject({ p10: 20, p90: 60 });
  });
});
