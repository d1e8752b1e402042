import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import path from 'node:path';
import { Garden, Planting, PlantingLog } from '../../server/db/models';
import { screenshotDir, signInAs, startBrowserSession } from '../helpers/browser';
import type { WeatherService } from '../../server/modules/weather/weather.service';

let session: Awaited<ReturnType<typeof startBrowserSession>>;
beforeAll(async () => {
  session = await startBrowserSession();
}, 120_000);
afterAll(async () => {
  await session?.close();
});

async function southGarden() {
  return (await Garden.findOne({ where: { name: 'Saltbush Lane School Garden' } }))!;
}

describe('a grower in the browser (Debian Chromium)', () => {
  it('when the southern garden’s weather is opened at phone width, then highs, lows and their sources show in °C', async () => {
    const garden = await southGarden();
    const weather = session.app.locals.weather as WeatherService;
    const cellId = (await weather.locateGarden(garden)) ?? garden.weatherCellId!;
    await weather.runRefresh({ kind: 'manual', gardenId: garden.id, cellId });
    const page = await session.newPage(375, 900);
    await signInAs(page, session.baseUrl, 'grower.rosa@hollowbrook.example');
    await page.goto(`${session.baseUrl}/g/${garden.id}/weather`);
    await page.getByText('Daily highs and lows in °C', { exact: false }).first().waitFor({ timeout: 15_000 });
    await page.locator('svg.recharts-surface').first().waitFor({ timeout: 15_000 });
    const table = await page.locator('table').first().innerText();
    expect(table).toMatch(/Observed/);
    expect(table).toMatch(/Forecast/);
    expect(table).toMatch(/°C/);
    expect(table).not.toMatch(/°F/);
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await page.screenshot({ path: path.join(screenshotDir, 'weather-south-phone.png'), fullPage: true });
    expect(session.offsite).toEqual([]);
    expect(session.pageErrors).toEqual([]);
  });

  it('when a grower logs watering on a growing planting in two taps, then it is saved and listed', async () => {
    const garden = await southGarden();
    const page = await session.newPage(375, 900);
    await signInAs(page, session.baseUrl, 'grower.tomasz@hollowbrook.example');
    const growing = (await Planting.findOne({ where: { gardenId: garden.id, status: 'growing' } }))!;
    await page.goto(`${session.baseUrl}/g/${garden.id}/plantings`);
    await page.locator(`a[href="/g/${garden.id}/plantings/${growing.id}"]:visible`).first().click();
    await page.getByRole('heading', { name: 'Add to the log' }).waitFor({ timeout: 15_000 });
    const before = await PlantingLog.count({ where: { gardenId: garden.id, kind: 'watered' } });
    await page.getByRole('group', { name: 'What happened' }).getByRole('button', { name: 'Watered' }).click();
    await page.getByRole('button', { name: 'Save “Watered”' }).click();
    await expect.poll(() => PlantingLog.count({ where: { gardenId: garden.id, kind: 'watered' } }), { timeout: 10_000 }).toBe(before + 1);
    await page.screenshot({ path: path.join(screenshotDir, 'planting-logged-phone.png'), fullPage: true });
    expect(session.pageErrors).toEqual([]);
  });
});
