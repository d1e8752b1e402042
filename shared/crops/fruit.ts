/**
 * Fruit trees and bushes with the winter chill they need before they leaf out and flower
 * evenly, in chill hours (hours at or below 7.2 °C; SCIENCE §8). Kept apart from the vegetable
 * library: fruit is not planted and harvested in a season. Every range here is a typical spread
 * across varieties as recalled from extension fruit guides (from memory, no source read,
 * confidence L); a variety's own figure from its nursery always comes first.
 */
export interface FruitChill {
  key: string;
  name: string;
  /** Chill hours (≤ 7.2 °C) the range of common varieties needs. */
  chillHours: { min: number; max: number };
  source: string;
  confidence: 'L';
}

const RECALLED = 'Typical range across varieties, recalled from extension fruit guides (from memory, no source read)';

const fruit = (key: string, name: string, min: number, max: number): FruitChill => ({ key, name, chillHours: { min, max }, source: RECALLED, confidence: 'L' });

export const FRUIT_CHILL: readonly FruitChill[] = [
  fruit('apple', 'Apple', 500, 1500),
  fruit('pear', 'Pear', 600, 1500),
  fruit('peach', 'Peach and nectarine', 150, 1200),
  fruit('apricot', 'Apricot', 300, 1000),
  fruit('plum', 'Plum', 400, 1000),
  fruit('sweet-cherry', 'Sweet cherry', 700, 1300),
  fruit('sour-cherry', 'Sour cherry', 800, 1200),
  fruit('highbush-blueberry', 'Northern highbush blueberry', 800, 1000),
  fruit('southern-blueberry', 'Southern highbush blueberry', 150, 600),
  fruit('currant', 'Currant and gooseberry', 800, 1500),
];

export type ChillStatus = 'met' | 'low-chill-met' | 'short';

/** Where a garden's chill hours stand against a fruit's range, in words. */
export function chillStatus(hours: number, need: FruitChill['chillHours']): { status: ChillStatus; words: string } {
  const h = Math.round(hours);
  if (h >= need.max) return { status: 'met', words: 'Enough for every variety in the range' };
  if (h >= need.min) return { status: 'low-chill-met', words: `Enough for lower-chill varieties; ${need.max - h} h more for the highest` };
  return { status: 'short', words: `Not yet: ${need.min - h} h more for the lowest-chill varieties` };
}
