import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { Garden } from '../../server/db/models';
import { screenshotDir, signInAs, startBrowserSession } from '../helpers/browser';
import type { WeatherService } from '../../server/modules/weather/weather.service';

let session: Awaited<ReturnType<typeof startBrowserSession>>;
beforeAll(async () => {
  session = await startBrowserSession();
}, 120_000);
afterAll(async () => {
  await session?.close();
});

/** Screenshots are tagged so a before/after pair can sit side by side (SHOT_TAG=before). */
const shot = (name: string) => path.join(screenshotDir, `${name}-${process.env.SHOT_TAG ?? 'after'}.png`);

async function weatherPage(width: number) {
  const garden = (await Garden.findOne({ where: { name: 'Saltbush Lane School Garden' } }))!;
  const weather = session.app.locals.weather as WeatherService;
  const cellId = (await weather.locateGarden(garden)) ?? garden.weatherCellId!;
  await weather.runRefresh({ kind: 'manual', gardenId: garden.id, cellId });
  const page = await session.newPage(width, 900);
  await signInAs(page, session.baseUrl, 'grower.rosa@hollowbrook.example');
  await page.goto(`${session.baseUrl}/g/${garden.id}/weather`);
  await page.locator('svg.recharts-surface').first().waitFor({ timeout: 15_000 });
  await page.locator('svg.recharts-surface .recharts-line-curve').first().waitFor({ timeout: 15_000 });
  return page;
}

type Box = { x: number; y: number; width: number; height: number };
const overlaps = (a: Box, b: Box) => a.x < b.x + b.width && b.x < a.x + a.width && a.y < b.y + b.height && b.y < a.y + a.height;

/** What the chart's words are and where they sit, read from the drawn SVG. */
async function chartText(page: Page) {
  return page.evaluate(() => {
    const svg = document.querySelector('svg.recharts-surface')!;
    const box = (el: Element) => {
      const r = el.getBoundingClientRect();
      return { x: r.x, y: r.y, width: r.width, height: r.height };
    };
    const texts = (selector: string) =>
      [...svg.querySelectorAll(selector)].map((el) => ({ text: el.textContent ?? '', box: box(el), fontSize: parseFloat(getComputedStyle(el).fontSize), fill: getComputedStyle(el).fill }));
    const grid = svg.querySelector('.recharts-cartesian-grid');
    return {
      plot: grid ? box(grid) : null,
      thresholdLabels: texts('[data-threshold-key]'),
      xTicks: texts('.recharts-xAxis-tick-labels .recharts-cartesian-axis-tick-value'),
      yTicks: texts('.recharts-yAxis-tick-labels .recharts-cartesian-axis-tick-value'),
      allText: texts('text'),
      lines: [...svg.querySelectorAll('.recharts-line-curve, .recharts-reference-line-line')].map(box),
      background: getComputedStyle(svg.closest('figure')!).backgroundColor,
    };
  });
}

/** WCAG 2.2 relative luminance and contrast ratio, from computed rgb() colours. */
function luminance(rgb: string): number {
  const [r, g, b] = rgb.match(/\d+(\.\d+)?/g)!.slice(0, 3).map((c) => Number(c) / 255).map((c) => (c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4));
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
}
const contrast = (a: string, b: string) => {
  const [hi, lo] = [luminance(a), luminance(b)].sort((x, y) => y - x);
  return (hi + 0.05) / (lo + 0.05);
};

describe('the weather chart’s words (Debian Chromium)', () => {
  for (const width of [1280, 390]) {
    it(`when the weather is opened at ${width} px, then threshold labels sit outside the plot, ticks are readable and do not collide, and every word has 4.5:1 contrast`, async () => {
      const page = await weatherPage(width);
      await page.screenshot({ path: shot(`weather-chart-${width}`), fullPage: false });
      await page.locator('figure').first().screenshot({ path: shot(`weather-chart-figure-${width}`) });
      const t = await chartText(page);
      expect(t.plot).not.toBeNull();
      const plot = t.plot!;

      expect(t.thresholdLabels.length).toBeGreaterThan(0);
      for (const label of t.thresholdLabels) {
        // Right of the plot, so no data line or threshold line runs under the words.
        expect(label.box.x, label.text).toBeGreaterThanOrEqual(plot.x + plot.width);
        for (const line of t.lines) expect(overlaps(label.box, line), `${label.text} over a line`).toBe(false);
      }
      for (let i = 0; i < t.thresholdLabels.length; i++) {
        for (let j = i + 1; j < t.thresholdLabels.length; j++) expect(overlaps(t.thresholdLabels[i].box, t.thresholdLabels[j].box)).toBe(false);
      }

      for (const ticks of [t.xTicks, t.yTicks]) {
        expect(ticks.length).toBeGreaterThan(1);
        for (const tick of ticks) expect(tick.fontSize, tick.text).toBeGreaterThanOrEqual(12);
        for (let i = 1; i < ticks.length; i++) expect(overlaps(ticks[i - 1].box, ticks[i].box), `${ticks[i - 1].text} / ${ticks[i].text}`).toBe(false);
      }
      if (width < 640) expect(t.xTicks.length).toBeLessThanOrEqual(5);

      for (const text of t.allText) expect(contrast(text.fill, t.background), `“${text.text}” in ${text.fill}`).toBeGreaterThanOrEqual(4.5);
      expect(session.pageErrors).toEqual([]);
    });
  }
});
