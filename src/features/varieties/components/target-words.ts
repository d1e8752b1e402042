import { basisWords } from '#shared/crops/basis';
import { formatDegreeDays } from '#shared/thermal/units';
import type { DisplayUnit } from '#shared/schemas/gardens';
import type { VarietyDto } from '#shared/schemas/varieties';

/** A grower's target with the method it was counted in: the same figure means other dates at another base. */
export function targetWords(v: VarietyDto, units: DisplayUnit): string {
  const figure = formatDegreeDays(v.gddTargetOverrideC!, units);
  return v.gddTargetBasis ? `${figure}, set at ${basisWords(v.gddTargetBasis, units)}` : figure;
}
