import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import path from 'node:path';
import type { Garden } from '../../server/db/models';
import { inSeasonGarden } from '../helpers/in-season-garden';
import { screenshotDir, signInAs, startBrowserSession } from '../helpers/browser';
import type { WeatherService } from '../../server/modules/weather/weather.service';

let session: Awaited<ReturnType<typeof startBrowserSession>>;
let garden: Garden;

beforeAll(async () => {
  session = await startBrowserSession();
  garden = await inSeasonGarden(session.app.locals.weather as WeatherService);
}, 120_000);
afterAll(async () => {
  await session?.close();
});

describe('a grower reads progress in heat (Debian Chromium, 390 px)', () => {
  it('when the grower signs in, then Today opens and a planting’s page tells in words where it stands in heat', async () => {
    const page = await session.newPage(390, 900);
    await signInAs(page, session.baseUrl, 'grower.rosa@hollowbrook.example');
    await page.goto(`${session.baseUrl}/g/${garden.id}`);
    await page.getByRole('heading', { name: 'Today', level: 1 }).waitFor({ timeout: 15_000 });
    await page.getByRole('heading', { name: 'Growing now' }).waitFor();
    const bars = page.getByRole('progressbar');
    await bars.first().waitFor({ timeout: 15_000 });
    expect(await bars.count()).toBeGreaterThan(0);
    const unitDays = garden.units === 'F' ? '°F-days' : '°C-days';
    const growing = page.locator('section[aria-labelledby="growing-now"]');
    expect(await growing.innerText()).toContain(unitDays);
    await page.screenshot({ path: path.join(screenshotDir, 'today-phone.png'), fullPage: true });

    await growing.getByRole('link').first().click();
    await page.getByRole('heading', { name: 'In words' }).waitFor({ timeout: 15_000 });
    const words = await page.locator('section[aria-labelledby="progress-summary"]').innerText();
    expect(words).toContain(unitDays);
    // Today lists the most pressing first, which may be a planting already being picked.
    expect(words).toMatch(/likely ready|reached its target|forecast reaches|not reach|harvesting since/i);
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await page.screenshot({ path: path.join(screenshotDir, 'planting-progress-phone.png'), fullPage: true });
    expect(session.offsite).toEqual([]);
    expect(session.pageErrors).toEqual([]);
  });
});
