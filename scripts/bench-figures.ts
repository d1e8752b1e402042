/**
 * One measured figure of a benchmark run, for `npm run bench` (scripts/bench.ts): when
 * BENCH_FIGURES names a file, each call appends one JSON line { group, name, value, unit, better }.
 * A script run on its own (npm run bench:engine, …) prints as before and records nothing.
 * The same name recorded by several runs is reported as their median with min–max.
 */
import { appendFileSync } from 'node:fs';

export interface Figure {
  group: string;
  name: string;
  value: number;
  unit: string;
  /** Which way is better: 'lower' for times, 'higher' for throughput. */
  better: 'lower' | 'higher';
}

export function figure(group: string, name: string, value: number, unit: string, better: Figure['better'] = 'lower'): void {
  const file = process.env.BENCH_FIGURES;
  if (!file || !Number.isFinite(value)) return;
  const line: Figure = { group, name, value, unit, better };
  appendFileSync(file, `${JSON.stringify(line)}\n`);
}
