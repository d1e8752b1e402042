/**
 * Heat, chilling and frost events from daily temperatures (°C), by crop class (SCIENCE §4).
 * Thresholds are written in °F as published and converted exactly with fToC.
 */
import { addDays } from './dates';
import { toDenseSeries } from './series';
import type { DailyTemp } from './types';
import { formatTemp, fToC } from './units';
import type { TempUnit } from './units';

export type HardinessClass = 'very-hardy' | 'frost-tolerant' | 'tender' | 'warm-loving';
export type FrostSeverity = 'possible' | 'light' | 'moderate' | 'severe';
export type StressKind = 'frost' | 'chilling' | 'blossom-drop' | 'pollination-heat';
export type StressSeverity = FrostSeverity | 'watch' | 'warning';

export interface StressThresholdsF {
  /** Shelter lows at or below which frost can form on plants (33–36 °F, M). */
  frostPossible: number;
  /** NWS freeze categories (from memory, M): light 29–32, moderate 25–28, severe ≤ 24 °F. */
  lightFreeze: number;
  moderateFreeze: number;
  severeFreeze: number;
  /** Chilling injury of warm-season crops below ~50 °F (M). */
  chilling: number;
}

export const STRESS_THRESHOLDS_F: StressThresholdsF = {
  frostPossible: 36,
  lightFreeze: 32,
  moderateFreeze: 28,
  severeFreeze: 24,
  chilling: 50,
};

export interface BlossomDropProfile {
  /** Highs above this (°F) stress flowers; 'watch' at highWatchF, 'warning' at highWarningF (85–92 °F, M). */
  highWatchF: number;
  highWarningF: number;
  /** Nights above / below these (°F) stress flowers (70 / 55 °F, M). */
  nightAboveF: number;
  nightBelowF: number;
  /** "For several days": 3 is our reading (common practice, no source). */
  minDays: number;
}

export interface PollinationHeatProfile {
  /** Pollen falls above 95 °F; from the 4th straight day ≈1 % loss a day (Rees & Hoegemeyer 2019, H). */
  highAboveF: number;
  warningFromDay: number;
}

export interface StressProfile {
  hardiness: HardinessClass;
  /** Warm-season crops suffer chilling injury below ~50 °F. */
  chillingSensitive?: boolean;
  /** Nights in a row below the chilling limit that make a spell worth acting on (default 3: a sustained spell, not one cool night; common practice, no source). */
  chillingMinDays?: number;
  blossomDrop?: BlossomDropProfile;
  pollinationHeat?: PollinationHeatProfile;
}

export interface StressEvent {
  kind: StressKind;
  severity: StressSeverity;
  start: string;
  end: string;
  days: number;
  /** True when any day of the event is a forecast. */
  forecast: boolean;
  /** The figures that triggered it, °C (and the threshold in its published °F). */
  figures: { lowestMinC?: number; highestMaxC?: number; thresholdC: number; thresholdF: number };
  message: string;
}

const SEVERITY_ORDER: StressSeverity[] = ['possible', 'watch', 'light', 'moderate', 'warning', 'severe'];

/**
 * Which frost categories matter per hardiness class (our reading of Purdue HO-203 / Illinois
 * VC-14 classes, M): very hardy crops shrug off light and moderate freezes, frost-tolerant ones
 * take light freezes, tender and warm-loving crops are hurt by any frost.
 */
export const FROST_SEVERITIES_BY_CLASS: Record<HardinessClass, readonly FrostSeverity[]> = {
  'very-hardy': ['severe'],
  'frost-tolerant': ['moderate', 'severe'],
  tender: ['possible', 'light', 'moderate', 'severe'],
  'warm-loving': ['possible', 'light', 'moderate', 'severe'],
};

const f1 = (c: number) => String(Number(c.toFixed(1)));

/**
 * A low exactly on a published °F edge belongs to the colder category (≤ 24 °F is severe), but
 * the same low can reach us by another float path than fToC, e.g. (24 + 40) × 5/9 − 40 =
 * −4.444444444444443 against fToC's −4.444444444444445, and would slip a category on a last-bit
 * difference. 1e-6 °C is far below any thermometer and far above such rounding.
 */
const EDGE_C = 1e-6;
const atOrBelow = (tminC: number, f: number) => tminC <= fToC(f) + EDGE_C;

function frostSeverity(tminC: number, t: StressThresholdsF): FrostSeverity | null {
  if (atOrBelow(tminC, t.severeFreeze)) return 'severe';
  if (atOrBelow(tminC, t.moderateFreeze)) return 'moderate';
  if (atOrBelow(tminC, t.lightFreeze)) return 'light';
  if (atOrBelow(tminC, t.frostPossible)) return 'possible';
  return null;
}

interface DayHit {
  date: string;
  severity: StressSeverity;
  forecast: boolean;
  tmax: number;
  tmin: number;
  thresholdF: number;
}

/** Runs of consecutive hit days become one event; its severity is the worst day's. */
function group(kind: StressKind, hits: (DayHit | null)[], minDays: number, describe: (e: StressEvent) => string): StressEvent[] {
  const events: StressEvent[] = [];
  let run: DayHit[] = [];
  const flush = () => {
    if (run.length >= minDays) {
      const worst = run.reduce((a, h) => (SEVERITY_ORDER.indexOf(h.severity) > SEVERITY_ORDER.indexOf(a) ? h.severity : a), run[0].severity);
      const thresholdF = run.find((h) => h.severity === worst)!.thresholdF;
      const e: StressEvent = {
        kind,
        severity: worst,
        start: run[0].date,
        end: run[run.length - 1].date,
        days: run.length,
        forecast: run.some((h) => h.forecast),
        figures: {
          lowestMinC: Math.min(...run.map((h) => h.tmin)),
          highestMaxC: Math.max(...run.map((h) => h.tmax)),
          thresholdC: fToC(thresholdF),
          thresholdF,
        },
        message: '',
      };
      e.message = describe(e);
      events.push(e);
    }
    run = [];
  };
  for (const h of hits) {
    if (h) run.push(h);
    else flush();
  }
  flush();
  return events;
}

/**
 * Stress events in a run of days (usually the forecast, observed days allowed). Missing days
 * split events. Frost counts per class as FROST_SEVERITIES_BY_CLASS says; chilling only for
 * chilling-sensitive crops; blossom drop and pollination heat only where the profile has them.
 */
export function stressEvents(
  days: readonly DailyTemp[],
  profile: StressProfile,
  thresholds: StressThresholdsF = STRESS_THRESHOLDS_F,
  unit: TempUnit = 'C',
): StressEvent[] {
  const deg = (c: number) => formatTemp(c, unit);
  // A published °F limit is shown as published; in a °C garden its °C value comes first.
  const published = (f: number) => (unit === 'F' ? `${f} °F` : `${f1(fToC(f))} °C (${f} °F)`);
  const nDays = (n: number) => `${n} ${n === 1 ? 'day' : 'days'}`;
  const s = toDenseSeries(days);
  const dayAt = (i: number) => ({
    date: addDays('1970-01-01', s.first + i),
    forecast: s.source[i] === 'forecast',
    tmax: s.tmax[i],
    tmin: s.tmin[i],
  });
  const idx = Array.from({ length: s.length }, (_, i) => i);
  const events: StressEvent[] = [];

  const matters = FROST_SEVERITIES_BY_CLASS[profile.hardiness];
  const frostF: Record<FrostSeverity, number> = {
    possible: thresholds.frostPossible,
    light: thresholds.lightFreeze,
    moderate: thresholds.moderateFreeze,
    severe: thresholds.severeFreeze,
  };
  const frostHits = idx.map((i) => {
    if (!s.present[i]) return null;
    const sev = frostSeverity(s.tmin[i], thresholds);
    return sev && matters.includes(sev) ? { ...dayAt(i), severity: sev, thresholdF: frostF[sev] } : null;
  });
  events.push(...group('frost', frostHits, 1, (e) =>
    e.severity === 'possible'
      ? `low of ${deg(e.figures.lowestMinC!)} is at or below ${published(e.figures.thresholdF)}: frost can form on plants`
      : `${e.severity} freeze: low of ${deg(e.figures.lowestMinC!)} is at or below ${published(e.figures.thresholdF)}`));

  if (profile.chillingSensitive) {
    const limit = fToC(thresholds.chilling);
    const hits = idx.map((i) => (s.present[i] && s.tmin[i] < limit ? { ...dayAt(i), severity: 'watch' as const, thresholdF: thresholds.chilling } : null));
    events.push(...group('chilling', hits, profile.chillingMinDays ?? 3, (e) => `lows down to ${deg(e.figures.lowestMinC!)}, below ${published(e.figures.thresholdF)}, ${nDays(e.days)} in a row: chilling injury of warm-season crops`));
  }

  const b = profile.blossomDrop;
  if (b) {
    const hits = idx.map((i) => {
      if (!s.present[i]) return null;
      const d = dayAt(i);
      if (d.tmax > fToC(b.highWarningF)) return { ...d, severity: 'warning' as const, thresholdF: b.highWarningF };
      if (d.tmax > fToC(b.highWatchF)) return { ...d, severity: 'watch' as const, thresholdF: b.highWatchF };
      if (d.tmin > fToC(b.nightAboveF)) return { ...d, severity: 'watch' as const, thresholdF: b.nightAboveF };
      if (d.tmin < fToC(b.nightBelowF)) return { ...d, severity: 'watch' as const, thresholdF: b.nightBelowF };
      return null;
    });
    const limits = `highs above ${published(b.highWatchF)}, nights above ${published(b.nightAboveF)} or below ${published(b.nightBelowF)}`;
    events.push(...group('blossom-drop', hits, b.minDays, (e) =>
      `${e.days} days in a row with ${limits}; highs up to ${deg(e.figures.highestMaxC!)}, lows down to ${deg(e.figures.lowestMinC!)}: blossoms may drop`));
  }

  const p = profile.pollinationHeat;
  if (p) {
    const limit = fToC(p.highAboveF);
    let streak = 0;
    const hits = idx.map((i) => {
      streak = s.present[i] && s.tmax[i] > limit ? streak + 1 : 0;
      return streak ? { ...dayAt(i), severity: (streak >= p.warningFromDay ? 'warning' : 'watch') as StressSeverity, thresholdF: p.highAboveF } : null;
    });
    events.push(...group('pollination-heat', hits, 1, (e) =>
      `${nDays(e.days)} with highs above ${published(e.figures.thresholdF)}, up to ${deg(e.figures.highestMaxC!)}: pollen is lost${e.days >= p.warningFromDay ? `, from day ${p.warningFromDay} about 1 % of kernels a day` : ''}`));
  }
  return events.sort((x, y) => (x.start < y.start ? -1 : x.start > y.start ? 1 : 0));
}
