/**
 * npm run bench:api — signed-in reads under load against the production build on loopback.
 * Seeds the invented demo (and a generated copy of its in-season garden holding 5,000 growing
 * plantings) into the heatclock_bench database with weather from the local fake, starts the server
 * as `npm start` does (NODE_ENV=production, built client), signs in as the demo grower and runs
 * autocannon at 50 connections for BENCH_SECONDS (30) per endpoint, BENCH_RUNS (3) times, with
 * /api/health in every run for the ratio; then 200 connections for 20 s to see the overload shed,
 * then the client figures in Chromium (scripts/bench-client.ts). Prints the tables and appends
 * them to docs/benchmarks.md.
 */
import { spawn } from 'node:child_process';
import type { ChildProcess } from 'node:child_process';
import { appendFileSync, existsSync, mkdirSync, readFileSync } from 'node:fs';
import { createServer } from 'node:net';
import os from 'node:os';
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
import { createApp, createWeatherService } from '../server/app';
import { addDays } from '#shared/thermal/dates';
import { seasonOf, seasonOfYear } from '#shared/thermal/season';
import { seasonYearOf } from '../server/db/planting-season';
import { figure } from './bench-figures';

const SECONDS = Number(process.env.BENCH_SECONDS ?? 30);
const RUNS = Number(process.env.BENCH_RUNS ?? 3);
const CONNECTIONS = 50;
const DB = process.env.BENCH_DB_NAME ?? 'heatclock_bench';
const BIG_COUNT = 5000;
const BIG = `Bench garden with ${BIG_COUNT} plantings`;
/** Past lettuce plantings of the compare garden, per season, over COMPARE_SEASONS seasons. */
const COMPARE_PER_SEASON = 200;
const COMPARE_SEASONS = 3;
const COMPARED = `Bench garden with ${COMPARE_PER_SEASON * COMPARE_SEASONS} past lettuce plantings`;

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
    // 50 beds of 100 plantings: the unique key (variety, bed, method, start) allows it.
    const beds = await Bed.bulkCreate(Array.from({ length: 50 }, (_, i) => ({ gardenId: big.id, name: `Row ${i + 1}`, kind: 'row' as const, lengthM: 30, widthM: 1, notes: '' })));
    const own: Variety[] = [];
    for (const v of varieties) own.push(await Variety.create({ ...v.get({ plain: true }), id: undefined, gardenId: big.id }));
    const today = localDate(big.timeZone);
    for (let chunk = 0; chunk < BIG_COUNT; chunk += 1000) {
      await Planting.bulkCreate(
        Array.from({ length: 1000 }, (_, k) => {
          const i = chunk + k;
          return {
            gardenId: big.id, bedId: beds[i % beds.length].id, varietyId: own[Math.floor(i / beds.length) % own.length].id, seedLotId: null,
            method: 'direct-sow' as const, status: 'growing' as const, quantity: 10, quantityUnit: 'plants' as const,
            sownOn: addDays(today, -(5 + (Math.floor(i / (beds.length * own.length)) % 70))), emergedOn: null, thinnedOn: null, transplantedOn: null,
            firstHarvestOn: null, lastHarvestOn: null, boltedOn: null, notes: '', createdBy: null,
          };
        }),
      );
    }
  }
  const compared = await seedCompared(demo, home.id, users.map((u) => u.id));
  const fake = (await import('../fixtures/weather/server')).startFakeWeather('error');
  const weather = createWeatherService({ ...base, db: { ...base.db, database: DB } }, sequelize, createLogger('warn'));
  for (const g of [...gardens, big, compared.garden]) {
    const cellId = (await weather.locateGarden(g)) ?? g.weatherCellId;
    if (cellId) await weather.prepareCell(cellId, g.id);
  }
  await weather.idle();
  fake.close();
  // The generated garden's alerts, as the nightly evaluation would leave them.
  const app = createApp({ config: { ...base, db: { ...base.db, database: DB } }, sequelize, clientDir: null, weather, logger: createLogger('warn') });
  const t = performance.now();
  await (app.locals.alerts as { evaluate: (gardenId: number) => Promise<unknown> }).evaluate(big.id);
  const evaluateBig = Math.round(performance.now() - t);
  const planting = await Planting.findOne({ where: { gardenId: home.id, status: 'growing' }, order: [['id', 'ASC']] });
  const lettuce = await Variety.findAll({ where: { gardenId: home.id, cropKey: 'lettuce' }, order: [['id', 'ASC']] });
  // Start cold: no stored progress and no pending weather events for the worker to warm it with.
  await sequelize.query('DELETE FROM garden_events');
  await sequelize.query('DELETE FROM planting_progress');
  await sequelize.close();
  return {
    home: home.id, big: big.id, planting: planting!.id, today: localDate(home.timeZone), evaluateBig,
    lettuce: lettuce.map((v) => v.id), compared: compared.garden.id, comparedSeasons: compared.seasons,
  };
}

/**
 * A copy of the in-season demo garden holding COMPARE_SEASONS past seasons of lettuce, each with
 * COMPARE_PER_SEASON plantings sown a week apart in its spring, each recorded as picked, bolted or
 * both (some bolted before their first harvest, some after), for the compare read.
 */
async function seedCompared(demo: (typeof DEMO_GARDENS)[number], homeId: number, userIds: number[]) {
  const [garden] = await Garden.findOrCreate({ where: { name: COMPARED }, defaults: { ...demo, name: COMPARED } });
  for (const userId of userIds) await Membership.findOrCreate({ where: { userId, gardenId: garden.id }, defaults: { userId, gardenId: garden.id, role: 'grower' } });
  const latitude = garden.latitude ?? demo.latitude;
  const current = seasonOf(localDate(garden.timeZone), latitude).startYear;
  const seasons = Array.from({ length: COMPARE_SEASONS }, (_, k) => current - COMPARE_SEASONS + k);
  if ((await Planting.count({ where: { gardenId: garden.id } })) === 0) {
    const varieties: Variety[] = [];
    for (const v of await Variety.findAll({ where: { gardenId: homeId, cropKey: 'lettuce' }, order: [['id', 'ASC']] })) {
      varieties.push(await Variety.create({ ...v.get({ plain: true }), id: undefined, gardenId: garden.id }));
    }
    const BEDS = 20;
    const beds = await Bed.bulkCreate(Array.from({ length: BEDS }, (_, i) => ({ gardenId: garden.id, name: `Lettuce row ${i + 1}`, kind: 'row' as const, lengthM: 10, widthM: 1, notes: '' })));
    // bulkCreate runs no beforeSave hook, so the start day and season are written here from the same rule.
    const rows = seasons.flatMap((year) => {
      // A month into the season's spring (September south of the equator, March north of it).
      const first = addDays(seasonOfYear(year, latitude).start, 62);
      return Array.from({ length: COMPARE_PER_SEASON }, (_, i) => {
        const variety = varieties[i % varieties.length];
        const sownOn = addDays(first, 7 * Math.floor(i / BEDS));
        const firstHarvestOn = addDays(sownOn, 48 + (i % 5) * 4);
        const boltedOn = i % 4 === 0 ? null : addDays(sownOn, 44 + (i % 9) * 4);
        const p = {
          gardenId: garden.id, bedId: beds[i % BEDS].id, varietyId: variety.id, seedLotId: null,
          method: 'direct-sow' as const, status: boltedOn && boltedOn < firstHarvestOn ? ('bolted' as const) : ('harvested' as const),
          quantity: 10, quantityUnit: 'plants' as const, sownOn, emergedOn: null, thinnedOn: null, transplantedOn: null,
          firstHarvestOn, lastHarvestOn: addDays(firstHarvestOn, 14), boltedOn, notes: '', createdBy: null, startOn: sownOn,
        };
        return { ...p, seasonYear: seasonYearOf(p, variety, latitude) };
      });
    });
    await Planting.bulkCreate(rows);
  }
  return { garden, seasons };
}

async function startServer(port: number) {
  // BENCH_PROFILE=<dir> writes the server's CPU profile there on exit (profile before optimising).
  const profile = process.env.BENCH_PROFILE ? ['--cpu-prof', '--cpu-prof-dir', path.resolve(process.env.BENCH_PROFILE)] : [];
  const child = spawn(process.execPath, [...profile, '--import', 'tsx', 'server/index.ts'], {
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

/** Resident memory of the server process, MB. */
function rssOf(child: ChildProcess): number {
  const status = readFileSync(`/proc/${child.pid}/status`, 'utf8');
  return Math.round(Number(/VmRSS:\s+(\d+)/.exec(status)![1]) / 1024);
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

interface Sample { rps: number; p50: number; p99: number; errors: number }

/** `vary(n)`: the path of the n-th request, for a read that must miss the read cache every time. */
async function load(url: string, cookie: string, connections = CONNECTIONS, duration = SECONDS, vary?: (n: number) => string) {
  const requests = vary ? [{ setupRequest: (req: autocannon.Request) => ({ ...req, path: vary(asked++) }) }] : undefined;
  return autocannon({ url, connections, duration, headers: { cookie }, ...(requests ? { requests } : {}) });
}

async function sample(url: string, cookie: string, vary?: (n: number) => string): Promise<Sample> {
  const r = await load(url, cookie, CONNECTIONS, SECONDS, vary);
  if (vary && asked > 3 * VARIANTS) console.warn(`\n${asked} varied requests so far but only ${3 * VARIANTS} distinct paths: the later ones may have hit the read cache`);
  return { rps: Math.round(r.requests.average), p50: r.latency.p50, p99: r.latency.p99, errors: r.errors + r.timeouts + r.non2xx };
}

/**
 * Distinct paths for a read that must miss: the query schemas are strict (no spare parameter),
 * but the read cache keys by the URL as sent, so a number written with n leading zeros
 * (varietyId=0…07, parsed as 7) or a season named again (seasons=2023,2023,…, de-duplicated) is
 * the same request to the service and a new key to the cache. Paths stay under 8 KB.
 */
const VARIANTS = 6000;
const zeros = (n: number) => '0'.repeat(n % VARIANTS);
/** Varied requests made so far, across every run: each one gets a path of its own. */
let asked = 0;

/** Times of `count` sequential reads, each at a path not read before. */
async function sequential(base: string, cookie: string, count: number, vary: (n: number) => string) {
  const ms: number[] = [];
  for (let k = 0; k < count; k++) ms.push((await timeOnce(`${base}${vary(asked++)}`, cookie)).ms);
  return ms;
}

async function timeOnce(url: string, cookie: string): Promise<{ ms: number; bytes: number }> {
  const t = performance.now();
  const res = await fetch(url, { headers: { cookie } });
  const body = await res.arrayBuffer();
  if (res.status !== 200) throw new Error(`${url}: ${res.status}`);
  return { ms: Math.round(performance.now() - t), bytes: body.byteLength };
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
const spread = (xs: number[]) => (xs.length > 1 ? ` (${Math.min(...xs)}–${Math.max(...xs)})` : '');

if (!existsSync(path.join(projectRoot, 'dist', 'client', 'index.html'))) throw new Error('Build the client first: npx vite build');
const ids = await seed();
const port = await freePort();
const server = await startServer(port);
try {
  const base = `http://127.0.0.1:${port}`;
  const cookie = await signIn(base);
  const g = (id: number) => `${base}/api/gardens/${id}`;
  // Each miss asks for another of the demo's lettuces at another risk, the variety id written with n leading zeros.
  const planPath = (n: number) => `/api/gardens/${ids.home}/plan?varietyId=${zeros(Math.floor(n / 3))}${ids.lettuce[n % ids.lettuce.length]}&frostRisk=${['10', '50', '90'][n % 3]}`;
  const comparePath = (n: number) => `/api/gardens/${ids.compared}/compare?crop=lettuce&seasons=${[...Array<number>(Math.floor(n / 3) % VARIANTS).fill(ids.comparedSeasons[n % 3]), ...ids.comparedSeasons].join(',')}`;
  const seasonsText = `${ids.comparedSeasons.length} seasons`;
  const all: { name: string; url: string; signedIn: boolean; vary?: (n: number) => string }[] = [
    { name: '/api/health', url: `${base}/api/health`, signedIn: false },
    { name: '/api/auth/me', url: `${base}/api/auth/me`, signedIn: true },
    { name: '/api/gardens', url: `${base}/api/gardens`, signedIn: true },
    { name: 'plantings list (demo garden)', url: `${g(ids.home)}/plantings`, signedIn: true },
    { name: 'weather, 45 days (demo garden)', url: `${g(ids.home)}/weather?from=${addDays(ids.today, -37)}&to=${addDays(ids.today, 7)}`, signedIn: true },
    { name: 'varieties (demo garden)', url: `${g(ids.home)}/varieties`, signedIn: true },
    { name: 'seed lots (demo garden)', url: `${g(ids.home)}/seed-lots`, signedIn: true },
    { name: 'progress of a demo planting', url: `${g(ids.home)}/plantings/${ids.planting}/progress`, signedIn: true },
    { name: 'Today (demo garden)', url: `${g(ids.home)}/today`, signedIn: true },
    { name: `plantings list (${BIG_COUNT} plantings)`, url: `${g(ids.big)}/plantings`, signedIn: true },
    { name: `Today (${BIG_COUNT} plantings)`, url: `${g(ids.big)}/today`, signedIn: true },
    { name: 'plan of a demo lettuce, read-cache hit', url: `${g(ids.home)}/plan?varietyId=${ids.lettuce[0]}&frostRisk=50`, signedIn: true },
    { name: 'plan of a demo lettuce, read-cache miss each request', url: `${g(ids.home)}/plan?varietyId=${ids.lettuce[0]}&frostRisk=50`, signedIn: true, vary: planPath },
    { name: `compare lettuce, ${seasonsText} × ${COMPARE_PER_SEASON}, read-cache hit`, url: `${base}${comparePath(0)}`, signedIn: true },
    { name: `compare lettuce, ${seasonsText} × ${COMPARE_PER_SEASON}, read-cache miss each request`, url: `${base}${comparePath(0)}`, signedIn: true, vary: comparePath },
  ];
  // BENCH_ONLY=<text> measures only the endpoints whose name holds it (with health for the ratio)
  // and writes nothing to docs/benchmarks.md: a quick look, or a profile (BENCH_PROFILE).
  const only = process.env.BENCH_ONLY;
  const endpoints = only ? all.filter((e) => e.name === '/api/health' || e.name.includes(only)) : all;
  // First reads of plan and compare, before anything below warms them: the plan's weather and
  // climatology are loaded and prepared; the compare computes and stores 600 progress answers.
  const wants = (prefix: string) => endpoints.some((e) => e.name.startsWith(prefix));
  const first = {
    plan: wants('plan of') ? await timeOnce(`${base}${planPath(asked++)}`, cookie) : null,
    compare: wants('compare') ? await timeOnce(`${base}${comparePath(asked++)}`, cookie) : null,
  };
  // Cold: the first read of the day computes and stores every growing planting's progress.
  const cold = only
    ? null
    : {
        todayDemo: await timeOnce(`${g(ids.home)}/today`, cookie),
        todayBig: await timeOnce(`${g(ids.big)}/today`, cookie),
        progress: await timeOnce(`${g(ids.home)}/plantings/${ids.planting}/progress`, cookie),
      };
  const sizes = new Map<string, number>();
  for (const e of endpoints) sizes.set(e.name, (await timeOnce(e.url, cookie)).bytes);
  // Sequential misses (one request at a time, each at a path not read before), per run.
  const seqPlan: number[] = [];
  const seqCompare: number[] = [];
  const samples = new Map<string, Sample[]>(endpoints.map((e) => [e.name, []]));
  for (let run = 0; run < RUNS; run++) {
    let healthOfRun = 0;
    for (const e of endpoints) {
      const got = await sample(e.url, cookie, e.vary);
      samples.get(e.name)!.push(got);
      if (e.name === '/api/health') healthOfRun = got.rps;
      figure('api', `${e.name}: req/s`, got.rps, 'req/s', 'higher');
      figure('api', `${e.name}: p50`, got.p50, 'ms');
      figure('api', `${e.name}: p99`, got.p99, 'ms');
      figure('api', `${e.name}: errors`, got.errors, 'errors');
      if (healthOfRun && e.name !== '/api/health') figure('api ratio', `${e.name} ÷ health, req/s`, got.rps / healthOfRun, '×', 'higher');
      process.stdout.write('.');
    }
    if (first.plan) seqPlan.push(median(await sequential(base, cookie, 30, planPath)));
    if (first.compare) seqCompare.push(median(await sequential(base, cookie, 10, comparePath)));
    if (first.plan) figure('api', 'plan, sequential read-cache misses, p50 of 30', seqPlan.at(-1)!, 'ms');
    if (first.compare) figure('api', 'compare, sequential read-cache misses over stored progress, p50 of 10', seqCompare.at(-1)!, 'ms');
  }
  console.log();
  const misses = [
    first.plan ? `Plan: first read after the server started ${first.plan.ms} ms (weather loaded, climatology prepared); sequential read-cache misses (30 a run, each another variety or risk) p50 ${median(seqPlan)}${spread(seqPlan)} ms.` : '',
    first.compare ? `Compare: first read ${first.compare.ms} ms (computes and stores the ${COMPARE_PER_SEASON * COMPARE_SEASONS} plantings' progress); sequential read-cache misses over stored progress (10 a run) p50 ${median(seqCompare)}${spread(seqCompare)} ms.` : '',
  ].filter(Boolean).join(' ');
  console.log(misses);
  const healthRps = median(samples.get('/api/health')!.map((s) => s.rps));
  const row = (e: (typeof endpoints)[number]) => {
    const xs = samples.get(e.name)!;
    const rps = xs.map((s) => s.rps);
    const p50 = xs.map((s) => s.p50);
    const p99 = xs.map((s) => s.p99);
    const errors = xs.reduce((n, s) => n + s.errors, 0);
    return `| ${e.name} | ${median(rps)}${spread(rps)} | ${median(p50)}${spread(p50)} | ${median(p99)}${spread(p99)} | ${errors} | ${(median(rps) / healthRps).toFixed(2)} | ${(sizes.get(e.name)! / 1024).toFixed(1)} |`;
  };
  const table = [
    '| endpoint | req/s | p50 ms | p99 ms | errors | × health | body KiB |',
    '|---|---|---|---|---|---|---|',
    ...endpoints.map(row),
  ].join('\n');

  if (only) {
    console.log(table);
  } else {
    // Overload: 200 connections on the heaviest read; only 2xx or 503 may come back.
    const before = rssOf(server);
    const over = await load(`${g(ids.home)}/today`, cookie, 200, 20);
    const after = rssOf(server);
    figure('api', '200 connections on Today (demo garden): req/s', Math.round(over.requests.average), 'req/s', 'higher');
    figure('api', '200 connections on Today (demo garden): p99', over.latency.p99, 'ms');
    const codes = Object.entries(over.statusCodeStats ?? {}).map(([code, v]) => `${code}: ${(v as { count: number }).count}`).join(', ');
    const overload = `200 connections × 20 s on Today (demo garden): ${Math.round(over.requests.average)} req/s, p50 ${over.latency.p50} ms, p99 ${over.latency.p99} ms; status codes ${codes}; socket errors ${over.errors}, timeouts ${over.timeouts}; server RSS ${before} MB before, ${after} MB after.`;

    let client = '';
    const clientBench = path.join(projectRoot, 'scripts', 'bench-client.ts');
    if (existsSync(clientBench)) {
      const { benchClient, clientTable } = (await import(clientBench)) as { benchClient: (b: string) => Promise<unknown>; clientTable: (r: unknown) => string };
      try {
        const figures = (await benchClient(base)) as { todayFirstContentRunsMs: number[]; todayFirstContentSlow4gRunsMs: number[]; today: { total: number; withoutCharts: number }; signIn: { total: number } };
        for (const ms of figures.todayFirstContentRunsMs) figure('client', "Today's first content, cold load on loopback", ms, 'ms');
        for (const ms of figures.todayFirstContentSlow4gRunsMs) figure('client', "Today's first content, cold load on slow 4G (150 ms, 1.6 Mbit/s)", ms, 'ms');
        figure('client', 'JS transferred for Today, without chart chunks', figures.today.withoutCharts / 1000, 'kB');
        figure('client', 'JS transferred for /sign-in', figures.signIn.total / 1000, 'kB');
        client = `\n### Client (headless Chromium, loopback)\n\n${clientTable(figures)}\n`;
      } catch (err) {
        client = `\nClient figures could not be taken: ${(err as Error).message}\n`;
      }
    }

    const machine = `${os.cpus().length} × ${os.cpus()[0]?.model ?? 'CPU'}, ${Math.round(os.totalmem() / 2 ** 30)} GiB, Node ${process.version}`;
    const report = `\n## bench:api — ${new Date().toISOString().slice(0, 16).replace('T', ' ')} UTC\n\n${machine}. ${CONNECTIONS} connections, ${SECONDS} s per endpoint, median of ${RUNS} runs (min–max), production build, one Node process, signed in as the demo grower (health unauthenticated).\n\n${table}\n\nFirst (uncached) reads: Today of the demo garden ${cold!.todayDemo.ms} ms, Today of the ${BIG_COUNT}-planting garden ${cold!.todayBig.ms} ms, one planting's progress ${cold!.progress.ms} ms. ${misses} Evaluating the ${BIG_COUNT}-planting garden's alerts ${ids.evaluateBig} ms.\n\n${overload}\n${client}`;
    console.log(report);
    figure('api', 'first read of Today (demo garden)', cold!.todayDemo.ms, 'ms');
    figure('api', `first read of Today (${BIG_COUNT} plantings)`, cold!.todayBig.ms, 'ms');
    figure('api', `alert evaluation of the ${BIG_COUNT}-planting garden`, ids.evaluateBig, 'ms');
    // Under npm run bench (BENCH_FIGURES) the report is written by scripts/bench.ts instead.
    if (!process.env.BENCH_FIGURES) {
      mkdirSync(path.join(projectRoot, 'docs'), { recursive: true });
      appendFileSync(path.join(projectRoot, 'docs', 'benchmarks.md'), report);
    }
  }
} finally {
  const exited = new Promise((resolve) => server.once('exit', resolve));
  server.kill('SIGTERM');
  await exited;
}
