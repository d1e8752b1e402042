/**
 * What a garden's plantings and weather call for, read off their progress (never a second copy
 * of its rules): bolt risk turning elevated or high, frost, heat and sustained chilling in the
 * forecast, harvest windows that have opened, and a weather data gap older than two days. Pure:
 * the evaluator stores what this returns under each alert's natural key.
 */
import type { AlertSeverity, AlertType } from '#shared/schemas/alerts';
import type { ProgressSummaryDto, StressDto } from '#shared/schemas/progress';
import { dayToken, rangeToken } from '#shared/format/dates';
import { addDays } from '#shared/thermal/dates';

/** How far ahead a spell of bolt risk is worth acting on now. */
export const BOLT_LOOKAHEAD_DAYS = 7;
/** A missing day younger than this may still arrive with the next refresh (issue: "older than 2 days"). */
export const GAP_GRACE_DAYS = 2;

export const HEAT_CAUTION = 'When you work outdoors in the heat, drink water often, rest in the shade and follow local heat-safety advice.';
export const FROST_CAUTION =
  'If you use a heater for frost protection, follow its label and local fire codes, keep fuel away from plants and people, and never run a fuel-burning heater in a closed space.';

const ACTION = {
  bolt: 'Harvest what is near size now; shade and water it through the heat; for the next sowing, choose a slower-bolting variety or sow where it gets afternoon shade.',
  frost: 'Cover it overnight with row cover or a sheet, water the soil the afternoon before, and bring containers in.',
  chilling: 'Cover it at night or move containers somewhere sheltered; warm-season crops stall and can be injured in a run of cold nights.',
  heat: 'Water deeply early in the day and shade it through the hottest hours.',
  window: 'Check it for size and taste: the degree-day window for harvest has opened.',
  gap: 'The weather service has not sent these days yet; they are fetched again each night. If you keep a station, upload its readings for them on the Weather page.',
} as const;

export interface PlantingForRules {
  plantingId: number;
  /** "Lettuce: Copperleaf Butterhead (Plot 3)". */
  label: string;
  progress: ProgressSummaryDto;
}

export interface AlertCandidate {
  type: AlertType;
  plantingId: number | null;
  firstOn: string;
  endsOn: string | null;
  severity: AlertSeverity;
  subject: string;
  title: string;
  reasons: string[];
  action: string;
  caution: string | null;
}

const SEVERITY_RANK: Record<AlertSeverity, number> = { info: 0, watch: 1, warning: 2, severe: 3 };
export const worse = (a: AlertSeverity, b: AlertSeverity) => SEVERITY_RANK[a] > SEVERITY_RANK[b];

function bolt(p: PlantingForRules, today: string): AlertCandidate[] {
  const g = p.progress;
  if (g.boltLevel === 'none' || !g.boltRiskFrom) return [];
  const highSoon = g.boltHighFrom !== null && g.boltHighFrom <= addDays(today, BOLT_LOOKAHEAD_DAYS);
  const now = g.boltLevel === 'elevated' || g.boltLevel === 'high';
  if (!now && !highSoon) return [];
  const high = g.boltLevel === 'high' || highSoon;
  const when = g.boltLevel === 'high' ? 'now' : highSoon ? `from ${dayToken(g.boltHighFrom!)}` : 'now';
  return [{
    type: 'bolt-risk',
    plantingId: p.plantingId,
    firstOn: g.boltRiskFrom,
    endsOn: null,
    severity: high ? 'warning' : 'watch',
    subject: p.label,
    title: `Bolt risk ${high ? 'high' : 'elevated'} ${when}`,
    reasons: g.boltReasons.length ? g.boltReasons : [g.boltReason ?? g.summary],
    action: ACTION.bolt,
    caution: HEAT_CAUTION,
  }];
}

const STRESS_TYPE: Record<StressDto['kind'], AlertType> = { frost: 'frost', chilling: 'chilling', 'blossom-drop': 'heat-stress', 'pollination-heat': 'heat-stress' };

function stressSeverity(s: { kind: StressDto['kind']; severity: StressDto['severity'] }): AlertSeverity {
  if (s.kind === 'frost') return s.severity === 'severe' ? 'severe' : s.severity === 'moderate' ? 'warning' : 'watch';
  return s.severity === 'warning' ? 'warning' : 'watch';
}

function stressTitle(s: { kind: StressDto['kind']; severity: StressDto['severity']; start: string; end: string }): string {
  const when = rangeToken(s.start, s.end);
  if (s.kind === 'frost') return `${s.severity === 'possible' ? 'Frost possible' : `${s.severity[0].toUpperCase()}${s.severity.slice(1)} freeze`} forecast ${when}`;
  if (s.kind === 'chilling') return `Cold nights forecast ${when}`;
  return `${s.kind === 'blossom-drop' ? 'Heat for blossoms' : 'Heat for pollination'} forecast ${when}`;
}

function stress(p: PlantingForRules): AlertCandidate[] {
  return p.progress.stress.map((s) => {
    const type = STRESS_TYPE[s.kind];
    return {
      type,
      plantingId: p.plantingId,
      firstOn: s.start,
      endsOn: s.end,
      severity: stressSeverity(s),
      subject: p.label,
      title: stressTitle(s),
      reasons: [s.message],
      action: type === 'frost' ? ACTION.frost : type === 'chilling' ? ACTION.chilling : ACTION.heat,
      caution: type === 'frost' ? FROST_CAUTION : type === 'heat-stress' ? HEAT_CAUTION : null,
    };
  });
}

function window(p: PlantingForRules, today: string): AlertCandidate[] {
  const g = p.progress;
  const m = g.maturity;
  if (!m.p10 || m.p10 > today || m.kind === 'recorded' || m.kind === 'none') return [];
  const range = m.p90 && m.p90 !== m.p10 ? `likely ready ${rangeToken(m.p10, m.p90)}` : `ready from ${dayToken(m.p10)}`;
  const heat = g.target ? `${Math.round(g.accumulated)} of ${Math.round(g.target)} °${g.unit}-days (${Math.round(g.percent ?? 0)} %)` : `${Math.round(g.accumulated)} °${g.unit}-days`;
  return [{ type: 'harvest-window', plantingId: p.plantingId, firstOn: m.p10, endsOn: m.p90, severity: 'info', subject: p.label, title: 'Harvest window open', reasons: [`${heat}; ${range}`], action: ACTION.window, caution: null }];
}

export interface GardenGap {
  from: string;
  to: string;
  days: number;
}

function gaps(gardenName: string, list: GardenGap[], today: string): AlertCandidate[] {
  const old = list.filter((g) => g.to <= addDays(today, -(GAP_GRACE_DAYS + 1)));
  if (!old.length) return [];
  const days = old.reduce((n, g) => n + g.days, 0);
  return [{
    type: 'data-gap',
    plantingId: null,
    firstOn: old[0].from,
    endsOn: old.at(-1)!.to,
    severity: 'watch',
    subject: gardenName,
    title: `Weather missing for ${days} ${days === 1 ? 'day' : 'days'}`,
    reasons: old.map((g) => (g.from === g.to ? `no temperatures for ${dayToken(g.from)}` : `no temperatures for ${rangeToken(g.from, g.to)} (${g.days} days)`)),
    action: ACTION.gap,
    caution: null,
  }];
}

/** Every alert the garden's state calls for today, bolt risk and stress first. */
export function alertCandidates(input: { today: string; gardenName: string; plantings: PlantingForRules[]; gaps: GardenGap[] }): AlertCandidate[] {
  const { today, plantings } = input;
  return [
    ...plantings.flatMap((p) => bolt(p, today)),
    ...plantings.flatMap((p) => stress(p)),
    ...plantings.flatMap((p) => window(p, today)),
    ...gaps(input.gardenName, input.gaps, today),
  ];
}
