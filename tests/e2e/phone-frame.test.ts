import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { screenshotDir, signInAs, startBrowserSession } from '../helpers/browser';

let session: Awaited<ReturnType<typeof startBrowserSession>>;

beforeAll(async () => {
  session = await startBrowserSession();
}, 60_000);
afterAll(async () => {
  await session?.close();
});

const GROWER = 'grower.rosa@hollowbrook.example';
const h1 = (page: Page, name: string) => page.getByRole('heading', { level: 1, name });
const tabBar = (page: Page) => page.getByRole('navigation', { name: 'Garden' });

async function signedInPhone() {
  const page = await session.newPage(390, 844);
  await signInAs(page, session.baseUrl, GROWER);
  await h1(page, 'Today').waitFor({ timeout: 15_000 });
  return page;
}

describe('the garden frame on a phone (Debian Chromium, 390 × 844)', () => {
  it('while the session is being checked, then the wait shows in the page frame, not at the top-left edge', async () => {
    const page = await session.newPage(390, 844);
    await signInAs(page, session.baseUrl, GROWER);
    let answer = () => {};
    const held = new Promise<void>((resolve) => (answer = resolve));
    await page.route('**/api/auth/me', async (route) => {
      await held;
      await route.continue();
    });
    await page.reload();
    const waiting = page.getByRole('status').filter({ hasText: 'Checking your session…' });
    await waiting.waitFor();
    const box = (await waiting.boundingBox())!;
    const banner = (await page.getByRole('banner').boundingBox())!;
    expect(box.y).toBeGreaterThan(banner.y + banner.height);
    expect(box.x).toBeGreaterThanOrEqual(16);
    await page.screenshot({ path: path.join(screenshotDir, 'frame-checking-session-phone.png') });
    answer();
    await h1(page, 'Today').waitFor({ timeout: 15_000 });
  });

  it('when Today opens, then the top bar is at most 120 px, names the garden in full, and stays pinned', async () => {
    const page = await signedInPhone();

    const banner = page.getByRole('banner');
    const box = (await banner.boundingBox())!;
    expect(box.height).toBeLessThanOrEqual(120);
    const switcher = page.getByRole('combobox', { name: 'Garden' });
    expect(await switcher.getAttribute('title')).toMatch(/^Hollowbrook Teaching Garden \(/);
    await page.screenshot({ path: path.join(screenshotDir, 'frame-today-phone.png') });

    await page.mouse.wheel(0, 1500);
    await page.waitForFunction(() => window.scrollY > 0);
    expect((await banner.boundingBox())!.y).toBe(0);
    const nav = (await tabBar(page).boundingBox())!;
    expect(nav.y + nav.height).toBeCloseTo(844, 0);
    // The last of the page is not left under the tab bar.
    await page.evaluate(() => window.scrollTo(0, document.documentElement.scrollHeight));
    const mainBottom = await page.locator('main').evaluate((m) => {
      const last = [...m.querySelectorAll('*')].filter((e) => e.getClientRects().length > 0).pop()!;
      return last.getBoundingClientRect().bottom;
    });
    expect(mainBottom).toBeLessThanOrEqual(nav.y);
    expect(session.pageErrors).toEqual([]);
  });

  it('when the grower taps Plantings, Alerts and Today in the tab bar, then each opens in one tap', async () => {
    const page = await signedInPhone();
    const bar = tabBar(page);

    for (const [tab, heading] of [
      ['Plantings', 'Plantings'],
      [/^Alerts/, 'Alerts'],
      ['Today', 'Today'],
    ] as const) {
      const link = bar.getByRole('link', { name: tab });
      await link.click();
      await h1(page, heading).waitFor({ timeout: 10_000 });
      expect(await link.getAttribute('aria-current')).toBe('page');
    }
    await page.screenshot({ path: path.join(screenshotDir, 'frame-tabs-phone.png') });
  });

  it('when the tab bar shows, then every link and button in it is at least 44 × 44 px', async () => {
    const page = await signedInPhone();
    const targets = tabBar(page).locator('a:visible, button:visible');
    expect(await targets.count()).toBe(4);
    for (const target of await targets.all()) {
      const box = (await target.boundingBox())!;
      const name = await target.innerText();
      expect(box.height, name).toBeGreaterThanOrEqual(44);
      expect(box.width, name).toBeGreaterThanOrEqual(44);
    }
  });

  it('when the grower opens More, then it lists the other pages, Escape closes it, and Weather opens from it', async () => {
    const page = await signedInPhone();
    const more = tabBar(page).getByRole('button', { name: 'More' });
    expect(await more.getAttribute('aria-expanded')).toBe('false');

    await more.focus();
    await page.keyboard.press('Enter');
    expect(await more.getAttribute('aria-expanded')).toBe('true');
    const panel = page.locator(`[id="${await more.getAttribute('aria-controls')}"]`);
    for (const name of ['Varieties', 'Seed lots', 'Beds', 'Crops', 'Weather', 'Garden settings', 'Test mailbox']) {
      await panel.getByRole('link', { name }).waitFor();
    }
    await panel.getByRole('button', { name: 'Sign out' }).waitFor();
    for (const target of await panel.locator('a, button').all()) {
      expect((await target.boundingBox())!.height, await target.innerText()).toBeGreaterThanOrEqual(44);
    }
    await page.screenshot({ path: path.join(screenshotDir, 'frame-more-phone.png') });
    await page.keyboard.press('Escape');
    await panel.waitFor({ state: 'detached' });
    expect(await more.evaluate((b) => b === document.activeElement)).toBe(true);

    await more.click();
    await panel.getByRole('link', { name: 'Weather' }).click();
    await h1(page, 'Weather').waitFor({ timeout: 10_000 });
    await panel.waitFor({ state: 'detached' });
    expect(await more.getAttribute('aria-expanded')).toBe('false');
  });

  it('when the crop library is opened at a crop, then no internal source marks show', async () => {
    const page = await signedInPhone();
    const gardenId = page.url().match(/\/g\/(\d+)/)![1];
    await page.goto(`${session.baseUrl}/g/${gardenId}/crops`);
    await h1(page, 'Crop library').waitFor({ timeout: 10_000 });
    const lettuce = page.locator('summary', { hasText: 'Lettuce' }).first();
    await lettuce.click();
    await page.getByRole('heading', { level: 3 }).first().waitFor();

    await page.screenshot({ path: path.join(screenshotDir, 'frame-crop-phone.png'), fullPage: true });
    // What shows, what is read out, and what a hover shows; each offending line is reported.
    const lines = await page.locator('main').evaluate((m) => [
      ...(m as HTMLElement).innerText.split('\n'),
      ...[...m.querySelectorAll('.sr-only')].map((e) => e.textContent ?? ''),
      ...[...m.querySelectorAll('[title]')].map((e) => `title: ${e.getAttribute('title')}`),
    ]);
    expect(lines.join(' ')).toContain('Lettuce');
    const marks = [...new Set(lines.filter((line) => /SCIENCE|from memory|common practice, no source/i.test(line)))];
    expect(marks).toEqual([]);
  });
});

describe.each([768, 1280])('the garden frame on a wider screen (%i px)', (width) => {
  it('when Today opens, then every page is a link in the header, with no tab bar or More', async () => {
    const page = await session.newPage(width, 900);
    await signInAs(page, session.baseUrl, GROWER);
    await h1(page, 'Today').waitFor({ timeout: 15_000 });
    const nav = tabBar(page);
    for (const name of ['Today', 'Plantings', /^Alerts/, 'Varieties', 'Seed lots', 'Beds', 'Crops', 'Weather', 'Garden settings']) {
      expect(await nav.getByRole('link', { name }).isVisible(), String(name)).toBe(true);
    }
    expect(await nav.getByRole('button', { name: 'More' }).isVisible()).toBe(false);
    const header = (await page.getByRole('banner').boundingBox())!;
    // Two rows: the garden and account, then every page.
    expect(header.height).toBeLessThanOrEqual(120);
    const navBox = (await nav.boundingBox())!;
    expect(navBox.y + navBox.height).toBeLessThanOrEqual(header.y + header.height);
    await page.getByRole('button', { name: 'Sign out' }).waitFor();

    await nav.getByRole('link', { name: 'Weather' }).click();
    await h1(page, 'Weather').waitFor({ timeout: 10_000 });
    expect(await nav.getByRole('link', { name: 'Weather' }).getAttribute('aria-current')).toBe('page');
    await page.screenshot({ path: path.join(screenshotDir, `frame-weather-${width}.png`) });
    expect(session.pageErrors).toEqual([]);
  });
});
