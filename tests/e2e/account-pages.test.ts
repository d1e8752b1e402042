import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import path from 'node:path';
import { AxeBuilder } from '@axe-core/playwright';
import type { Page } from 'playwright-core';
import { screenshotDir, signInAs, startBrowserSession } from '../helpers/browser';
import { addMember, createGarden, createUser, PASSWORD } from '../helpers/factories';

/**
 * The account page and the password reset pages at a wide and a phone width: nothing wider than
 * the screen, every button and field at least 44 px tall, and no serious or critical axe finding.
 */
const TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa'];
const WIDTHS = [
  { width: 1280, height: 900 },
  { width: 390, height: 844 },
];

let session: Awaited<ReturnType<typeof startBrowserSession>>;
let email: string;

beforeAll(async () => {
  session = await startBrowserSession();
  const user = await createUser({ name: 'Ines Hartwell' });
  email = user.email;
  await addMember(user.id, (await createGarden({ name: 'Creek plot' })).id, 'owner');
}, 120_000);
afterAll(async () => {
  await session?.close();
});

async function expectFits(page: Page, where: string) {
  const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
  expect(overflow, `${where}: wider than the screen`).toBeLessThanOrEqual(0);
  const small = await page
    // Links inside a sentence are exempt (WCAG 2.2 SC 2.5.8, inline); buttons and fields are not.
    .locator('main button:visible, main input:visible')
    .evaluateAll((els) => els.filter((e) => e.getBoundingClientRect().height < 44).map((e) => e.outerHTML.slice(0, 120)));
  expect(small, `${where}: targets under 44 px`).toEqual([]);
  const { violations } = await new AxeBuilder({ page }).withTags(TAGS).setLegacyMode(true).analyze();
  const serious = violations.filter((v) => v.impact === 'serious' || v.impact === 'critical').map((v) => `${v.id}: ${v.nodes.map((n) => n.html.slice(0, 120)).join(' | ')}`);
  expect(serious, where).toEqual([]);
}

describe.each(WIDTHS)('at $width px', ({ width, height }) => {
  it('when the account page opens, then it fits, lists this device and passes axe', async () => {
    const page = await session.newPage(width, height);
    await signInAs(page, session.baseUrl, email, PASSWORD);
    await page.goto(`${session.baseUrl}/account`);
    await page.getByRole('heading', { level: 1, name: 'Your account' }).waitFor();
    await page.getByText('This device').waitFor();
    await page.getByRole('link', { name: /Creek plot/ }).waitFor();
    await expectFits(page, `account at ${width}`);
    await page.screenshot({ path: path.join(screenshotDir, `account-${width}.png`), fullPage: true });
    await page.close();
  });

  it('when the forgot-password and reset pages open signed out, then they fit and pass axe', async () => {
    const page = await session.newPage(width, height);
    await page.goto(`${session.baseUrl}/sign-in`);
    await page.getByRole('link', { name: 'Forgot password?' }).click();
    await page.getByRole('heading', { level: 1, name: 'Forgot your password?' }).waitFor();
    await expectFits(page, `forgot-password at ${width}`);
    await page.screenshot({ path: path.join(screenshotDir, `forgot-password-${width}.png`), fullPage: true });
    await page.goto(`${session.baseUrl}/reset-password/${'A'.repeat(43)}`);
    await page.getByRole('alert').waitFor();
    await expectFits(page, `reset-password refused at ${width}`);
    await page.screenshot({ path: path.join(screenshotDir, `reset-password-refused-${width}.png`), fullPage: true });
    await page.close();
  });
});
