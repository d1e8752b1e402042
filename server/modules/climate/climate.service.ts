/**
 * A garden's climate facts from its own stored weather: frost dates and the extreme minimum
 * through the engine (shared/thermal/frost-dates.ts, hardiness.ts), the frost-free season from the
 * same per-season frost days, and the owner's override (garden_climate_overrides, migration 0019).
 */
import { QueryTypes } from 'sequelize';
import type { Sequelize } from 'sequelize';
import { CLIMATE_MIN_YEARS } from '#shared/schemas/climate';
import type { ClimateDto, ClimateOverrideDto, ClimateOverrideInput, FrostDateFigure } from '#shared/schemas/climate';
import { addDays, daysBetween } from '#shared/thermal/dates';
import { frostDates } from '#shared/thermal/frost-dates';
import type { FrostDates, FrostWindow } from '#shared/thermal/frost-dates';
import { nearestRank } from '#shared/thermal/quantiles';
import { isSouthern, seasonOfYear } from '#shared/thermal/season';
import { tempIn } from '#shared/thermal/units';
import type { DailyTemp } from '#shared/thermal/types';
import { moveGardenRevisions } from '../../lib/garden-revision';
import { inTransaction } from '../../lib/transaction';
import { changedFields, recordAudit } from '../audit/audit';
import type { AuditActor } from '../audit/audit';
import { changedSummary } from '../audit/audit-words';
import type { GardenFacts } from '../../lib/routes';
import type { WeatherService } from '../weather/weather.service';

const round1 = (x: number) => Math.round(x * 10) / 10;

function figureOf(w: FrostWindow): FrostDateFigure {
  return { p10: w.p10?.monthDay ?? null, p50: w.p50?.monthDay ?? null, p90: w.p90?.monthDay ?? null, years: w.seasons, estimate: w.seasons < CLIMATE_MIN_YEARS };
}

/**
 * Each season with both halves complete: the days strictly between its last spring frost and its
 * first fall frost (common practice, no source); a season without a spring frost counts from its
 * first day, one without a fall frost to its last day.
 */
export function frostFreeLengths(f: FrostDates, latitude: number): number[] {
  const out: number[] = [];
  for (const s of f.seasons) {
    if (!s.springComplete || !s.fallComplete) continue;
    const season = seasonOfYear(Number(s.season.slice(0, 4)), latitude);
    const from = s.lastSpringFrost ?? addDays(season.start, -1);
    const to = s.firstFallFrost ?? addDays(season.end, 1);
    out.push(daysBetween(from, to) - 1);
  }
  return out.sort((a, b) => a - b);
}

export interface ClimateOverrideRow {
  last_spring_frost: string | null;
  first_fall_frost: string | null;
  zone: string | null;
  updated_at: Date | string;
}

function overrideDto(row: ClimateOverrideRow | undefined): ClimateOverrideDto | null {
  if (!row) return null;
  const at = row.updated_at instanceof Date ? row.updated_at : new Date(`${String(row.updated_at).replace(' ', 'T')}Z`);
  return { lastSpringFrost50: row.last_spring_frost, firstFallFrost50: row.first_fall_frost, zone: row.zone, updatedAt: at.toISOString() };
}

export class ClimateService {
  constructor(
    private readonly db: Sequelize,
    private readonly weather: WeatherService,
  ) {}

  async override(gardenId: number): Promise<ClimateOverrideDto | null> {
    const [row] = await this.db.query<ClimateOverrideRow>('SELECT last_spring_frost, first_fall_frost, zone, updated_at FROM garden_climate_overrides WHERE garden_id = ?', {
      replacements: [gardenId],
      type: QueryTypes.SELECT,
    });
    return overrideDto(row);
  }

  async climate(garden: GardenFacts): Promise<ClimateDto> {
    const [history, override] = await Promise.all([this.history(garden), this.override(garden.id)]);
    return climateOf(history, garden.latitude, garden.units, override);
  }

  private async history(garden: GardenFacts): Promise<DailyTemp[]> {
    if (garden.latitude === null || garden.weatherCellId === null) return [];
    const days = await this.weather.gardenHistory({ id: garden.id, weatherCellId: garden.weatherCellId, timeZone: garden.timeZone });
    return days.map(({ date, tmax, tmin, source }) => ({ date, tmax, tmin, source }));
  }

  /** Sets the named figures (null clears one); the row goes when none is left. Moves the garden's revision with it. */
  async setOverride(gardenId: number, actor: AuditActor, input: ClimateOverrideInput): Promise<ClimateOverrideDto | null> {
    await inTransaction(this.db, async (transaction) => {
      const [current] = await this.db.query<ClimateOverrideRow>('SELECT last_spring_frost, first_fall_frost, zone, updated_at FROM garden_climate_overrides WHERE garden_id = ? FOR UPDATE', {
        replacements: [gardenId],
        type: QueryTypes.SELECT,
        transaction,
      });
      const next = {
        spring: input.lastSpringFrost50 !== undefined ? input.lastSpringFrost50 : (current?.last_spring_frost ?? null),
        fall: input.firstFallFrost50 !== undefined ? input.firstFallFrost50 : (current?.first_fall_frost ?? null),
        zone: input.zone !== undefined ? input.zone : (current?.zone ?? null),
      };
      if (next.spring === null && next.fall === null && next.zone === null) {
        await this.db.query('DELETE FROM garden_climate_overrides WHERE garden_id = ?', { replacements: [gardenId], transaction });
      } else {
        await this.db.query(
          `INSERT INTO garden_climate_overrides (garden_id, last_spring_frost, first_fall_frost, zone, updated_by, updated_at)
           VALUES (?, ?, ?, ?, ?, UTC_TIMESTAMP(3))
           ON DUPLICATE KEY UPDATE last_spring_frost = VALUES(last_spring_frost), first_fall_frost = VALUES(first_fall_frost), zone = VALUES(zone),
             updated_by = VALUES(updated_by), updated_at = VALUES(updated_at)`,
          { replacements: [gardenId, next.spring, next.fall, next.zone, actor.id], transaction },
        );
      }
      const changes = changedFields(
        { lastSpringFrost50: current?.last_spring_frost ?? null, firstFallFrost50: current?.first_fall_frost ?? null, zone: current?.zone ?? null },
        { lastSpringFrost50: next.spring, firstFallFrost50: next.fall, zone: next.zone },
        ['lastSpringFrost50', 'firstFallFrost50', 'zone'],
      );
      if (Object.keys(changes).length) {
        await recordAudit(transaction, { gardenId, actor, entity: 'climate', entityId: gardenId, action: 'changed', summary: changedSummary(changes, "the garden's climate"), changes });
      }
      await moveGardenRevisions(this.db, [gardenId], transaction);
    });
    return this.override(gardenId);
  }
}

/** The facts of one history (pure: the route's answer, and what the tests check). */
export function climateOf(history: readonly DailyTemp[], latitude: number | null, unit: 'F' | 'C', override: ClimateOverrideDto | null): ClimateDto {
  const lat = latitude ?? 0;
  const f = frostDates(history, lat);
  const lengths = frostFreeLengths(f, lat);
  const winters = f.extremeMinimum.winters.length;
  const spring = figureOf(f.lastSpring);
  const fall = figureOf(f.firstFall);
  const years = Math.min(spring.years, fall.years, winters);
  const reason =
    latitude === null ? 'The garden has no location yet, so it has no weather.' : history.length === 0 ? 'No weather is stored for this garden yet.' : null;
  const source = override && (override.lastSpringFrost50 !== null || override.firstFallFrost50 !== null || override.zone !== null) ? 'override' : 'history';
  return {
    years,
    estimate: years < CLIMATE_MIN_YEARS,
    hemisphere: isSouthern(lat) ? 'south' : 'north',
    reason,
    lastSpringFrost: spring,
    firstFallFrost: fall,
    frostFreeDays: {
      p10: nearestRank(lengths, 10),
      p50: nearestRank(lengths, 50),
      p90: nearestRank(lengths, 90),
      years: lengths.length,
      estimate: lengths.length < CLIMATE_MIN_YEARS,
    },
    extremeMinimum: { mean: f.extremeMinimum.meanC === null ? null : round1(tempIn(f.extremeMinimum.meanC, unit)), unit, years: winters, estimate: f.extremeMinimum.estimate },
    zone: { zone: f.extremeMinimum.zone, years: winters, estimate: f.extremeMinimum.estimate },
    override,
    source,
  };
}
