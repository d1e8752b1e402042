import { describe, expect, it } from 'vitest';
import { OVERDUE_AFTER_READY_DAYS, STALE_AFTER_DAYS, plantingAttention } from '#shared/plantings/attention';

// The thresholds are common practice, no source (shared/plantings/attention.ts); these check the rule keeps to them.
const growing = { status: 'growing', firstHarvestOn: null, recordedOn: ['2026-06-01'], maturity: { p10: '2026-07-01', p50: '2026-07-05', p90: '2026-07-12', kind: 'analog' } };

describe('overdue harvests and stale plantings', () => {
  it('when a projected window has closed with no harvest, then the planting is overdue from the day after its late end', () => {
    expect(plantingAttention({ ...growing, recordedOn: ['2026-07-10'] }, '2026-07-12').overdue).toBeNull();
    expect(plantingAttention({ ...growing, recordedOn: ['2026-07-10'] }, '2026-07-13').overdue).toEqual({ due: '2026-07-12', days: 1 });
  });

  it('when a harvest is on record, or the planting is no longer growing, then nothing is overdue', () => {
    expect(plantingAttention({ ...growing, firstHarvestOn: '2026-07-11' }, '2026-08-01').overdue).toBeNull();
    expect(plantingAttention({ ...growing, status: 'harvested' }, '2026-08-01')).toEqual({ overdue: null, stale: null });
  });

  it(`when the target was reached in recorded weather, then it is overdue ${OVERDUE_AFTER_READY_DAYS} days later`, () => {
    const reached = { ...growing, recordedOn: ['2026-07-20'], maturity: { p10: '2026-07-05', p50: '2026-07-05', p90: '2026-07-05', kind: 'observed' } };
    expect(plantingAttention(reached, '2026-07-12').overdue).toBeNull();
    expect(plantingAttention(reached, '2026-07-13').overdue).toEqual({ due: '2026-07-12', days: 1 });
  });

  it(`when nothing has been recorded for more than ${STALE_AFTER_DAYS} days, then the planting is stale, counted from its latest record`, () => {
    const p = { ...growing, recordedOn: ['2026-05-01', '2026-06-01', null] };
    expect(plantingAttention(p, '2026-06-22').stale).toBeNull();
    expect(plantingAttention(p, '2026-06-23').stale).toEqual({ lastOn: '2026-06-01', days: 22 });
    // A record dated ahead of today (a planned transplant) does not count as recent.
    expect(plantingAttention({ ...p, recordedOn: [...p.recordedOn, '2026-07-01'] }, '2026-06-23').stale).toEqual({ lastOn: '2026-06-01', days: 22 });
  });
});
