/**
 * Thermal engine benchmark: `npm run bench:engine`. Synthetic, deterministic weather (seeded
 * sine plus noise), median of several timed runs after a warm-up.
 */
import {
  accumulateDegreeDays,
  addDays,
  dailyDegreeDays,
  prepareSowingSweep,
  sowingWindowSweep,
} from '#shared/thermal/index';
import type { DailyTemp, DegreeDayMethodName } from '#shared/thermal/index';
import { figure } from './bench-figures';

function seeded(seed: number): () => number {
  let a = seed;
  return () => {
    a = (a + 0x6d2b79f5) | 0;
    let t = Math.imul(a ^ (a >>> 15), 1 | a);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

function weather(from: string, days: number, seed: number): DailyTemp[] {
  const rand = seeded(seed);
  return Array.from({ length: days }, (_, k) => {
    const mean = 11 + 11 * Math.cos(((k - 200) / 365.25) * 2 * Math.PI) + (rand() - 0.5) * 8;
    const range = 6 + rand() * 8;
    return { date: addDays(from, k), tmax: mean + range / 2, tmin: mean - range / 2, source: 'observed' as const };
  });
}

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[s.length >> 1];
}

/** Median ms per call of fn over `runs` timed runs, each of `inner` calls, after `warm` calls. */
function time(fn: () => unknown, runs = 15, inner = 1, warm = 5): number {
  for (let i = 0; i < warm; i++) fn();
  const ms: number[] = [];
  for (let r = 0; r < runs; r++) {
    const t0 = performance.now();
    for (let i = 0; i < inner; i++) fn();
    ms.push((performance.now() - t0) / inner);
  }
  return median(ms);
}

let sink = 0;
const fmt = (x: number, d = 3) => x.toFixed(d);

const methods: DegreeDayMethodName[] = ['average', 'clamped-average', 'single-sine', 'single-triangle', 'double-sine', 'double-triangle'];
const rand = seeded(42);
const pairs = Array.from({ length: 10_000 }, () => {
  const a = rand() * 40 - 5;
  const b = rand() * 40 - 5;
  return [Math.max(a, b), Math.min(a, b), rand() * 30 - 5];
});
console.log('dailyDegreeDays, ns per evaluation (base 10 °C, upper 30 °C, intermediate cutoff):');
for (const method of methods) {
  const ms = time(() => {
    for (const [tx, tn, next] of pairs) sink += dailyDegreeDays(tx, tn, { base: 10, upper: 30, method, cutoff: 'intermediate', tminNext: next });
  }, 15, 5, 20);
  console.log(`  ${method.padEnd(16)} ${fmt((ms * 1e6) / pairs.length, 1)} ns`);
  figure('engine', `daily degree days, ${method}`, (ms * 1e6) / pairs.length, 'ns');
}

const season = weather('2024-01-01', 365, 7);
const method = { base: 4.4, upper: 30, method: 'double-sine' as const, cutoff: 'horizontal' as const };
const accMs = time(() => (sink += accumulateDegreeDays(season, method, { start: '2024-01-01' }).total), 30, 5);
console.log(`accumulate a 365-day season (double sine): ${fmt(accMs)} ms`);
figure('engine', 'accumulate a 365-day season (double sine)', accMs, 'ms');

const history = weather('1995-01-01', 365 * 30 + 8, 2024);
const triggers = { heatThresholdC: 27, heatStreakDays: 3, criticalPhotoperiodH: 14 };
const sweepOpts = { from: '2025-01-01', to: '2025-12-31', target: 800, harvestWindowDays: 7, cutoff: 'first-fall-frost' as const, maxDays: 120 };
const prepare = () => prepareSowingSweep({ history, latitude: 45, method, triggers });
const clim = prepare();
const check = sowingWindowSweep(clim, sweepOpts);
const pairsUsed = check.candidates.reduce((a, c) => a + c.analogYears, 0);
const median60 = check.candidates.find((c) => c.sowDate === '2025-05-01')!.maturityDays.p50;
const readMs = time(() => {
  let s = 0;
  for (const d of history) s += d.tmax + d.tmin;
  sink += s;
}, 31, 20);
const prepMs = time(() => (sink += prepare().prefixDd.length), 15);
const sweepMs = time(() => (sink += sowingWindowSweep(clim, sweepOpts).candidates.length), 31, 5);
console.log(`sowing-window sweep: ${check.candidates.length} candidate dates × up to 30 analog years (${pairsUsed} usable pairs; late sowings lose the latest year, whose season runs past the history), target 800 °C-days (p50 ${median60} days from a May 1 sowing)`);
console.log(`  read the ${history.length}-day history once (sum tmax + tmin): ${fmt(readMs, 4)} ms`);
console.log(`  prepare (dense series, degree days, prefix sums, bolt flags, frost dates): ${fmt(prepMs)} ms`);
console.log(`  sweep (365 candidates): ${fmt(sweepMs)} ms`);
console.log(`  prepare + sweep: ${fmt(prepMs + sweepMs)} ms`);
console.log(`  ratio sweep / read: ${fmt(sweepMs / readMs, 1)}×; (prepare + sweep) / read: ${fmt((prepMs + sweepMs) / readMs, 1)}×`);
figure('engine', 'read a 30-year history once', readMs, 'ms');
figure('engine', 'sowing-window sweep, 365 dates × 30 years (target < 20 ms)', sweepMs, 'ms');
figure('engine', 'sweep-preparation of 30 years', prepMs, 'ms');
figure('engine', 'ratio sweep ÷ read (target ≤ 10×)', sweepMs / readMs, '×');
if (Number.isNaN(sink)) console.log('unreachable');
