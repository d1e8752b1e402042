import { describe, expect, it } from 'vitest';
import { shortestCircularSpan } from '../../server/modules/varieties/variety-target';

describe('the start window of a variety from its own plantings', () => {
  it('when starts fall in spring, then the window runs from the first to the last', () => {
    expect(shortestCircularSpan(['04-20', '03-15', '05-01'])).toEqual({ from: '03-15', to: '05-01' });
  });
  it('when starts straddle New Year (a southern summer), then the window wraps instead of spanning the year', () => {
    expect(shortestCircularSpan(['11-20', '01-05', '12-10'])).toEqual({ from: '11-20', to: '01-05' });
  });
  it('when there is one start or none, then the window is that day or nothing', () => {
    expect(shortestCircularSpan(['06-01'])).toEqual({ from: '06-01', to: '06-01' });
    expect(shortestCircularSpan([])).toBeNull();
  });
});
