import { describe, expect, it } from 'vitest';
import { spreadLabels, weekStepFor } from '@/lib/chart-axes';

describe('threshold keys beside their lines', () => {
  it('when lines are far apart, then each key sits at its own line', () => {
    expect(spreadLabels([40, 120, 200], 15, [0, 300])).toEqual([44, 124, 204]);
  });

  it('when two lines run close, then the keys are pushed a label height apart, in the order given', () => {
    const ys = spreadLabels([102, 100], 15, [0, 300]);
    expect(Math.abs(ys[0] - ys[1])).toBeGreaterThanOrEqual(15);
    expect(ys[1]).toBeLessThan(ys[0]);
  });

  it('when close lines sit at the bottom of the plot, then the keys stay inside it', () => {
    const ys = spreadLabels([298, 299, 300], 15, [0, 300]);
    expect(Math.max(...ys)).toBeLessThanOrEqual(300);
    expect([...ys].sort((a, b) => a - b)).toEqual([270, 285, 300]);
  });
});

describe('date ticks on a narrow chart', () => {
  it('when 46 days must fit four ticks, then the step is two weeks; nine ticks, one week', () => {
    expect(weekStepFor('2026-11-02', '2026-12-17', 4)).toBe(14);
    expect(weekStepFor('2026-11-02', '2026-12-17', 9)).toBe(7);
  });
});
