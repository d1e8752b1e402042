/**
 * npm run bench:weather — one nightly weather run for 1,000 gardens spread over 200 cells, against
 * the local fake weather service answering with 50 ms latency, on a separate bench database.
 * Reports wall time, requests made (must equal cells) and peak memory.
 */
import { loadConfig } from '../server/config';
import { createSequelize } from '../server/db/sequelize';
import { initModels, Garden } from '../server/db/models';
import { migrate } from '../server/db/migrate';
import { createLogger } from '../server/lib/logger';
import { createWeatherService } from '../server/app';
import { startFakeWeather } from '../fixtures/weather/server';
import { fakeWeather } from '../fixtures/weather/control';
import { figure } from './bench-figures';
import { emptyBenchGardens } from './bench-db';

const GARDENS = 1000;
const CELLS = 200;
const LATENCY_MS = 50;

const base = loadConfig();
const config = { ...base, db: { ...base.db, database: process.env.BENCH_DB_NAME ?? 'heatclock_bench', poolMax: 20 } };
const sequelize = createSequelize(config.db);
initModels(sequelize);
await migrate(sequelize);
await emptyBenchGardens(sequelize);

const fake = startFakeWeather('error');
const weather = createWeatherService(config, sequelize, createLogger('error'));

// 200 cells on a 0.5° grid across mid-latitudes of both hemispheres; five gardens within each cell.
const rows = [];
for (let i = 0; i < GARDENS; i++) {
  const cell = i % CELLS;
  const lat = (cell % 2 ? -1 : 1) * (30 + Math.floor(cell / 20) * 2) + 0.02 + (i % 5) * 0.01;
  const lon = -120 + (cell % 20) * 5 + 0.02;
  rows.push({ name: `Bench garden ${i}`, latitude: lat, longitude: lon, timeZone: lat < 0 ? 'Australia/Sydney' : 'America/Chicago', units: 'F' as const });
}
await Garden.bulkCreate(rows);
for (const g of await Garden.findAll()) await weather.locateGarden(g);
const [[{ cells }]] = (await sequelize.query('SELECT COUNT(*) AS cells FROM weather_cells')) as [Array<{ cells: number }>, unknown];

async function measured(label: string) {
  await sequelize.query('UPDATE weather_cells SET refreshed_at = NULL');
  fakeWeather.requests = [];
  fakeWeather.latencyMs = LATENCY_MS;
  let peakRss = 0;
  let peakHeap = 0;
  const sample = setInterval(() => {
    const m = process.memoryUsage();
    peakRss = Math.max(peakRss, m.rss);
    peakHeap = Math.max(peakHeap, m.heapUsed);
  }, 20);
  const started = performance.now();
  const run = await weather.runRefresh({ kind: 'nightly' });
  const ms = performance.now() - started;
  clearInterval(sample);
  const mb = (b: number) => (b / 1024 / 1024).toFixed(0);
  console.log(
    `${label}: ${(ms / 1000).toFixed(2)} s wall, ${fakeWeather.requests.length} requests for ${cells} cells / ${GARDENS} gardens, ` +
      `${run.cellsOk} cells ok, ${run.cellsFailed} failed, ${run.daysWritten} days written, peak RSS ${mb(peakRss)} MB, peak heap ${mb(peakHeap)} MB`,
  );
  return { ms, requests: fakeWeather.requests.length, peakRss };
}

console.log(`bench:weather — ${GARDENS} gardens in ${cells} cells, fake service latency ${LATENCY_MS} ms, concurrency ${config.weather.concurrency}`);
const firstNight = await measured('first night (92 past days + 16-day forecast per cell)');
const night = await measured('nightly run (yesterday + forecast)');
figure('weather', `first night, ${GARDENS} gardens in ${cells} cells (50 ms fake latency)`, firstNight.ms / 1000, 's');
figure('weather', `nightly run, ${GARDENS} gardens in ${cells} cells (target < 30 s)`, night.ms / 1000, 's');
figure('weather', 'requests per cell in the nightly run (target 1.00)', night.requests / Number(cells), 'requests');
figure('weather', 'peak RSS of the nightly run', night.peakRss / 2 ** 20, 'MB');
console.log(`requests per cell: ${(night.requests / Number(cells)).toFixed(2)} (target 1.00); target wall time < 30 s: ${night.ms < 30_000 ? 'met' : 'NOT met'}`);
fake.close();
await sequelize.close();
