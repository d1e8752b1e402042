import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { randomUUID } from 'node:crypto';
import { startBrowserSession } from '../helpers/browser';
import { createUser, PASSWORD } from '../helpers/factories';
import { accountMailFor } from '../helpers/registration';
import type { WeatherService } from '../../server/modules/weather/weather.service';
import { fakeWeather } from '../../fixtures/weather/control';
import { checkPage, settle, shot, tabTo, WIDTHS } from './helpers/journeys';

/**
 * Journeys of a person's account in the browser (Debian Chromium, production build on loopback):
 * signing up by the mailed link and seeing the new garden's weather arrive, choosing a new password
 * through the mailed link, and signing in with the keyboard alone.
 */
let session: Awaited<ReturnType<typeof startBrowserSession>>;
beforeAll(async () => {
  session = await startBrowserSession();
}, 60_000);
afterAll(async () => {
  // A new garden's history is fetched in the background: let it finish before the database closes.
  await (session?.app.locals.weather as WeatherService | undefined)?.idle();
  await session?.close();
}, 60_000);

describe.each(WIDTHS)('account journeys at $width px ($label)', ({ width, height, label }) => {
  it('when someone signs up, opens the mailed link and sets the garden’s place, then Weather shows its history being fetched', async () => {
    const tag = randomUUID().slice(0, 8);
    const email = `journey-signup-${tag}@test.example`;
    const gardenName = `Fernbrake Allotment ${tag}`;
    const page = await session.newPage(width, height);

    await page.goto(`${session.baseUrl}/sign-in`);
    await settle(page, 'Sign in');
    await page.getByRole('link', { name: /create an account|register/i }).first().click();
    await settle(page, 'Create an account');
    await checkPage(page, `register, ${width} px`);
    await page.getByLabel('Your name').fill('Wren Ashdown');
    await page.getByLabel('E-mail').fill(email);
    await page.getByLabel('Password').fill('lantern meadow copper thistle');
    await page.getByLabel('Garden name').fill(gardenName);
    await page.getByRole('button', { name: 'Create account' }).click();
    await page.getByText(email, { exact: true }).first().waitFor({ timeout: 10_000 });
    await page.getByText(/check your e-mail/i).first().waitFor();
    await checkPage(page, `register, link sent, ${width} px`);

    // The captured message, as the person would read it in their mail.
    const [mail] = await accountMailFor(email);
    expect(mail.subject).toBeTruthy();
    const link = /\/register\/confirm\/[A-Za-z0-9_-]{43}/.exec(mail.text_body)?.[0];
    expect(link, mail.text_body).toBeTruthy();

    const fromMail = await session.newPage(width, height);
    await fromMail.goto(`${session.baseUrl}${link}`);
    await settle(fromMail, 'Finish creating your account');
    await checkPage(fromMail, `register confirm, ${width} px`);
    await fromMail.getByRole('button', { name: 'Finish creating my account' }).click();
    await fromMail.waitForURL(/\/g\/\d+$/, { timeout: 15_000 });
    const gardenId = Number(/\/g\/(\d+)$/.exec(fromMail.url())![1]);
    await settle(fromMail, 'Today');
    await fromMail.getByText('No location yet').first().waitFor();
    await checkPage(fromMail, `new garden Today, ${width} px`);

    await fromMail.goto(`${session.baseUrl}/g/${gardenId}/settings`);
    await settle(fromMail, 'Garden settings');
    expect(await fromMail.getByLabel('Garden name').inputValue()).toBe(gardenName);
    // A place of its own (a new weather cell), so its history really has to be fetched.
    const lat = (44 + Math.random() * 3).toFixed(2);
    const lon = (-(80 + Math.random() * 8)).toFixed(2);
    await fromMail.getByLabel(/Latitude/).fill(lat);
    await fromMail.getByLabel(/Longitude/).fill(lon);
    await fromMail.getByLabel('Time zone').fill('America/Toronto');
    // The fake weather service answers slowly here (this file's process only), so the history is
    // still arriving when Weather opens, as it would be from the real service.
    fakeWeather.latencyMs = 500;
    try {
      await fromMail.getByRole('button', { name: 'Save settings' }).click();
      await fromMail.getByText('Settings saved.').waitFor({ timeout: 10_000 });
      await checkPage(fromMail, `garden settings saved, ${width} px`);

      await fromMail.goto(`${session.baseUrl}/g/${gardenId}/weather`);
      await settle(fromMail, 'Weather');
      const history = fromMail.getByText(/^Weather history: /).first();
      await history.waitFor({ timeout: 15_000 });
      expect(await history.innerText()).toMatch(/^Weather history: \d+ % of 11 years fetched/);
      const bar = fromMail.getByRole('progressbar', { name: 'Weather history fetched' });
      expect(await bar.getAttribute('aria-valuetext')).toMatch(/^\d+ %$/);
      await checkPage(fromMail, `weather of a new garden, history arriving, ${width} px`);
      await shot(fromMail, `signup-weather-arriving-${label}`);
      // Then, as the page keeps asking (or on a reload), the whole history.
      await expect
        .poll(
          async () => {
            const words = await history.innerText().catch(() => '');
            if (!/complete/.test(words) && !/…$/.test(words)) await fromMail.reload();
            return words;
          },
          { timeout: 40_000, interval: 1_000 },
        )
        .toMatch(/^Weather history: complete, 11 years back to \S/);
    } finally {
      fakeWeather.latencyMs = 0;
    }
    await checkPage(fromMail, `weather of a new garden, ${width} px`);
    await shot(fromMail, `signup-weather-${label}`);
    expect(session.offsite).toEqual([]);
  }, 75_000);

  it('when a person forgets their password, then the mailed link lets them choose a new one and sign in with it', async () => {
    const user = await createUser({ name: 'Odile Marsh' });
    const page = await session.newPage(width, height);
    await page.goto(`${session.baseUrl}/sign-in`);
    await settle(page, 'Sign in');
    await page.getByRole('link', { name: 'Forgot password?' }).click();
    await page.waitForURL(/\/forgot-password$/);
    await settle(page, 'Forgot your password?');
    await checkPage(page, `forgot password, ${width} px`);
    await page.getByLabel('E-mail').fill(user.email);
    await page.getByRole('button', { name: 'Send me a link' }).click();
    await page.getByRole('heading', { name: 'Check your e-mail' }).waitFor({ timeout: 10_000 });
    expect(await page.getByRole('status').first().innerText()).toContain(user.email);
    await checkPage(page, `forgot password, link sent, ${width} px`);

    await expect.poll(async () => (await accountMailFor(user.email)).length, { timeout: 10_000 }).toBeGreaterThan(0);
    const mail = (await accountMailFor(user.email)).at(-1)!;
    const link = /\/reset-password\/[A-Za-z0-9_-]{43}/.exec(mail.text_body)?.[0];
    expect(link, mail.text_body).toBeTruthy();

    await page.goto(`${session.baseUrl}${link}`);
    await settle(page, 'Choose a new password');
    await page.getByLabel('New password').waitFor();
    await checkPage(page, `reset password, ${width} px`);
    const fresh = 'juniper harbour velvet compass';
    await page.getByLabel('New password').fill(fresh);
    await page.getByRole('button', { name: 'Save the new password' }).click();
    await page.getByText('Your password is changed and your account is signed out on every device.').waitFor({ timeout: 10_000 });
    await checkPage(page, `reset password, done, ${width} px`);
    await page.getByRole('link', { name: 'Sign in with the new password' }).click();
    await settle(page, 'Sign in');

    // The old password no longer opens the account; the new one does.
    await page.getByLabel('E-mail').fill(user.email);
    await page.getByLabel('Password').fill(PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('alert').first().waitFor({ timeout: 10_000 });
    expect(page.url()).toMatch(/\/sign-in/);
    await page.getByLabel('Password').fill(fresh);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'), { timeout: 15_000 });
    await shot(page, `reset-signed-in-${label}`);
  }, 45_000);

  it('when a person signs in with the keyboard alone, then they reach their garden', async () => {
    const page = await session.newPage(width, height);
    await page.goto(`${session.baseUrl}/sign-in`);
    await settle(page, 'Sign in');
    await tabTo(page, (el) => el.tag === 'input' && /E-mail/.test(el.label));
    await page.keyboard.type('grower.rosa@hollowbrook.example');
    await tabTo(page, (el) => el.tag === 'input' && el.type === 'password');
    await page.keyboard.type('heatclock-demo');
    // Back to the e-mail and forward again, as someone checking what they typed would.
    await tabTo(page, (el) => el.tag === 'input' && /E-mail/.test(el.label), { back: true });
    expect(await page.evaluate(() => (document.activeElement as HTMLInputElement).value)).toBe('grower.rosa@hollowbrook.example');
    await tabTo(page, (el) => el.tag === 'input' && el.type === 'password');
    await page.keyboard.press('Enter');
    await page.waitForURL(/\/g\/\d+/, { timeout: 15_000 });
    await settle(page, 'Today');
    await checkPage(page, `Today after keyboard sign-in, ${width} px`);
  }, 30_000);
});

describe('the browser itself', () => {
  it('when every journey above has run, then nothing left loopback and no page reported an error', () => {
    expect(session.offsite).toEqual([]);
    expect(session.pageErrors).toEqual([]);
  });
});
