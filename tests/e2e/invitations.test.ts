import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import path from 'node:path';
import { AxeBuilder } from '@axe-core/playwright';
import type { Page } from 'playwright-core';
import { Membership } from '../../server/db/models';
import { screenshotDir, startBrowserSession } from '../helpers/browser';
import { addMember, createGarden, createUser, PASSWORD, uniqueEmail } from '../helpers/factories';
import { accountMailFor } from '../helpers/registration';

let session: Awaited<ReturnType<typeof startBrowserSession>>;
beforeAll(async () => {
  session = await startBrowserSession();
}, 60_000);
afterAll(async () => {
  await session?.close();
});

const TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa'];

/** As in accessibility.test.ts: axe inside the page, serious and critical findings listed. */
async function expectNoSeriousViolations(page: Page, where: string) {
  const { violations } = await new AxeBuilder({ page }).withTags(TAGS).setLegacyMode(true).analyze();
  const words = violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .flatMap((v) => v.nodes.map((n) => `${v.id} at ${n.target.join(' ')}: ${n.html.slice(0, 200)}`));
  expect(words, `${where}:\n${words.join('\n')}`).toEqual([]);
}

async function signIn(page: Page, email: string) {
  await page.goto(`${session.baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL(/\/g\/\d+/);
}

const tokenIn = (text: string) => /\/invitations\/([A-Za-z0-9_-]{43})/.exec(text)?.[1];

describe('invitations in the browser (Debian Chromium)', () => {
  it('when an owner invites someone on the Members page, then the invitee opens the mailed link, creates an account and lands in the garden', async () => {
    const garden = await createGarden({ name: 'Quarry Lane Plot' });
    const owner = await createUser({ name: 'Petra Hale' });
    await addMember(owner.id, garden.id, 'owner');
    const invitee = uniqueEmail('e2e-invitee');

    const page = await session.newPage();
    await signIn(page, owner.email);
    await page.goto(`${session.baseUrl}/g/${garden.id}/members`);
    const form = page.getByRole('form', { name: 'Invite someone' });
    await form.getByLabel('E-mail').fill(invitee);
    await form.getByLabel('Role').selectOption('grower');
    await form.getByRole('button', { name: 'Send invitation' }).click();
    await page.getByText(`We e-mailed an invitation to ${invitee}.`).waitFor({ state: 'visible', timeout: 10_000 });
    await page.getByText(invitee).first().waitFor({ state: 'visible' });
    await page.screenshot({ path: path.join(screenshotDir, 'members-owner.png'), fullPage: true });
    await expectNoSeriousViolations(page, 'members page, owner, 1280 px');

    const [mail] = await accountMailFor(invitee);
    const token = tokenIn(mail.text_body);
    expect(token).toBeTruthy();

    // Another browser, signed out, as the invitee would open it from their mail.
    const theirs = await session.newPage(390, 844);
    await theirs.goto(`${session.baseUrl}/invitations/${token}`);
    await theirs.getByRole('heading', { name: 'Join “Quarry Lane Plot”' }).waitFor({ state: 'visible', timeout: 10_000 });
    expect(await theirs.getByText('Petra Hale invited').count()).toBeGreaterThan(0);
    expect(await theirs.evaluate(() => document.documentElement.scrollWidth - window.innerWidth)).toBeLessThanOrEqual(0);
    await theirs.screenshot({ path: path.join(screenshotDir, 'invitation-phone.png'), fullPage: true });
    await expectNoSeriousViolations(theirs, 'invitation page, 390 px');
    await theirs.getByLabel('Your name').fill('Noor Fenwick');
    await theirs.getByLabel('Password').fill('marble kettle upstream violet');
    await theirs.getByRole('button', { name: 'Create account and join' }).click();
    await theirs.waitForURL(new RegExp(`/g/${garden.id}$`), { timeout: 15_000 });

    await theirs.goto(`${session.baseUrl}/g/${garden.id}/members`);
    await theirs.getByRole('table').waitFor({ state: 'visible', timeout: 10_000 });
    expect(await theirs.getByRole('cell', { name: /Noor Fenwick \(you\)/ }).count()).toBe(1);
    expect(await theirs.evaluate(() => document.documentElement.scrollWidth - window.innerWidth)).toBeLessThanOrEqual(0);
    await theirs.screenshot({ path: path.join(screenshotDir, 'members-grower-phone.png'), fullPage: true });
    await expectNoSeriousViolations(theirs, 'members page, grower, 390 px');
    expect(await Membership.count({ where: { gardenId: garden.id } })).toBe(2);

    // The same link again is refused in words.
    const again = await session.newPage();
    await again.goto(`${session.baseUrl}/invitations/${token}`);
    await again.getByText('This invitation has been used', { exact: true }).waitFor({ state: 'visible', timeout: 10_000 });

    // The owner on a phone: the new grower's row has a role select and Remove, which asks first.
    const phone = await session.newPage(390, 844);
    await signIn(phone, owner.email);
    await phone.goto(`${session.baseUrl}/g/${garden.id}/members`);
    await phone.getByRole('combobox', { name: 'Role of Noor Fenwick' }).waitFor({ state: 'visible', timeout: 10_000 });
    await phone.getByRole('button', { name: 'Remove Noor Fenwick' }).click();
    await phone.getByText('Remove Noor Fenwick from this garden?').waitFor({ state: 'visible' });
    expect(await phone.evaluate(() => document.documentElement.scrollWidth - window.innerWidth)).toBeLessThanOrEqual(0);
    await expectNoSeriousViolations(phone, 'members page, owner, 390 px');
    await phone.screenshot({ path: path.join(screenshotDir, 'members-owner-phone.png'), fullPage: true });

    expect(session.offsite).toEqual([]);
    expect(session.pageErrors.filter((e) => !/status of 410/.test(e))).toEqual([]);
  }, 60_000);
});
