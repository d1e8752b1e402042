import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import path from 'node:path';
import { Garden, Variety } from '../../server/db/models';
import { screenshotDir, signInAs, startBrowserSession } from '../helpers/browser';

let session: Awaited<ReturnType<typeof startBrowserSession>>;
beforeAll(async () => {
  session = await startBrowserSession();
}, 120_000);
afterAll(async () => {
  await session?.close();
});

describe('the varieties page in the browser (Debian Chromium)', () => {
  for (const width of [1280, 390]) {
    it(`when a °F garden’s varieties are opened at ${width} px, then cards are compact, show the target and read inches`, async () => {
      const garden = (await Garden.findOne({ where: { name: 'Hollowbrook Teaching Garden' } }))!;
      const count = await Variety.count({ where: { gardenId: garden.id } });
      const page = await session.newPage(width, 900);
      await signInAs(page, session.baseUrl, 'grower.rosa@hollowbrook.example');
      await page.goto(`${session.baseUrl}/g/${garden.id}/varieties`);
      const cards = page.locator('article');
      await cards.first().waitFor({ timeout: 15_000 });
      expect(await cards.count()).toBe(count);
      const first = await cards.first().innerText();
      expect(first).toMatch(/Degree-day target: [\d,]+ °F-days from (sowing|transplanting)|Degree-day target: not known yet/);
      expect(first).not.toMatch(/\bcm\b/);
      // A phone shows a card in well under one screen.
      const heights = await cards.evaluateAll((els) => els.map((el) => el.getBoundingClientRect().height));
      expect(Math.max(...heights)).toBeLessThan(width < 640 ? 480 : 400);
      await page.screenshot({ path: path.join(screenshotDir, `varieties-${width}.png`), fullPage: false });
      expect(session.pageErrors).toEqual([]);
    });
  }
});
