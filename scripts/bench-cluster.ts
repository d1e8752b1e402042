/**
 * npm run bench:cluster — the nightly weather run and the alert evaluation with three app
 * instances on the three-node Galera cluster (scripts/cluster.sh), against one instance on the
 * project's single MariaDB. Both databases are migrated and seeded with the demo the same way
 * (scripts/migrate.ts --seed-demo), and get the same CELLS extra gardens, each in its own weather
 * cell. Each instance is a process of its own (tests/cluster/nightly-run.ts) against the fake
 * weather service (40 ms a request), all started at one instant; the wall time runs from that
 * instant (or the first instance to begin, if later) to the last instance's end; how late each
 * began is printed. BENCH_CLUSTER_RUNS (3) runs of each.
 * Checks as it goes: every cell is fetched exactly once per night, whatever the instance count.
 */
import { execFileSync, spawn } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import path from 'node:path';
import { projectRoot, readEnvFile } from '../server/config';
import { figure } from './bench-figures';

const CELLS = Number(process.env.BENCH_CLUSTER_CELLS ?? 120);
const RUNS = Number(process.env.BENCH_CLUSTER_RUNS ?? 3);
const SINGLE_DB = 'heatclock_bench_single';
/** Time for every instance's process to start before the common start instant (3 at once on 2 cores take ~9 s). */
const START_MARGIN_MS = 15_000;
const root = projectRoot;
const sessionSecret = randomBytes(32).toString('hex');

interface Target {
  label: string;
  host: string;
  ports: number[];
  user: string;
  password: string;
  database: string;
}

function env(t: Target, port: number, extra: Record<string, string> = {}): NodeJS.ProcessEnv {
  return {
    PATH: process.env.PATH,
    HOME: process.env.HOME,
    TZ: 'UTC',
    NODE_ENV: 'development',
    DB_HOST: t.host,
    DB_PORT: String(port),
    DB_USER: t.user,
    DB_PASSWORD: t.password,
    DB_NAME: t.database,
    SESSION_SECRET: sessionSecret,
    WEATHER_MODE: 'fake',
    MAIL_MODE: 'fake',
    MAIL_FAKE_PORT: '0',
    SCHEDULER: 'off',
    LOG_LEVEL: 'error',
    ...extra,
  };
}

/** Runs a script to its end; resolves with the last stdout line parsed as JSON (or null). */
function script<T>(t: Target, port: number, args: string[], extra: Record<string, string> = {}): Promise<T> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, ['--import', 'tsx', ...args], { cwd: root, env: env(t, port, extra), stdio: ['ignore', 'pipe', 'pipe'] });
    let out = '';
    let err = '';
    child.stdout.on('data', (c: Buffer) => (out += c.toString()));
    child.stderr.on('data', (c: Buffer) => (err += c.toString()));
    child.once('exit', (code) => {
      if (code !== 0) return reject(new Error(`${args.join(' ')} on :${port} exited with ${code}\n${err.slice(-2000)}`));
      const last = out.trim().split('\n').at(-1) ?? '';
      try {
        resolve(JSON.parse(last) as T);
      } catch {
        resolve(null as T);
      }
    });
  });
}

/** From the first instance beginning its work to the last one ending it (process start-up left out). */
const span = (xs: { begunAt: number; endedAt: number }[]) => Math.max(...xs.map((a) => a.endedAt)) - Math.min(...xs.map((a) => a.begunAt));
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[xs.length >> 1];
const spread = (xs: number[]) => `${median(xs)} (${Math.min(...xs)}–${Math.max(...xs)})`;

interface NightlyAnswer {
  fetched: [number, number][];
  row: { status: string; cellsOk: number; claimConflicts: number };
  ms: number;
  begunAt: number;
  endedAt: number;
}
interface AlertsAnswer {
  opened: number;
  retried: number;
  begunAt: number;
  endedAt: number;
}

async function measure(t: Target) {
  const first = t.ports[0];
  await script(t, first, ['scripts/migrate.ts', '--seed-demo']);
  await script(t, first, ['tests/cluster/nightly-run.ts', 'setup', String(CELLS)]);
  const nights: number[] = [];
  const alerts: number[] = [];
  let conflicts = 0;
  let gardens = 0;
  for (let run = 0; run < RUNS; run++) {
    // Every cell due again (setup with no new gardens only clears the cells' refresh marks).
    await script(t, first, ['tests/cluster/nightly-run.ts', 'setup', '0']);
    const startAt = Date.now() + START_MARGIN_MS;
    const answers = await Promise.all(t.ports.map((p) => script<NightlyAnswer>(t, p, ['tests/cluster/nightly-run.ts', 'nightly'], { START_AT: String(startAt) })));
    const fetched = answers.flatMap((a) => a.fetched.map(([la, lo]) => `${la},${lo}`));
    const cells = new Set(fetched);
    if (fetched.length !== cells.size) throw new Error(`${t.label}: ${fetched.length - cells.size} cells were fetched twice in one night`);
    conflicts += answers.reduce((n, a) => n + Number(a.row.claimConflicts ?? 0), 0);
    nights.push(span(answers));
    const each = answers.map((a) => `${a.row.cellsOk} cells in ${a.ms} ms, began ${a.begunAt - startAt} ms late`).join('; ');
    process.stdout.write(`  ${t.label}: night ${run + 1}: ${cells.size} cells fetched once each in ${nights.at(-1)} ms (${each})\n`);

    const { gardenIds } = await script<{ gardenIds: number[] }>(t, first, ['tests/cluster/nightly-run.ts', 'alerts-setup']);
    gardens = gardenIds.length;
    const alertStart = Date.now() + START_MARGIN_MS;
    const evaluated = await Promise.all(
      t.ports.map((p) => script<AlertsAnswer>(t, p, ['tests/cluster/nightly-run.ts', 'alerts', gardenIds.join(',')], { START_AT: String(alertStart) })),
    );
    alerts.push(span(evaluated));
    process.stdout.write(
      `  ${t.label}: alerts ${run + 1}: ${gardenIds.length} gardens on every instance at once in ${alerts.at(-1)} ms, ` +
        `${evaluated.reduce((n, a) => n + a.opened, 0)} alerts opened in all, ${evaluated.reduce((n, a) => n + a.retried, 0)} evaluations retried on conflict\n`,
    );
  }
  return { nights, alerts, conflicts, gardens };
}

function singleTarget(): Target {
  execFileSync('bash', ['scripts/db.sh', 'start'], { cwd: root, stdio: 'ignore' });
  const db = readEnvFile(path.join(root, '.data', 'db.env'));
  const sql = `DROP DATABASE IF EXISTS ${SINGLE_DB}; CREATE DATABASE ${SINGLE_DB} CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci; GRANT ALL PRIVILEGES ON ${SINGLE_DB}.* TO '${db.DB_USER}'@'127.0.0.1';`;
  execFileSync('mariadb', ['--no-defaults', '--protocol=socket', `--socket=${path.join(root, '.data', 'run', 'm.sock')}`, '-uroot', '-e', sql]);
  return { label: 'one instance, single server', host: db.DB_HOST, ports: [Number(db.DB_PORT)], user: db.DB_USER, password: db.DB_PASSWORD, database: SINGLE_DB };
}

function clusterTarget(): Target {
  const cluster = (cmd: string) => execFileSync('bash', ['scripts/cluster.sh', cmd], { cwd: root, encoding: 'utf8', timeout: 180_000 });
  cluster('reset');
  process.stdout.write(cluster('start'));
  const db = readEnvFile(path.join(root, '.cluster', 'cluster.env'));
  return { label: 'three instances, three-node Galera', host: db.DB_HOST ?? '127.0.0.1', ports: db.CLUSTER_PORTS.split(',').map(Number), user: db.DB_USER, password: db.DB_PASSWORD, database: db.DB_NAME };
}

console.log(`bench:cluster — ${CELLS} extra gardens in their own cells plus the demo, fake weather 40 ms a request, ${RUNS} runs`);
const single = process.env.BENCH_CLUSTER_ONLY === '1' ? { nights: [1], alerts: [1], conflicts: 0, gardens: 0 } : await measure(singleTarget());
let clustered: Awaited<ReturnType<typeof measure>>;
try {
  clustered = await measure(clusterTarget());
} finally {
  execFileSync('bash', ['scripts/cluster.sh', 'stop'], { cwd: root, stdio: 'ignore' });
}
if (process.env.BENCH_CLUSTER_ONLY === '1') process.exit(0);
for (const [label, r] of [['one instance, single server', single], ['three instances, Galera', clustered]] as const) {
  for (const ms of r.nights) figure('cluster', `nightly run, ${CELLS} cells and the demo's: ${label}`, ms / 1000, 's');
  for (const ms of r.alerts) figure('cluster', `alert evaluation of the ${r.gardens} demo gardens on every instance at once: ${label}`, ms / 1000, 's');
}
figure('cluster ratio', 'nightly run: one instance ÷ three instances (speed-up)', median(single.nights) / median(clustered.nights), '×', 'higher');
figure('cluster ratio', 'alert evaluation: three instances ÷ one instance (cost of evaluating everywhere at once)', median(clustered.alerts) / median(single.alerts), '×');
console.log(`nightly run, ms: single ${spread(single.nights)}; cluster ${spread(clustered.nights)}; claim conflicts on the cluster ${clustered.conflicts}`);
console.log(`alert evaluation, ms: single ${spread(single.alerts)}; cluster ${spread(clustered.alerts)}`);
