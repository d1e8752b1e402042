import { findCrop } from '#shared/crops/library';
import { libraryBasis, recordedBasis } from '#shared/crops/basis';
import type { DegreeDayBasis } from '#shared/crops/basis';
import { traitGuidance } from '#shared/crops/guidance';
import type { GddTargetDto, VarietyCreateInput, VarietyDto } from '#shared/schemas/varieties';
import type { Variety } from '../../db/models';

/** The method the override was counted with; rows from before 0007 count as the crop's library method. */
export function targetBasis(v: Variety): DegreeDayBasis | null {
  if (v.gddTargetOverrideC === null) return null;
  const stored = recordedBasis({ baseC: v.gddTargetBaseC, upperC: v.gddTargetUpperC, method: v.gddTargetMethod, cutoff: v.gddTargetCutoff });
  const crop = findCrop(v.cropKey);
  return stored ?? (crop ? libraryBasis(crop) : null);
}

export function presentVariety(v: Variety, season: 'cool' | 'warm', gddTarget?: GddTargetDto): VarietyDto {
  const crop = findCrop(v.cropKey);
  const { cropKey: _cropKey, ...packetFacts } = varietyFields(v);
  return {
    id: v.id,
    crop: { key: v.cropKey, name: crop?.name ?? v.cropKey, season },
    ...packetFacts,
    gddTargetBasis: targetBasis(v),
    guidance: traitGuidance(v.traits),
    ...(gddTarget ? { gddTarget } : {}),
  };
}

/** The stored packet facts in the shape of the create schema, for presenting and for merged checks. */
export function varietyFields(v: Variety): VarietyCreateInput {
  return {
    cropKey: v.cropKey,
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
  };
}
