/**
 * Shapes computed progress for the API in the garden's display unit: °F and °F-days, or °C and
 * °C-days, never mixed. The same figures feed the one-line summary every page shows.
 */
import type { DisplayUnit } from '#shared/schemas/gardens';
import type { BoltLevelOrNone, ProgressDto, ProgressSummaryDto, StartEventKind, StressDto, TargetBasis } from '#shared/schemas/progress';
import { dayToken, rangeToken } from '#shared/format/dates';
import { countOf } from '#shared/format/count-words';
import type { PlantingPreviewDto } from '#shared/schemas/plantings';
import type { PreviewComputation } from './progress-loader';
import type { PlantingProgress } from '#shared/thermal/planting-progress';
import type { StartEvent } from '#shared/thermal/start-event';
import type { DegreeDayMethod } from '#shared/thermal/types';
import { degreeDaysIn, formatDegreeDays, tempIn } from '#shared/thermal/units';
import type { Planting } from '../../db/models';
import { BOLT_RANK } from './progress.repository';
import type { ProgressRow } from './progress.repository';

export interface Computed {
  planting: Planting;
  cropName: string;
  season: 'cool' | 'warm';
  unit: DisplayUnit;
  today: string;
  method: DegreeDayMethod;
  /** °C-days. */
  target: number | null;
  targetBasis: TargetBasis | null;
  targetNote: string;
  event: StartEvent | null;
  startReason: string | null;
  progress: PlantingProgress | null;
  boltNotes: string[];
}

const r1 = (x: number) => Math.round(x * 10) / 10;
const r2 = (x: number) => Math.round(x * 100) / 100;
const dd = (cDays: number, unit: DisplayUnit) => r1(degreeDaysIn(cDays, unit));
const t = (c: number, unit: DisplayUnit) => r2(tempIn(c, unit));

function eventKind(e: StartEvent): StartEventKind {
  return e.planned ? (e.kind === 'sowing' ? 'planned-sowing' : 'planned-transplant') : e.kind;
}

const STRESS_WORDS: Record<StressDto['kind'], string> = {
  frost: 'frost',
  chilling: 'chilling',
  'blossom-drop': 'blossom drop',
  'pollination-heat': 'pollination heat',
};

export function stressTitle(s: { kind: StressDto['kind']; severity: StressDto['severity'] }): string {
  if (s.kind === 'frost') return s.severity === 'possible' ? 'frost possible' : `${s.severity} freeze`;
  return `${STRESS_WORDS[s.kind]} (${s.severity})`;
}

function stressOf(c: Computed): StressDto[] {
  return (c.progress?.stress ?? []).map((e) => ({
    kind: e.kind,
    severity: e.severity,
    start: e.start,
    end: e.end,
    days: e.days,
    forecast: e.forecast,
    lowestMin: e.figures.lowestMinC === undefined ? null : t(e.figures.lowestMinC, c.unit),
    highestMax: e.figures.highestMaxC === undefined ? null : t(e.figures.highestMaxC, c.unit),
    threshold: t(e.figures.thresholdC, c.unit),
    message: e.message,
  }));
}

/** "412 of 950 °F-days (43 %); likely ready 14 – 22 Jun; bolt risk elevated now, high from 9 Jun: …". */
export function summarySentence(c: Computed): string {
  const p = c.progress;
  const { unit } = c;
  if (!c.event || !p) return c.startReason ?? 'No start date yet.';
  const parts: string[] = [];
  const heat = c.target ? `${formatDegreeDays(p.accumulated, unit).replace(/ °.-days$/, '')} of ${formatDegreeDays(c.target, unit)} (${Math.round(p.percent ?? 0)} %)` : formatDegreeDays(p.accumulated, unit);
  const m = p.maturity;
  const status = c.planting.status;
  if (status === 'harvested' || (status === 'bolted' && m.kind === 'recorded')) {
    parts.push(`first harvest ${dayToken(m.p50!)} after ${formatDegreeDays(p.accumulated, unit)}`);
  } else if (status === 'bolted') {
    parts.push(`bolted ${c.planting.boltedOn ? dayToken(c.planting.boltedOn) : ''} after ${formatDegreeDays(p.accumulated, unit)}, before any harvest`.replace('  ', ' '));
  } else if (status === 'failed') {
    parts.push('failed');
  } else {
    if (c.event.planned) parts.push(`planned for ${dayToken(c.event.on)}`);
    else parts.push(heat);
    if (m.kind === 'recorded') parts.push(`harvesting since ${dayToken(m.p50!)}`);
    else if (m.kind === 'observed') parts.push(`reached its target on ${dayToken(m.p50!)}: ready to harvest`);
    else if (m.kind === 'forecast') parts.push(`the forecast reaches its target on ${dayToken(m.p50!)}`);
    else if (m.kind === 'analog' && m.p10 && m.p90) parts.push(`likely ready ${rangeToken(m.p10, m.p90)}`);
    else if (m.kind === 'analog') parts.push('may not reach its target this season');
    else parts.push(m.note.replace(/\.$/, '').replace(/^./, (x) => x.toLowerCase()));
    parts.push(...boltWords(c));
    const s = p.stress[0];
    if (s) parts.push(`${stressTitle(s)} forecast ${rangeToken(s.start, s.end)}`);
  }
  const sentence = parts.join('; ');
  return sentence.charAt(0).toUpperCase() + sentence.slice(1) + '.';
}

function boltWords(c: Computed): string[] {
  const b = c.progress!.bolt;
  if (b.level === 'none') return [];
  const why = (reasons: { message: string; trigger: string }[]) => reasons.filter((r) => r.trigger !== 'tolerance').map((r) => r.message)[0];
  const now = why(b.reasons);
  const out = [`bolt risk ${b.level}${now && b.level !== 'low' ? `: ${now}` : ''}`];
  if (b.highFrom && b.level !== 'high') {
    const ahead = why(b.highReasons);
    out.push(`high from ${dayToken(b.highFrom)}${ahead ? `: ${ahead}` : ''}`);
  }
  return out;
}

/** The reasons behind the risk that matters: the coming high day's when it lies ahead, else today's; tolerance last. */
function boltReasonWords(p: PlantingProgress | null): string[] {
  if (!p || p.bolt.level === 'none') return [];
  const reasons = p.bolt.highReasons.length ? p.bolt.highReasons : p.bolt.reasons;
  // The engine's words already say which days are forecast.
  return [...reasons.filter((r) => r.trigger !== 'tolerance'), ...reasons.filter((r) => r.trigger === 'tolerance')].map((r) => r.message);
}

export function summaryOf(c: Computed): ProgressSummaryDto {
  const p = c.progress;
  const m = p?.maturity;
  return {
    plantingId: c.planting.id,
    unit: c.unit,
    accumulated: p ? dd(p.accumulated, c.unit) : 0,
    target: c.target === null ? null : dd(c.target, c.unit),
    percent: p?.percent == null ? null : r1(p.percent),
    maturity: { p10: m?.p10 ?? null, p50: m?.p50 ?? null, p90: m?.p90 ?? null, kind: m?.kind ?? 'none' },
    boltLevel: (p?.bolt.level ?? 'none') as BoltLevelOrNone,
    boltHighFrom: p?.bolt.highFrom ?? null,
    boltReason: p?.bolt.reasons.find((r) => r.trigger !== 'tolerance')?.message ?? null,
    boltRiskFrom: p?.bolt.riskFrom ?? null,
    boltReasons: boltReasonWords(p),
    stress: (p?.stress ?? []).map((s) => ({ kind: s.kind, severity: s.severity, start: s.start, end: s.end, message: s.message })),
    summary: summarySentence(c),
  };
}

export function presentProgress(c: Computed): ProgressDto {
  const p = c.progress;
  const { unit } = c;
  return {
    plantingId: c.planting.id,
    status: c.planting.status,
    unit,
    method: c.method.method,
    base: t(c.method.base, unit),
    upper: c.method.upper === undefined ? null : t(c.method.upper, unit),
    cutoff: c.method.cutoff ?? 'horizontal',
    target: c.target === null ? null : dd(c.target, unit),
    targetBasis: c.targetBasis,
    targetNote: [c.targetNote, c.event?.explanation].filter(Boolean).join(' '),
    accumulated: p ? dd(p.accumulated, unit) : 0,
    percent: p?.percent == null ? null : r1(p.percent),
    startEvent: c.event ? { kind: eventKind(c.event), on: c.event.on } : null,
    packetDate: c.event?.packetDate ?? null,
    maturity: {
      p10: p?.maturity.p10 ?? null,
      p50: p?.maturity.p50 ?? null,
      p90: p?.maturity.p90 ?? null,
      basis: p
        ? { kind: p.maturity.kind, observedDays: p.maturity.observedDays, forecastDays: p.maturity.forecastDays, analogYears: p.maturity.analogYears, neverMatureShare: r2(p.maturity.neverMatureShare), note: p.maturity.note }
        : { kind: 'none', observedDays: 0, forecastDays: 0, analogYears: 0, neverMatureShare: 0, note: c.startReason ?? '' },
    },
    boltRisk: {
      level: p?.bolt.level ?? 'none',
      note: c.boltNotes.join(' ') || (p?.bolt.level === 'none' ? 'No weather since the start event yet to judge it by.' : null),
      reasons: (p?.bolt.reasons ?? []).map((r) => ({ trigger: r.trigger, message: r.message, forecast: r.forecast })),
      highFrom: p?.bolt.highFrom ?? null,
      days: p?.bolt.days ?? [],
    },
    stress: stressOf(c),
    series: (p?.series ?? []).map((d) => ({ date: d.date, tmax: t(d.tmax, unit), tmin: t(d.tmin, unit), dd: r2(degreeDaysIn(d.dd, unit)), cumulative: r1(degreeDaysIn(d.cumulative, unit)), source: d.source })),
    projection: (p?.band ?? []).map((b) => ({ date: b.date, p10: dd(b.p10, unit), p50: dd(b.p50, unit), p90: dd(b.p90, unit) })),
    today: c.today,
    missingDates: p?.missingDates ?? [],
    recorded: { firstHarvestOn: c.planting.firstHarvestOn, boltedOn: c.planting.boltedOn },
    summary: summarySentence(c),
  };
}

export function progressRow(c: Computed): ProgressRow {
  const summary = summaryOf(c);
  return {
    plantingId: c.planting.id,
    gardenId: c.planting.gardenId,
    computedFor: c.today,
    percent: summary.percent,
    readyOn: summary.maturity.p50,
    boltRank: BOLT_RANK[summary.boltLevel],
    summary,
    body: JSON.stringify(presentProgress(c)),
  };
}

/** Half or more of the past seasons with high bolt risk at harvest is a warning; a quarter, a caution (common practice, no source). */
export const BOLT_SEASON_WARN_SHARE = 0.5;
export const BOLT_SEASON_CAUTION_SHARE = 0.25;

/** The new-planting form's preview: the saved planting's computation, and the garden's bolt seasons. */
export function presentPreview({ computed: c, boltSeason }: PreviewComputation): PlantingPreviewDto {
  const p = c.progress;
  const m = p?.maturity;
  let season: PlantingPreviewDto['boltSeason'] = null;
  if (boltSeason && c.event) {
    const { highShare, years } = boltSeason;
    const hot = Math.round(highShare * years);
    const share = `in ${hot} of the last ${countOf(years, 'season')} here`;
    const started = `${c.cropName} ${c.event.kind === 'sowing' ? 'sown' : 'set out'} on ${dayToken(c.event.on)}`;
    const warning =
      highShare >= BOLT_SEASON_WARN_SHARE
        ? `High bolt risk: ${started} would have met bolting heat or long days while ready to pick ${share}. Sow earlier or later, choose a bolt-tolerant variety, or plan shade.`
        : highShare >= BOLT_SEASON_CAUTION_SHARE
          ? `Some bolt risk: ${started} would have met bolting conditions while ready to pick ${share}.`
          : null;
    season = { highShare: r2(highShare), years, warning };
  }
  return {
    unit: c.unit,
    target: c.target === null ? null : dd(c.target, c.unit),
    targetNote: [c.targetNote, c.event?.explanation].filter(Boolean).join(' '),
    startEvent: c.event ? { kind: c.event.kind, on: c.event.on } : null,
    startReason: c.startReason,
    maturity: { p10: m?.p10 ?? null, p50: m?.p50 ?? null, p90: m?.p90 ?? null, kind: m?.kind ?? 'none', note: m?.note ?? c.startReason ?? '' },
    boltSeason: season,
  };
}
