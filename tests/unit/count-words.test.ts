import { describe, expect, it } from 'vitest';
import { countOf } from '#shared/format/count-words';

describe('counts in words', () => {
  it('when there is one, none or many, then the noun takes its English form and the number is grouped', () => {
    expect(countOf(1, 'problem')).toBe('1 problem');
    expect(countOf(0, 'problem')).toBe('0 problems');
    expect(countOf(2, 'problem')).toBe('2 problems');
    expect(countOf(1250, 'planting')).toBe('1,250 plantings');
    expect(countOf(1, 'planting was', 'plantings were')).toBe('1 planting was');
    expect(countOf(3, 'planting was', 'plantings were')).toBe('3 plantings were');
  });
});
