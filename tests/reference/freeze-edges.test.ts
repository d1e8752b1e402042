import { describe, expect, it } from 'vitest';
import { fToC, stressEvents } from '#shared/thermal/index';
import type { DailyTemp } from '#shared/thermal/index';

const night = (tmin: number): DailyTemp[] => [{ date: '2025-04-10', tmax: 12, tmin, source: 'observed' }];
/** A tender crop hears every frost category, so the grade alone is read. */
const grade = (tminC: number) => stressEvents(night(tminC), { hardiness: 'tender' }).find((e) => e.kind === 'frost')?.severity ?? null;
/** The same °F reading by another float path than fToC: the ±40 trick gives a last-bit-warmer °C. */
const viaMinus40 = (f: number) => ((f + 40) * 5) / 9 - 40;

describe('freeze categories on their °F edges', () => {
  // NWS climatological freeze categories (SCIENCE §4, from memory, M): light 29–32 °F, moderate
  // 25–28 °F, severe ≤ 24 °F; frost can form on plants at shelter lows of 33–36 °F (M).
  const cases: [number, string | null][] = [
    [24, 'severe'],
    [24.01, 'moderate'],
    [28, 'moderate'],
    [28.01, 'light'],
    [32, 'light'],
    [32.01, 'possible'],
    [36, 'possible'],
    [36.01, null],
  ];

  for (const [f, expected] of cases) {
    it(`when the low is ${f} °F converted with fToC, then it grades ${expected ?? 'no frost'} (NWS categories, SCIENCE §4)`, () => {
      expect(grade(fToC(f))).toBe(expected);
    });
  }

  it('when an edge low arrives by another float path, then it still grades on the edge (NWS: severe ≤ 24 °F)', () => {
    expect(viaMinus40(24)).toBeGreaterThan(fToC(24));
    expect(grade(viaMinus40(24))).toBe('severe');
    expect(grade((24 - 32) * (5 / 9))).toBe('severe');
    expect(grade(viaMinus40(28))).toBe('moderate');
    expect(grade(viaMinus40(32))).toBe('light');
    expect(grade(viaMinus40(36))).toBe('possible');
  });
});
