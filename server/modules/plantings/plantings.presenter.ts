import { findCrop } from '#shared/crops/library';
import { STAGE_FIELDS } from '#shared/schemas/plantings';
import type { NextEventDto, PlantingCreateInput, PlantingDto } from '#shared/schemas/plantings';
import type { ProgressSummaryDto } from '#shared/schemas/progress';
import { dayToken, rangeToken } from '#shared/format/dates';
import { plantingAttention } from '#shared/plantings/attention';
import { addDays } from '#shared/thermal/index';
import { packetEmergenceDays } from '#shared/thermal/start-event';
import { seasonOfYear } from '#shared/thermal/season';
import type { Planting, Variety } from '../../db/models';

/** What comes next for the planting: its own dates first, then the degree-day projection. */
export function nextEvent(p: Planting, v: Variety, today: string, progress: ProgressSummaryDto | null): NextEventDto | null {
  if (p.status === 'planned') {
    return p.method === 'direct-sow'
      ? { label: 'Sow', on: p.sownOn, basis: 'Planned date.' }
      : { label: 'Transplant', on: p.transplantedOn, basis: 'Planned date.' };
  }
  if (p.status !== 'growing') return null;
  if (p.firstHarvestOn) return { label: 'Harvesting', on: p.firstHarvestOn, basis: 'First harvest recorded.' };
  const emergence = packetEmergenceDays(v);
  // Past its packet days to emergence, an unrecorded emergence is taken as done.
  if (p.sownOn && !p.emergedOn && !p.transplantedOn && emergence !== null && addDays(p.sownOn, emergence) >= today) {
    return { label: 'Emergence expected', on: addDays(p.sownOn, emergence), basis: 'Packet days to emergence from sowing.' };
  }
  if (p.method === 'indoor-start' && !p.transplantedOn) return { label: 'Transplant out', on: null, basis: 'Indoor start not yet transplanted.' };
  const m = progress?.maturity;
  if (!m || !m.p10) return null;
  if (m.kind === 'observed') return { label: 'Ready to harvest', on: m.p10, basis: 'Its degree-day target is reached in recorded weather.' };
  if (m.kind === 'forecast') return { label: 'Ready by the forecast', on: m.p10, basis: 'The forecast reaches its degree-day target.' };
  const window = m.p90 ? rangeToken(m.p10, m.p90) : `${dayToken(m.p10)} or later`;
  return { label: 'Likely ready from', on: m.p10, basis: `Degree-day projection from this garden’s weather: ${window}.` };
}

export function presentPlanting(p: Planting, garden: { latitude: number | null; today: string }, progress: ProgressSummaryDto | null = null): PlantingDto {
  const v = p.variety!;
  const crop = findCrop(v.cropKey);
  const lot = p.seedLot ?? null;
  const { bedId: _bed, varietyId: _variety, seedLotId: _lot, ...stages } = plantingFields(p);
  return {
    id: p.id,
    bed: { id: p.bed!.id, name: p.bed!.name },
    variety: { id: v.id, name: v.name, dtmDays: v.dtmDays, dtmFrom: v.dtmFrom, boltTolerance: v.boltTolerance },
    crop: { key: v.cropKey, name: crop?.name ?? v.cropKey, season: crop?.params.season.value ?? 'cool' },
    seedLot: lot ? { id: lot.id, label: seedLotLabel(lot) } : null,
    ...stages,
    // The stored season (server/db/planting-season.ts), labelled for the garden's hemisphere.
    season: p.seasonYear === null || p.seasonYear === undefined ? null : seasonOfYear(p.seasonYear, garden.latitude ?? 0).label,
    nextEvent: nextEvent(p, v, garden.today, progress),
    logCount: Number(p.get('logCount') ?? 0),
    progress,
    attention: plantingAttention({ ...stages, recordedOn: [...STAGE_FIELDS.map((f) => stages[f] ?? null), dayOf(p.get('lastLogOn'))], maturity: progress?.maturity ?? null }, garden.today),
  };
}

/** A DATE column read through a literal: the driver may hand back text or a Date at UTC midnight. */
function dayOf(value: unknown): string | null {
  if (value instanceof Date) return value.toISOString().slice(0, 10);
  return typeof value === 'string' && /^\d{4}-\d{2}-\d{2}/.test(value) ? value.slice(0, 10) : null;
}

export function seedLotLabel(lot: { supplier: string; lotNumber: string; packedForYear: number | null }): string {
  const parts = [lot.lotNumber && `lot ${lot.lotNumber}`, lot.supplier, lot.packedForYear && `packed for ${lot.packedForYear}`].filter(Boolean);
  return parts.length ? parts.join(', ') : 'Unlabelled lot';
}

/** The stored planting in the shape of the create schema, for presenting and for merged checks. */
export function plantingFields(p: Planting): PlantingCreateInput {
  return {
    bedId: p.bedId,
    varietyId: p.varietyId,
    seedLotId: p.seedLotId,
    method: p.method,
    status: p.status,
    quantity: p.quantity,
    quantityUnit: p.quantityUnit,
    sownOn: p.sownOn,
    emergedOn: p.emergedOn,
    thinnedOn: p.thinnedOn,
    transplantedOn: p.transplantedOn,
    firstHarvestOn: p.firstHarvestOn,
    lastHarvestOn: p.lastHarvestOn,
    boltedOn: p.boltedOn,
    notes: p.notes,
  };
}
