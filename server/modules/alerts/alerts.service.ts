/**
 * Alert evaluation: the garden's progress (computed or cached by the progress service) and its
 * recent weather go through the rules, and each candidate is stored under its natural key in one
 * transaction — new ones opened, changed ones updated (a worsening keeps its row), passed ones
 * resolved and kept. Messages for new or worsened alerts are written in the same transaction.
 */
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
    const plantings = rows.flatMap((r) =>
      r.summary ? [{ plantingId: r.plantingId, label: `${findCrop(r.cropKey)?.name ?? r.cropKey}: ${r.varietyName} (${r.bedName})`, progress: r.summary }] : [],
    );
    const from = addDays(today, -GAP_LOOKBACK_DAYS);
    const days = garden.weatherCellId ? await this.weather.gardenSeries(garden, from, addDays(today, -1)) : [];
    // A garden with no weather at all is still being set up; its gaps are the backfill's to fill.
    const gaps = days.length ? findGaps(new Set(days.filter((d) => d.source !== 'forecast').map((d) => d.date)), from, addDays(today, -1)) : [];
    return { today, list: alertCandidates({ today, gardenName: garden.name, plantings, gaps }) };
  }

  /**
   * Safe to run any number of times, concurrently and on several instances: rows are keyed and
   * locked. `progressFresh`: the caller has just recomputed the garden's growing plantings.
   */
  async evaluate(gardenId: number, opts: { progressFresh?: boolean } = {}): Promise<Evaluation> {
    const { today, list } = await this.candidates(gardenId, opts.progressFresh ?? false);
    const result = await inTransaction(this.sequelize, async (transaction) => {
      const existing = new Map((await this.repo.forEvaluation(gardenId, transaction)).map((r) => [naturalKey(r), r]));
      const out: Evaluation = { opened: 0, updated: 0, resolved: 0, notified: [] };
      const seen = new Set<number>();
      const fresh: AlertCandidate[] = [];
      for (const c of list) {
        const row = existing.get(naturalKey({ subjectKey: subjectKey(c), type: c.type, firstOn: c.firstOn }));
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
      const passed = [...existing.values()].filter((r) => r.status !== 'resolved' && !seen.has(r.id)).map((r) => r.id);
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
