/**
 * The counting method a stored degree-day figure was measured with. A figure in °C-days only
 * means something at the base, upper threshold, method and cutoff it was counted with: 500
 * °C-days at base 4.4 °C is a later date than 500 °C-days at base 7 °C. So every stored figure
 * keeps its basis, and one whose basis differs from the crop's current method is not reused.
 *
 * Rows stored before the basis was recorded have none; they are read as measured with the
 * crop's library default method, the only method the app offered until owners changed it.
 */
import { formatTemp } from '../thermal/units';
import type { CropDefinition, CropParamValues, ParamValue } from './params';

export interface DegreeDayBasis {
  baseC: number;
  upperC: number | null;
  method: ParamValue<'method'>;
  cutoff: ParamValue<'cutoff'>;
}

/** Columns as stored: all null when no basis was recorded. */
export interface StoredBasis {
  baseC: number | null;
  upperC: number | null;
  method: ParamValue<'method'> | null;
  cutoff: ParamValue<'cutoff'> | null;
}

/** Stored temperatures are doubles and library bases are exact conversions (40 °F = 4.444… °C). */
const SAME_C = 1e-6;

export function basisOfValues(values: Pick<CropParamValues, 'baseC' | 'upperC' | 'method' | 'cutoff'>): DegreeDayBasis {
  if (values.baseC === null) throw new RangeError('baseC is not set: degree days need a base temperature');
  return { baseC: values.baseC, upperC: values.upperC, method: values.method, cutoff: values.cutoff };
}

export function libraryBasis(crop: CropDefinition): DegreeDayBasis {
  const p = crop.params;
  return basisOfValues({ baseC: p.baseC.value, upperC: p.upperC.value, method: p.method.value, cutoff: p.cutoff.value });
}

export function recordedBasis(stored: StoredBasis): DegreeDayBasis | null {
  if (stored.baseC === null || stored.method === null || stored.cutoff === null) return null;
  return { baseC: stored.baseC, upperC: stored.upperC, method: stored.method, cutoff: stored.cutoff };
}

const close = (a: number, b: number) => Math.abs(a - b) <= SAME_C;

/** The cutoff only shapes the count above an upper threshold, so without one it does not matter. */
export function sameBasis(a: DegreeDayBasis, b: DegreeDayBasis): boolean {
  if (!close(a.baseC, b.baseC) || a.method !== b.method) return false;
  if (a.upperC === null || b.upperC === null) return a.upperC === b.upperC;
  return close(a.upperC, b.upperC) && a.cutoff === b.cutoff;
}

/** e.g. "base 40 °F, single sine" or "base 50 °F, upper 86 °F, single sine, horizontal cutoff". */
export function basisWords(basis: DegreeDayBasis, units: 'C' | 'F'): string {
  const method = basis.method.replace('-', ' ');
  if (basis.upperC === null) return `base ${formatTemp(basis.baseC, units)}, ${method}`;
  return `base ${formatTemp(basis.baseC, units)}, upper ${formatTemp(basis.upperC, units)}, ${method}, ${basis.cutoff} cutoff`;
}
