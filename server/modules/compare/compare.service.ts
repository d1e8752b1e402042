/**
 * How one crop's varieties fared in this garden: per planting, from its progress answer (the same
 * series and recorded events the planting's page shows, progress.service.ts; one rule, one place),
 * the days and degree days from the start event to first harvest and to bolting, the heat days it
 * endured before bolting (highs above the crop's effective bolt heat threshold, crop-thermal.ts)
 * and the longest run of them, and the day length when it bolted; per variety the medians, the
 * share that bolted before harvest and a heat-tolerance rank from the heat days endured.
 */
import { Op } from 'sequelize';
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

/** Fewer plantings than this make a shaky rank (common practice, no source). */
export const FEW_PLANTINGS = 3;
const MAX_PLANTINGS = 500;

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
  const all = varietyIds.length
    ? await Planting.findAll({ where: { gardenId, varietyId: { [Op.in]: varietyIds } }, attributes: ['id', 'varietyId', 'seasonYear'], order: [['id', 'ASC']], limit: MAX_PLANTINGS })
    : [];
  const availableYears = [...new Set(all.map((p) => p.seasonYear).filter((y): y is number => y !== null))].sort((a, b) => a - b);
  const chosen = input.seasons ? new Set(input.seasons) : null;
  const picked = chosen ? all.filter((p) => p.seasonYear !== null && chosen.has(p.seasonYear)) : all;

  // Computes the plantings without a stored answer for today in one pass, so each read below is a stored one.
  if (picked.length) await progress.summaries(gardenId, picked.map((p) => p.id));
  const plantings: ComparePlantingDto[] = [];
  for (const p of picked) {
    const dto = JSON.parse(await progress.plantingProgress(gardenId, p.id)) as ProgressDto;
    plantings.push({
      plantingId: p.id,
      varietyId: p.varietyId,
      season: p.seasonYear,
      seasonLabel: p.seasonYear === null ? null : label(p.seasonYear),
      ...plantingFigures(dto, thresholdShown, latitude),
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

  const seasonYears = chosen ? [...chosen].sort((a, b) => a - b) : availableYears;
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
