import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { addDays } from '#shared/thermal';
import type { DailyTemp } from '#shared/thermal';

export const repoRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');

/** The published validation set, kept in the repository with its licence (fixtures/reference/README.md). */
export const validationDir = path.resolve(repoRoot, 'fixtures/reference/degree-day-validation');

export function readCsv(file: string): Record<string, string>[] {
  const [head, ...rows] = readFileSync(file, 'utf8').trim().split(/\r?\n/);
  const cols = head.split(',').map((c) => c.replace(/"/g, ''));
  return rows.map((r) => Object.fromEntries(r.split(',').map((v, i) => [cols[i], v.replace(/"/g, '')])));
}

/** NOAA daily data shipped in the vega-datasets npm package (U.S. Government work), °C. */
export function noaaDaily(location: 'Seattle' | 'New York'): DailyTemp[] {
  return readCsv(path.join(repoRoot, 'node_modules/vega-datasets/data/weather.csv'))
    .filter((r) => r.location === location)
    .map((r) => ({ date: r.date, tmax: Number(r.temp_max), tmin: Number(r.temp_min), source: 'imported' as const }));
}

/** Deterministic sine-plus-noise weather (°C) for a latitude's seasons; mulberry32 noise. */
export function syntheticWeather(from: string, days: number, opts: { seed?: number; southern?: boolean; meanC?: number; swingC?: number } = {}): DailyTemp[] {
  let a = opts.seed ?? 1;
  const rand = () => {
    a = (a + 0x6d2b79f5) | 0;
    let t = Math.imul(a ^ (a >>> 15), 1 | a);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  const mean = opts.meanC ?? 11;
  const swing = opts.swingC ?? 11;
  const out: DailyTemp[] = [];
  for (let k = 0; k < days; k++) {
    const date = addDays(from, k);
    const doy = Number(date.slice(5, 7)) * 30.4 + Number(date.slice(8, 10));
    const phase = Math.cos(((doy - 200) / 365.25) * 2 * Math.PI) * (opts.southern ? -1 : 1);
    const m = mean + swing * phase + (rand() - 0.5) * 8;
    const range = 6 + rand() * 8;
    out.push({ date, tmax: m + range / 2, tmin: m - range / 2, source: 'observed' });
  }
  return out;
}

export const constantDays = (from: string, days: number, tmax: number, tmin: number, source: DailyTemp['source'] = 'observed'): DailyTemp[] =>
  Array.from({ length: days }, (_, k) => ({ date: addDays(from, k), tmax, tmin, source }));
