/**
 * What this garden's own harvests say a variety needs: for each planting of it with a first
 * harvest on record, the degree days from its start event to that harvest, read from the same
 * progress computation the planting's page shows (one rule, one place). Their median and spread
 * sit beside the packet-derived target; adopting the median stores it as the grower's target,
 * with the crop's current base and method (varieties.service.ts records the basis).
 */
import { Op } from 'sequelize';
import { fDaysToCDays } from '#shared/thermal/units';
import { median, nearestRank } from '#shared/thermal/quantiles';
import { countOf } from '#shared/format/count-words';
import type { ProgressDto } from '#shared/schemas/progress';
import type { CalibrationDto } from '#shared/schemas/varieties';
import { Planting } from '../../db/models';
import type { Variety } from '../../db/models';
import type { ProgressService } from '../progress/progress.service';

/** Fewer harvests than this make a shaky median (common practice, no source). */
export const FEW_HARVESTS = 3;
const MAX_PLANTINGS = 200;

export async function calibrationOf(progress: ProgressService, gardenId: number, variety: Variety): Promise<CalibrationDto> {
  const plantings = await Planting.findAll({
    where: { gardenId, varietyId: variety.id, firstHarvestOn: { [Op.ne]: null } },
    attributes: ['id', 'firstHarvestOn'],
    order: [['firstHarvestOn', 'DESC']],
    limit: MAX_PLANTINGS,
  });
  const { garden } = await progress.gardenToday(gardenId);
  const unit = garden.units;
  const harvests: CalibrationDto['harvests'] = [];
  let unmeasured = 0;
  for (const p of plantings) {
    const dto = JSON.parse(await progress.plantingProgress(gardenId, p.id)) as ProgressDto;
    const day = dto.series.find((d) => d.date === p.firstHarvestOn);
    if (!dto.startEvent || !day || dto.missingDates.some((m) => m <= p.firstHarvestOn!)) {
      unmeasured++; // no start, or days without weather before the harvest: the sum would be short
      continue;
    }
    harvests.push({ plantingId: p.id, startOn: dto.startEvent.on, firstHarvestOn: p.firstHarvestOn!, degreeDays: day.cumulative, days: dto.series.indexOf(day) + 1 });
  }
  const sorted = harvests.map((h) => h.degreeDays).sort((a, b) => a - b);
  const mid = sorted.length ? median(sorted) : null;
  const toC = (x: number) => (unit === 'F' ? fDaysToCDays(x) : x);
  return {
    unit,
    count: harvests.length,
    unmeasured,
    median: mid === null ? null : Math.round(mid),
    medianC: mid === null ? null : Math.round(toC(mid) * 10) / 10,
    p25: nearestRank(sorted, 25),
    p75: nearestRank(sorted, 75),
    min: sorted[0] ?? null,
    max: sorted.at(-1) ?? null,
    caution:
      harvests.length === 0
        ? 'No harvest with complete weather is on record for this variety yet.'
        : harvests.length < FEW_HARVESTS
          ? `Only ${countOf(harvests.length, 'harvest')} back this figure: treat it as a first guess and keep recording.`
          : null,
    harvests,
  };
}
