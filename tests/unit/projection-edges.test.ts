import { describe, expect, it } from 'vitest';
import { projectMaturity } from '#shared/thermal/index';
import { plantingProgress } from '#shared/thermal/planting-progress';
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

describe('planting progress at its edges', () => {
  const base = {
    today: '2026-06-10',
    latitude: 45,
    recorded: { firstHarvestOn: null, boltedOn: null },
    target: 500,
    method,
    history: steady('2024-01-01', 800, 15),
    boltTriggers: null,
    stressProfile: null,
    unit: 'C' as const,
  };
  const event = (on: string) => ({ kind: 'sowing' as const, on, planned: false, packetDays: 50, packetDate: null, explanation: '' });

  it('when a planned date has passed unsown, then no heat is credited and the window is projected from today', () => {
    const weather = steady('2026-05-02', 39, 20);
    const p = plantingProgress({ ...base, status: 'planned', event: { ...event('2026-05-01'), planned: true }, weather });
    expect(p.accumulated).toBe(0);
    expect(p.maturity.kind).toBe('analog');
    expect(p.maturity.p50! > '2026-06-10').toBe(true);
    expect(p.maturity.note).toMatch(/planned date has passed/);
  });

  it('when a past day kept only its forecast, then it is a gap, not recorded heat', () => {
    const weather = [...steady('2026-05-02', 30, 20), ...steady('2026-06-01', 2, 25, 'forecast'), ...steady('2026-06-03', 7, 20)];
    const p = plantingProgress({ ...base, status: 'growing', event: event('2026-05-01'), weather });
    expect(p.accumulated).toBeCloseTo(37 * 10, 6);
    expect(p.missingDates).toEqual(['2026-06-01', '2026-06-02']);
  });
});
