/**
 * The demo's lettuce and spinach outcomes, decided by the garden's weather once it is in: each
 * planting is first picked on the day its progress series (the same answer its page shows,
 * progress-loader.ts) reaches its variety's invented true need, and runs to seed after its
 * invented number of heat days (DEMO_VARIETY_TRUTH), whichever comes first. So a variety that
 * stands more heat really did stand more in the weather Compare reads, and the ranking is true.
 */
import type { Sequelize, Transaction } from 'sequelize';
import { addDays } from '#shared/thermal/dates';
import { degreeDaysIn, tempIn } from '#shared/thermal/units';
import type { ProgressDto } from '#shared/schemas/progress';
import type { PlantingStatus } from '#shared/schemas/plantings';
import { Planting, PlantingLog } from '../models';
import type { Garden } from '../models';
import type { WeatherService } from '../../modules/weather/weather.service';
import { computeGardenProgress } from '../../modules/progress/progress-loader';
import { progressRow } from '../../modules/progress/progress.presenter';
import { effectiveValues, getCrop } from '../../modules/crops/crops.service';
import { cropBoltTriggers } from '../../modules/crops/crop-thermal';
import { DEMO_VARIETY_TRUTH } from './demo-records';
import type { PendingOutcome } from './demo-records';

export interface DemoOutcome {
  firstHarvestOn: string | null;
  lastHarvestOn: string | null;
  boltedOn: string | null;
  status: PlantingStatus;
}

/** Share of the degree-day need before heat counts towards bolting (invented for the demo). */
const JUVENILE_SHARE = 0.4;

/**
 * What the weather made of one planting: first picking when the series' cumulative degree days
 * reach `need`; bolting two days after the `heatDays`-th day past the juvenile share with a high
 * above `threshold` (need and threshold in the progress answer's unit); picking goes on for
 * `pickingDays` unless bolting ends it. Events after the answer's today have not happened.
 */
export function outcomeOf(dto: ProgressDto, need: number, threshold: number | null, heatDays: number, pickingDays: number): DemoOutcome {
  const today = dto.today;
  const ready = dto.series.find((d) => d.cumulative >= need)?.date;
  let hot = 0;
  let bolt: string | undefined;
  for (const d of dto.series) {
    if (threshold !== null && d.cumulative >= need * JUVENILE_SHARE && d.tmax > threshold && ++hot === heatDays) {
      bolt = addDays(d.date, 2);
      break;
    }
  }
  const happened = (day: string | undefined) => (day !== undefined && day <= today ? day : null);
  if (bolt && (!ready || bolt <= ready)) {
    const boltedOn = happened(bolt);
    return { firstHarvestOn: null, lastHarvestOn: null, boltedOn, status: boltedOn ? 'bolted' : 'growing' };
  }
  const firstHarvestOn = happened(ready);
  if (!firstHarvestOn) return { firstHarvestOn: null, lastHarvestOn: null, boltedOn: null, status: 'growing' };
  const pickedUntil = addDays(firstHarvestOn, pickingDays);
  const boltedOn = bolt && bolt < pickedUntil ? happened(bolt) : null;
  if (boltedOn) return { firstHarvestOn, lastHarvestOn: boltedOn, boltedOn, status: 'bolted' };
  const lastHarvestOn = happened(pickedUntil);
  return { firstHarvestOn, lastHarvestOn, boltedOn: null, status: lastHarvestOn ? 'harvested' : 'growing' };
}

/**
 * Settles the pending plantings of one garden from its stored weather, with their log entries:
 * the progress is computed first, then the outcomes are written in one transaction (so the
 * computation never waits for a connection the transaction holds).
 */
export async function settleDemoOutcomes(sequelize: Sequelize, weather: WeatherService, garden: Garden, pending: readonly PendingOutcome[]): Promise<number> {
  if (!pending.length) return 0;
  const { results } = await computeGardenProgress(
    weather,
    garden.id,
    pending.map((p) => p.plantingId),
  );
  const byId = new Map(results.map((r) => [r.planting.id, JSON.parse(progressRow(r).body) as ProgressDto]));
  return sequelize.transaction((transaction) => writeOutcomes(garden, pending, byId, transaction));
}

async function writeOutcomes(garden: Garden, pending: readonly PendingOutcome[], byId: ReadonlyMap<number, ProgressDto>, transaction: Transaction): Promise<number> {
  const thresholds = new Map<string, number | null>();
  let settled = 0;
  for (const p of pending) {
    const dto = byId.get(p.plantingId);
    const planting = await Planting.findByPk(p.plantingId, { include: ['variety'], transaction });
    if (!dto || !planting) continue;
    const cropKey = planting.variety!.cropKey;
    if (!thresholds.has(cropKey)) {
      const crop = await getCrop(garden.id, cropKey, transaction);
      const c = cropBoltTriggers(cropKey, effectiveValues(crop), crop.overrides, garden.units)?.triggers.heatThresholdC;
      thresholds.set(cropKey, c === undefined ? null : Math.round(tempIn(c, garden.units) * 10) / 10);
    }
    const truth = DEMO_VARIETY_TRUTH[p.variety];
    const o = outcomeOf(dto, degreeDaysIn(truth.dd, garden.units), thresholds.get(cropKey)!, truth.heatDays, p.pickingDays);
    const [a, b = a, c = b] = p.authors;
    const log = (entryOn: string, kind: 'harvest' | 'bolted' | 'observation', note: string, createdBy: number, amount: number | null = null) =>
      PlantingLog.create({ gardenId: garden.id, plantingId: planting.id, entryOn, kind, amount, amountUnit: amount === null ? null : 'kg', note, photoId: null, createdBy }, { transaction });
    if (o.status === 'growing' && !o.firstHarvestOn) {
      // Still growing today: a recent look, as a grower tending it would have noted.
      const lastLook = addDays(dto.today, -3);
      if (dto.startEvent && lastLook > dto.startEvent.on) await log(lastLook, 'observation', 'Heads filling out; no sign of bolting yet.', b);
      continue;
    }
    await planting.update(o, { transaction });
    if (o.firstHarvestOn) await log(o.firstHarvestOn, 'harvest', 'First picking.', a, 0.6);
    if (o.lastHarvestOn && o.lastHarvestOn !== o.firstHarvestOn && o.status === 'harvested') await log(o.lastHarvestOn, 'harvest', 'Final picking.', b, 0.8);
    if (o.boltedOn) {
      await log(addDays(o.boltedOn, -2), 'observation', 'Centres elongating after the hot spell.', b);
      await log(o.boltedOn, 'bolted', o.firstHarvestOn ? 'Seed stalks showing; last leaves picked, the rest pulled for compost.' : 'Ran to seed before it was ready; pulled for compost.', c);
    }
    settled++;
  }
  return settled;
}
