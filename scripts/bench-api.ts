/**
 * npm run bench:api — signed-in reads under load against the production build on loopback.
 * Seeds the invented demo (and a copy of its in-season garden holding 200 growing plantings) into
 * the heatclock_bench database with weather from the local fake, starts the server as `npm start`
 * does (NODE_ENV=production, built client), signs in as the demo grower and runs autocannon at 50
 * connections for BENCH_SECONDS (30) per endpoint, /api/health in the same run for the ratio.
 * Prints a table and appends it to docs/benchmarks.md.
 */
import { spawn } from 'node:child_process';
import { appendFileSync, existsSync, mkdirSync } from 'node:fs';
import { createServer } from 'node:net';
import path from 'node:path';
import autocannon from 'autocannon';
import { loadConfig, projectRoot } from '../server/config';
import { createSequelize } from '../server/db/sequelize';
import { initModels, Garden, Membership, Planting, Variety, Bed } from '../server/db/models';
import { migrate } from '../server/db/migrate';
import { seedDemo, DEMO_GARDENS } from '../server/db/seeders/demo';
import { inSeason } from '../server/db/seeders/demo-records';
import { createLogger } from '../server/lib/logger';
import { localDate } from '../server/lib/local-date';
import { createWeatherService } from '../server/app';
import { addDays } from '../shared/thermal/dates';

const SECONDS = Number(process.env.BENCH_SECONDS ?? 30);
const CONNECTIONS = 50;
const DB = process.env.BENCH_DB_NAME ?? 'heatclock_bench';
const BIG = 'Bench garden with 200 plantings';

async function freePort(): Promise<number> {
  return new Promise((resolve) => {
    const s = createServer().listen(0, '127.0.0.1', () => {
      const port = (s.address() as { port: number }).port;
      s.close(() => resolve(port));
    });
  });
}

async function seed() {
  const base = loadConfig();
  const sequelize = createSequelize({ ...base.db, database: DB });
  initModels(sequelize);
  await migrate(sequelize);
  const { gardens, users } = await seedDemo(sequelize);
  const demo = DEMO_GARDENS.find((g) => inSeason(g.latitude, localDate(g.timeZone)))!;
  const home = gardens.find((g) => g.name === demo.name)!;
  const [big] = await Garden.findOrCreate({ where: { name: BIG }, defaults: { ...demo, name: BIG } });
  for (const u of users) await Membership.findOrCreate({ where: { userId: u.id, gardenId: big.id }, defaults: { userId: u.id, gardenId: big.id, role: 'grower' } });
  if ((await Planting.count({ where: { gardenId: big.id } })) === 0) {
    const varieties = await Variety.findAll({ where: { gardenId: home.id } });
    const bed = await Bed.create({ gardenId: big.id, name: 'Long row', kind: 'row', lengthM: 200, widthM: 1, notes: '' });
    const own: Variety[] = [];
    for (const v of varieties) own.push(await Variety.create({ ...v.get({ plain: true }), id: undefined, gardenId: big.id }));
    const today = localDate(big.timeZone);
    await Planting.bulkCreate(
      Array.from({ length: 200 }, (_, i) => ({
        gardenId: big.id, bedId: bed.id, varietyId: own[i % own.length].id, seedLotId: null, method: 'direct-sow' as const, status: 'growing' as const,
        quantity: 10, quantityUnit: 'plants' as const, sownOn: addDays(today, -(5 + (i % 70))), emergedOn: null, thinnedOn: null, transplantedOn: null,
        firstHarvestOn: null, lastHarvestOn: null, boltedOn: null, notes: '', createdBy: null,
      })),
    );
  }
  const fake = (await import('../fixtures/weather/server')).startFakeWeather('error');
  const weather = createWeatherService({ ...base, db: { ...base.db, database: DB } }, sequelize, createLogger('warn'));
  for (const g of [...gardens, big]) {
    const cellId = (await weather.locateGarden(g)) ?? g.weatherCellId;
    if (cellId) await weather.prepareCell(cellId, g.id);
  }
  await weather.idle();
  fake.close();
  const planting = await Planting.findOne({ where: { gardenId: home.id, status: 'growing' }, order: [['id', 'ASC']] });
  // Start cold: no stored progress and no pending weather events for the worker to warm it with.
  await sequelize.query('DELETE FROM garden_events');
  await sequelize.query('DELETE FROM planting_progress');
  await sequelize.close();
  return { home: home.id, big: big.id, planting: planting!.id };
}

async function startServer(port: number) {
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    cwd: projectRoot,
    env: { ...process.env, NODE_ENV: 'production', PORT: String(port), HOST: '127.0.0.1', DB_NAME: DB, SCHEDULER: 'off', LOG_LEVEL: 'error' },
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  await new Promise<void>((resolve, reject) => {
    child.stdout!.on('data', (b: Buffer) => b.toString().includes('Heatclock is running') && resolve());
    child.on('exit', (code) => reject(new Error(`server exited with ${code}`)));
  });
  return child;
}

async function signIn(base: string): Promise<string> {
  const res = await fetch(`${base}/api/auth/login`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json' },
    body: JSON.stringify({ email: 'grower.rosa@hollowbrook.example', password: 'heatclock-demo' }),
  });
  if (res.status !== 200) throw new Error(`sign-in failed: ${res.status}`);
  return res.headers.get('set-cookie')!.split(';')[0];
}

interface Row { name: string; rps: number; p50: number; p99: number; errors: number }

async function load(name: string, url: string, cookie: string): Promise<Row> {
  const r = await autocannon({ url, connections: CONNECTIONS, duration: SECONDS, headers: { cookie } });
  const errors = r.errors + r.timeouts + r.non2xx;
  return { name, rps: Math.round(r.requests.average), p50: r.latency.p50, p99: r.latency.p99, errors };
}

async function timeOnce(url: string, cookie: string): Promise<number> {
  const t = performance.now();
  const res = await fetch(url, { headers: { cookie } });
  await res.arrayBuffer();
  if (res.status !== 200) throw new Error(`${url}: ${res.status}`);
  return Math.round(performance.now() - t);
}

if (!existsSync(path.join(projectRoot, 'dist', 'client', 'index.html'))) throw new Error('Build the client first: npx vite build');
const ids = await seed();
const port = await freePort();
const server = await startServer(port);
try {
  const base = `http://127.0.0.1:${port}`;
  const cookie = await signIn(base);
  const progress = `${base}/api/gardens/${ids.home}/plantings/${ids.planting}/progress`;
  const today = `${base}/api/gardens/${ids.big}/today`;
  // Cold: the first read of the day computes and stores every growing planting's progress.
  const coldToday = await timeOnce(today, cookie);
  const coldProgress = await timeOnce(progress, cookie);
  const rows = [
    await load('/api/health', `${base}/api/health`, cookie),
    await load('progress of a demo planting', progress, cookie),
    // The floor every signed-in read pays today: session load and touch, user, nothing else.
    await load('/api/auth/me (session only)', `${base}/api/auth/me`, cookie),
    await load('Today, 200 growing plantings', today, cookie),
  ];
  const ratio = (rows[1].rps / rows[0].rps).toFixed(2);
  const table = [
    `| endpoint | req/s | p50 ms | p99 ms | errors |`,
    `|---|---|---|---|---|`,
    ...rows.map((r) => `| ${r.name} | ${r.rps} | ${r.p50} | ${r.p99} | ${r.errors} |`),
  ].join('\n');
  const report = `\n## bench:api — ${new Date().toISOString().slice(0, 16).replace('T', ' ')} UTC\n\n${CONNECTIONS} connections, ${SECONDS} s each, production build, one Node process, signed in as the demo grower.\n\n${table}\n\nRatio progress / health: ${ratio}. First (uncached) read: Today for 200 plantings ${coldToday} ms, one planting's progress ${coldProgress} ms.\n`;
  console.log(report);
  mkdirSync(path.join(projectRoot, 'docs'), { recursive: true });
  appendFileSync(path.join(projectRoot, 'docs', 'benchmarks.md'), report);
} finally {
  server.kill('SIGTERM');
}
