import type { SoilSowingStatus } from '../thermal/emergence';

/** "about 12 days" (rounded to the day; "about 1 day" at the least). */
export function aboutDays(days: number): string {
  const n = Math.max(1, Math.round(days));
  return `about ${n} day${n === 1 ? '' : 's'}`;
}

/**
 * What a soil temperature means for sowing one crop, in one sentence. `fmt` writes a temperature
 * in the garden's unit ("9 °C"). Cold, wet soil rots the seed of warm-season crops before it
 * comes up: common practice, no source.
 */
export function soilAdviceWords(p: {
  season: 'cool' | 'warm';
  status: SoilSowingStatus;
  emergenceDays: number | null;
  min: number | null;
  max: number | null;
  fmt: (t: number) => string;
}): string {
  const comesUp = p.emergenceDays === null ? null : `comes up in ${aboutDays(p.emergenceDays)}`;
  switch (p.status) {
    case 'too-cold':
      return p.season === 'warm'
        ? `Too cold: below its ${p.fmt(p.min!)} minimum the seed is likely to rot — wait for ${p.fmt(p.min!)}.`
        : `Too cold: below its ${p.fmt(p.min!)} minimum few seeds sprout — wait for ${p.fmt(p.min!)}.`;
    case 'too-warm':
      return `Too warm: above its ${p.fmt(p.max!)} maximum germination suffers — sow in a cooler spell or shade the row.`;
    case 'cool':
      return comesUp ? `Slow but sowable: ${comesUp}.` : 'Slow but sowable: in its range, on the cool side.';
    case 'good':
      return comesUp ? `Good: ${comesUp}.` : 'Good: in its germination range.';
    case 'unknown':
      return comesUp ? `No germination range on record; ${comesUp}.` : 'No germination range on record for this crop.';
  }
}
