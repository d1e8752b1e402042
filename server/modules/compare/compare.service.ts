/**
 * How one crop's varieties fared in this garden: per planting, from its progress answer (the same
 * series and recorded events the planting's page shows, progress.service.ts; one rule, one place),
 * the days and degree days from the start event to first harvest and to bolting, the heat days it
 * endured before bolting (highs above the crop's effective bolt heat threshold, crop-thermal.ts)
 * and the longest run of them, and the day length when it bolted; per variety the medians, the
 * share that bolted before harvest and a heat-tolerance rank from the heat days endured.
 */
import { Op, QueryTypes } from 'sequelize';
import { countOf } from '#shared/format/count-words';
import { dayLengthHours } from '#shared/thermal/day-length';
import { addDays, daysBetween } from '#shared/thermal/dates';
import { median } from '#shared/thermal/quantiles';
import { seasonOfYear } from '#shared/thermal/season';
import { tempIn } from '#shared/thermal/units';
import type { ProgressDto } from '#shared/schemas/progress';
import type { CompareDto, CompareMediansDto, ComparePlantingDto, CompareVarietyDto, HeatUntil } from '#shared/schemas/compare';
import { Garden, Planting, Variety } from '../../db/models';
import { AppError } from '../../errors';
import { effectiveValues, getCrop } from '../crops/crops.service';
import { cropBoltTriggers } from '../crops/crop-thermal';
import type { ProgressService } from '../progress/progress.service';
import { PROGRESS_FORMAT } from '../progress/progress.repository';
import { localDate } from '../../lib/local-date';

/** Fewer plantings than this make a shaky rank (common practice, no source). */
export const FEW_PLANTINGS = 3;
/**
 * Plantings of the crop counted at most: the most recent seasons whose plantings fit, whole
 * seasons only, so a season is counted entirely or not at all and `seasons` of the answer names
 * exactly those counted (a garden that outgrows it sees its oldest seasons left out, not a season
 * cut short). About 60 ms of stored answers read and parsed per 1,000 plantings.
 */
export const MAX_PLANTINGS = 2000;

/** Stored progress answers read per query (an IN list of ids). */
const BODY_SLICE = 1000;

type Figures = ReturnType<typeof plantingFigures>;

/**
 * Plantings' figures by what they are made from: the SHA-1 of the stored progress answer (taken
 * by the database, so unchanged answers are neither sent nor parsed again), the threshold and the
 * latitude. Parsing the answers (≈6 KB each) was most of a comparison's time; a recomputed answer
 * has another digest. Least recently used first past FIGURES_MAX (≈0.5 KB each).
 */
const FIGURES = new Map<string, Figures>();
const FIGURES_MAX = 10_000;

function remembered(key: string): Figures | undefined {
  const found = FIGURES.get(key);
  if (found) {
    FIGURES.delete(key);
    FIGURES.set(key, found);
  }
  return found;
}

function remember(key: string, figures: Figures) {
  FIGURES.set(key, figures);
  for (const k of FIGURES.keys()) {
    if (FIGURES.size <= FIGURES_MAX) break;
    FIGURES.delete(k);
  }
}

const r1 = (x: number) => Math.round(x * 10) / 10;

/** The figures of one planting from its progress answer; `thresholdShown` is in the answer's unit. */
export function plantingFigures(dto: ProgressDto, thresholdShown: number | null, latitude: number | null): Omit<ComparePlantingDto, 'plantingId' | 'varietyId' | 'season' | 'seasonLabel'> {
  const start = dto.startEvent && !dto.startEvent.kind.startsWith('planned') ? dto.startEvent.on : null;
  const { firstHarvestOn, boltedOn } = dto.recorded;
  const complete = (day: string) => !dto.missingDates.some((m) => m <= day);
  const cumulativeOn = (day: string | null) => {
    if (!start || !day || day < start || !complete(day)) return null;
    return dto.series.find((d) => d.date === day)?.cumulative ?? null;
  };
  const daysTo = (day: string | null) => (start && day && day >= start ? daysBetween(start, day) : null);
  const boltedBeforeHarvest = boltedOn ? !firstHarvestOn || boltedOn < firstHarvestOn : firstHarvestOn ? false : null;
  // A planting picked before it bolted stood the heat up to its harvest (a lower bound); its
  // progress may end there, so a later bolting is not counted past it.
  const heatUntil: HeatUntil = boltedBeforeHarvest ? 'bolt' : firstHarvestOn ? 'harvest' : null;
  const end = heatUntil === 'bolt' ? boltedOn : heatUntil === 'harvest' ? firstHarvestOn : null;
  // Every day before the end must be in the series, or the count would be short.
  const covered = (day: string) => (dto.series.at(-1)?.date ?? '') >= addDays(day, -1);
  let heatDays: number | null = null;
  let longestHotStreak: number | null = null;
  if (start && end && end >= start && thresholdShown !== null && complete(end) && covered(end)) {
    heatDays = 0;
    longestHotStreak = 0;
    let run = 0;
    for (const d of dto.series) {
      if (d.date >= end) break;
      if (d.tmax > thresholdShown) {
        heatDays++;
        run++;
        longestHotStreak = Math.max(longestHotStreak, run);
      } else run = 0;
    }
  }
  return {
    startOn: start,
    firstHarvestOn,
    boltedOn,
    daysToHarvest: daysTo(firstHarvestOn),
    ddToHarvest: cumulativeOn(firstHarvestOn),
    daysToBolt: daysTo(boltedOn),
    ddToBolt: cumulativeOn(boltedOn),
    heatDays,
    longestHotStreak,
    heatUntil: start && end && end >= start ? heatUntil : null,
    dayLengthAtBolt: boltedOn && latitude !== null ? r1(dayLengthHours(latitude, boltedOn)) : null,
    boltedBeforeHarvest,
  };
}

function medianOf(rows: readonly ComparePlantingDto[], pick: (p: ComparePlantingDto) => number | null): number | null {
  const values = rows.map(pick).filter((v): v is number => v !== null);
  return values.length ? r1(median(values)) : null;
}

function mediansOf(rows: readonly ComparePlantingDto[]): CompareMediansDto {
  return {
    daysToHarvest: medianOf(rows, (p) => p.daysToHarvest),
    ddToHarvest: medianOf(rows, (p) => p.ddToHarvest),
    daysToBolt: medianOf(rows, (p) => p.daysToBolt),
    ddToBolt: medianOf(rows, (p) => p.ddToBolt),
    heatDays: medianOf(rows, (p) => p.heatDays),
    longestHotStreak: medianOf(rows, (p) => p.longestHotStreak),
    dayLengthAtBolt: medianOf(rows, (p) => p.dayLengthAtBolt),
  };
}

const heatWords = (n: number) => `${n === 1 ? '1 heat day' : `${n} heat days`}`;

/** The evidence in words: what the heat days endured were counted up to, across how many plantings. */
function evidenceOf(counted: readonly ComparePlantingDto[], score: number | null, threshold: string | null): string {
  if (threshold === null) return 'This crop has no bolt heat threshold, so heat tolerance is not ranked.';
  if (score === null || !counted.length) return 'No bolting or harvest with complete weather is on record yet, so it is not ranked.';
  const bolted = counted.filter((p) => p.heatUntil === 'bolt').length;
  const across = `across ${countOf(counted.length, 'planting')}`;
  const highs = `(highs above ${threshold})`;
  if (bolted === counted.length) return `Bolted after a median of ${heatWords(score)} ${highs} ${across}.`;
  if (bolted === 0) return `Never bolted before harvest: reached it after a median of ${heatWords(score)} ${highs} ${across}, so it stood at least that much heat.`;
  return `Endured a median of ${heatWords(score)} ${highs} ${across}; ${bolted} of them bolted, the others reached harvest first.`;
}

interface PickedPlanting {
  id: number;
  varietyId: number;
  seasonYear: number | null;
}

/**
 * The plantings counted under MAX_PLANTINGS: whole seasons, newest first, while they fit (the
 * newest always, cut to the cap in the unlikely case it alone holds more); plantings without a
 * season (no start event) only when every season fits. `left`: the seasons left out.
 */
export function withinCap<P extends PickedPlanting>(wanted: P[], cap = MAX_PLANTINGS): { picked: P[]; left: Set<number | null> } {
  if (wanted.length <= cap) return { picked: wanted, left: new Set() };
  const bySeason = new Map<number | null, P[]>();
  for (const p of wanted) {
    const list = bySeason.get(p.seasonYear);
    if (list) list.push(p);
    else bySeason.set(p.seasonYear, [p]);
  }
  const newestFirst = [...bySeason.keys()].sort((a, b) => (a === null ? 1 : b === null ? -1 : b - a));
  const kept = new Set<number | null>();
  let count = 0;
  for (const year of newestFirst) {
    const n = bySeason.get(year)!.length;
    if (kept.size && count + n > cap) break;
    kept.add(year);
    count += n;
  }
  const picked = wanted.filter((p) => kept.has(p.seasonYear)).slice(0, cap);
  return { picked, left: new Set(newestFirst.filter((y) => !kept.has(y))) };
}

/**
 * The figures of these plantings from their stored progress answers for the garden's today: one
 * query for the digests; the answers missing are computed and stored in one pass; then one query
 * for the answers not seen before (with their digests, so a row rewritten in between is keyed by
 * what was read).
 */
async function figuresOf(progress: ProgressService, garden: Garden, ids: number[], thresholdShown: number | null, latitude: number | null): Promise<Map<number, Figures>> {
  const db = Planting.sequelize!;
  const today = localDate(garden.timeZone, progress.now());
  const keyOf = (digest: string) => `${digest}|${thresholdShown}|${latitude}`;
  const read = async <T extends object>(columns: string, some: number[]) => {
    const rows: T[] = [];
    for (let i = 0; i < some.length; i += BODY_SLICE) {
      rows.push(
        ...(await db.query<T>(
          `SELECT planting_id AS plantingId, ${columns} FROM planting_progress
            WHERE garden_id = ? AND computed_for = ? AND format = ? AND planting_id IN (?)`,
          { replacements: [garden.id, today, PROGRESS_FORMAT, some.slice(i, i + BODY_SLICE)], type: QueryTypes.SELECT },
        )),
      );
    }
    return rows;
  };
  const out = new Map<number, Figures>();
  const stored = new Set<number>();
  for (const r of await read<{ plantingId: number; digest: string }>('SHA1(body_json) AS digest', ids)) {
    stored.add(r.plantingId);
    const known = remembered(keyOf(r.digest));
    if (known) out.set(r.plantingId, known);
  }
  const missing = ids.filter((id) => !stored.has(id));
  if (missing.length) await progress.summaries(garden.id, missing);
  const unseen = ids.filter((id) => !out.has(id));
  if (unseen.length) {
    for (const r of await read<{ plantingId: number; digest: string; body: string }>('SHA1(body_json) AS digest, body_json AS body', unseen)) {
      const figures = plantingFigures(JSON.parse(r.body) as ProgressDto, thresholdShown, latitude);
      remember(keyOf(r.digest), figures);
      out.set(r.plantingId, figures);
    }
  }
  // An answer dropped by a change that landed meanwhile is computed on its own.
  for (const id of ids) {
    if (!out.has(id)) out.set(id, plantingFigures(JSON.parse(await progress.plantingProgress(garden.id, id)) as ProgressDto, thresholdShown, latitude));
  }
  return out;
}

export interface CompareInput {
  crop: string;
  seasons?: number[];
}

export async function computeCompare(progress: ProgressService, gardenId: number, input: CompareInput): Promise<CompareDto> {
  const garden = await Garden.findByPk(gardenId);
  if (!garden) throw AppError.notFound('That garden');
  const unit = garden.units;
  const crop = await getCrop(gardenId, input.crop);
  const effective = effectiveValues(crop);
  const bolt = cropBoltTriggers(input.crop, effective, crop.overrides, unit);
  const thresholdC = bolt?.triggers.heatThresholdC ?? null;
  const thresholdShown = thresholdC === null ? null : Math.round(tempIn(thresholdC, unit) * 10) / 10;
  const thresholdWords = thresholdShown === null ? null : `${thresholdShown} °${unit}`;
  const latitude = garden.latitude;
  const label = (year: number) => seasonOfYear(year, latitude ?? 0).label;

  const varieties = await Variety.findAll({ where: { gardenId, cropKey: input.crop }, attributes: ['id', 'name'], order: [['name', 'ASC']] });
  const varietyIds = varieties.map((v) => v.id);
  // Three small columns of every started planting of the crop (a planned one has nothing to
  // compare yet): cheap however many seasons the garden keeps.
  const all = varietyIds.length
    ? await Planting.findAll({ where: { gardenId, varietyId: { [Op.in]: varietyIds }, status: { [Op.ne]: 'planned' } }, attributes: ['id', 'varietyId', 'seasonYear'], order: [['id', 'ASC']], raw: true })
    : [];
  const availableYears = [...new Set(all.map((p) => p.seasonYear).filter((y): y is number => y !== null))].sort((a, b) => a - b);
  const chosen = input.seasons ? new Set(input.seasons) : null;
  const wanted = chosen ? all.filter((p) => p.seasonYear !== null && chosen.has(p.seasonYear)) : all;
  const { picked, left } = withinCap(wanted);
  const figures = picked.length ? await figuresOf(progress, garden, picked.map((p) => p.id), thresholdShown, latitude) : new Map<number, Figures>();
  const plantings: ComparePlantingDto[] = [];
  for (const p of picked) {
    plantings.push({
      plantingId: p.id,
      varietyId: p.varietyId,
      season: p.seasonYear,
      seasonLabel: p.seasonYear === null ? null : label(p.seasonYear),
      ...figures.get(p.id)!,
    });
  }

  const rows = varieties
    .map((v) => {
      const own = plantings.filter((p) => p.varietyId === v.id);
      const withOutcome = own.filter((p) => p.boltedBeforeHarvest !== null);
      const counted = own.filter((p) => p.heatDays !== null);
      // Heat days endured; for a planting that never bolted, those to its harvest stand as a lower bound.
      const score = counted.length ? r1(median(counted.map((p) => p.heatDays!))) : null;
      const boltedShare = withOutcome.length ? withOutcome.filter((p) => p.boltedBeforeHarvest).length / withOutcome.length : null;
      return { v, own, withOutcome, counted, score, boltedShare };
    })
    .filter((r) => r.own.length > 0);
  const ranked = rows
    .filter((r) => r.score !== null)
    .sort((a, b) => b.score! - a.score! || (a.boltedShare ?? 0) - (b.boltedShare ?? 0) || b.counted.length - a.counted.length || a.v.name.localeCompare(b.v.name));
  const rankOf = new Map(ranked.map((r, k) => [r.v.id, k + 1]));
  const out: CompareVarietyDto[] = [...ranked, ...rows.filter((r) => r.score === null)].map((r) => ({
    varietyId: r.v.id,
    name: r.v.name,
    plantings: r.own.length,
    withOutcome: r.withOutcome.length,
    boltedBeforeHarvestShare: r.boltedShare === null ? null : Math.round(r.boltedShare * 100) / 100,
    medians: mediansOf(r.own),
    rank: rankOf.get(r.v.id) ?? null,
    evidence: evidenceOf(r.counted, r.score, thresholdWords),
    caution:
      r.score !== null && r.counted.length < FEW_PLANTINGS
        ? `Only ${countOf(r.counted.length, 'planting')} ${r.counted.length === 1 ? 'backs' : 'back'} this rank: treat it as a first hint and keep recording.`
        : null,
  }));

  const seasonYears = (chosen ? [...chosen].sort((a, b) => a - b) : availableYears).filter((y) => !left.has(y));
  return {
    crop: { key: crop.crop.key, name: crop.crop.name },
    unit,
    heatThreshold: thresholdShown,
    seasons: seasonYears.map((year) => ({ year, label: label(year) })),
    availableSeasons: availableYears.map((year) => ({ year, label: label(year) })),
    varieties: out,
    plantings,
    method:
      thresholdWords === null
        ? 'Figures come from each planting’s recorded sowing or transplanting, harvest and bolting, and the garden’s weather. This crop has no bolt heat threshold, so heat days are not counted.'
        : `Figures come from each planting’s recorded sowing or transplanting, harvest and bolting, and the garden’s weather. A heat day is a day with a high above ${thresholdWords}, counted up to bolting, or up to the first harvest for a planting that did not bolt. Varieties rank by the median heat days their plantings endured; one that never bolted counts its heat days to harvest, so it stood at least that much.`,
  };
}
