import { findCrop } from '#shared/crops/library';
import { traitGuidance } from '#shared/crops/guidance';
import type { GddTargetDto, VarietyDto } from '#shared/schemas/varieties';
import type { Variety } from '../../db/models';

export function presentVariety(v: Variety, season: 'cool' | 'warm', gddTarget?: GddTargetDto): VarietyDto {
  const crop = findCrop(v.cropKey);
  return {
    id: v.id,
    crop: { key: v.cropKey, name: crop?.name ?? v.cropKey, season },
    name: v.name,
    dtmDays: v.dtmDays,
    dtmFrom: v.dtmFrom,
    emergenceDaysMin: v.emergenceDaysMin,
    emergenceDaysMax: v.emergenceDaysMax,
    boltTolerance: v.boltTolerance,
    heatTolerance: v.heatTolerance,
    traits: v.traits,
    containerFriendly: v.containerFriendly,
    sunHours: v.sunHours,
    waterCmPerWeek: v.waterCmPerWeek,
    sowDepthCm: v.sowDepthCm,
    spacingCm: v.spacingCm,
    thinSpacingCm: v.thinSpacingCm,
    gddTargetOverrideC: v.gddTargetOverrideC,
    notes: v.notes,
    guidance: traitGuidance(v.traits),
    ...(gddTarget ? { gddTarget } : {}),
  };
}
