/**
 * Mail about an existing account: the reset link, the link that confirms a new address, and the
 * notes sent after a password or address changed. Like the sign-up mail (auth/account-mail.ts)
 * they are queued in the request's transaction, and nothing typed by a visitor goes into them
 * except the address they are sent to.
 */
import { esc, mailPage } from '../notifications/mail-content';
import type { MailContent } from '../notifications/mail-content';
import { mailSettings } from '../notifications/mail-settings';
import { EMAIL_LINK_HOURS, RESET_LINK_HOURS } from './account-tokens';

export const RESET_SUBJECT = 'Choose a new Heatclock password';
export const PASSWORD_CHANGED_SUBJECT = 'Your Heatclock password was changed';
export const CONFIRM_EMAIL_SUBJECT = 'Confirm your new e-mail for Heatclock';
export const EMAIL_TAKEN_SUBJECT = 'Someone tried to move a Heatclock account to your e-mail';
export const EMAIL_CHANGED_SUBJECT = 'Your Heatclock e-mail was changed';

export const resetUrlFor = (token: string) => `${mailSettings().appUrl}/reset-password/${token}`;
export const confirmEmailUrlFor = (token: string) => `${mailSettings().appUrl}/account/confirm-email/${token}`;
const forgotUrl = () => `${mailSettings().appUrl}/forgot-password`;

function compose(subject: string, greeting: string, parts: { text: string; link?: { url: string; label: string } }[]): MailContent {
  const text = [greeting, ''];
  const html = [esc(greeting)];
  for (const p of parts) {
    text.push(p.text, ...(p.link ? [p.link.url] : []), '');
    html.push(p.link ? `${esc(p.text)}<br><a href="${esc(p.link.url)}">${esc(p.link.label)}</a>` : esc(p.text));
  }
  return { subject, text: text.join('\n').trimEnd(), html: mailPage(subject, html.map((p) => `<p>${p}</p>`)) };
}

export function renderResetMail(email: string, url: string): MailContent {
  return compose(RESET_SUBJECT, 'Hello,', [
    { text: `You, or someone using your address, asked to reset the password of the Heatclock account for ${email}.` },
    { text: `To choose a new password, open this link within ${RESET_LINK_HOURS} hour. It works once:`, link: { url, label: 'Choose a new password' } },
    { text: 'Choosing a new password signs the account out on every device.' },
    { text: 'If you did not ask for this, ignore this e-mail: your password stays as it is.' },
  ]);
}

export function renderPasswordChangedMail(name: string): MailContent {
  return compose(PASSWORD_CHANGED_SUBJECT, `Hello ${name},`, [
    { text: 'The password of your Heatclock account was just changed, and the account was signed out on your other devices.' },
    { text: 'If this was not you, choose a new password at once with this link:', link: { url: forgotUrl(), label: 'Reset my password' } },
  ]);
}

export function renderConfirmEmailMail(name: string, newEmail: string, url: string): MailContent {
  return compose(CONFIRM_EMAIL_SUBJECT, `Hello ${name},`, [
    { text: `You asked to use ${newEmail} for your Heatclock account. Until you confirm, your account keeps its old e-mail.` },
    { text: `To confirm, open this link within ${EMAIL_LINK_HOURS} hours while signed in. It works once:`, link: { url, label: 'Use this e-mail' } },
    { text: 'If you did not ask for this, ignore this e-mail: nothing changes.' },
  ]);
}

export function renderEmailTakenMail(newEmail: string): MailContent {
  return compose(EMAIL_TAKEN_SUBJECT, 'Hello,', [
    { text: `Someone signed in to Heatclock asked to move their account to ${newEmail}. This address already has its own account, so nothing was changed.` },
    { text: 'If it was you, sign in to the account that uses this address instead. If it was not you, you can ignore this e-mail.' },
  ]);
}

export function renderEmailChangedMail(name: string, newEmail: string): MailContent {
  return compose(EMAIL_CHANGED_SUBJECT, `Hello ${name},`, [
    { text: `Your Heatclock account now uses ${newEmail}. Messages and sign-in go to that address from now on.` },
    { text: 'If this was not you, someone else is signed in to your account: tell whoever runs this Heatclock, so they can give the account back to you.' },
  ]);
}
