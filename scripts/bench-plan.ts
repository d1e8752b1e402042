/**
 * Plan benchmark: `node --import tsx scripts/bench-plan.ts`. The two halves of a plan's engine
 * work on synthetic, deterministic weather (30 years): the preparation a plan.service.ts cache miss
 * pays (prepareSowingSweep + frost dates) and the sweep every plan pays (a season of start days
 * with a fixed autumn-frost cut-off). Median of 20 timed runs after 5 warm-up runs.
 */
import { addDays, prepareSowingSweep, sowingWindowSweep } from '#shared/thermal/index';
import { frostDatesOfSeries } from '#shared/thermal/frost-dates';
import type { DailyTemp } from '#shared/thermal/index';
import { figure } from './bench-figures';

function weather(from: string, days: number): DailyTemp[] {
  let a = 42;
  const rand = () => {
    a = (a * 1103515245 + 12345) % 2147483648;
    return a / 2147483648;
  };
  return Array.from({ length: days }, (_, k) => {
    const mean = 11 + 11 * Math.cos(((k - 200) / 365.25) * 2 * Math.PI) + (rand() - 0.5) * 8;
    return { date: addDays(from, k), tmax: mean + 6, tmin: mean - 6, source: 'observed' as const };
  });
}

function median(fn: () => unknown, runs = 20, warm = 5): number {
  for (let i = 0; i < warm; i++) fn();
  const times: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t = performance.now();
    fn();
    times.push(performance.now() - t);
  }
  return times.sort((x, y) => x - y)[runs >> 1];
}

const history = weather('1996-01-01', 30 * 365 + 7);
const latitude = 45;
const method = { base: 4.44, method: 'average' as const, cutoff: 'horizontal' as const };
const triggers = { heatThresholdC: 27, heatStreakDays: 3, criticalPhotoperiodH: 14, twilightAllowanceH: 0.5 };
const prepare = () => {
  const clim = prepareSowingSweep({ history, latitude, method, triggers, boltTolerance: 3 });
  return { clim, frost: frostDatesOfSeries(clim.series, latitude) };
};
const { clim } = prepare();
const sweep = () => sowingWindowSweep(clim, { from: '2026-01-01', to: '2026-12-31', target: 550, cutoff: { monthDay: '10-20' } });
console.log(`days of history: ${history.length}`);
const prepareMs = median(prepare);
const sweepMs = median(sweep);
console.log(`preparation (cache miss): ${prepareMs.toFixed(2)} ms`);
console.log(`season sweep (every plan): ${sweepMs.toFixed(2)} ms`);
figure('plan engine', 'preparation of 30 years (a plan cache miss)', prepareMs, 'ms');
figure('plan engine', 'season sweep (every plan)', sweepMs, 'ms');
