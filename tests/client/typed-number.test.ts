import { describe, expect, it } from 'vitest';
import { parseTypedNumber } from '@/lib/typed-number';

describe('a figure a grower typed', () => {
  it('when it has a decimal point or comma, then both read the same', () => {
    expect(parseTypedNumber(' 1.5 ')).toBe(1.5);
    expect(parseTypedNumber('1,5')).toBe(1.5);
    expect(parseTypedNumber('.5')).toBe(0.5);
  });
  it('when it is blank, then it is no figure; when it is not a plain decimal, then it is refused', () => {
    expect(parseTypedNumber('   ')).toBeNull();
    for (const t of ['five', '1e3', '0x10', '2.5.1', '+5', '-3']) expect(parseTypedNumber(t)).toBeNaN();
  });
  it('when negative figures make sense, then a hyphen or a typographic minus both read as minus', () => {
    expect(parseTypedNumber('-3', { negative: true })).toBe(-3);
    expect(parseTypedNumber('−2,5', { negative: true })).toBe(-2.5);
    expect(parseTypedNumber('--3', { negative: true })).toBeNaN();
  });
});
