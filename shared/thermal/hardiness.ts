import { cToF } from './units';

/**
 * USDA plant hardiness zone from the average annual extreme minimum (USDA-ARS & Oregon State
 * PRISM 2023 map, SCIENCE §6): zone = floor((T°F + 60)/10) + 1, 'a' for the colder 5 °F half.
 * The map's scale stops at 1a and 13b, so colder values report '1a' and warmer ones '13b'
 * (the zone whose open end they lie in) rather than inventing zones 0 or 14.
 */
export function hardinessZone(averageAnnualExtremeMin: number, unit: 'F' | 'C'): string {
  if (!Number.isFinite(averageAnnualExtremeMin)) {
    throw new RangeError(`averageAnnualExtremeMin (${averageAnnualExtremeMin}) is not a finite number`);
  }
  if (unit !== 'F' && unit !== 'C') throw new RangeError(`unit (${String(unit)}) must be 'F' or 'C'`);
  const f = unit === 'F' ? averageAnnualExtremeMin : cToF(averageAnnualExtremeMin);
  // Rounding to 1e-6 °F keeps a converted boundary (−6.6667 °C = 20 °F) on its inclusive side.
  const shifted = Math.round((f + 60) * 1e6) / 1e6;
  const clamped = Math.min(129.999999, Math.max(0, shifted));
  const zone = Math.floor(clamped / 10) + 1;
  return `${zone}${clamped % 10 < 5 ? 'a' : 'b'}`;
}
