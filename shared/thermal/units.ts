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
