import { findCrop } from '#shared/crops/library';
import type { NextEventDto, PlantingCreateInput, PlantingDto } from '#shared/schemas/plantings';
import { addDays, seasonOf } from '#shared/thermal/index';
import type { Planting, Variety } from '../../db/models';

const PACKET = 'Calendar days from the packet; the degree-day projection will refine it.';

/** Where the start of the packet's days-to-maturity count falls, when known. */
function dtmStart(p: Planting, v: Variety): string | null {
  if (v.dtmFrom === 'transplant') return p.transplantedOn;
  if (v.dtmFrom === 'emergence') {
    const emergence = v.emergenceDaysMax ?? v.emergenceDaysMin;
    return p.emergedOn ?? (p.sownOn && emergence !== null ? addDays(p.sownOn, emergence) : null);
  }
  return p.sownOn;
}

export function nextEvent(p: Planting, v: Variety): NextEventDto | null {
  if (p.status === 'planned') {
    return p.method === 'transplant'
      ? { label: 'Transplant', on: p.transplantedOn, basis: 'Planned date.' }
      : { label: 'Sow', on: p.sownOn, basis: 'Planned date.' };
  }
  if (p.status !== 'growing') return null;
  if (p.firstHarvestOn) return { label: 'Harvesting', on: p.firstHarvestOn, basis: 'First harvest recorded.' };
  if (p.sownOn && !p.emergedOn && !p.transplantedOn && v.emergenceDaysMax !== null) {
    return { label: 'Emergence expected', on: addDays(p.sownOn, v.emergenceDaysMax), basis: 'Packet days to emergence from sowing.' };
  }
  if (p.method === 'indoor-start' && !p.transplantedOn) return { label: 'Transplant out', on: null, basis: 'Indoor start not yet transplanted.' };
  const start = dtmStart(p, v);
  if (start && v.dtmDays !== null) return { label: 'Harvest from', on: addDays(start, v.dtmDays), basis: PACKET };
  return null;
}

export function presentPlanting(p: Planting, latitude: number): PlantingDto {
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
    season: p.startOn ? seasonOf(p.startOn, latitude).label : null,
    nextEvent: nextEvent(p, v),
    logCount: Number(p.get('logCount') ?? 0),
  };
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
