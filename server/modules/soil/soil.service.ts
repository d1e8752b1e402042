/**
 * A garden's soil temperature for timing sowings: the grower's thermometer readings, the
 * weather service's daily soil means (both through the one reader, loadGardenSoil), and for each
 * crop whether the soil suits sowing now and how long seed takes to come up (shared/thermal/emergence.ts).
 */
import { QueryTypes } from 'sequelize';
import type { Sequelize } from 'sequelize';
import { CROP_LIBRARY } from '#shared/crops/library';
import { soilAdviceWords } from '#shared/crops/soil-words';
import type { DisplayUnit } from '#shared/schemas/gardens';
import { SOIL_READING_RANGE_C } from '#shared/schemas/soil';
import type { GardenSoilResponse, SoilCropDto, SoilReadingCreateInput, SoilReadingDto } from '#shared/schemas/soil';
import { EMERGENCE_SOURCE, addDays, cToF, fToC, soilSowing } from '#shared/thermal';
import { dayToken } from '#shared/format/dates';
import { AppError } from '../../errors';
import { localDate } from '../../lib/local-date';
import { moveGardenRevisions } from '../../lib/garden-revision';
import { inTransaction } from '../../lib/transaction';
import { fieldsOf, recordAudit } from '../audit/audit';
import type { AuditActor } from '../audit/audit';
import { effectiveCrops } from '../crops/crops.service';
import { loadGardenSoil } from '../weather/garden-soil';
import type { GardenSoilDay } from '../weather/garden-soil';

export interface SoilGardenRef {
  id: number;
  units: DisplayUnit;
  timeZone: string;
  weatherCellId: number | null;
}

const round1 = (x: number) => Math.round(x * 10) / 10;
const shown = (c: number, unit: DisplayUnit) => round1(unit === 'F' ? cToF(c) : c);
const fmt = (unit: DisplayUnit) => (c: number) => `${shown(c, unit)} °${unit}`;

/** How far back a past value still stands for the soil now. */
const CURRENT_LOOKBACK_DAYS = 3;

/** Today's reading, else the latest observed or read day of the last few, else today's forecast. */
function currentSoil(days: Map<string, GardenSoilDay>, today: string): GardenSoilDay | null {
  const t = days.get(today);
  if (t?.source === 'reading') return t;
  for (let k = 1; k <= CURRENT_LOOKBACK_DAYS; k++) {
    const d = days.get(addDays(today, -k));
    if (d) return d;
  }
  return t ?? null;
}

export async function listSoilReadings(sequelize: Sequelize, gardenId: number, limit = 10, onlyId?: number): Promise<SoilReadingDto[]> {
  const rows = await sequelize.query<{ id: number; readOn: string; soilC: string | number; depthCm: string | number | null; note: string; by: string | null; units: DisplayUnit }>(
    `SELECT r.id, r.read_on AS readOn, r.soil_c AS soilC, r.depth_cm AS depthCm, r.note, u.name AS \`by\`, g.units
       FROM soil_readings r JOIN gardens g ON g.id = r.garden_id LEFT JOIN users u ON u.id = r.user_id
      WHERE r.garden_id = ? ${onlyId === undefined ? '' : 'AND r.id = ?'} ORDER BY r.read_on DESC, r.id DESC LIMIT ?`,
    { replacements: [gardenId, ...(onlyId === undefined ? [] : [onlyId]), limit], type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({
    id: r.id,
    readOn: r.readOn,
    temperature: shown(Number(r.soilC), r.units),
    depthCm: r.depthCm === null ? null : Number(r.depthCm),
    note: r.note,
    by: r.by,
  }));
}

export async function gardenSoil(sequelize: Sequelize, garden: SoilGardenRef, now = new Date()): Promise<GardenSoilResponse> {
  const today = localDate(garden.timeZone, now);
  const [days, readings, effective] = await Promise.all([
    loadGardenSoil(sequelize, garden, { from: addDays(today, -CURRENT_LOOKBACK_DAYS), to: addDays(today, 16) }),
    listSoilReadings(sequelize, garden.id),
    effectiveCrops(garden.id),
  ]);
  const current = currentSoil(days, today);
  const crops: SoilCropDto[] = current
    ? CROP_LIBRARY.map((crop) => {
        const v = effective.get(crop.key)!;
        const germ = { cropKey: crop.key, germMinC: v.germMinC, germOptC: v.germOptC, germMaxC: v.germMaxC };
        const { status, emergence } = soilSowing(germ, current.soil);
        return {
          key: crop.key,
          name: crop.name,
          season: v.season,
          status,
          emergenceDays: emergence ? round1(emergence.days) : null,
          interpolated: emergence?.interpolated ?? false,
          germ: v.germMinC === null || v.germMaxC === null ? null : { min: shown(v.germMinC, garden.units), opt: v.germOptC === null ? null : shown(v.germOptC, garden.units), max: shown(v.germMaxC, garden.units) },
          words: soilAdviceWords({ season: v.season, status, emergenceDays: emergence?.days ?? null, min: v.germMinC, max: v.germMaxC, fmt: fmt(garden.units) }),
        };
      })
    : [];
  return {
    unit: garden.units,
    current: current && { date: current.date, temperature: shown(current.soil, garden.units), source: current.source },
    forecast: [...days.values()]
      .filter((d) => d.date >= today && d.source === 'forecast')
      .sort((a, b) => (a.date < b.date ? -1 : 1))
      .slice(0, 7)
      .map((d) => ({ date: d.date, temperature: shown(d.soil, garden.units) })),
    readings,
    crops,
    emergenceSource: EMERGENCE_SOURCE,
  };
}

// The trail keeps a reading's values as stored (°C, cm); only its summary is in the garden's unit.
const readingSubject = (r: { readOn: string; soilC: number }, unit: DisplayUnit) => `a soil reading of ${shown(r.soilC, unit)} °${unit} on ${dayToken(r.readOn)}`;

export async function addSoilReading(sequelize: Sequelize, garden: SoilGardenRef, actor: AuditActor, input: SoilReadingCreateInput, now = new Date()): Promise<SoilReadingDto> {
  const soilC = Math.round((garden.units === 'F' ? fToC(input.temperature) : input.temperature) * 100) / 100;
  if (soilC < SOIL_READING_RANGE_C.min || soilC > SOIL_READING_RANGE_C.max) {
    const [lo, hi] = [SOIL_READING_RANGE_C.min, SOIL_READING_RANGE_C.max].map((c) => Math.round(shown(c, garden.units)));
    const msg = `A soil reading must be between ${lo} and ${hi} °${garden.units}.`;
    throw new AppError(422, 'validation_failed', msg, { temperature: msg });
  }
  const today = localDate(garden.timeZone, now);
  if (input.readOn > today) {
    const msg = 'A reading cannot be dated after today in the garden.';
    throw new AppError(422, 'validation_failed', msg, { readOn: msg });
  }
  const id = await inTransaction(sequelize, async (transaction) => {
    const [insertId] = await sequelize.query(
      `INSERT INTO soil_readings (garden_id, read_on, soil_c, depth_cm, note, user_id, created_at) VALUES (?, ?, ?, ?, ?, ?, UTC_TIMESTAMP(3))`,
      { replacements: [garden.id, input.readOn, soilC, input.depthCm ?? null, input.note ?? '', actor.id], type: QueryTypes.INSERT, transaction },
    );
    const made = { readOn: input.readOn, soilC, depthCm: input.depthCm ?? null, note: input.note ?? '' };
    await recordAudit(transaction, { gardenId: garden.id, actor, entity: 'soil-reading', entityId: insertId, action: 'created', summary: `Recorded ${readingSubject(made, garden.units)}`, changes: fieldsOf(made, 'to') });
    // Cached soil and weather answers of the garden are stale from this commit on.
    await moveGardenRevisions(sequelize, [garden.id], transaction);
    return insertId;
  });
  const [reading] = await listSoilReadings(sequelize, garden.id, 1, id);
  return reading!;
}

export async function deleteSoilReading(sequelize: Sequelize, garden: Pick<SoilGardenRef, 'id' | 'units'>, actor: AuditActor, readingId: number): Promise<void> {
  const gardenId = garden.id;
  const gone = await inTransaction(sequelize, async (transaction) => {
    const [row] = await sequelize.query<{ readOn: string; soilC: string | number; depthCm: string | number | null; note: string }>(
      'SELECT read_on AS readOn, soil_c AS soilC, depth_cm AS depthCm, note FROM soil_readings WHERE id = ? AND garden_id = ? FOR UPDATE',
      { replacements: [readingId, gardenId], type: QueryTypes.SELECT, transaction },
    );
    if (!row) return false;
    await sequelize.query('DELETE FROM soil_readings WHERE id = ? AND garden_id = ?', { replacements: [readingId, gardenId], type: QueryTypes.BULKDELETE, transaction });
    const deleted = { readOn: row.readOn, soilC: Number(row.soilC), depthCm: row.depthCm === null ? null : Number(row.depthCm), note: row.note };
    await recordAudit(transaction, { gardenId, actor, entity: 'soil-reading', entityId: readingId, action: 'deleted', summary: `Deleted ${readingSubject(deleted, garden.units)}`, changes: fieldsOf(deleted, 'from') });
    await moveGardenRevisions(sequelize, [gardenId], transaction);
    return true;
  });
  if (!gone) throw new AppError(404, 'not_found', 'No such soil reading in this garden.');
}
