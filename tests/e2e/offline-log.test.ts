import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdirSync } from 'node:fs';
import type { Page } from 'playwright-core';
import type { LogEntryDto, PlantingDto } from '#shared/schemas/plantings';
import { signInAs, startBrowserSession } from '../helpers/browser';
import { tinyPng } from './helpers/journeys';

// Runs against the production build (it has the service worker); screenshots go to /tmp/hc-pwa.
const shots = '/tmp/hc-pwa';
let session: Awaited<ReturnType<typeof startBrowserSession>>;

beforeAll(async () => {
  session = await startBrowserSession();
  mkdirSync(shots, { recursive: true });
}, 120_000);
afterAll(async () => {
  await session?.close();
});

async function firstGrowingPlanting(page: Page): Promise<PlantingDto> {
  const answer = await page.request.get(`${session.baseUrl}/api/gardens/1/plantings?pageSize=100`);
  expect(answer.ok()).toBe(true);
  const { items } = (await answer.json()) as { items: PlantingDto[] };
  const planting = items.find((p) => p.status === 'growing') ?? items[0];
  expect(planting).toBeDefined();
  return planting!;
}

async function logNotes(page: Page, plantingId: number): Promise<string[]> {
  const answer = await page.request.get(`${session.baseUrl}/api/gardens/1/plantings/${plantingId}/log?pageSize=200`);
  expect(answer.ok()).toBe(true);
  return ((await answer.json()) as { items: LogEntryDto[] }).items.map((e) => e.note);
}

/** Each step's time, printed at the end, and named in the error when one fails (CI runs on 2 busy cores). */
const steps: string[] = [];
async function step<T>(name: string, work: () => Promise<T>): Promise<T> {
  const t0 = Date.now();
  try {
    const out = await work();
    steps.push(`${name} ${((Date.now() - t0) / 1000).toFixed(1)} s`);
    return out;
  } catch (err) {
    throw new Error(`step “${name}” failed after ${((Date.now() - t0) / 1000).toFixed(1)} s (before it: ${steps.join(', ') || 'none'}): ${(err as Error).message}`);
  }
}

describe('logging in a bed with no signal (Debian Chromium, service worker on)', () => {
  it('when the manifest is fetched, then it is linked from the page and every icon it names exists', async () => {
    const page = await session.newPage(1280, 900, { serviceWorkers: 'allow' });
    await page.goto(`${session.baseUrl}/sign-in`);
    const href = await page.locator('link[rel="manifest"]').getAttribute('href');
    expect(href).toBe('/manifest.webmanifest');
    const manifest = (await (await page.request.get(`${session.baseUrl}${href}`)).json()) as {
      name: string;
      display: string;
      icons: { src: string; sizes: string; purpose: string }[];
    };
    expect(manifest).toMatchObject({ name: 'Heatclock', display: 'standalone' });
    expect(manifest.icons.map((i) => `${i.sizes} ${i.purpose}`).sort()).toEqual(['192x192 any', '192x192 maskable', '512x512 any', '512x512 maskable']);
    for (const icon of manifest.icons) {
      const file = await page.request.get(`${session.baseUrl}${icon.src}`);
      expect(file.status()).toBe(200);
      expect(file.headers()['content-type']).toBe('image/png');
    }
    await page.context().close();
  });

  it('when an entry and a photo are saved offline, then they wait on the device, the page reopens from the cache, and once online the server has it once', async () => {
    const page = await session.newPage(1280, 900, { serviceWorkers: 'allow' });
    const context = page.context();
    await signInAs(page, session.baseUrl, 'grower.rosa@hollowbrook.example');
    const planting = await firstGrowingPlanting(page);
    const url = `${session.baseUrl}/g/1/plantings/${planting.id}`;
    await step('open the planting', () => page.goto(url));
    // Installing means fetching the whole shell (about 100 files): slow on a loaded machine, so bounded and named.
    await step('service worker installed', () =>
      page.evaluate(() =>
        Promise.race([
          navigator.serviceWorker.ready.then(() => true),
          new Promise((_, reject) =>
            setTimeout(() => {
              // Say how far it got: no registration, or a worker stuck installing.
              void navigator.serviceWorker.getRegistration().then((r) => {
                const state = r ? `installing ${r.installing?.state ?? '-'}, waiting ${r.waiting?.state ?? '-'}, active ${r.active?.state ?? '-'}` : 'no registration';
                reject(new Error(`not ready in 45 s (${state}; document ${document.readyState})`));
              });
            }, 45_000),
          ),
        ]),
      ),
    );
    // The first load ran before the worker took control: load again so its answers are cached.
    await step('reload under the worker', () => page.reload());
    expect(await page.evaluate(() => navigator.serviceWorker.controller !== null)).toBe(true);
    await step('planting page drawn', () => page.getByRole('heading', { name: 'Add to the log' }).waitFor({ timeout: 20_000 }));
    // The worker has kept the planting's answer: what the page reopens from offline.
    await step('planting answer cached', () =>
      page.waitForFunction(
        async (id) => {
          const cache = await caches.open('heatclock-api');
          return (await cache.keys()).some((r) => new URL(r.url).pathname === `/api/gardens/1/plantings/${id}`);
        },
        planting.id,
        { timeout: 20_000, polling: 250 },
      ),
    );

    const note = `offline check ${Date.now()}`;
    const caption = `offline photo ${Date.now()}`;
    await context.setOffline(true);
    await step('log an entry offline', async () => {
      await page.getByRole('button', { name: 'Watered', exact: true }).click();
      await page.getByLabel('Note (optional)').fill(note);
      await page.getByRole('button', { name: 'Save “Watered”' }).click();
      await page.getByText('waiting to send — saved on this device').first().waitFor({ timeout: 20_000 });
      await page.getByText('Waiting to send — saved on this device at').waitFor();
      await page.getByText('1 entry waiting to send.').waitFor();
    });
    await step('add a photo offline', async () => {
      const photoForm = page.getByRole('form', { name: 'Add a photo' });
      await photoForm.getByLabel('Photo').setInputFiles({ name: 'bed-edge.png', mimeType: 'image/png', buffer: await tinyPng() });
      await photoForm.getByLabel('Caption (optional)').fill(caption);
      await photoForm.getByRole('button', { name: 'Add photo' }).click();
      await page.getByText('Photo waiting to send').waitFor({ timeout: 20_000 });
      await page.getByText('1 photo is waiting to send from this device.').waitFor();
      await page.getByText('2 entries waiting to send.').waitFor();
    });

    await step('reopen offline from the cache', async () => {
      await page.reload();
      await page.getByText('Offline — showing what you last saw.').waitFor({ timeout: 15_000 });
      await page.getByRole('heading', { name: 'Add to the log' }).waitFor({ timeout: 15_000 });
      await page.getByText(planting.variety.name).first().waitFor();
      await page.getByText('Waiting to send — saved on this device at').waitFor();
      await page.screenshot({ path: `${shots}/offline-1280.png`, fullPage: true });
      await page.setViewportSize({ width: 390, height: 900 });
      await page.screenshot({ path: `${shots}/offline-390.png`, fullPage: true });
    });
    // Asked outside the page (Playwright's own request, not the offline browser): the server has nothing yet.
    expect(await logNotes(page, planting.id)).not.toContain(note);

    await context.setOffline(false);
    await step('back online: sent', async () => {
      await page.getByText('Waiting to send — saved on this device at').waitFor({ state: 'detached', timeout: 30_000 });
      await page.getByText(note).waitFor({ timeout: 15_000 });
    });
    // Another flush (a reconnect announced twice, a reload) sends nothing more.
    await step('reload: still once', async () => {
      await page.reload();
      await page.getByText(note).waitFor({ timeout: 15_000 });
      await page.getByRole('img', { name: caption }).waitFor({ timeout: 15_000 });
    });
    expect((await logNotes(page, planting.id)).filter((n) => n === note)).toHaveLength(1);
    const photos = (await (await page.request.get(`${session.baseUrl}/api/gardens/1/plantings/${planting.id}/photos`)).json()) as { photos: { caption: string }[] };
    expect(photos.photos.filter((p) => p.caption === caption)).toHaveLength(1);
    await context.close();
    process.stdout.write(`[offline journey] ${steps.join(', ')}\n`);
  }, 150_000);
});
