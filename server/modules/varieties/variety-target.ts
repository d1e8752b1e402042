/**
 * The degree-day target of a variety: the grower's override while the crop still counts with
 * the method it was set in, else the thermal engine's conversion of the packet's days to
 * maturity over this garden's own past weather.
 */
import { basisOfValues, basisWords, sameBasis } from '#shared/crops/basis';
import { formatDegreeDays } from '#shared/thermal/units';
import type { CropParamValues } from '#shared/crops/params';
import { dayOfYear, degreeDayTargetFromDtm, isSouthern } from '#shared/thermal/index';
import { packetEmergenceDays, startEvent } from '#shared/thermal/start-event';
import { monthDayToken } from '#shared/format/dates';
import { countOf } from '#shared/format/count-words';
import type { DailyTemp } from '#shared/thermal/index';
import type { GddTargetDto } from '#shared/schemas/varieties';
import { Planting } from '../../db/models';
import type { Garden, Variety } from '../../db/models';
import { cropMethod } from '../crops/crop-thermal';
import { targetBasis } from './varieties.presenter';

/**
 * Typical start windows when the garden has no plantings of the variety yet (common practice,
 * no source): cool-season crops in spring, warm-season crops after the last frost, mirrored
 * six months for the southern hemisphere.
 */
const DEFAULT_WINDOWS = {
  cool: { N: { from: '03-15', to: '05-15' }, S: { from: '09-15', to: '11-15' } },
  warm: { N: { from: '05-15', to: '06-30' }, S: { from: '11-15', to: '12-31' } },
} as const;

/**
 * The span of month-days this variety's plantings have started on in this garden, each from its
 * start event (the one rule, start-event.ts). The span is the shortest one around the calendar,
 * so starts in November and January make a window across New Year (southern summers), not one
 * across the whole year.
 */
type StartRow = Pick<Planting, 'varietyId' | 'method' | 'status' | 'sownOn' | 'emergedOn' | 'transplantedOn'>;
const START_COLUMNS = ['varietyId', 'method', 'status', 'sownOn', 'emergedOn', 'transplantedOn'] as const;

async function startRowsOf(varietyIds: number[]): Promise<StartRow[]> {
  if (!varietyIds.length) return [];
  return Planting.findAll({ where: { varietyId: varietyIds }, attributes: [...START_COLUMNS], raw: true });
}

async function ownWindow(variety: Variety, preloaded?: StartRow[]): Promise<{ from: string; to: string } | null> {
  const rows = preloaded ?? (await startRowsOf([variety.id]));
  const starts = rows
    .map((p) => startEvent(p, variety).event?.on)
    .filter((d): d is string => !!d)
    .map((d) => d.slice(5));
  return shortestCircularSpan(starts);
}

/** The shortest span of month-days ('MM-DD') holding them all, possibly wrapping past 31 Dec. */
export function shortestCircularSpan(monthDays: string[]): { from: string; to: string } | null {
  const sorted = [...new Set(monthDays)].sort();
  if (!sorted.length) return null;
  const ordinal = (md: string) => dayOfYear(`2001-${md === '02-29' ? '02-28' : md}`);
  let widest = -1;
  let after = 0;
  for (let i = 0; i < sorted.length; i++) {
    const next = (i + 1) % sorted.length;
    const gap = (ordinal(sorted[next]) - ordinal(sorted[i]) + 365) % 365;
    if (gap > widest) {
      widest = gap;
      after = next;
    }
  }
  return { from: sorted[after], to: sorted[(after + sorted.length - 1) % sorted.length] };
}

const none = (explanation: string): GddTargetDto => ({ valueC: null, basis: 'none', countsFrom: null, explanation, p10C: null, p90C: null, stale: false });

type Override = { use: GddTargetDto } | { setAside: string };

/**
 * The grower's target when its method still holds, or the reason it is set aside: a figure
 * counted at another base or method is a different amount of heat, so it is never reused.
 */
function override(variety: Variety, crop: CropParamValues, units: 'C' | 'F'): Override | null {
  const measured = targetBasis(variety);
  if (variety.gddTargetOverrideC === null || !measured) return null;
  const current = basisOfValues(crop);
  if (!sameBasis(measured, current)) {
    const was = `${formatDegreeDays(variety.gddTargetOverrideC, units)} was set at ${basisWords(measured, units)}`;
    return { setAside: `Your target of ${was}; this crop now counts from ${basisWords(current, units)}, so the packet-derived target is used until you set it again.` };
  }
  const countsFrom = variety.dtmFrom === 'transplant' ? 'transplant' : 'sowing';
  const at = basisWords(measured, units);
  return {
    use: { valueC: variety.gddTargetOverrideC, basis: 'override', countsFrom, explanation: `Set by a grower for this variety, at ${at}.`, p10C: null, p90C: null, basisNote: `Set at ${at}.`, stale: false },
  };
}

/**
 * `forPlanting`: a planting's own start event and its days from it (startEvent()), so a planting
 * whose start differs from the packet's count (an indoor start with a sowing count, say) gets
 * a target counted from its own start.
 */
export async function varietyTarget(
  garden: Garden,
  variety: Variety,
  crop: CropParamValues,
  loadHistory: (garden: Garden) => Promise<DailyTemp[]>,
  forPlanting?: { days: number; from: 'sowing' | 'transplant' },
  startRows?: StartRow[],
): Promise<GddTargetDto> {
  const own = override(variety, crop, garden.units);
  if (own && 'use' in own) return own.use;
  const derived = await packetTarget(garden, variety, crop, loadHistory, forPlanting, startRows);
  if (!own) return derived;
  return { ...derived, explanation: `${own.setAside} ${derived.explanation}`, basisNote: own.setAside, stale: true };
}

/**
 * The targets of a page of varieties in one pass: the garden's history is read once and the
 * plantings of all of them in one query, so a list costs the same few queries however long it is.
 */
export async function varietyTargets(
  garden: Garden,
  varieties: Variety[],
  cropOf: (variety: Variety) => CropParamValues,
  loadHistory: (garden: Garden) => Promise<DailyTemp[]>,
): Promise<Map<number, GddTargetDto>> {
  const needsHistory = varieties.some((v) => v.dtmDays !== null);
  const [history, rows] = await Promise.all([needsHistory ? loadHistory(garden) : Promise.resolve([]), startRowsOf(varieties.map((v) => v.id))]);
  const byVariety = new Map<number, StartRow[]>(varieties.map((v) => [v.id, []]));
  for (const row of rows) byVariety.get(row.varietyId)?.push(row);
  const once = () => Promise.resolve(history);
  const targets = await Promise.all(varieties.map((v) => varietyTarget(garden, v, cropOf(v), once, undefined, byVariety.get(v.id))));
  return new Map(varieties.map((v, i) => [v.id, targets[i]]));
}

async function packetTarget(
  garden: Garden,
  variety: Variety,
  crop: CropParamValues,
  loadHistory: (garden: Garden) => Promise<DailyTemp[]>,
  forPlanting?: { days: number; from: 'sowing' | 'transplant' },
  startRows?: StartRow[],
): Promise<GddTargetDto> {
  if (variety.dtmDays === null) return none('Add the packet’s days to maturity to derive a degree-day target.');
  const history = await loadHistory(garden);
  if (!history.length) return none('No past weather for this garden yet: the target is derived once its history has been fetched.');
  const hemisphere = isSouthern(garden.latitude ?? 0) ? 'S' : 'N';
  const own = await ownWindow(variety, startRows);
  const window = own ?? DEFAULT_WINDOWS[crop.season][hemisphere];
  const emergence = packetEmergenceDays(variety) ?? undefined;
  try {
    const t = degreeDayTargetFromDtm({
      ...(forPlanting
        ? { daysToMaturity: forPlanting.days, countsFrom: forPlanting.from }
        : { daysToMaturity: variety.dtmDays, countsFrom: variety.dtmFrom, daysToEmergence: emergence }),
      history,
      method: cropMethod(crop),
      window,
    });
    const from = own ? 'this variety’s own start dates' : `the usual ${crop.season}-season start window`;
    return {
      valueC: t.target,
      basis: 'derived',
      countsFrom: t.countsFrom,
      explanation: `${t.days} days from ${t.countsFrom === 'transplant' ? 'transplanting' : 'sowing'}, measured in this garden’s past weather over ${from} (start days ${monthDayToken(window.from)} to ${monthDayToken(window.to)}; ${countOf(t.samples, 'sample')}).`,
      p10C: t.p10,
      p90C: t.p90,
      stale: false,
    };
  } catch (err) {
    if (err instanceof RangeError) return none(`The target could not be derived: ${err.message}.`);
    throw err;
  }
}
