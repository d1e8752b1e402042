/**
 * The words of alert and digest e-mails, as plain text and as accessible HTML (headings, lists,
 * severity in words, never colour alone). Figures arrive already worded in the garden's unit.
 */
import { ALERT_SEVERITY_WORDS, ALERT_TYPE_WORDS } from '#shared/schemas/alerts';
import type { AlertSeverity, AlertType } from '#shared/schemas/alerts';
import { DEFAULT_LOCALE, dayMonth, dayRange, resolveDates } from '#shared/format/dates';

export interface MailAlert {
  type: AlertType;
  severity: AlertSeverity;
  subject: string;
  title: string;
  reasons: string[];
  action: string;
  caution: string | null;
  firstOn: string;
  endsOn: string | null;
}

export interface MailContext {
  memberName: string;
  gardenName: string;
  gardenUrl: string;
  settingsUrl: string;
  unsubscribeUrl: string;
}

export interface MailContent {
  subject: string;
  text: string;
  html: string;
}

const when = (a: MailAlert) => (a.endsOn ? dayRange(a.firstOn, a.endsOn) : `from ${dayMonth(a.firstOn)}`);
const heading = (a: MailAlert) => `${ALERT_SEVERITY_WORDS[a.severity]} · ${ALERT_TYPE_WORDS[a.type]}: ${a.title}`;

export const esc = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

function alertText(a: MailAlert): string {
  return [
    heading(a),
    `For: ${a.subject}`,
    `When: ${when(a)}`,
    ...(a.reasons.length ? ['Why:', ...a.reasons.map((r) => `  - ${r}`)] : []),
    `What to do: ${a.action}`,
    ...(a.caution ? [`Take care: ${a.caution}`] : []),
  ].join('\n');
}

function alertHtml(a: MailAlert): string {
  return [
    '<section>',
    `<h2>${esc(heading(a))}</h2>`,
    `<p><strong>For:</strong> ${esc(a.subject)}<br><strong>When:</strong> ${esc(when(a))}</p>`,
    a.reasons.length ? `<h3>Why</h3><ul>${a.reasons.map((r) => `<li>${esc(r)}</li>`).join('')}</ul>` : '',
    `<p><strong>What to do:</strong> ${esc(a.action)}</p>`,
    a.caution ? `<p><strong>Take care:</strong> ${esc(a.caution)}</p>` : '',
    '</section>',
  ].join('');
}

function footerText(ctx: MailContext, reason: string): string {
  return [
    `Open ${ctx.gardenName} in Heatclock: ${ctx.gardenUrl}`,
    '',
    `${reason} Choose what you receive: ${ctx.settingsUrl}`,
    `Stop e-mail from ${ctx.gardenName} with one click: ${ctx.unsubscribeUrl}`,
  ].join('\n');
}

/** One accessible HTML page for every Heatclock mail: its subject as title and heading, then `body`. */
export function mailPage(subject: string, body: string[]): string {
  return [
    '<!doctype html>',
    '<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width">',
    `<title>${esc(subject)}</title></head>`,
    '<body style="font-family: sans-serif; line-height: 1.5; max-width: 40em">',
    `<h1>${esc(subject)}</h1>`,
    ...body,
    '</body></html>',
  ].join('\n');
}

function page(subject: string, intro: string, body: string, ctx: MailContext, reason: string): string {
  return mailPage(subject, [
    `<p>Hello ${esc(ctx.memberName)},</p><p>${esc(intro)}</p>`,
    body,
    `<p><a href="${esc(ctx.gardenUrl)}">Open ${esc(ctx.gardenName)} in Heatclock</a></p>`,
    `<footer><p>${esc(reason)} <a href="${esc(ctx.settingsUrl)}">Choose what you receive</a> or `,
    `<a href="${esc(ctx.unsubscribeUrl)}">stop e-mail from ${esc(ctx.gardenName)}</a>.</p></footer>`,
  ]);
}

/** Mail is worded once for everyone it goes to: stored dates in the default language. */
const worded = (m: MailContent, today: string): MailContent => ({
  subject: resolveDates(m.subject, DEFAULT_LOCALE, today),
  text: resolveDates(m.text, DEFAULT_LOCALE, today),
  html: resolveDates(m.html, DEFAULT_LOCALE, today),
});

/** The mail's own day, for wording its dates with a year only when they lie in another one. */
const newest = (alerts: MailAlert[]) => alerts.map((a) => a.firstOn).reduce((a, b) => (a > b ? a : b), '0000-01-01');

export function renderAlertMail(ctx: MailContext, alerts: MailAlert[]): MailContent {
  const subject = alerts.length === 1 ? `${heading(alerts[0])} · ${ctx.gardenName}` : `${alerts.length} new alerts · ${ctx.gardenName}`;
  const intro = alerts.length === 1 ? `There is a new alert for ${ctx.gardenName}.` : `There are ${alerts.length} new alerts for ${ctx.gardenName}.`;
  const reason = `You get this because you chose e-mail right away for ${ctx.gardenName}.`;
  return worded({
    subject,
    text: [`Hello ${ctx.memberName},`, '', intro, '', ...alerts.map((a) => alertText(a) + '\n'), footerText(ctx, reason)].join('\n'),
    html: page(subject, intro, alerts.map(alertHtml).join('\n'), ctx, reason),
  }, newest(alerts));
}

export function renderDigest(ctx: MailContext, alerts: MailAlert[], date: string): MailContent {
  const count = alerts.length === 1 ? '1 open alert' : `${alerts.length} open alerts`;
  const subject = `${ctx.gardenName} on ${dayMonth(date)}: ${count}`;
  const intro = `Your daily summary for ${ctx.gardenName}: ${count}.`;
  const reason = `You get this because you chose a daily summary for ${ctx.gardenName}.`;
  return worded({
    subject,
    text: [`Hello ${ctx.memberName},`, '', intro, '', ...alerts.map((a) => alertText(a) + '\n'), footerText(ctx, reason)].join('\n'),
    html: page(subject, intro, alerts.map(alertHtml).join('\n'), ctx, reason),
  }, date);
}
