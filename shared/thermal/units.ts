/** °C → °F for a temperature reading. */
export function cToF(c: number): number {
  return c * 1.8 + 32;
}

/** °F → °C for a temperature reading. */
export function fToC(f: number): number {
  return (f - 32) / 1.8;
}

/** A temperature difference (or a threshold offset) in °C expressed in °F: no 32 offset. */
export function cDeltaToF(c: number): number {
  return c * 1.8;
}

/** A temperature difference in °F expressed in °C. */
export function fDeltaToC(f: number): number {
  return f / 1.8;
}

/** °C-days → °F-days; exact for every method when thresholds are converted too (SCIENCE §0). */
export function cDaysToFDays(cDays: number): number {
  return cDays * 1.8;
}

/** °F-days → °C-days. */
export function fDaysToCDays(fDays: number): number {
  return fDays / 1.8;
}

export type TempUnit = 'C' | 'F';

/** A stored °C reading in the display unit. */
export function tempIn(c: number, unit: TempUnit): number {
  return unit === 'F' ? cToF(c) : c;
}

/** Stored °C-days in the display unit's degree days (°F-days or °C-days). */
export function degreeDaysIn(cDays: number, unit: TempUnit): number {
  return unit === 'F' ? cDaysToFDays(cDays) : cDays;
}

const oneDecimal = (x: number) => String(Number(x.toFixed(1)));

/** "80 °F", "26.7 °C": a reading for people, one decimal at most. */
export function formatTemp(c: number, unit: TempUnit): string {
  return `${oneDecimal(tempIn(c, unit))} °${unit}`;
}

/** "412 °F-days": whole degree days for people. */
export function formatDegreeDays(cDays: number, unit: TempUnit): string {
  return `${Math.round(degreeDaysIn(cDays, unit))} °${unit}-days`;
}
