/**
 * Lengths, areas and masses at the edges: Heatclock stores SI (bed sizes in metres, spacing and
 * depth in centimetres, harvest masses in kilograms or grams) and shows them in the garden's
 * unit system: a °F garden reads feet, inches, square feet, pounds and ounces; a °C garden
 * metric. Every screen and the server convert through this one module.
 *
 * Factors are the exact international definitions (NIST Handbook 44, Appendix C, 1959 yard and
 * pound): 1 in = 2.54 cm, 1 ft = 0.3048 m, 1 lb = 0.45359237 kg, 1 oz = 1/16 lb.
 * Temperatures and degree days convert in shared/thermal/units.ts.
 */
import type { TempUnit } from '../thermal/units';

export type UnitSystem = 'metric' | 'us';

export const CM_PER_INCH = 2.54;
export const M_PER_FOOT = 0.3048;
export const KG_PER_POUND = 0.45359237;
export const OUNCES_PER_POUND = 16;
export const M2_PER_SQUARE_FOOT = M_PER_FOOT * M_PER_FOOT;

/** A °F garden measures in US customary units, a °C garden in metric. */
export function unitSystemOf(unit: TempUnit): UnitSystem {
  return unit === 'F' ? 'us' : 'metric';
}

/**
 * What is measured, and the SI unit it is stored in:
 * - `bed`: a bed's length or width, stored in m, shown in m or ft;
 * - `spacing`: spacing and sowing depth, stored in cm, shown in cm or in;
 * - `area`: stored in m², shown in m² or sq ft;
 * - `mass`: a harvest, stored in kg, shown in kg or lb;
 * - `elevation`: a garden's height above sea level, stored in m, shown in whole m or ft.
 */
export type MeasureKind = 'bed' | 'spacing' | 'area' | 'mass' | 'elevation';

interface Shown {
  /** The unit's symbol as printed after a figure. */
  symbol: string;
  /** How many shown units make one stored unit. */
  perStored: number;
  /** Decimals worth showing. */
  digits: number;
}

const UNITS: Record<MeasureKind, Record<UnitSystem, Shown>> = {
  bed: { metric: { symbol: 'm', perStored: 1, digits: 2 }, us: { symbol: 'ft', perStored: 1 / M_PER_FOOT, digits: 1 } },
  spacing: { metric: { symbol: 'cm', perStored: 1, digits: 1 }, us: { symbol: 'in', perStored: 1 / CM_PER_INCH, digits: 1 } },
  area: { metric: { symbol: 'm²', perStored: 1, digits: 1 }, us: { symbol: 'sq ft', perStored: 1 / M2_PER_SQUARE_FOOT, digits: 0 } },
  mass: { metric: { symbol: 'kg', perStored: 1, digits: 2 }, us: { symbol: 'lb', perStored: 1 / KG_PER_POUND, digits: 2 } },
  elevation: { metric: { symbol: 'm', perStored: 1, digits: 0 }, us: { symbol: 'ft', perStored: 1 / M_PER_FOOT, digits: 0 } },
};

/** The symbol a field's value is typed and shown in: "ft", "cm", "sq ft", "lb". */
export function measureSymbol(kind: MeasureKind, system: UnitSystem): string {
  return UNITS[kind][system].symbol;
}

const round = (x: number, digits: number) => Number(x.toFixed(digits));

/** A stored SI value in the shown unit, rounded to what is worth showing (for a form's field). */
export function toShown(kind: MeasureKind, stored: number, system: UnitSystem): number {
  const u = UNITS[kind][system];
  return round(stored * u.perStored, u.digits);
}

/**
 * A typed value back to SI for storing. Rounded to the stored precision that keeps a value typed
 * in either system coming back as typed (4 decimals of m, cm or kg: 0.1 mm, 0.1 g).
 */
export function toStored(kind: MeasureKind, shown: number, system: UnitSystem): number {
  return round(shown / UNITS[kind][system].perStored, 4);
}

const number = (digits: number) => new Intl.NumberFormat('en', { maximumFractionDigits: digits });

/** "1.2 m", "4 ft", "30 cm", "12 in", "3.6 m²", "39 sq ft", "1.25 kg", "2 lb 3 oz". */
export function formatMeasure(kind: MeasureKind, stored: number, system: UnitSystem): string {
  if (kind === 'mass' && system === 'us') return formatPounds(stored);
  const u = UNITS[kind][system];
  return `${number(u.digits).format(stored * u.perStored)} ${u.symbol}`;
}

/** A mass in pounds and whole ounces: "2 lb 3 oz", "5 oz", "1 lb". */
export function formatPounds(kg: number): string {
  const ounces = Math.round((kg / KG_PER_POUND) * OUNCES_PER_POUND);
  const lb = Math.floor(ounces / OUNCES_PER_POUND);
  const oz = ounces % OUNCES_PER_POUND;
  if (lb === 0) return `${oz} oz`;
  return oz === 0 ? `${lb} lb` : `${lb} lb ${oz} oz`;
}

/** A recorded harvest amount as kilograms, when it is a mass (the log keeps the unit typed). */
export function massInKg(amount: number, unit: string): number | null {
  if (unit === 'kg') return amount;
  if (unit === 'g') return amount / 1000;
  if (unit === 'lb') return amount * KG_PER_POUND;
  if (unit === 'oz') return (amount * KG_PER_POUND) / OUNCES_PER_POUND;
  return null;
}
