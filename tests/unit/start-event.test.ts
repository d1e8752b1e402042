import { describe, expect, it } from 'vitest';
import { firstCountedDay, plantingSeason, startEvent } from '#shared/thermal/start-event';
import type { StartEventPlanting, StartEventVariety } from '#shared/thermal/start-event';

const planting = (p: Partial<StartEventPlanting>): StartEventPlanting => ({ method: 'direct-sow', status: 'growing', sownOn: null, emergedOn: null, transplantedOn: null, ...p });
const variety = (v: Partial<StartEventVariety>): StartEventVariety => ({ dtmDays: 50, dtmFrom: 'sowing', emergenceDaysMin: 4, emergenceDaysMax: 8, ...v });

describe('the start event: one rule for where a planting’s degree days start', () => {
  it('when a crop is sown in place and its packet counts from sowing, then it starts on the sowing day and the packet date is sowing + days', () => {
    const { event } = startEvent(planting({ sownOn: '2026-04-01' }), variety({}));
    expect(event).toMatchObject({ kind: 'sowing', on: '2026-04-01', planned: false, packetDays: 50, packetDate: '2026-05-21' });
    expect(firstCountedDay('2026-04-01')).toBe('2026-04-02');
  });

  it('when the packet counts from emergence, then the days to emergence are added once, and a recorded emergence sets the packet date', () => {
    const v = variety({ dtmFrom: 'emergence' });
    expect(startEvent(planting({ sownOn: '2026-04-01' }), v).event).toMatchObject({ kind: 'sowing', on: '2026-04-01', packetDays: 58, packetDate: '2026-05-29' });
    const emerged = startEvent(planting({ sownOn: '2026-04-01', emergedOn: '2026-04-12' }), v).event!;
    expect(emerged).toMatchObject({ on: '2026-04-01', packetDays: 58, packetDate: '2026-06-01' });
  });

  it('when a bought transplant goes in and its packet counts from transplanting, then it starts on the transplant day', () => {
    const { event } = startEvent(planting({ method: 'transplant', transplantedOn: '2026-05-15' }), variety({ dtmFrom: 'transplant', dtmDays: 65 }));
    expect(event).toMatchObject({ kind: 'transplant', on: '2026-05-15', packetDays: 65, packetDate: '2026-07-19' });
  });

  it('when a crop is started indoors, then days under lights do not count: it starts when transplanted, with its indoor days taken off a seed count', () => {
    const indoor = planting({ method: 'indoor-start', sownOn: '2026-03-01', emergedOn: '2026-03-08', transplantedOn: '2026-04-10' });
    expect(startEvent(indoor, variety({ dtmFrom: 'transplant', dtmDays: 70 })).event).toMatchObject({ kind: 'transplant', on: '2026-04-10', packetDays: 70 });
    // 50 days from sowing, 40 of them indoors: 10 days in the garden's weather.
    expect(startEvent(indoor, variety({ dtmFrom: 'sowing', dtmDays: 50 })).event).toMatchObject({ kind: 'transplant', on: '2026-04-10', packetDays: 10 });
    const waiting = startEvent(planting({ method: 'indoor-start', sownOn: '2026-03-01' }), variety({}));
    expect(waiting.event).toBeNull();
    expect(waiting.reason).toMatch(/not transplanted yet/);
  });

  it('when a planting is planned, then it starts on its planned date and says so', () => {
    expect(startEvent(planting({ status: 'planned', sownOn: '2026-09-01' }), variety({})).event).toMatchObject({ kind: 'sowing', on: '2026-09-01', planned: true });
  });

  it('when an indoor start is sown in June south of the equator and set out in September, then it belongs to the season it grows in', () => {
    const p = planting({ method: 'indoor-start', sownOn: '2026-06-20', transplantedOn: '2026-09-05' });
    expect(plantingSeason(p, variety({ dtmFrom: 'transplant' }), -35)?.label).toBe('2026–27');
    // North of the equator the calendar year is the season either way.
    expect(plantingSeason(p, variety({ dtmFrom: 'transplant' }), 45)?.label).toBe('2026');
    // Not yet set out: no season until it goes into the garden.
    expect(plantingSeason(planting({ method: 'indoor-start', sownOn: '2026-06-20' }), variety({}), -35)).toBeNull();
  });

  it('when a southern direct sowing falls in late June, then it belongs to the season that is ending', () => {
    expect(plantingSeason(planting({ sownOn: '2026-06-30' }), variety({}), -35)?.label).toBe('2025–26');
    expect(plantingSeason(planting({ sownOn: '2026-07-01' }), variety({}), -35)?.label).toBe('2026–27');
  });
});
