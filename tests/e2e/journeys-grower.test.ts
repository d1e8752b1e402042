import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { randomUUID } from 'node:crypto';
import type { Page } from 'playwright-core';
import { Bed, Garden, Planting, SeedLot, Variety } from '../../server/db/models';
import type { WeatherService } from '../../server/modules/weather/weather.service';
import { signInAs, startBrowserSession } from '../helpers/browser';
import { inSeasonGarden } from '../helpers/in-season-garden';
import { checkPage, expectChartHasWords, settle, shot, tabTo, tinyPng, WIDTHS } from './helpers/journeys';

/**
 * A grower's day in the browser (Debian Chromium, production build on loopback), in the demo
 * garden that is in its season now: Today, a planting's progress in words, a log entry and a
 * photo, and a new planting made with the keyboard alone from a variety and a seed lot.
 */
let session: Awaited<ReturnType<typeof startBrowserSession>>;
let garden: Garden;
let unitDays: string;
let lot: { varietyName: string; label: string; lotNumber: string };
const run = randomUUID().slice(0, 6);

beforeAll(async () => {
  session = await startBrowserSession();
  garden = await inSeasonGarden(session.app.locals.weather as WeatherService);
  unitDays = garden.units === 'F' ? '°F-days' : '°C-days';
  const seedLot = (await SeedLot.findOne({ where: { gardenId: garden.id }, order: [['id', 'ASC']] }))!;
  const variety = (await Variety.findByPk(seedLot.varietyId))!;
  const label = [seedLot.lotNumber && `Lot ${seedLot.lotNumber}`, seedLot.packedForYear && `packed for ${seedLot.packedForYear}`].filter(Boolean).join(', ') || 'Unlabelled lot';
  lot = { varietyName: variety.name, label, lotNumber: seedLot.lotNumber };
  // Beds of this run's own, so a planting made here never meets one made by another run or file.
  for (const { label: w } of WIDTHS) await Bed.create({ gardenId: garden.id, name: `Journey bed ${run} ${w}`, kind: 'bed', notes: '' });
}, 120_000);
afterAll(async () => {
  await session?.close();
});

async function openGrowingPlanting(page: Page) {
  const growing = (await Planting.findOne({ where: { gardenId: garden.id, status: 'growing' }, order: [['id', 'ASC']] }))!;
  await page.goto(`${session.baseUrl}/g/${garden.id}/plantings/${growing.id}`);
  await page.getByRole('heading', { name: 'In words' }).waitFor({ timeout: 15_000 });
  await settle(page, /./);
  return growing;
}

/** Presses a key until the focused select's chosen option reads as wanted. */
async function arrowTo(page: Page, wanted: (text: string) => boolean, max = 80) {
  for (let i = 0; i < max; i++) {
    const text = await page.evaluate(() => {
      const s = document.activeElement as HTMLSelectElement;
      return s.tagName === 'SELECT' ? (s.selectedOptions[0]?.textContent ?? '') : '';
    });
    if (wanted(text)) return text;
    await page.keyboard.press('ArrowDown');
  }
  throw new Error('ArrowDown did not reach the wanted option');
}

describe.each(WIDTHS)('a grower’s journeys at $width px ($label)', ({ width, height, label }) => {
  let page: Page;
  beforeAll(async () => {
    page = await session.newPage(width, height);
    await signInAs(page, session.baseUrl, 'grower.rosa@hollowbrook.example');
  }, 30_000);

  it('when the grower opens Today and then a planting, then its progress reads in degree days and a ready window in words', async () => {
    await page.goto(`${session.baseUrl}/g/${garden.id}`);
    await settle(page, 'Today');
    const growing = page.locator('section[aria-labelledby="growing-now"]');
    await growing.getByRole('progressbar').first().waitFor({ timeout: 15_000 });
    expect(await growing.innerText()).toContain(unitDays);
    await checkPage(page, `Today, ${width} px`);
    await shot(page, `today-${label}`);

    await growing.getByRole('link').first().click();
    await page.getByRole('heading', { name: 'In words' }).waitFor({ timeout: 15_000 });
    await settle(page, /./);
    const words = page.locator('section[aria-labelledby="progress-summary"]');
    const heat = await words.locator('dt', { hasText: 'Heat so far' }).locator('xpath=following-sibling::dd').innerText();
    expect(heat).toMatch(new RegExp(`\\d[\\d,]* ${unitDays}`));
    const ready = await words.locator('dt', { hasText: 'Ready' }).locator('xpath=following-sibling::dd').innerText();
    expect(ready).toMatch(/Likely ready \d{1,2}|Likely ready [A-Z][a-z]{2} \d|Target reached|First harvest on record|A harvest is on record|No maturity window yet/);

    // The progress chart: named, and its figures day by day in a table with units.
    const name = await expectChartHasWords(page.locator('figure[aria-labelledby="progress-chart-caption"]'), 'progress chart');
    expect(name.length).toBeGreaterThan(10);
    await page.getByText('The chart’s figures, day by day').click();
    const table = page.getByRole('region', { name: 'Figures day by day' }).getByRole('table');
    await table.waitFor();
    const tableText = await table.innerText();
    expect(tableText).toContain(unitDays);
    expect(tableText).toMatch(/°[CF]/);
    await checkPage(page, `planting progress, ${width} px`);
    await shot(page, `planting-progress-${label}`);
  });

  it('when the grower adds a note to the log and a photo, then both are listed on the planting', async () => {
    await openGrowingPlanting(page);
    const note = `Leaves curling at the edges ${randomUUID().slice(0, 6)}`;
    await page.getByRole('group', { name: 'What happened' }).getByRole('button', { name: 'Observation' }).click();
    await page.getByLabel('Note (optional)').fill(note);
    await page.getByRole('button', { name: 'Save “Observation”' }).click();
    await page.getByText(/Observation logged for/).waitFor({ timeout: 10_000 });
    await page.getByText(note).first().waitFor({ timeout: 10_000 });
    await checkPage(page, `planting with a new log entry, ${width} px`);

    const caption = `Row end after rain ${randomUUID().slice(0, 6)}`;
    const form = page.getByRole('form', { name: 'Add a photo' });
    await form.getByLabel('Photo').setInputFiles({ name: 'row-end.png', mimeType: 'image/png', buffer: await tinyPng() });
    await form.getByLabel('Caption (optional)').fill(caption);
    await form.getByRole('button', { name: 'Add photo' }).click();
    await page.getByText('Photo added').waitFor({ timeout: 15_000 });
    const img = page.getByRole('img', { name: caption });
    await img.waitFor({ timeout: 10_000 });
    expect(await img.evaluate((el) => (el as HTMLImageElement).naturalWidth)).toBeGreaterThan(0);
    await checkPage(page, `planting with a new photo, ${width} px`);
    await shot(page, `planting-log-photo-${label}`);
  });

  it('when the grower makes a planting from a variety and a seed lot with the keyboard alone, then the form and the new planting show its harvest window', async () => {
    const note = `Journey sowing ${randomUUID().slice(0, 8)}`;
    await page.goto(`${session.baseUrl}/g/${garden.id}/plantings`);
    await settle(page, 'Plantings');
    await tabTo(page, (el) => el.tag === 'button' && /New planting/.test(el.name), { max: 80 });
    await page.keyboard.press('Enter');
    await page.getByRole('form', { name: 'New planting' }).waitFor();
    await tabTo(page, (el) => el.tag === 'select' && el.label === 'Bed');
    await arrowTo(page, (t) => t === `Journey bed ${run} ${label}`, 400);
    await tabTo(page, (el) => el.tag === 'select' && el.label === 'Variety');
    await arrowTo(page, (t) => t.endsWith(`: ${lot.varietyName}`));
    await tabTo(page, (el) => el.tag === 'select' && el.label === 'Seed lot (optional)');
    await arrowTo(page, (t) => t === lot.label);

    const preview = page.locator('section[aria-labelledby="harvest-preview"]');
    await preview.waitFor({ timeout: 15_000 });
    await page.waitForFunction(() => document.querySelector('section[aria-labelledby="harvest-preview"]')?.getAttribute('aria-busy') === 'false', undefined, { timeout: 15_000 });
    const previewWords = await preview.innerText();
    expect(previewWords).toContain('Expected harvest');
    expect(previewWords).toMatch(/Likely ready .+ \(middle estimate .+\)|The forecast reaches its degree-day target on|would already be reached/);
    expect(previewWords).toMatch(new RegExp(`Target: [\\d,]+ ${unitDays}`));
    await checkPage(page, `new planting form with its preview, ${width} px`);
    await shot(page, `new-planting-preview-${label}`);

    await tabTo(page, (el) => el.tag === 'textarea' && el.label === 'Notes');
    await page.keyboard.type(note);
    // Shift+Tab back past the notes and forward again: the focus order holds both ways.
    await page.keyboard.press('Shift+Tab');
    await tabTo(page, (el) => el.tag === 'textarea' && el.label === 'Notes');
    await tabTo(page, (el) => el.tag === 'button' && el.name === 'Save planting');
    await page.keyboard.press('Space');
    await page.waitForURL(/\/plantings\/\d+$/, { timeout: 15_000 });
    await page.getByRole('heading', { name: 'In words' }).waitFor({ timeout: 15_000 });
    await settle(page, /./);
    const saved = (await Planting.findOne({ where: { gardenId: garden.id, notes: note } }))!;
    expect(saved.seedLotId).not.toBeNull();
    expect(page.url()).toMatch(new RegExp(`/plantings/${saved.id}$`));

    const words = page.locator('section[aria-labelledby="progress-summary"]');
    const ready = await words.locator('dt', { hasText: 'Ready' }).locator('xpath=following-sibling::dd').innerText();
    expect(ready).toMatch(/Likely ready .+ \(middle estimate .+\)|Target reached/);
    const lotFact = await page.locator('dt', { hasText: 'Seed lot' }).first().locator('xpath=following-sibling::dd').innerText();
    expect(lotFact).not.toBe('—');
    if (lot.lotNumber) expect(lotFact).toContain(lot.lotNumber);
    await checkPage(page, `the new planting, ${width} px`);
    await shot(page, `new-planting-page-${label}`);
  });

  it('when the grower opens Weather, then the chart is named and its figures are in a table with units', async () => {
    await page.goto(`${session.baseUrl}/g/${garden.id}/weather`);
    await settle(page, 'Weather');
    const name = await expectChartHasWords(page.locator('figure[aria-labelledby="weather-chart-caption"]'), 'weather chart');
    expect(name).toMatch(/°[CF]|high|low/i);
    const table = page.getByRole('table', { name: /Day by day, in °[CF]/ });
    await table.waitFor();
    expect(await table.innerText()).toMatch(new RegExp(`-?\\d+(\\.\\d)? °${garden.units}`));
    await checkPage(page, `weather, ${width} px`);
  });
});

describe('the browser itself', () => {
  it('when every journey above has run, then nothing left loopback and no page reported an error', () => {
    expect(session.offsite).toEqual([]);
    expect(session.pageErrors).toEqual([]);
  });
});
