import type { LogEntryDto } from '#shared/schemas/plantings';
import type { PlantingLog } from '../../db/models';

export function presentLogEntry(e: PlantingLog): LogEntryDto {
  return {
    id: e.id,
    entryOn: e.entryOn,
    kind: e.kind,
    amount: e.amount,
    amountUnit: e.amountUnit,
    note: e.note,
    photoId: e.photoId,
    by: e.author?.name ?? null,
    createdAt: e.createdAt.toISOString(),
  };
}
