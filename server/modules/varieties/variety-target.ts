/**
 * The degree-day target of a variety: the grower's override, else the thermal engine's
 * conversion of the packet's days to maturity over this garden's own past weather.
 */
import { dayOfYear, degreeDayTargetFromDtm, isSouthern } from '#shared/thermal/index';
import type { DailyTemp, DegreeDayMethod } from '#shared/thermal/index';
import type { GddTargetDto } from '#shared/schemas/varieties';
import { Planting } from '../../db/models';
import type { Garden, Variety } from '../../db/models';
import type { effectiveValues } from '../crops/crops.service';

type Effective = ReturnType<typeof effectiveValues>;

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
 * The span of month-days this variety's packet count has started on in this garden: transplant
 * dates when its days to maturity count from transplanting, sowing dates otherwise. The span is
 * the shortest one around the calendar, so starts in November and January make a window across
 * New Year (southern summers), not one across the whole year.
 */
async function ownWindow(variety: Variety): Promise<{ from: string; to: string } | null> {
  const rows = await Planting.findAll({ where: { varietyId: variety.id }, attributes: ['sownOn', 'transplantedOn'], raw: true });
  const starts = rows
    .map((p) => (variety.dtmFrom === 'transplant' ? p.transplantedOn : (p.sownOn ?? p.transplantedOn)))
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

const none = (explanation: string): GddTargetDto => ({ valueC: null, basis: 'none', countsFrom: null, explanation, p10C: null, p90C: null });

export async function varietyTarget(
  garden: Garden,
  variety: Variety,
  crop: Effective,
  loadHistory: (garden: Garden) => Promise<DailyTemp[]>,
): Promise<GddTargetDto> {
  const countsFrom = variety.dtmFrom === 'transplant' ? 'transplant' : 'sowing';
  if (variety.gddTargetOverrideC !== null) {
    return { valueC: variety.gddTargetOverrideC, basis: 'override', countsFrom, explanation: 'Set by a grower for this variety.', p10C: null, p90C: null };
  }
  if (variety.dtmDays === null) return none('Add the packet’s days to maturity to derive a degree-day target.');
  const history = await loadHistory(garden);
  if (!history.length) return none('No past weather for this garden yet: the target is derived once its history has been fetched.');
  const hemisphere = isSouthern(garden.latitude ?? 0) ? 'S' : 'N';
  const own = await ownWindow(variety);
  const window = own ?? DEFAULT_WINDOWS[crop.season][hemisphere];
  const method: DegreeDayMethod = { base: crop.baseC!, method: crop.method, cutoff: crop.cutoff, ...(crop.upperC !== null ? { upper: crop.upperC } : {}) };
  const emergence = variety.emergenceDaysMax ?? variety.emergenceDaysMin ?? undefined;
  try {
    const t = degreeDayTargetFromDtm({
      daysToMaturity: variety.dtmDays,
      countsFrom: variety.dtmFrom,
      daysToEmergence: emergence,
      history,
      method,
      window,
    });
    const from = own ? 'this variety’s own start dates' : `the usual ${crop.season}-season start window`;
    return {
      valueC: t.target,
      basis: 'derived',
      countsFrom: t.countsFrom,
      explanation: `${t.days} days from ${t.countsFrom === 'transplant' ? 'transplanting' : 'sowing'}, measured in this garden’s past weather over ${from} (${window.from} to ${window.to}, ${t.samples} samples).`,
      p10C: t.p10,
      p90C: t.p90,
    };
  } catch (err) {
    if (err instanceof RangeError) return none(`The target could not be derived: ${err.message}.`);
    throw err;
  }
}
