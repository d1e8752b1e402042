import type { BedDto } from '#shared/schemas/beds';
import type { Bed } from '../../db/models';
import type { BedCounts } from './beds.service';

export function presentBed(b: Bed, counts: BedCounts = { active: 0, onRecord: 0 }): BedDto {
  return {
    id: b.id,
    name: b.name,
    kind: b.kind,
    lengthM: b.lengthM,
    widthM: b.widthM,
    areaM2: b.lengthM !== null && b.widthM !== null ? Math.round(b.lengthM * b.widthM * 100) / 100 : null,
    notes: b.notes,
    activePlantings: counts.active,
    plantingsOnRecord: counts.onRecord,
  };
}
