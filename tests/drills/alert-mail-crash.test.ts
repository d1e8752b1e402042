/**
 * Drill: the process that wrote an alert is killed (SIGKILL, no shutdown) before its e-mail went
 * out; a fresh sender after the "restart" sends it exactly once. The killed process is a real
 * child (tests/drills/alert-crash-child.ts); messages are counted by Message-ID at the fake SMTP.
 */
import { describe, expect, it } from 'vitest';
import { spawn } from 'node:child_process';
import type { ChildProcess } from 'node:child_process';
import path from 'node:path';
import { createInterface } from 'node:readline';
import { QueryTypes } from 'sequelize';
import { testApp, testDb, testWeather } from '../helpers/test-app';
import { addMember, createGarden, createUser } from '../helpers/factories';
import { makePlanting, makeVariety } from '../helpers/garden-records';
import { giveGardenWeather, steadyDays } from '../helpers/garden-weather';
import { addDays } from '#shared/thermal/dates';
import type { AlertService } from '../../server/modules/alerts/alerts.service';
import { capturedFor, fakeSmtp, outboxFor, sender, setPreference } from '../api/mail/mail-helpers';
import { projectRoot } from '../../server/config';

const TODAY = '2026-06-10';
const NOW = `${TODAY}T17:00:00Z`;
const { sequelize } = testDb();

/** A garden whose evaluation opens a bolt-risk alert for a member who wants mail at once. */
async function gardenAboutToAlert() {
  const garden = await createGarden();
  const grower = await createUser();
  await addMember(grower.id, garden.id, 'grower');
  await setPreference(grower.id, garden.id, 'immediate');
  await giveGardenWeather(sequelize, garden, [...steadyDays('2021-01-01', addDays(TODAY, -1), 18, 9), ...steadyDays(TODAY, addDays(TODAY, 6), 31, 18, 'forecast')]);
  await makePlanting(garden.id, { varietyId: (await makeVariety(garden.id, { dtmDays: 55, boltTolerance: 1 })).id, sownOn: '2026-05-01' });
  return { garden, grower };
}

/** Runs the child until it reports `step`, then SIGKILLs it; resolves with its exit signal. */
async function killWhen(gardenId: number, mode: 'after-commit' | 'mid-send', until: (step: string) => Promise<boolean> | boolean) {
  const child: ChildProcess = spawn(process.execPath, ['--import', 'tsx', path.join('tests', 'drills', 'alert-crash-child.ts'), String(gardenId), mode, NOW], {
    cwd: projectRoot,
    env: { ...process.env, NODE_ENV: 'test', LOG_LEVEL: 'silent' },
    stdio: ['pipe', 'pipe', 'pipe'],
  });
  let stderr = '';
  child.stderr!.on('data', (d: Buffer) => (stderr += d.toString()));
  const exited = new Promise<NodeJS.Signals | number | null>((resolve) => child.once('exit', (code, signal) => resolve(signal ?? code)));
  const watchdog = setTimeout(() => child.kill('SIGKILL'), 30_000);
  try {
    const steps: string[] = [];
    for await (const line of createInterface({ input: child.stdout! })) {
      const { step } = JSON.parse(line) as { step: string };
      steps.push(step);
      if (await until(step)) {
        child.kill('SIGKILL');
        break;
      }
    }
    const how = await exited;
    expect(how, `child steps ${steps.join(' → ')}; stderr: ${stderr}`).toBe('SIGKILL');
    return steps;
  } finally {
    clearTimeout(watchdog);
    child.kill('SIGKILL');
  }
}

async function waitFor(check: () => Promise<boolean>, boundMs: number, what: string) {
  const started = Date.now();
  while (!(await check())) {
    if (Date.now() - started > boundMs) throw new Error(`${what}: not within ${boundMs} ms`);
    await new Promise((r) => setTimeout(r, 25));
  }
}

async function openAlerts(gardenId: number) {
  return sequelize.query<{ id: number; type: string }>("SELECT id, type FROM alerts WHERE garden_id = ? AND status = 'open'", {
    replacements: [gardenId],
    type: QueryTypes.SELECT,
  });
}

async function leaseRunOut(gardenId: number) {
  const [row] = await sequelize.query<{ due: number }>('SELECT lease_until IS NULL OR lease_until < UTC_TIMESTAMP(3) AS due FROM mail_outbox WHERE garden_id = ?', {
    replacements: [gardenId],
    type: QueryTypes.SELECT,
  });
  return Number(row.due) === 1;
}

/** What the receiving side got, grouped by Message-ID. */
async function copiesByMessageId(email: string) {
  const counts = new Map<string, number>();
  for (const m of await capturedFor(email)) {
    const id = m.headers['message-id'];
    counts.set(id, (counts.get(id) ?? 0) + 1);
  }
  return counts;
}

describe('drill: the process dies between writing an alert and sending its e-mail', () => {
  it('when it is killed right after the commit, before any sender saw the row, then after restart the message is sent once', async () => {
    const fake = await fakeSmtp();
    const { garden, grower } = await gardenAboutToAlert();

    const steps = await killWhen(garden.id, 'after-commit', (step) => step === 'committed');
    expect(steps).toEqual(['ready', 'committed']);

    // What the dead process committed is all there: the alert and its message, not yet sent.
    expect((await openAlerts(garden.id)).map((a) => a.type)).toContain('bolt-risk');
    expect(await outboxFor(garden.id)).toMatchObject([{ status: 'pending', attempts: 0 }]);
    expect(await capturedFor(grower.email)).toEqual([]);

    // The restarted instance: two senders racing, and the evaluation run again.
    const app = testApp({}, testWeather({}, () => new Date(NOW)));
    await Promise.all([sender(fake.port, garden.id).drain(), sender(fake.port, garden.id).drain()]);
    await (app.locals.alerts as AlertService).evaluate(garden.id);
    await sender(fake.port, garden.id).drain();

    const copies = await copiesByMessageId(grower.email);
    expect([...copies.values()]).toEqual([1]);
    expect(await outboxFor(garden.id)).toMatchObject([{ status: 'sent', attempts: 1 }]);
  }, 60_000);

  it('when it is killed mid-send (row claimed, SMTP conversation open), then once its lease runs out a fresh sender sends it once', async () => {
    const fake = await fakeSmtp();
    const { garden, grower } = await gardenAboutToAlert();

    await killWhen(garden.id, 'mid-send', async (step) => {
      if (step !== 'ready') return false;
      await waitFor(async () => (await outboxFor(garden.id))[0]?.status === 'sending', 15_000, 'the child claims the message');
      return true;
    });
    expect(await outboxFor(garden.id)).toMatchObject([{ status: 'sending', attempts: 1 }]);

    // A live lease (5 s in the child) is respected: no second copy while its sender might still be at it.
    // Checked only when the lease was still live once the drain had finished (a very slow machine may pass it).
    await sender(fake.port, garden.id).drain();
    if (!(await leaseRunOut(garden.id))) expect(await capturedFor(grower.email)).toEqual([]);

    await waitFor(() => leaseRunOut(garden.id), 15_000, 'the dead sender’s lease runs out');
    await Promise.all([sender(fake.port, garden.id).drain(), sender(fake.port, garden.id).drain()]);
    await sender(fake.port, garden.id).drain();

    const copies = await copiesByMessageId(grower.email);
    expect([...copies.values()]).toEqual([1]);
    expect(await outboxFor(garden.id)).toMatchObject([{ status: 'sent', attempts: 2 }]);
  }, 60_000);
});
