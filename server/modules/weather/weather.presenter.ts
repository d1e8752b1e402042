import type { DisplayUnit } from '#shared/schemas/gardens';
import type { JobRunDto, WeatherDayDto } from '#shared/schemas/weather';
import type { DailyTemp } from '#shared/thermal/types';
import { cToF } from '#shared/thermal/units';
import type { RunRow } from './weather.repository';
import type { GardenSoilDay } from './garden-soil';

/** Temperatures are stored in °C; a garden shows them in its own display unit, to 0.1°. */
export function presentDay(d: DailyTemp & { note?: string | null }, unit: DisplayUnit, soil?: GardenSoilDay): WeatherDayDto {
  const conv = unit === 'F' ? (c: number) => Math.round(cToF(c) * 10) / 10 : (c: number) => c;
  return {
    date: d.date,
    tmax: conv(d.tmax),
    tmin: conv(d.tmin),
    source: d.source,
    ...(d.note ? { note: d.note } : {}),
    // Where known, like the note: most days of a long history have no soil figure.
    ...(soil ? { soil: conv(soil.soil), soilSource: soil.source } : {}),
  };
}

const iso = (d: Date | string | null) => (d === null ? null : new Date(d).toISOString());

export function presentRun(r: RunRow): JobRunDto {
  return {
    id: r.id,
    kind: r.kind,
    startedAt: iso(r.startedAt)!,
    finishedAt: iso(r.finishedAt),
    status: r.status,
    cellsOk: r.cellsOk,
    cellsFailed: r.cellsFailed,
    cellsSkipped: r.cellsSkipped,
    daysWritten: r.daysWritten,
    daysRejected: r.daysRejected,
    requests: r.requests,
    message: r.message ?? null,
  };
}
