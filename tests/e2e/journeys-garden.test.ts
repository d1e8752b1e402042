import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { QueryTypes } from 'sequelize';
import { Planting } from '../../server/db/models';
import type { Garden } from '../../server/db/models';
import { localDate } from '../../server/lib/local-date';
import type { WeatherService } from '../../server/modules/weather/weather.service';
import { signInAs, startBrowserSession } from '../helpers/browser';
import { inSeasonGarden } from '../helpers/in-season-garden';
import { testDb } from '../helpers/test-app';
import { checkPage, expectChartHasWords, settle, shot, WIDTHS } from './helpers/journeys';

/**
 * The garden's shared pages in the browser (Debian Chromium, production build on loopback): a
 * station file with a bad row, an alert acknowledged, Compare and Plan read in words, and what a
 * viewer is (not) offered.
 */
let session: Awaited<ReturnType<typeof startBrowserSession>>;
let garden: Garden;

beforeAll(async () => {
  session = await startBrowserSession();
  garden = await inSeasonGarden(session.app.locals.weather as WeatherService);
}, 120_000);
afterAll(async () => {
  await session?.close();
});

const daysBefore = (iso: string, n: number) => new Date(Date.parse(`${iso}T00:00:00Z`) - n * 86_400_000).toISOString().slice(0, 10);

/** Waits until no part of the page says it is still working. */
async function quiet(page: Page) {
  await page.waitForFunction(
    () => ![...document.querySelectorAll('[role=status]')].some((e) => /Loading|Making|Comparing|Drawing|Checking/.test(e.textContent ?? '')),
    undefined,
    { timeout: 20_000 },
  );
}

describe.each(WIDTHS)('garden journeys at $width px ($label)', ({ width, height, label }) => {
  let page: Page;
  beforeAll(async () => {
    page = await session.newPage(width, height);
    await signInAs(page, session.baseUrl, 'grower.rosa@hollowbrook.example');
  }, 30_000);

  it('when a station file with one bad row is uploaded on Weather, then nothing is imported and the line and column to fix are named', async () => {
    await page.goto(`${session.baseUrl}/g/${garden.id}/weather`);
    await settle(page, 'Weather');
    const today = localDate(garden.timeZone);
    const csv = ['date,high,low', `${daysBefore(today, 40)},21.5,9.0`, `${daysBefore(today, 39)},warm,8.4`, `${daysBefore(today, 38)},22.1,10.2`].join('\n');
    await page.getByRole('radio', { name: /Celsius|°C/ }).check();
    await page.getByLabel('CSV file').setInputFiles({ name: 'shed-station.csv', mimeType: 'text/csv', buffer: Buffer.from(csv) });
    await page.getByRole('button', { name: 'Upload readings' }).click();
    const failure = page.getByRole('alert').filter({ hasText: 'Nothing was imported' });
    await failure.waitFor({ timeout: 15_000 });
    const rows = failure.getByRole('region', { name: 'Rows to fix' }).getByRole('row');
    expect(await rows.count()).toBe(2);
    const cells = await rows.nth(1).getByRole('cell').allInnerTexts();
    expect(cells).toEqual(['3', 'high', '"warm" is not a number.']);
    expect(await failure.innerText()).toMatch(/Fix this row in the file and upload it again/);
    await checkPage(page, `weather upload refused, ${width} px`);
    await shot(page, `station-bad-row-${label}`);
  });

  it('when the grower acknowledges an open alert, then it moves under Acknowledged with their name', async () => {
    await page.goto(`${session.baseUrl}/g/${garden.id}/alerts`);
    await settle(page, 'Alerts');
    await quiet(page);
    const open = page.locator('section[aria-labelledby="alerts-open"]');
    if ((await open.getByRole('button', { name: /^Acknowledge/ }).count()) === 0) {
      // Earlier runs acknowledged them all: open one again, as a new alert would be.
      await testDb().sequelize.query(
        `UPDATE alerts SET status = 'open', acknowledged_at = NULL, acknowledged_by = NULL WHERE garden_id = ? AND status = 'acknowledged' ORDER BY id LIMIT 1`,
        { replacements: [garden.id], type: QueryTypes.UPDATE },
      );
      await page.reload();
      await settle(page, 'Alerts');
      await quiet(page);
    }
    const card = open.getByRole('article').first();
    await card.waitFor({ timeout: 10_000 });
    const title = (await card.getByRole('heading', { level: 3 }).innerText()).trim();
    expect(await card.locator('li').first().innerText()).toMatch(/\d/);
    await checkPage(page, `alerts, ${width} px`);
    await card.getByRole('button', { name: /^Acknowledge/ }).click();
    const acknowledged = page.locator('section[aria-labelledby="alerts-acknowledged"]').getByRole('article').filter({ has: page.getByRole('heading', { name: title, exact: true }) });
    await acknowledged.first().waitFor({ timeout: 10_000 });
    expect(await acknowledged.first().innerText()).toMatch(/Acknowledged \S.* by \S/);
    await checkPage(page, `alerts after acknowledging, ${width} px`);
    await shot(page, `alert-acknowledged-${label}`);
  });

  it('when the grower opens Compare, then the ranking says how many heat days each variety stood, and the chart has its figures in a table', async () => {
    await page.goto(`${session.baseUrl}/g/${garden.id}/compare`);
    await settle(page, 'Compare');
    await quiet(page);
    const ranking = page.locator('section[aria-labelledby="compare-ranking"]');
    await ranking.waitFor({ timeout: 20_000 });
    const evidence = await ranking.locator('ol > li').allInnerTexts();
    expect(evidence.length).toBeGreaterThan(0);
    expect(evidence.join('\n')).toMatch(/\d+ heat days?/);
    const chart = page.locator('section[aria-labelledby="compare-chart"] figure');
    const name = await expectChartHasWords(chart, 'compare chart');
    expect(name).toMatch(/Heat days and degree days/);
    const table = page.locator('section[aria-labelledby="compare-table"] table');
    await table.waitFor();
    expect(await table.innerText()).toMatch(/°[CF]-days|heat days/i);
    await checkPage(page, `compare, ${width} px`);
    await shot(page, `compare-${label}`);
  });

  it('when the grower opens Plan, then a named sowing window with its dates is given, and the chart has its table of start days', async () => {
    await page.goto(`${session.baseUrl}/g/${garden.id}/plan`);
    await settle(page, 'Plan');
    await quiet(page);
    const windows = page.locator('section').filter({ has: page.getByRole('heading', { level: 2, name: /^When to (sow|set out) / }) }).first();
    await windows.waitFor({ timeout: 20_000 });
    const named = await windows.locator('li').allInnerTexts();
    expect(named.join('\n')).toMatch(/(Spring|Autumn|Summer) window: .*\d/);
    const chart = page.locator('figure[aria-label^="Start days of"]');
    const name = await expectChartHasWords(chart.first(), 'plan chart');
    expect(name).toMatch(/bolt risk at harvest/);
    await page.getByText('Table of start days').first().click();
    const rows = page.getByRole('table').first().getByRole('row');
    expect(await rows.count()).toBeGreaterThan(1);
    expect(await rows.nth(1).innerText()).toMatch(/of \d+ years/);
    await checkPage(page, `plan, ${width} px`);
    await shot(page, `plan-${label}`);
  });

  it('when a viewer opens the records, then no page offers to add, save or delete anything', async () => {
    const EDITS = /New planting|^Save|^Delete|Edit planting|^Add|Upload readings|^Acknowledge|^New /i;
    // The same question asked of the grower finds the controls, so an empty answer below means something.
    await page.goto(`${session.baseUrl}/g/${garden.id}/plantings`);
    await settle(page, 'Plantings');
    expect(await page.getByRole('button', { name: EDITS }).allInnerTexts()).toContainEqual(expect.stringContaining('New planting'));

    const viewer = await session.newPage(width, height);
    await signInAs(viewer, session.baseUrl, 'volunteer@hollowbrook.example');
    const edits = () => viewer.getByRole('button', { name: EDITS });
    const planting = (await Planting.findOne({ where: { gardenId: garden.id }, order: [['id', 'ASC']] }))!;
    const pages: Array<[string, string | RegExp]> = [
      [`/g/${garden.id}/plantings`, 'Plantings'],
      [`/g/${garden.id}/plantings/${planting.id}`, /./],
      [`/g/${garden.id}/varieties`, 'Varieties'],
      [`/g/${garden.id}/seed-lots`, 'Seed lots'],
      [`/g/${garden.id}/beds`, 'Beds'],
      [`/g/${garden.id}/weather`, 'Weather'],
      [`/g/${garden.id}/alerts`, 'Alerts'],
    ];
    for (const [url, heading] of pages) {
      await viewer.goto(`${session.baseUrl}${url}`);
      await settle(viewer, heading);
      await quiet(viewer);
      expect(await edits().allInnerTexts(), `${url}: edit controls for a viewer`).toEqual([]);
      expect(await viewer.getByRole('group', { name: 'What happened' }).count(), `${url}: quick log for a viewer`).toBe(0);
    }
    await viewer.getByText('Read only').first().waitFor();
    await checkPage(viewer, `alerts as a viewer, ${width} px`);
    await shot(viewer, `viewer-alerts-${label}`);
    await viewer.close();
  }, 45_000);
});

describe('the browser itself', () => {
  it('when every journey above has run, then nothing left loopback and no page reported an error other than the refused upload', () => {
    expect(session.offsite).toEqual([]);
    expect(session.pageErrors.filter((e) => !/status of 422/.test(e))).toEqual([]);
  });
});
