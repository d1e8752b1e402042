/**
 * A variety's packet lengths in the garden's units: a °F garden types and reads inches, a °C
 * garden centimetres. The API keeps centimetres; the form converts at its edge and checks the
 * ranges in the unit the grower typed, so the message names that unit.
 */
import { CM_PER_INCH, formatMeasure, measureSymbol, toShown, toStored } from '#shared/units/measures';
import type { UnitSystem } from '#shared/units/measures';

export const MEASURE_FIELDS = ['sowDepthCm', 'spacingCm', 'thinSpacingCm', 'waterCmPerWeek'] as const;
export type MeasureField = (typeof MEASURE_FIELDS)[number];

/** The server's ranges in cm (shared/schemas/varieties.ts), with the names its messages use. */
const RANGES: Record<MeasureField, { what: string; minCm: number; maxCm: number; per?: string }> = {
  sowDepthCm: { what: 'Sowing depth', minCm: 0, maxCm: 15 },
  spacingCm: { what: 'Spacing', minCm: 1, maxCm: 300 },
  thinSpacingCm: { what: 'Thinning spacing', minCm: 1, maxCm: 300 },
  waterCmPerWeek: { what: 'Water', minCm: 0, maxCm: 20, per: ' a week' },
};

/** "in" or "cm", with " a week" for water. */
export function measureUnit(field: MeasureField, system: UnitSystem): string {
  return `${measureSymbol('spacing', system)}${RANGES[field].per ?? ''}`;
}

/** "12 in", "30 cm", "1 in a week", or "—" when the packet does not say. */
export function showMeasure(field: MeasureField, cm: number | null, system: UnitSystem): string {
  return cm === null ? '—' : `${formatMeasure('spacing', cm, system)}${RANGES[field].per ?? ''}`;
}

export function shownValue(cm: number | null, system: UnitSystem): number | null {
  return cm === null ? null : toShown('spacing', cm, system);
}

export function storedValue(shown: number | null, system: UnitSystem): number | null {
  return shown === null || !Number.isFinite(shown) ? shown : toStored('spacing', shown, system);
}

/**
 * The range in the shown unit, rounded inwards to a tenth so every value inside it is also inside
 * the stored range after converting (0.4 in, not 0.39 in, is the smallest spacing).
 */
export function shownRange(field: MeasureField, system: UnitSystem): { min: number; max: number } {
  const { minCm, maxCm } = RANGES[field];
  const per = system === 'us' ? 1 / CM_PER_INCH : 1;
  return { min: Math.ceil(minCm * per * 10) / 10, max: Math.floor(maxCm * per * 10) / 10 };
}

/** The problem with a typed value in the shown unit, naming the field and the unit, or null. */
export function measureProblem(field: MeasureField, shown: number | null, system: UnitSystem): string | null {
  if (shown === null) return null;
  const { what } = RANGES[field];
  if (!Number.isFinite(shown)) return `${what} must be a number.`;
  const { min, max } = shownRange(field, system);
  const unit = measureUnit(field, system);
  if (shown < min || shown > max) return `${what} must be from ${min} to ${max} ${unit}.`;
  return null;
}
