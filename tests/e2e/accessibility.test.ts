import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import path from 'node:path';
import { AxeBuilder } from '@axe-core/playwright';
import type { Page } from 'playwright-core';
import { Planting } from '../../server/db/models';
import type { WeatherService } from '../../server/modules/weather/weather.service';
import { screenshotDir, signInAs, startBrowserSession } from '../helpers/browser';
import { inSeasonGarden } from '../helpers/in-season-garden';

/**
 * Every page, signed in as a grower and signed out, checked by axe-core against WCAG 2.0, 2.1 and
 * 2.2 A and AA at a wide and a phone width; serious and critical findings fail. Chart words are
 * SVG, where axe cannot work out contrast, so they are measured here against WCAG 2.2's
 * definitions of relative luminance and contrast ratio (SC 1.4.3: at least 4.5:1).
 */
const TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa'];
const WIDTHS = [
  { width: 1280, height: 900 },
  { width: 390, height: 844 },
];

let session: Awaited<ReturnType<typeof startBrowserSession>>;
let gardenId: number;
let plantingId: number;

beforeAll(async () => {
  session = await startBrowserSession();
  const garden = await inSeasonGarden(session.app.locals.weather as WeatherService);
  gardenId = garden.id;
  plantingId = (await Planting.findOne({ where: { gardenId, status: 'growing' }, order: [['id', 'ASC']] }))!.id;
}, 120_000);
afterAll(async () => {
  await session?.close();
});

function luminance([r, g, b]: readonly number[]): number {
  const [lr, lg, lb] = [r, g, b].map((v) => v / 255).map((c) => (c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4));
  return 0.2126 * lr + 0.7152 * lg + 0.0722 * lb;
}
function contrast(a: readonly number[], b: readonly number[]): number {
  const [hi, lo] = [luminance(a), luminance(b)].sort((x, y) => y - x);
  return (hi + 0.05) / (lo + 0.05);
}

/** Waits for the page's heading, its data and any lazily loaded part (a chart) to have arrived. */
async function settle(page: Page, heading: string | RegExp) {
  await page.getByRole('heading', { level: 1, name: heading }).waitFor({ timeout: 15_000 });
  await page.waitForLoadState('networkidle');
  await page.waitForFunction(
    () => ![...document.querySelectorAll('[role=status]')].some((e) => /Loading|Opening|Checking/.test(e.textContent ?? '')),
    undefined,
    { timeout: 15_000 },
  );
}

async function expectNoSeriousViolations(page: Page, where: string) {
  // Legacy mode runs axe inside the page itself: the session's pages own their context, where the
  // default mode would open a second page to combine frames' results (Heatclock has no frames).
  const { violations } = await new AxeBuilder({ page }).withTags(TAGS).setLegacyMode(true).analyze();
  const serious = violations.filter((v) => v.impact === 'serious' || v.impact === 'critical');
  const words = serious.flatMap((v) =>
    v.nodes.map((n) => `${v.id} (${v.impact}) at ${n.target.join(' ')}: ${n.html.slice(0, 200)}\n    ${n.failureSummary?.replace(/\n/g, ' ')}`),
  );
  expect(words, `${where}:\n${words.join('\n')}`).toEqual([]);
}

/** Every word drawn in the page's charts whose fill is below 4.5:1 against what is behind the chart. */
async function expectReadableChartText(page: Page, where: string) {
  await page.locator('figure svg text').first().waitFor({ timeout: 15_000 });
  const drawn = await page.locator('figure svg text').evaluateAll((texts) =>
    texts
      .filter((t) => (t.textContent ?? '').trim() !== '' && t.getClientRects().length > 0)
      .map((t) => {
        let behind: Element | null = t.closest('svg');
        let background = 'rgba(0, 0, 0, 0)';
        while (behind) {
          background = getComputedStyle(behind).backgroundColor;
          if (!/rgba\(.*,\s*0\)$|transparent/.test(background)) break;
          behind = behind.parentElement;
        }
        const style = getComputedStyle(t);
        return { text: (t.textContent ?? '').trim(), fill: style.fill, opacity: Number(style.fillOpacity) * Number(style.opacity), background };
      }),
  );
  expect(drawn.length, `${where}: chart words`).toBeGreaterThan(0);
  const rgb = (css: string) => (css.match(/[\d.]+/g) ?? []).map(Number);
  const failing = drawn
    .map((d) => {
      const bg = rgb(d.background).slice(0, 3);
      const [r, g, b, a = 1] = rgb(d.fill);
      const alpha = a * d.opacity;
      const fill = [r, g, b].map((c, i) => c * alpha + bg[i] * (1 - alpha));
      return { ...d, ratio: Math.round(contrast(fill, bg) * 100) / 100 };
    })
    .filter((d) => !(d.ratio >= 4.5));
  const words = failing.map((d) => `"${d.text}" ${d.fill} on ${d.background}: ${d.ratio}:1`);
  expect(words, `${where}, chart words below 4.5:1:\n${words.join('\n')}`).toEqual([]);
}

describe.each(WIDTHS)('signed in as a grower, at $width px: no serious or critical WCAG findings', ({ width, height }) => {
  let page: Page;
  const shot = (name: string) => page.screenshot({ path: path.join(screenshotDir, `a11y-${name}-${width}.png`), fullPage: true });
  const visit = async (url: string, heading: string | RegExp) => {
    await page.goto(`${session.baseUrl}${url}`);
    await settle(page, heading);
  };

  beforeAll(async () => {
    page = await session.newPage(width, height);
    await signInAs(page, session.baseUrl, 'grower.rosa@hollowbrook.example');
  }, 30_000);

  const PAGES: ReadonlyArray<[string, () => string, string | RegExp]> = [
    ['Today', () => `/g/${gardenId}`, 'Today'],
    ['Alerts', () => `/g/${gardenId}/alerts`, 'Alerts'],
    ['Plantings', () => `/g/${gardenId}/plantings`, 'Plantings'],
    ['Varieties', () => `/g/${gardenId}/varieties`, 'Varieties'],
    ['Seed lots', () => `/g/${gardenId}/seed-lots`, 'Seed lots'],
    ['Beds', () => `/g/${gardenId}/beds`, 'Beds'],
    ['Crops', () => `/g/${gardenId}/crops`, 'Crop library'],
    ['Garden settings', () => `/g/${gardenId}/settings`, 'Garden settings'],
    ['Plan', () => `/g/${gardenId}/plan`, 'Plan'],
    ['Compare', () => `/g/${gardenId}/compare`, 'Compare'],
    ['Test mailbox', () => '/mailbox', 'Test mailbox'],
  ];

  it.each(PAGES)('when %s opens, then axe finds nothing serious', async (name, url, heading) => {
    await visit(url(), heading);
    await expectNoSeriousViolations(page, `${name} at ${width} px`);
  });

  it('when the garden menu is open on a phone, or the header shows on a wide screen, then axe finds nothing serious', async () => {
    await visit(`/g/${gardenId}`, 'Today');
    const more = page.getByRole('navigation', { name: 'Garden' }).getByRole('button', { name: 'More' });
    if (await more.isVisible()) await more.click();
    await expectNoSeriousViolations(page, `garden navigation at ${width} px`);
    await shot('navigation');
  });

  it('when a planting’s page opens, then axe finds nothing serious and its chart words are readable', async () => {
    await visit(`/g/${gardenId}/plantings/${plantingId}`, /./);
    await expectReadableChartText(page, `planting at ${width} px`);
    await expectNoSeriousViolations(page, `planting at ${width} px`);
    await shot('planting');
  });

  it('when the new planting form is open, then axe finds nothing serious', async () => {
    await visit(`/g/${gardenId}/plantings`, 'Plantings');
    await page.getByRole('button', { name: 'New planting' }).click();
    await page.getByRole('heading', { name: 'New planting' }).waitFor();
    await settle(page, 'Plantings');
    await expectNoSeriousViolations(page, `new planting form at ${width} px`);
    await shot('new-planting');
  });

  it('when a crop is opened in the library, then axe finds nothing serious', async () => {
    await visit(`/g/${gardenId}/crops`, 'Crop library');
    await page.locator('summary', { hasText: 'Lettuce' }).first().click();
    await page.getByRole('heading', { level: 3 }).first().waitFor();
    await expectNoSeriousViolations(page, `a crop at ${width} px`);
  });

  it('when Weather opens, then axe finds nothing serious and its chart words are readable', async () => {
    await visit(`/g/${gardenId}/weather`, 'Weather');
    await expectReadableChartText(page, `weather at ${width} px`);
    await expectNoSeriousViolations(page, `weather at ${width} px`);
    await shot('weather');
  });
});

describe.each(WIDTHS)('signed out, at $width px: no serious or critical WCAG findings', ({ width, height }) => {
  it.each([
    ['/sign-in', 'Sign in'],
    ['/register', 'Create an account'],
  ])('when %s opens, then axe finds nothing serious', async (url, heading) => {
    const page = await session.newPage(width, height);
    await page.goto(`${session.baseUrl}${url}`);
    await settle(page, heading);
    await page.getByRole('button').first().waitFor();
    await expectNoSeriousViolations(page, `${url} at ${width} px`);
    await page.close();
  });
});

describe('the checks themselves', () => {
  it('when a page has a nameless button, faint text and faint chart words, then each check reports them', async () => {
    const page = await session.newPage(1280, 900);
    await page.goto(`${session.baseUrl}/sign-in`);
    await settle(page, 'Sign in');
    await page.evaluate(() => {
      const main = document.querySelector('main')!;
      main.insertAdjacentHTML(
        'beforeend',
        '<button type="button"></button><p style="color:#d8cfbf">Faint words</p>' +
          '<figure><svg width="200" height="40"><text x="4" y="20" fill="#c9bfae">Faint tick</text><text x="4" y="36" fill="#2b2118">Dark tick</text></svg></figure>',
      );
    });

    await expect(expectNoSeriousViolations(page, 'planted flaws')).rejects.toThrow(/button-name \(critical\)[\s\S]*color-contrast \(serious\)|color-contrast \(serious\)[\s\S]*button-name \(critical\)/);
    const chart = expectReadableChartText(page, 'planted chart');
    await expect(chart).rejects.toThrow(/"Faint tick" rgb\(201, 191, 174\)/);
    await expect(expectReadableChartText(page, 'planted chart')).rejects.not.toThrow(/Dark tick/);
    await page.close();
  });
});
