/**
 * Client benchmark: JavaScript sent over the wire for sign-in, Today and Weather, and the time
 * from navigation start to Today's first content, in Debian's Chromium with an empty cache.
 *
 * Needs a production server already running with the demo seeded:
 *   BENCH_URL=http://127.0.0.1:3000 node --import tsx scripts/bench-client.ts
 * `benchClient(baseUrl)` is exported for scripts/bench-api.ts.
 */
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { chromium } from 'playwright-core';
import type { BrowserContext, Page } from 'playwright-core';
import { CHROMIUM, CHROMIUM_ARGS } from '../tests/helpers/chromium';

const DEMO = { email: 'grower.rosa@hollowbrook.example', password: 'heatclock-demo' };
/** Recharts and the two chunks that draw with it; no other page needs them. */
const CHART_CHUNK = /\/assets\/(recharts|weather-chart|progress-chart)-[^/]*\.js$/;
const LOADS = 3;
/** A slow mobile link (150 ms round trip, 1.6 Mbit/s down, 750 kbit/s up), where bytes show in the time. */
const SLOW_4G = { offline: false, latency: 150, downloadThroughput: 1.6e6 / 8, uploadThroughput: 750e3 / 8 };

export interface JsTransfer {
  /** Bytes of JavaScript on the wire (compressed as sent, response headers not counted). */
  total: number;
  withoutCharts: number;
  files: number;
}

export interface ClientFigures {
  signIn: JsTransfer;
  today: JsTransfer;
  weather: JsTransfer;
  /** Navigation start to Today's heading and first planting row (or "nothing growing"), median of LOADS loads. */
  todayFirstContentMs: number;
  todayFirstContentRunsMs: number[];
  /** The same over SLOW_4G. */
  todayFirstContentSlow4gMs: number;
  todayFirstContentSlow4gRunsMs: number[];
}

/** Counts every script response of the page's loads through the DevTools protocol, with the cache off. */
async function watchScripts(page: Page, network?: typeof SLOW_4G) {
  const cdp = await page.context().newCDPSession(page);
  const scripts = new Map<string, { url: string; headerBytes: number }>();
  const finished: { url: string; bytes: number }[] = [];
  cdp.on('Network.responseReceived', ({ requestId, type, response }) => {
    if (type === 'Script') scripts.set(requestId, { url: response.url, headerBytes: response.encodedDataLength });
  });
  cdp.on('Network.loadingFinished', ({ requestId, encodedDataLength }) => {
    const script = scripts.get(requestId);
    if (script) finished.push({ url: script.url, bytes: encodedDataLength - script.headerBytes });
  });
  await cdp.send('Network.enable');
  await cdp.send('Network.setCacheDisabled', { cacheDisabled: true });
  if (network) await cdp.send('Network.emulateNetworkConditions', network);
  return (): JsTransfer => {
    const charts = finished.filter((f) => CHART_CHUNK.test(new URL(f.url).pathname));
    const sum = (list: { bytes: number }[]) => list.reduce((n, f) => n + f.bytes, 0);
    return { total: sum(finished), withoutCharts: sum(finished) - sum(charts), files: finished.length };
  };
}

async function measure(context: BrowserContext, url: string, ready: (page: Page) => Promise<unknown>) {
  const page = await context.newPage();
  const transfer = await watchScripts(page);
  await page.goto(url);
  await ready(page);
  await page.waitForLoadState('networkidle');
  const figures = transfer();
  await page.close();
  return figures;
}

/**
 * Resolves with performance.now() (ms since navigation start) in the first frame Today shows its
 * heading and what is growing: the first planting row, or the line saying nothing is (in winter).
 */
function todayFirstContent(page: Page) {
  return page.waitForFunction(
    () => {
      const heading = document.querySelector('h1')?.textContent === 'Today';
      const growing = document.querySelector('section[aria-labelledby="growing-now"] > ul > li, section[aria-labelledby="growing-now"] > p');
      return heading && growing ? performance.now() : false;
    },
    undefined,
    { polling: 'raf', timeout: 30_000 },
  );
}

async function signIn(context: BrowserContext, baseUrl: string): Promise<string> {
  const page = await context.newPage();
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(DEMO.email);
  await page.getByLabel('Password').fill(DEMO.password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL(/\/g\/\d+$/);
  const gardenPath = new URL(page.url()).pathname;
  await page.close();
  return gardenPath;
}

async function timeToday(context: BrowserContext, url: string, network?: typeof SLOW_4G): Promise<number> {
  const page = await context.newPage();
  await watchScripts(page, network);
  await page.goto(url, { waitUntil: 'commit' });
  const ms = (await (await todayFirstContent(page)).jsonValue()) as number;
  await page.close();
  return ms;
}

const median = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)];

export async function benchClient(baseUrl: string): Promise<ClientFigures> {
  const profile = await mkdtemp(join(tmpdir(), 'heatclock-bench-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: CHROMIUM,
    headless: true,
    args: CHROMIUM_ARGS,
    viewport: { width: 1280, height: 800 },
    // A first visit: the service worker would otherwise precache every chunk while /sign-in
    // loads and serve Today's scripts from its cache (0 bytes over the network).
    serviceWorkers: 'block',
  });
  try {
    const signInBytes = await measure(context, `${baseUrl}/sign-in`, (page) =>
      page.getByRole('button', { name: 'Sign in' }).waitFor(),
    );
    const garden = `${baseUrl}${await signIn(context, baseUrl)}`;
    const today = await measure(context, garden, todayFirstContent);
    const weather = await measure(context, `${garden}/weather`, (page) =>
      page.locator('.recharts-surface').first().waitFor(),
    );
    const runs: number[] = [];
    const slowRuns: number[] = [];
    for (let i = 0; i < LOADS; i++) runs.push(Math.round(await timeToday(context, garden)));
    for (let i = 0; i < LOADS; i++) slowRuns.push(Math.round(await timeToday(context, garden, SLOW_4G)));
    return {
      signIn: signInBytes,
      today,
      weather,
      todayFirstContentMs: median(runs),
      todayFirstContentRunsMs: runs,
      todayFirstContentSlow4gMs: median(slowRuns),
      todayFirstContentSlow4gRunsMs: slowRuns,
    };
  } finally {
    await context.close();
    await rm(profile, { recursive: true, force: true });
  }
}

const kB = (bytes: number) => `${(bytes / 1000).toFixed(1)} kB`;

export function clientTable(f: ClientFigures): string {
  const row = (page: string, t: JsTransfer) => `| ${page} | ${t.files} | ${kB(t.withoutCharts)} | ${kB(t.total)} |`;
  return [
    '| page | JS files | JS transferred without chart chunks | JS transferred in all |',
    '|---|---:|---:|---:|',
    row('/sign-in', f.signIn),
    row('Today (/g/:id)', f.today),
    row('Weather (chart drawn)', f.weather),
    '',
    `Today's first content (heading and first planting row, or its "nothing growing" line), median of ${LOADS} cold loads:`,
    '',
    '| network | median | loads |',
    '|---|---:|---|',
    `| as is (loopback) | ${f.todayFirstContentMs} ms | ${f.todayFirstContentRunsMs.join(', ')} ms |`,
    `| slow 4G (150 ms, 1.6 Mbit/s) | ${f.todayFirstContentSlow4gMs} ms | ${f.todayFirstContentSlow4gRunsMs.join(', ')} ms |`,
  ].join('\n');
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  const baseUrl = (process.env.BENCH_URL ?? 'http://127.0.0.1:3000').replace(/\/$/, '');
  console.log(clientTable(await benchClient(baseUrl)));
}
