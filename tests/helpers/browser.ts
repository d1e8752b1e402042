import { existsSync, mkdirSync } from 'node:fs';
import path from 'node:path';
import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import { chromium } from 'playwright-core';
import type { Browser, Page } from 'playwright-core';
import { createApp } from '../../server/app';
import { projectRoot } from '../../server/config';
import { testDb } from './test-app';
import { CHROMIUM, CHROMIUM_ARGS } from './chromium';

export { CHROMIUM } from './chromium';

/**
 * The built client and the API in this process on a free loopback port, and Debian's Chromium
 * driven by playwright-core (never a downloaded browser; a fresh profile per launch). Any request leaving loopback fails the page.
 */
export async function startBrowserSession() {
  if (!existsSync(CHROMIUM)) throw new Error('Chromium is missing: scripts/browser.sh installs it (apt-get install chromium)');
  // CLIENT_DIR: a build elsewhere (parallel work on one checkout builds into its own folder).
  const clientDir = process.env.CLIENT_DIR ?? path.join(projectRoot, 'dist', 'client');
  if (!existsSync(path.join(clientDir, 'index.html'))) throw new Error('The client is not built: run npx vite build');
  // The demo accounts and gardens are seeded once per run by the global setup.
  const { sequelize, config } = testDb();
  const app = createApp({ config, sequelize, clientDir });
  const server: Server = await new Promise((resolve) => {
    const s = app.listen(0, '127.0.0.1', () => resolve(s));
  });
  const baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  mkdirSync(screenshotDir, { recursive: true });
  const browser: Browser = await chromium.launch({
    executablePath: CHROMIUM,
    args: CHROMIUM_ARGS,
  });
  const offsite: string[] = [];
  const pageErrors: string[] = [];
  // Service workers answer requests page.route never sees: blocked unless a test is about them.
  async function newPage(width = 1280, height = 900, { serviceWorkers = 'block' }: { serviceWorkers?: 'allow' | 'block' } = {}): Promise<Page> {
    const page = await browser.newPage({ viewport: { width, height }, serviceWorkers });
    await page.route('**/*', (route) => {
      const url = new URL(route.request().url());
      if (url.hostname === '127.0.0.1' || url.protocol === 'data:' || url.protocol === 'blob:') return route.continue();
      offsite.push(url.toString());
      return route.abort();
    });
    page.on('pageerror', (err) => pageErrors.push(err.message));
    page.on('console', (msg) => {
      if (msg.type() === 'error' && !/status of 40[13]/.test(msg.text())) pageErrors.push(msg.text());
    });
    return page;
  }
  async function close() {
    await browser.close();
    await new Promise((r) => server.close(r));
  }
  return { app, baseUrl, newPage, close, offsite, pageErrors };
}

export async function signInAs(page: Page, baseUrl: string, email: string, password = 'heatclock-demo') {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL(/\/g\/\d+/);
}

export const screenshotDir = path.join(projectRoot, 'tests', 'e2e', 'screenshots');
