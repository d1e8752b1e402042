import { describe, expect, it } from 'vitest';
import {
  assessBoltRisk,
  BOLT_TRIGGER_DEFAULTS,
  boltTriggersOf,
  firstHighBoltRiskDate,
  fToC,
  STRESS_PROFILE_DEFAULTS,
  stressEvents,
} from '#shared/thermal';
import type { BoltRiskInput, DailyTemp } from '#shared/thermal';
import { constantDays } from './thermal-fixtures';

/* Triggers here are test inputs of the heuristic (our own), not sourced crop figures. */
const lettuceLike = { heatThresholdC: 27, heatStreakDays: 3, criticalPhotoperiodH: 14 };
const method = { base: 4.4, method: 'single-sine' as const };

function run(days: DailyTemp[], over: Partial<BoltRiskInput> = {}) {
  return assessBoltRisk({ start: days[0].date, days, latitude: 45, triggers: lettuceLike, method, ...over }).days;
}

describe('bolt risk heuristic (Heatclock’s own; triggers per SCIENCE §3)', () => {
  it('when a hot spell falls in long June days at 45 °N, then risk climbs to high and says why', () => {
    const days = [...constantDays('2025-06-10', 5, 22, 10), ...constantDays('2025-06-15', 4, 31, 17)];
    const out = run(days);
    expect(out[0].level).toBe('elevated');
    const last = out[out.length - 1];
    expect(last.level).toBe('high');
    const messages = last.reasons.map((r) => r.message);
    expect(messages).toContain('4 days in a row with highs above 27 °C');
    expect(messages.some((m) => /^day length 15\.\d h is above the critical 14 h$/.test(m))).toBe(true);
  });

  it('when the same spell comes in short October days, then it stays elevated', () => {
    const out = run(constantDays('2025-10-20', 5, 31, 17));
    expect(out[4].level).toBe('elevated');
    expect(out[4].reasons.map((r) => r.trigger)).toEqual(['heat']);
  });

  it('when the variety is slow-bolting (5 of 5), then the same spell is only elevated, and the reason says so', () => {
    const days = [...constantDays('2025-06-10', 5, 22, 10), ...constantDays('2025-06-15', 4, 31, 17)];
    const slow = run(days, { boltTolerance: 5 });
    const last = slow[slow.length - 1];
    expect(last.level).toBe('elevated');
    expect(last.reasons.find((r) => r.trigger === 'tolerance')?.message).toMatch(/slow-bolting variety \(bolt tolerance 5 of 5\)/);
    expect(run(days, { boltTolerance: 1 })[0].level).toBe('elevated');
  });

  it('when forecast days make the streak, then the reason marks them as forecast', () => {
    const days = [...constantDays('2025-06-15', 2, 31, 17), ...constantDays('2025-06-17', 2, 31, 17, 'forecast')];
    const last = run(days)[3];
    const heat = last.reasons.find((r) => r.trigger === 'heat')!;
    expect(heat.forecast).toBe(true);
    expect(heat.message).toBe('4 days in a row with highs above 27 °C (2 of them forecast)');
    expect(last.forecast).toBe(true);
  });

  it('when a southern garden (40 °S) is in December, then the days are long and count', () => {
    const out = assessBoltRisk({ start: '2025-12-10', days: constantDays('2025-12-10', 3, 20, 10), latitude: -40, triggers: { criticalPhotoperiodH: 14 }, method }).days;
    expect(out[0].reasons[0].message).toMatch(/^day length 14\.\d h is above the critical 14 h$/);
    const june = assessBoltRisk({ start: '2025-06-10', days: constantDays('2025-06-10', 3, 20, 10), latitude: -40, triggers: { criticalPhotoperiodH: 14 }, method }).days;
    expect(june[0].level).toBe('low');
  });

  it('when a biennial meets cold before its juvenile phase ends, then it does not count; after, it does', () => {
    const triggers = { vernalization: { minC: 4, maxC: 10, requiredDays: 10, juvenileGdd: 100 } };
    const bm = { base: 0, method: 'average' as const };
    const youngCold = assessBoltRisk({ start: '2025-03-01', days: constantDays('2025-03-01', 12, 10, 4), latitude: 45, triggers, method: bm }).days;
    expect(youngCold.every((d) => d.level === 'low' && d.reasons.length === 0)).toBe(true);
    const days = [...constantDays('2025-03-01', 10, 20, 10), ...constantDays('2025-03-11', 12, 10, 4)];
    const older = assessBoltRisk({ start: '2025-03-01', days, latitude: 45, triggers, method: bm }).days;
    const last = older[older.length - 1];
    expect(last.level).toBe('elevated');
    expect(last.reasons[0].message).toBe('12 days with a mean between 4 °C and 10 °C after the juvenile phase (100 °C-days); 10 needed');
  });

  it('when the plant nears its degree-day target, then closeness adds to an active trigger', () => {
    const days = constantDays('2025-06-01', 10, 31, 17);
    const far = run(days, { target: 10000 });
    const near = run(days, { target: 200 });
    expect(near[9].score).toBeGreaterThan(far[9].score);
    expect(near[9].reasons.some((r) => r.trigger === 'maturity' && /% of the degree-day target reached/.test(r.message))).toBe(true);
  });

  it('gives the first day projected high, and reports missing days that break a streak', () => {
    const days = [...constantDays('2025-06-15', 2, 31, 17), ...constantDays('2025-06-18', 4, 31, 17, 'forecast')];
    const input = { start: '2025-06-15', days, latitude: 45, triggers: lettuceLike, method };
    expect(assessBoltRisk(input).missingDates).toEqual(['2025-06-17']);
    expect(firstHighBoltRiskDate(input)?.date).toBe('2025-06-20');
  });

  it('ships default triggers with source and confidence on every value (SCIENCE §3 grades)', () => {
    for (const crop of ['spinach', 'lettuce', 'cilantro', 'arugula', 'radish', 'bok choy', 'pea']) {
      const d = BOLT_TRIGGER_DEFAULTS[crop];
      expect(d, crop).toBeDefined();
      for (const v of Object.values(d.triggers)) {
        expect(['from memory', 'L', 'M', 'H']).toContain(v!.confidence);
        expect(v!.source.length).toBeGreaterThan(5);
      }
    }
    expect(boltTriggersOf(BOLT_TRIGGER_DEFAULTS.spinach).criticalPhotoperiodH).toBe(14);
    expect(BOLT_TRIGGER_DEFAULTS.spinach.triggers.criticalPhotoperiodH!.confidence).toBe('M');
  });
});

describe('stress events (SCIENCE §4: NWS freeze categories, Purdue HO-203 classes, Utah/Oklahoma State Ext., UNL CropWatch)', () => {
  const day = (date: string, tmax: number, tmin: number, source: DailyTemp['source'] = 'forecast'): DailyTemp => ({ date, tmax, tmin, source });
  const frostWeek = [
    day('2025-10-01', 15, 5),
    day('2025-10-02', 12, fToC(35)),
    day('2025-10-03', 10, fToC(30)),
    day('2025-10-04', 9, fToC(26)),
    day('2025-10-05', 12, 4),
    day('2025-10-06', 8, fToC(22)),
  ];

  it('classifies frost by °F limits converted exactly and groups consecutive days; a tender crop sees all of it', () => {
    const events = stressEvents(frostWeek, STRESS_PROFILE_DEFAULTS.tomato.profile).filter((e) => e.kind === 'frost');
    expect(events.map((e) => [e.start, e.end, e.severity])).toEqual([
      ['2025-10-02', '2025-10-04', 'moderate'],
      ['2025-10-06', '2025-10-06', 'severe'],
    ]);
    expect(events[0].figures.lowestMinC).toBeCloseTo(fToC(26), 10);
    expect(events[0].figures.thresholdF).toBe(28);
    expect(events[0].message).toMatch(/^moderate freeze: low of -3\.3 °C is at or below -2\.2 °C \(28 °F\)$/);
    // In a °F garden the words carry the published °F figures alone.
    const inF = stressEvents(frostWeek, STRESS_PROFILE_DEFAULTS.tomato.profile, undefined, 'F').filter((e) => e.kind === 'frost');
    expect(inF[0].message).toBe('moderate freeze: low of 26 °F is at or below 28 °F');
    expect(events[1].forecast).toBe(true);
  });

  it('a very hardy crop only hears about a severe freeze; a frost-tolerant one from moderate on', () => {
    expect(stressEvents(frostWeek, { hardiness: 'very-hardy' }).map((e) => e.severity)).toEqual(['severe']);
    expect(stressEvents(frostWeek, { hardiness: 'frost-tolerant' }).map((e) => [e.start, e.severity])).toEqual([
      ['2025-10-04', 'moderate'],
      ['2025-10-06', 'severe'],
    ]);
  });

  it('warm-season crops get chilling below 50 °F (10 °C) after a sustained spell (3 nights, common practice, no source), not a single night', () => {
    const spell = [day('2025-05-01', 20, 11), day('2025-05-02', 18, 9.9), day('2025-05-03', 18, 8), day('2025-05-04', 17, 9), day('2025-05-05', 20, 12), day('2025-05-06', 19, 8), day('2025-05-07', 21, 12)];
    const chill = stressEvents(spell, STRESS_PROFILE_DEFAULTS.pepper.profile).filter((e) => e.kind === 'chilling');
    expect(chill.map((e) => [e.start, e.end])).toEqual([['2025-05-02', '2025-05-04']]);
    expect(chill[0].message).toBe('lows down to 8 °C, below 10 °C (50 °F), 3 days in a row: chilling injury of warm-season crops');
  });

  it('tomato blossom drop needs several (3) days of highs > 85 °F or nights > 70 °F; > 92 °F makes it a warning', () => {
    const hot = [day('2025-07-01', 28, 18), day('2025-07-02', 31, 19), day('2025-07-03', 34, 22), day('2025-07-04', 30, 19), day('2025-07-05', 27, 16)];
    const events = stressEvents(hot, STRESS_PROFILE_DEFAULTS.tomato.profile).filter((e) => e.kind === 'blossom-drop');
    expect(events).toHaveLength(1);
    expect(events[0]).toMatchObject({ start: '2025-07-02', end: '2025-07-04', severity: 'warning', days: 3 });
    const short = stressEvents(hot.slice(0, 3), STRESS_PROFILE_DEFAULTS.tomato.profile).filter((e) => e.kind === 'blossom-drop');
    expect(short).toEqual([]);
  });

  it('sweet corn pollination heat above 95 °F turns to a warning from the 4th straight day (Rees & Hoegemeyer 2019)', () => {
    const days = ['2025-07-20', '2025-07-21', '2025-07-22', '2025-07-23'].map((d) => day(d, 36, 22));
    const [e] = stressEvents(days, STRESS_PROFILE_DEFAULTS['sweet corn'].profile).filter((x) => x.kind === 'pollination-heat');
    expect(e).toMatchObject({ start: '2025-07-20', end: '2025-07-23', severity: 'warning' });
    expect(e.figures.thresholdC).toBeCloseTo(35, 10);
    const three = stressEvents(days.slice(0, 3), STRESS_PROFILE_DEFAULTS['sweet corn'].profile).filter((x) => x.kind === 'pollination-heat');
    expect(three[0].severity).toBe('watch');
  });
});
