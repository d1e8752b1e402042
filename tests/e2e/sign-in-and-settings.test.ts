import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import path from 'node:path';
import { Garden } from '../../server/db/models';
import { screenshotDir, signInAs, startBrowserSession } from '../helpers/browser';
import { checkPage } from './helpers/journeys';

let session: Awaited<ReturnType<typeof startBrowserSession>>;
beforeAll(async () => {
  session = await startBrowserSession();
}, 60_000);
afterAll(async () => {
  await session?.close();
  await Garden.update({ units: 'F' }, { where: { name: 'Hollowbrook Teaching Garden' } });
});

describe('in the browser (Debian Chromium)', () => {
  it('when the demo owner signs in and changes the display unit, then it is saved and stays after a reload', async () => {
    const page = await session.newPage();
    await signInAs(page, session.baseUrl, 'coordinator@hollowbrook.example');
    await page.getByRole('link', { name: /settings/i }).first().click();
    await page.getByLabel('°C (Celsius)').check();
    await page.getByRole('button', { name: 'Save settings' }).click();
    await page.getByText('Settings saved.').waitFor({ state: 'visible', timeout: 10_000 });
    await page.screenshot({ path: path.join(screenshotDir, 'settings-owner.png'), fullPage: true });
    await page.reload();
    expect(await page.getByLabel('°C (Celsius)').isChecked()).toBe(true);
    // The font ships with the app: it is served from our own origin, nothing from the network.
    const fontLoaded = await page.evaluate(async () => {
      await document.fonts.ready;
      return [...document.fonts].some((f) => f.family.includes('Roboto Flex') && f.status === 'loaded');
    });
    expect(fontLoaded).toBe(true);
    expect(session.offsite).toEqual([]);
    expect(session.pageErrors).toEqual([]);
  });

  it('when the owner finds the garden by ZIP code at phone width, then the match fills the location fields to check before saving', async () => {
    const page = await session.newPage(390, 900);
    await signInAs(page, session.baseUrl, 'coordinator@hollowbrook.example');
    const id = page.url().match(/\/g\/(\d+)/)![1];
    await page.goto(`${session.baseUrl}/g/${id}/settings`);
    const search = page.getByLabel('Find the garden by town or US ZIP code');
    await search.fill('99501');
    await search.press('Enter');
    await page.getByText('1 match: choose yours.').waitFor({ timeout: 15_000 });
    await page.getByText('Anchorage, Alaska, United States (ZIP 99501)').waitFor();
    await page.getByText(/Places from GeoNames/).waitFor();
    await checkPage(page, 'settings with a ZIP match, 390 px');
    await page.getByRole('button', { name: 'Use Anchorage, Alaska, United States (ZIP 99501)' }).click();
    await page.getByText('Filled in from Anchorage, Alaska, United States (ZIP 99501)').waitFor();
    expect(Number(await page.getByLabel('Latitude (decimal degrees, °)').inputValue())).toBeCloseTo(61.2116, 3);
    expect(await page.getByLabel('Time zone').inputValue()).toBe('America/Anchorage');
    await page.getByText('You have unsaved changes.').waitFor();
    await page.screenshot({ path: path.join(screenshotDir, 'settings-place-finder-phone.png'), fullPage: true });
    // Not saved: the demo garden keeps its place for the other tests.
    expect(session.pageErrors).toEqual([]);
  });

  it('when a volunteer viewer opens the settings at phone width, then they are read-only', async () => {
    const page = await session.newPage(375, 800);
    await signInAs(page, session.baseUrl, 'volunteer@hollowbrook.example');
    const id = page.url().match(/\/g\/(\d+)/)![1];
    await page.goto(`${session.baseUrl}/g/${id}/settings`);
    await page.getByText(/only the garden.s owner can change/i).first().waitFor({ state: 'visible', timeout: 10_000 });
    expect(await page.getByRole('button', { name: 'Save settings' }).count()).toBe(0);
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await page.screenshot({ path: path.join(screenshotDir, 'settings-viewer-phone.png'), fullPage: true });
    expect(session.pageErrors).toEqual([]);
  });

  it('when a wrong password is typed, then the page says so in words', async () => {
    const page = await session.newPage();
    await page.goto(`${session.baseUrl}/sign-in`);
    await page.getByLabel('E-mail').fill('grower.rosa@hollowbrook.example');
    await page.getByLabel('Password').fill('not-the-password');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByText('E-mail or password is incorrect.').waitFor({ state: 'visible', timeout: 10_000 });
  });
});
