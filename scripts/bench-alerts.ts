/**
 * npm run bench:alerts — alert evaluation of 5,000 growing plantings in 200 gardens (one weather
 * cell each) after a nightly run, on the heatclock_bench database with the local fake weather:
 * two years of history per cell, then the nightly refresh leaves one pending planting-progress
 * event per garden, and the worker drains them (progress, then alerts). Reports wall time, database
 * statements issued (MariaDB's own Questions counter), peak memory and Node's CPU time;
 * BENCH_PROFILE=file.cpuprofile also writes a CPU profile of the evaluation alone.
 */
import inspector from 'node:inspector/promises';
import { writeFileSync } from 'node:fs';
import { loadConfig } from '../server/config';
import { createSequelize } from '../server/db/sequelize';
import { initModels, Bed, Garden, Planting, Variety } from '../server/db/models';
import { migrate } from '../server/db/migrate';
import { createLogger } from '../server/lib/logger';
import { localDate } from '../server/lib/local-date';
import { createApp, createWeatherService } from '../server/app';
import { startFakeWeather } from '../fixtures/weather/server';
import { addDays } from '#shared/thermal/dates';
import type { Worker } from '../server/jobs/worker';
import { figure } from './bench-figures';
import { GARDEN_EVENT_CONSUMERS } from '../server/modules/weather/weather-events';
import { emptyBenchGardens } from './bench-db';

const GARDENS = 200;
const PER_GARDEN = 25;

const base = loadConfig();
const config = { ...base, db: { ...base.db, database: process.env.BENCH_DB_NAME ?? 'heatclock_bench', poolMax: 20 }, weather: { ...base.weather, historyYears: 2 } };
const sequelize = createSequelize(config.db);
initModels(sequelize);
await migrate(sequelize);
await emptyBenchGardens(sequelize);

const fake = startFakeWeather('error');
const logger = createLogger('error');
const weather = createWeatherService(config, sequelize, logger);
const app = createApp({ config, sequelize, logger, clientDir: null, weather });
const worker = app.locals.worker as Worker;

// One garden per 0.5° cell across mid-latitudes of both hemispheres, 25 growing plantings each.
const VARIETIES = [
  { cropKey: 'lettuce', name: 'Bench butterhead', dtmDays: 55, dtmFrom: 'emergence' as const, boltTolerance: 2 },
  { cropKey: 'spinach', name: 'Bench spinach', dtmDays: 42, dtmFrom: 'sowing' as const, boltTolerance: 3 },
  { cropKey: 'cilantro', name: 'Bench cilantro', dtmDays: 50, dtmFrom: 'sowing' as const, boltTolerance: 1 },
  { cropKey: 'tomato', name: 'Bench tomato', dtmDays: 70, dtmFrom: 'transplant' as const, boltTolerance: null },
  { cropKey: 'pea', name: 'Bench pea', dtmDays: 60, dtmFrom: 'sowing' as const, boltTolerance: null },
];
for (let i = 0; i < GARDENS; i++) {
  const lat = (i % 2 ? -1 : 1) * (30 + Math.floor(i / 20) * 2) + 0.02;
  const garden = await Garden.create({ name: `Bench garden ${i}`, latitude: lat, longitude: -120 + (i % 20) * 5 + 0.02, timeZone: lat < 0 ? 'Australia/Sydney' : 'America/Chicago', units: 'F' });
  await weather.locateGarden(garden);
  const bed = await Bed.create({ gardenId: garden.id, name: 'Row', kind: 'row', lengthM: 50, widthM: 1, notes: '' });
  const varieties: Variety[] = [];
  for (const v of VARIETIES) {
    varieties.push(await Variety.create({ gardenId: garden.id, ...v, emergenceDaysMin: 4, emergenceDaysMax: 8, heatTolerance: 3, traits: [], containerFriendly: false, sunHours: 6, waterCmPerWeek: 2.5, sowDepthCm: 1, spacingCm: 20, thinSpacingCm: null, gddTargetOverrideC: null, notes: '' }));
  }
  const today = localDate(garden.timeZone);
  await Planting.bulkCreate(
    Array.from({ length: PER_GARDEN }, (_, k) => {
      const v = varieties[k % varieties.length];
      const start = addDays(today, -(5 + ((k * 7) % 60)));
      const transplant = v.cropKey === 'tomato';
      return {
        gardenId: garden.id, bedId: bed.id, varietyId: v.id, seedLotId: null, method: transplant ? ('transplant' as const) : ('direct-sow' as const), status: 'growing' as const,
        quantity: 10, quantityUnit: 'plants' as const, sownOn: transplant ? null : start, emergedOn: null, thinnedOn: null, transplantedOn: transplant ? start : null,
        firstHarvestOn: null, lastHarvestOn: null, boltedOn: null, notes: '', createdBy: null,
      };
    }),
  );
}
await weather.backfillPending();
await weather.runRefresh({ kind: 'nightly' });
await weather.idle();
await sequelize.query('DELETE FROM planting_progress');
// What a night owes: the weather consumers' event of every garden. The record-change events the
// setup's plantings queued would have run the day they were made; left in, they would evaluate
// every garden a second time, which no night does.
await sequelize.query('DELETE FROM garden_events WHERE consumer NOT IN (?)', { replacements: [[...GARDEN_EVENT_CONSUMERS]] });
await sequelize.query("UPDATE garden_events SET status = 'pending', run_after = UTC_TIMESTAMP(3), attempts = 0");
const [[{ n: pending }]] = (await sequelize.query("SELECT COUNT(*) AS n FROM garden_events WHERE status = 'pending'")) as [Array<{ n: number }>, unknown];

async function questions(): Promise<number> {
  const [[row]] = (await sequelize.query("SHOW GLOBAL STATUS LIKE 'Questions'")) as [Array<{ Value: string }>, unknown];
  return Number(row.Value);
}

let peakRss = 0;
const sample = setInterval(() => (peakRss = Math.max(peakRss, process.memoryUsage().rss)), 20);
const q0 = await questions();
// BENCH_PROFILE=file.cpuprofile records a CPU profile of the evaluation alone.
const profiler = process.env.BENCH_PROFILE ? new inspector.Session() : null;
if (profiler) {
  profiler.connect();
  await profiler.post('Profiler.enable');
  await profiler.post('Profiler.start');
}
const cpu0 = process.cpuUsage();
const started = performance.now();
await worker.drain();
const ms = performance.now() - started;
const cpu = process.cpuUsage(cpu0);
const nodeCpuMs = (cpu.user + cpu.system) / 1000;
if (profiler) {
  const { profile } = await profiler.post('Profiler.stop');
  writeFileSync(process.env.BENCH_PROFILE!, JSON.stringify(profile));
  profiler.disconnect();
}
const q1 = await questions();
clearInterval(sample);
const [[{ n: alerts }]] = (await sequelize.query("SELECT COUNT(*) AS n FROM alerts WHERE status = 'open'")) as [Array<{ n: number }>, unknown];
const plantings = GARDENS * PER_GARDEN;
console.log(
  `bench:alerts — ${plantings} growing plantings in ${GARDENS} gardens / cells, ${pending} pending events: ` +
    `${(ms / 1000).toFixed(2)} s wall (target < 10 s: ${ms < 10_000 ? 'met' : 'NOT met'}), ${q1 - q0 - 1} statements ` +
    `(${((q1 - q0 - 1) / GARDENS).toFixed(1)} per garden, ${((q1 - q0 - 1) / plantings).toFixed(2)} per planting), ` +
    `peak RSS ${(peakRss / 1024 / 1024).toFixed(0)} MB, Node CPU ${(nodeCpuMs / 1000).toFixed(2)} s, ${alerts} open alerts`,
);
figure('alerts', `evaluation of ${GARDENS * PER_GARDEN} growing plantings in ${GARDENS} gardens after a night (target < 10 s)`, ms / 1000, 's');
figure('alerts', 'database statements per garden', (q1 - q0 - 1) / GARDENS, 'statements');
figure('alerts', 'peak RSS of the evaluation', peakRss / 2 ** 20, 'MB');
fake.close();
await sequelize.close();
