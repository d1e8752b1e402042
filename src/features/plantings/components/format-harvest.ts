import { HARVEST_UNIT_WORDS } from '#shared/schemas/plantings';
import type { HarvestUnit } from '#shared/schemas/plantings';
import { formatMeasure, formatPounds, KG_PER_POUND, massInKg, OUNCES_PER_POUND } from '#shared/units/measures';
import type { UnitSystem } from '#shared/units/measures';

/**
 * A harvest in the garden's units, whatever unit it was typed in: "2 lb 3 oz" in a °F garden,
 * "1.25 kg" in a °C one (grams under a kilogram stay grams). Counts and bunches stay as typed.
 */
export function formatHarvest(amount: number, unit: HarvestUnit, system: UnitSystem): string {
  const asTyped = `${amount} ${HARVEST_UNIT_WORDS[unit]}`;
  const kg = massInKg(amount, unit);
  if (kg === null) return asTyped;
  // Under half an ounce would read "0 oz": such a pinch stays as typed.
  if (system === 'us') return kg >= KG_PER_POUND / OUNCES_PER_POUND / 2 ? formatPounds(kg) : asTyped;
  return unit === 'g' && kg < 1 ? asTyped : formatMeasure('mass', kg, 'metric');
}
