/**
 * npm run bench — every benchmark in one go on the production build, then the report at the top
 * of docs/benchmarks.md (between the bench:report marks; the dated sections below it are the
 * history and stay). Each benchmark script runs several times as a process of its own; every
 * figure it records (scripts/bench-figures.ts) is reported as the median of its runs with min–max.
 *   BENCH_RUNS_FAST (5): runs of the engine and plan-engine benchmarks (pure computation)
 *   BENCH_RUNS_SLOW (3): runs of the weather and alert benchmarks, and bench:api's own runs
 *   BENCH_SECONDS (10): autocannon seconds per endpoint and run in bench:api
 *   BENCH_SKIP: comma-separated benchmark names to leave out (engine, plan, weather, alerts, api, cluster)
 * The logs of every run are kept in .data/bench/.
 */
import { execFileSync, spawn } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { projectRoot } from '../server/config';
import type { Figure } from './bench-figures';

const FAST = Number(process.env.BENCH_RUNS_FAST ?? 5);
const SLOW = Number(process.env.BENCH_RUNS_SLOW ?? 3);
const SECONDS = process.env.BENCH_SECONDS ?? '10';
const skip = new Set((process.env.BENCH_SKIP ?? '').split(',').filter(Boolean));
const logDir = path.join(projectRoot, '.data', 'bench');
const doc = path.join(projectRoot, 'docs', 'benchmarks.md');
const START = '<!-- bench:report:start -->';
const END = '<!-- bench:report:end -->';

interface Bench {
  name: string;
  script: string;
  runs: number;
  env?: Record<string, string>;
  about: string;
}

const benches: Bench[] = [
  { name: 'engine', script: 'scripts/bench-engine.ts', runs: FAST, about: 'thermal engine, synthetic 30-year weather (npm run bench:engine)' },
  { name: 'plan', script: 'scripts/bench-plan.ts', runs: FAST, about: "the plan's engine work, 30 years (npm run bench:plan)" },
  { name: 'weather', script: 'scripts/bench-weather.ts', runs: SLOW, about: 'nightly weather run, 1,000 gardens in 200 cells (npm run bench:weather)' },
  { name: 'alerts', script: 'scripts/bench-alerts.ts', runs: SLOW, about: 'alert evaluation after a night, 5,000 plantings (npm run bench:alerts)' },
  {
    name: 'api',
    script: 'scripts/bench-api.ts',
    runs: 1,
    env: { BENCH_RUNS: String(SLOW), BENCH_SECONDS: SECONDS },
    about: `signed-in reads at 50 connections, ${SECONDS} s each, ${SLOW} runs inside one process, then the client in Chromium (npm run bench:api)`,
  },
  { name: 'cluster', script: 'scripts/bench-cluster.ts', runs: 1, env: { BENCH_CLUSTER_RUNS: String(SLOW) }, about: `Galera, three instances against one on a single server, ${SLOW} runs inside one process (npm run bench:cluster)` },
];

function runOnce(b: Bench, run: number, figures: string): Promise<number> {
  const log = path.join(logDir, `${b.name}-${run + 1}.log`);
  return new Promise((resolve) => {
    const child = spawn('bash', ['-c', `exec node --import tsx ${b.script} > "${log}" 2>&1`], {
      cwd: projectRoot,
      env: { ...process.env, BENCH_FIGURES: figures, ...b.env },
      stdio: 'ignore',
    });
    child.once('exit', (code) => resolve(code ?? 1));
  });
}

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length % 2 ? s[s.length >> 1] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
};
const round = (x: number) => (Math.abs(x) >= 100 ? Math.round(x).toString() : Math.abs(x) >= 10 ? x.toFixed(1) : Math.abs(x) >= 1 ? x.toFixed(2) : x.toPrecision(2));

mkdirSync(logDir, { recursive: true });
execFileSync('bash', ['scripts/db.sh', 'start'], { cwd: projectRoot, stdio: 'inherit' });
execFileSync('bash', ['scripts/build-client.sh'], { cwd: projectRoot, stdio: 'inherit' });

const started = new Date();
const all: Figure[] = [];
const outcomes: string[] = [];
for (const b of benches) {
  if (skip.has(b.name)) {
    outcomes.push(`- ${b.name}: left out (BENCH_SKIP)`);
    continue;
  }
  const failed: number[] = [];
  const t0 = Date.now();
  for (let run = 0; run < b.runs; run++) {
    const figures = path.join(logDir, `${b.name}-${run + 1}.jsonl`);
    rmSync(figures, { force: true });
    process.stdout.write(`[bench] ${b.name} run ${run + 1}/${b.runs} … `);
    const code = await runOnce(b, run, figures);
    process.stdout.write(code === 0 ? 'done\n' : `failed (exit ${code}; see .data/bench/${b.name}-${run + 1}.log)\n`);
    if (code !== 0) failed.push(run + 1);
    if (existsSync(figures)) {
      for (const line of readFileSync(figures, 'utf8').split('\n').filter(Boolean)) all.push(JSON.parse(line) as Figure);
    }
  }
  const minutes = ((Date.now() - t0) / 60_000).toFixed(1);
  outcomes.push(`- ${b.name}: ${b.about}; ${b.runs} run${b.runs > 1 ? 's' : ''}, ${minutes} min${failed.length ? `; **run ${failed.join(', ')} failed** (its figures are left out)` : ''}`);
}

// Group by figure, in the order first recorded.
const groups = new Map<string, Map<string, Figure[]>>();
for (const f of all) {
  const g = groups.get(f.group) ?? new Map<string, Figure[]>();
  groups.set(f.group, g);
  g.set(f.name, [...(g.get(f.name) ?? []), f]);
}
const sections: string[] = [];
for (const [group, figures] of groups) {
  const rows = [...figures].map(([name, fs]) => {
    const xs = fs.map((f) => f.value);
    const range = xs.length > 1 ? `${round(Math.min(...xs))}–${round(Math.max(...xs))}` : '—';
    return `| ${name} | ${round(median(xs))} ${fs[0].unit} | ${range} | ${xs.length} | ${fs[0].better} |`;
  });
  sections.push(`### ${group}\n\n| figure | median | min–max | runs | better |\n|---|---:|---:|---:|---|\n${rows.join('\n')}`);
}

const load = os.loadavg().map((x) => x.toFixed(2)).join(', ');
const machine = `${os.cpus().length} × ${os.cpus()[0]?.model ?? 'CPU'}, ${Math.round(os.totalmem() / 2 ** 30)} GiB, Node ${process.version}, ${os.type()} ${os.release()}`;
const report = [
  START,
  `## The report of \`npm run bench\` — ${started.toISOString().slice(0, 16).replace('T', ' ')} UTC`,
  '',
  `Machine: ${machine}. Load average at the end: ${load}. Production build, loopback only, the local fakes for weather and mail.`,
  `Each figure is the median of its runs with min–max; a run is a process of its own, except bench:api and bench:cluster, which repeat inside one process. Finished in ${((Date.now() - started.getTime()) / 60_000).toFixed(1)} min.`,
  '',
  ...outcomes,
  '',
  sections.join('\n\n'),
  '',
  'Targets set by the issues, with the figures above: sweep < 20 ms and sweep ÷ read ≤ 10× (engine); nightly run < 30 s with 1.00 request a cell (weather); evaluation < 10 s (alerts); every signed-in read ≥ 0.25 × health req/s with p99 < 100 ms (api ratio); plan p50 < 50 ms and compare p50 < 200 ms (api).',
  END,
].join('\n');

const text = existsSync(doc) ? readFileSync(doc, 'utf8') : '# Benchmarks\n';
let next: string;
if (text.includes(START) && text.includes(END)) {
  next = text.slice(0, text.indexOf(START)) + report + text.slice(text.indexOf(END) + END.length);
} else {
  // After the title and its first paragraph.
  const at = text.indexOf('\n## ');
  next = at < 0 ? `${text.trimEnd()}\n\n${report}\n` : `${text.slice(0, at)}\n${report}\n${text.slice(at)}`;
}
writeFileSync(doc, next);
console.log(report);
