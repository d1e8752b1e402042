import { expect } from 'vitest';
import path from 'node:path';
import { AxeBuilder } from '@axe-core/playwright';
import type { Locator, Page } from 'playwright-core';
import sharp from 'sharp';
import { screenshotDir } from '../../helpers/browser';

/** The two widths every journey runs at: a desktop window and a phone. */
export const WIDTHS = [
  { width: 1280, height: 900, label: 'desktop' },
  { width: 390, height: 844, label: 'phone' },
] as const;

const TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa'];

/** As in accessibility.test.ts: axe inside the page (legacy mode), serious and critical findings listed. */
export async function expectNoSeriousViolations(page: Page, where: string) {
  const { violations } = await new AxeBuilder({ page }).withTags(TAGS).setLegacyMode(true).analyze();
  const words = violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .flatMap((v) => v.nodes.map((n) => `${v.id} (${v.impact}) at ${n.target.join(' ')}: ${n.html.slice(0, 200)}`));
  expect(words, `${where}:\n${words.join('\n')}`).toEqual([]);
}

/** The page's main heading is there and nothing on it still says it is loading. */
export async function settle(page: Page, heading: string | RegExp) {
  await page.getByRole('heading', { level: 1, name: heading }).waitFor({ timeout: 15_000 });
  await page.waitForFunction(
    () => ![...document.querySelectorAll('[role=status]')].some((e) => /Loading|Opening|Checking|Drawing/.test(e.textContent ?? '')),
    undefined,
    { timeout: 15_000 },
  );
}

/** Nothing wider than the window (a phone must not scroll sideways), then axe. */
export async function checkPage(page: Page, where: string) {
  const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
  expect(overflow, `${where}: wider than the window`).toBeLessThanOrEqual(0);
  // From the top of the page, as it opens: on a phone the pinned tab bar lies over whatever row
  // happens to be at the bottom of the window after a scroll, which axe would report as that
  // row's target being covered (target-size), a finding of the scroll position, not of the page.
  await page.evaluate(() => window.scrollTo(0, 0));
  await expectNoSeriousViolations(page, where);
}

export const shot = (page: Page, name: string) => page.screenshot({ path: path.join(screenshotDir, `journey-${name}.png`), fullPage: true });

/** A small real PNG (a green square with a darker stripe), made here rather than kept as a file. */
export async function tinyPng(): Promise<Buffer> {
  const stripe = await sharp({ create: { width: 48, height: 8, channels: 3, background: '#2f5d2a' } }).png().toBuffer();
  return sharp({ create: { width: 48, height: 32, channels: 3, background: '#7fb069' } })
    .composite([{ input: stripe, top: 12, left: 0 }])
    .png()
    .toBuffer();
}

/** A chart's figure has an accessible name (aria-label, aria-labelledby or its figcaption); returns it. */
export async function expectChartHasWords(figure: Locator, where: string) {
  await figure.waitFor({ timeout: 15_000 });
  const name = await figure.evaluate((el) => {
    const labelled = el.getAttribute('aria-labelledby');
    const byId = labelled ? labelled.split(/\s+/).map((id) => document.getElementById(id)?.textContent ?? '').join(' ') : '';
    return (el.getAttribute('aria-label') || byId || el.querySelector('figcaption')?.textContent || '').trim();
  });
  expect(name, `${where}: the chart has no accessible name`).not.toBe('');
  return name;
}

/** Presses Tab (or Shift+Tab) until the focused element matches, at most `max` times; fails otherwise. */
export async function tabTo(page: Page, matches: (el: { tag: string; name: string; label: string; type: string }) => boolean, { back = false, max = 60 } = {}) {
  for (let i = 0; i < max; i++) {
    await page.keyboard.press(back ? 'Shift+Tab' : 'Tab');
    const el = await page.evaluate(() => {
      const a = document.activeElement as HTMLElement | null;
      if (!a) return { tag: '', name: '', label: '', type: '' };
      const input = a as HTMLInputElement;
      const labels = input.labels ? [...input.labels].map((l) => l.textContent ?? '').join(' ') : '';
      return { tag: a.tagName.toLowerCase(), name: (a.getAttribute('aria-label') ?? a.textContent ?? '').trim(), label: labels.trim(), type: input.type ?? '' };
    });
    if (matches(el)) return el;
  }
  throw new Error(`Tab did not reach the wanted element in ${max} presses`);
}
