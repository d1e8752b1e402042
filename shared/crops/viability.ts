/**
 * A rough viability reading for a seed lot: a germination test when there is a recent one,
 * else the lot's age against the crop's seed life under good storage (Iowa State Ext. 1999
 * from Knott's, SCIENCE §7). Age counts seasons since the packed-for year. Estimates only.
 */
import type { ViabilityDto } from '../schemas/seed-lots';

export interface ViabilityInput {
  packedForYear: number | null;
  currentYear: number;
  seedLifeYears: number | null;
  latestTest: { testedOn: string; percent: number } | null;
}

/** A test older than this many years no longer speaks for the lot. */
const TEST_FRESH_YEARS = 1;

export function estimateViability({ packedForYear, currentYear, seedLifeYears, latestTest }: ViabilityInput): ViabilityDto {
  const ageYears = packedForYear === null ? null : Math.max(0, currentYear - packedForYear);
  const base = { ageYears, seedLifeYears };
  if (latestTest && currentYear - Number(latestTest.testedOn.slice(0, 4)) <= TEST_FRESH_YEARS) {
    const pct = Math.round(latestTest.percent);
    return {
      ...base,
      status: 'tested',
      message: `Germination test on ${latestTest.testedOn}: ${pct} % germinated. Sow extra seed in proportion.`,
    };
  }
  if (ageYears === null || seedLifeYears === null) {
    return {
      ...base,
      status: 'unknown',
      message:
        ageYears === null
          ? 'No packed-for year: run a germination test to know how much to sow.'
          : 'No seed-life figure for this crop: run a germination test to know how much to sow.',
    };
  }
  if (ageYears < seedLifeYears) {
    return { ...base, status: 'fresh', message: `${ageYears} of about ${seedLifeYears} years of seed life used (good storage). Expect normal germination.` };
  }
  if (ageYears === seedLifeYears) {
    return { ...base, status: 'ageing', message: `At the end of its typical ${seedLifeYears}-year seed life: germination may be falling. A test before sowing is worthwhile.` };
  }
  return {
    ...base,
    status: 'past-seed-life',
    message: `${ageYears} years old, past the typical ${seedLifeYears}-year seed life: run a germination test before relying on it.`,
  };
}
