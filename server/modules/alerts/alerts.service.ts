/**
 * Alert evaluation: the garden's progress (computed or cached by the progress service) and its
 * recent weather go through the rules, and each candidate is stored under its natural key in one
 * transaction — new ones opened, changed ones updated (a worsening keeps its row), passed ones
 * resolved and kept. Messages for new or worsened alerts are written in the same transaction.
 */
import type { ProgressSummaryDto } from '#shared/schemas/progress';
import type { Sequelize, Transaction } from 'sequelize';
import { findCrop } from '#shared/crops/library';
import type { AlertCountsDto, AlertDto, AlertListQuery, AlertType } from '#shared/schemas/alerts';
import type { TodayActionDto } from '#shared/schemas/progress';
import { addDays } from '#shared/thermal/dates';
import { AppError } from '../../errors';
import { inTransaction } from '../../lib/transaction';
import type { ProgressService } from '../progress/progress.service';
import type { WeatherService } from '../weather/weather.service';
import { findGaps } from '../weather/weather-gaps';
import { alertCandidates, worse } from './alert-rules';
import type { AlertCandidate } from './alert-rules';
import { AlertsRepository, naturalKey, subjectKey } from './alerts.repository';
import type { AlertRow } from './alerts.repository';

/** How far back a missing day is looked for. */
const GAP_LOOKBACK_DAYS = 30;

/** Writes the messages that report these alerts, in the evaluation's transaction; then wakes the sender. */
export interface AlertMail {
  enqueue(transaction: Transaction, gardenId: number, alertIds: number[]): Promise<unknown>;
  afterCommit(): void;
}

export interface Evaluation {
  opened: number;
  updated: number;
  resolved: number;
  notified: number[];
}

const iso = (d: Date | string | null) => (d === null ? null : new Date(d).toISOString());

export function presentAlert(r: AlertRow): AlertDto {
  return {
    id: r.id,
    gardenId: r.gardenId,
    type: r.type,
    severity: r.severity,
    status: r.status,
    plantingId: r.plantingId,
    subject: r.subject,
    title: r.title,
    startsOn: r.firstOn,
    endsOn: r.endsOn,
    reasons: JSON.parse(r.reasonsJson) as string[],
    action: r.action,
    caution: r.caution,
    createdAt: iso(r.createdAt)!,
    updatedAt: iso(r.updatedAt)!,
    acknowledgedAt: iso(r.acknowledgedAt),
    acknowledgedBy: r.acknowledgedBy,
    resolvedAt: iso(r.resolvedAt),
  };
}

const STRESS_KIND = { frost: 'frost', 'heat-stress': 'heat', chilling: 'chilling' } as const;

/** An open alert as Today lists it: alerts are the one source of what needs attention. */
export function asTodayAction(a: AlertDto): TodayActionDto {
  const kind =
    a.type === 'bolt-risk' ? (a.severity === 'warning' ? 'bolt-high' : 'bolt-elevated') : a.type === 'harvest-window' ? 'window-open' : a.type === 'data-gap' ? 'data-gap' : 'stress';
  return {
    kind,
    alertId: a.id,
    caution: a.caution,
    ...(kind === 'stress' ? { stressKind: STRESS_KIND[a.type as keyof typeof STRESS_KIND] } : {}),
    plantingId: a.plantingId,
    plantingIds: a.plantingId === null ? [] : [a.plantingId],
    title: `${a.subject}: ${a.title}`,
    advice: a.action,
    detail: a.reasons.join('; '),
    date: a.startsOn,
  };
}

/**
 * The current alert a candidate continues when its first date moved (a spell seen from a later
 * day, a window whose first likely day passed): same subject and type, overlapping or adjoining
 * dates for weather spells, any for bolt risk and the harvest window (one of each per planting).
 */
function continuing(current: AlertRow[], c: AlertCandidate, taken: ReadonlySet<number>): AlertRow | undefined {
  const key = subjectKey(c);
  return current.find((r) => {
    if (r.status === 'resolved' || taken.has(r.id) || r.subjectKey !== key || r.type !== c.type) return false;
    if (c.type === 'bolt-risk' || c.type === 'harvest-window' || c.type === 'data-gap') return true;
    return (r.endsOn ?? r.firstOn) >= addDays(c.firstOn, -1) && r.firstOn <= addDays(c.endsOn ?? c.firstOn, 1);
  });
}

const changed = (r: AlertRow, c: AlertCandidate) =>
  r.status === 'resolved' || r.severity !== c.severity || r.endsOn !== c.endsOn || r.title !== c.title || r.reasonsJson !== JSON.stringify(c.reasons) || r.caution !== c.caution;

export class AlertService {
  readonly repo: AlertsRepository;
  mail: AlertMail | null = null;

  constructor(
    private readonly sequelize: Sequelize,
    private readonly weather: WeatherService,
    private readonly progress: ProgressService,
  ) {
    this.repo = new AlertsRepository(sequelize);
  }

  private async candidates(gardenId: number, progressFresh: boolean) {
    const { garden, today } = await this.progress.gardenToday(gardenId);
    if (!progressFresh) await this.progress.refreshGarden(gardenId, { status: 'growing' });
    const rows = await this.progress.repo.growing(gardenId, today);
    // A summary a concurrent change kept out of the cache is computed for this run all the same.
    const missing = rows.filter((r) => !r.summary).map((r) => r.plantingId);
    const computed = missing.length ? await this.progress.summaries(gardenId, missing) : new Map<number, ProgressSummaryDto>();
    const plantings = rows.flatMap((r) => {
      const progress = r.summary ?? computed.get(r.plantingId);
      return progress ? [{ plantingId: r.plantingId, label: `${findCrop(r.cropKey)?.name ?? r.cropKey}: ${r.varietyName} (${r.bedName})`, progress }] : [];
    });
    const from = addDays(today, -GAP_LOOKBACK_DAYS);
    const days = garden.weatherCellId ? await this.weather.gardenSeries(garden, from, addDays(today, -1)) : [];
    // A garden with no weather at all is still being set up; its gaps are the backfill's to fill.
    const gaps = days.length ? findGaps(new Set(days.filter((d) => d.source !== 'forecast').map((d) => d.date)), from, addDays(today, -1)) : [];
    // Alerts of a planting without an answer this run are left as they are, never resolved by omission.
    const unknown = new Set(rows.filter((r) => !plantings.some((p) => p.plantingId === r.plantingId)).map((r) => `p${r.plantingId}`));
    return { today, unknown, list: alertCandidates({ today, gardenName: garden.name, plantings, gaps }) };
  }

  /**
   * Safe to run any number of times, concurrently and on several instances: each garden's run
   * takes the garden's evaluation row as a lock first, and a run whose inputs changed while it
   * computed (the garden's progress counter moved) gives way to the evaluation that change owes.
   * `progressFresh`: the caller has just recomputed the garden's growing plantings.
   */
  async evaluate(gardenId: number, opts: { progressFresh?: boolean } = {}): Promise<Evaluation> {
    const epoch = await this.progress.repo.epoch(gardenId);
    const { today, unknown, list } = await this.candidates(gardenId, opts.progressFresh ?? false);
    const result = await inTransaction(this.sequelize, async (transaction) => {
      const out: Evaluation = { opened: 0, updated: 0, resolved: 0, notified: [] };
      await this.repo.lockGarden(gardenId, transaction);
      if ((await this.progress.repo.epoch(gardenId, transaction)) !== epoch) return out;
      const current = await this.repo.forEvaluation(gardenId, transaction);
      const byKey = new Map(current.map((r) => [naturalKey(r), r]));
      const seen = new Set<number>();
      const fresh: AlertCandidate[] = [];
      for (const c of list) {
        const row = byKey.get(naturalKey({ subjectKey: subjectKey(c), type: c.type, firstOn: c.firstOn })) ?? continuing(current, c, seen);
        if (!row) {
          fresh.push(c);
          continue;
        }
        seen.add(row.id);
        if (!changed(row, c)) continue;
        await this.repo.update(row.id, c, transaction);
        out.updated++;
        if (row.status === 'resolved' || worse(c.severity, row.severity)) out.notified.push(row.id);
      }
      const created = await this.repo.insertMany(gardenId, fresh, transaction);
      out.opened = created.length;
      out.notified.push(...created);
      const passed = current.filter((r) => r.status !== 'resolved' && !seen.has(r.id) && !unknown.has(r.subjectKey)).map((r) => r.id);
      await this.repo.resolve(passed, transaction);
      out.resolved = passed.length;
      await this.repo.markEvaluated(gardenId, today, transaction);
      if (out.notified.length && this.mail) await this.mail.enqueue(transaction, gardenId, out.notified);
      return out;
    });
    if (result.notified.length) this.mail?.afterCommit();
    return result;
  }

  /** Evaluates first when the garden has not been evaluated for its today (a day turned, or never). */
  async ensureEvaluated(gardenId: number) {
    const { today } = await this.progress.gardenToday(gardenId);
    if ((await this.repo.evaluatedFor(gardenId)) !== today) await this.evaluate(gardenId);
  }

  async list(gardenId: number, q: AlertListQuery): Promise<AlertDto[]> {
    return (await this.repo.list(gardenId, q)).map(presentAlert);
  }

  async counts(gardenId: number): Promise<AlertCountsDto> {
    const rows = await this.repo.counts(gardenId);
    const byType: Partial<Record<AlertType, number>> = {};
    for (const r of rows) byType[r.type] = Number(r.n);
    return { open: rows.reduce((n, r) => n + Number(r.n), 0), byType };
  }

  async acknowledge(gardenId: number, alertId: number, userId: number): Promise<AlertDto> {
    const row = await this.repo.one(gardenId, alertId);
    if (!row) throw AppError.notFound('That alert');
    if (row.status === 'resolved') throw new AppError(409, 'alert_resolved', 'This alert has already passed; it is kept in the history.');
    await this.repo.acknowledge(gardenId, alertId, userId);
    return presentAlert((await this.repo.one(gardenId, alertId))!);
  }
}
