import type { PhotoDto } from '#shared/schemas/plantings';
import type { PlantingPhoto } from '../../db/models';

export function presentPhoto(p: PlantingPhoto): PhotoDto {
  return {
    id: p.id,
    plantingId: p.plantingId,
    takenOn: p.takenOn,
    caption: p.caption,
    width: p.width,
    height: p.height,
    bytes: p.bytes,
    url: `/api/gardens/${p.gardenId}/plantings/${p.plantingId}/photos/${p.id}`,
    by: p.author?.name ?? null,
  };
}
