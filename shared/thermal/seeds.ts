/** Germination test (Iowa State / Nebraska Ext. procedure, SCIENCE §7): germinated ÷ tested × 100. */
export function germinationPercent(germinated: number, tested: number): number {
  if (!Number.isInteger(tested) || tested < 1) throw new RangeError(`tested (${tested}) must be a whole number ≥ 1`);
  if (!Number.isInteger(germinated) || germinated < 0 || germinated > tested) {
    throw new RangeError(`germinated (${germinated}) must be a whole number from 0 to tested (${tested})`);
  }
  return (germinated / tested) * 100;
}

/**
 * Seeds to sow = ceil(plants ÷ (germination fraction × field-emergence factor)) (SCIENCE §7):
 * 100 plants at 75 % → 134; with a 0.8 emergence factor → 167.
 */
export function seedsToSow(plantsWanted: number, germinationPercent: number, emergenceFactor = 1): number {
  if (!Number.isInteger(plantsWanted) || plantsWanted < 0) {
    throw new RangeError(`plantsWanted (${plantsWanted}) must be a whole number ≥ 0`);
  }
  if (!Number.isFinite(germinationPercent) || germinationPercent <= 0 || germinationPercent > 100) {
    throw new RangeError(`germinationPercent (${germinationPercent}) must be above 0 and at most 100`);
  }
  if (!Number.isFinite(emergenceFactor) || emergenceFactor <= 0 || emergenceFactor > 1) {
    throw new RangeError(`emergenceFactor (${emergenceFactor}) must be above 0 and at most 1`);
  }
  // Rounded before ceil so 100 ÷ 0.75 = 133.33… is not pushed up by a float ending …0001.
  return Math.ceil(Math.round((plantsWanted / ((germinationPercent / 100) * emergenceFactor)) * 1e9) / 1e9);
}
