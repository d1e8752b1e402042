import { describe, expect, it } from 'vitest';
import {
  addDays,
  assessBoltRisk,
  dailyDegreeDays,
  degreeDayTargetFromDtm,
  frostDates,
  prepareSowingSweep,
  projectMaturity,
  recalibrateTarget,
  seasonCandidates,
  sowingWindowSweep,
} from '#shared/thermal';
import type { DailyTemp, DegreeDayMethod } from '#shared/thermal';
import { constantDays, noaaDaily, syntheticWeather } from './thermal-fixtures';

const method: DegreeDayMethod = { base: 4.4, upper: 30, method: 'double-sine' };

describe('maturity projection: observed, then forecast, then analog years', () => {
  const history = syntheticWeather('2014-01-01', 365 * 11 + 3, { seed: 11 });

  it('uses observed then forecast days, then one scenario per past year, with p10 ≤ p50 ≤ p90', () => {
    const observed = history.filter((d) => d.date >= '2024-04-01' && d.date <= '2024-04-20');
    const forecast = constantDays('2024-04-21', 7, 18, 8, 'forecast');
    const p = projectMaturity({ start: '2024-04-01', target: 700, method, observed, forecast, history: history.filter((d) => d.date < '2024-01-01'), latitude: 45, cutoffDate: '2024-10-15' });
    expect(p.knownThrough).toBe('2024-04-27');
    expect(p.missingDates).toEqual([]);
    expect(p.accumulated).toBeGreaterThan(0);
    expect(p.scenarios.map((s) => s.season)).toEqual(['2023', '2022', '2021', '2020', '2019', '2018', '2017', '2016', '2015', '2014']);
    expect(p.scenarios[0].analogStart).toBe('2023-04-28');
    expect(p.window.p10! <= p.window.p50! && p.window.p50! <= p.window.p90!).toBe(true);
    expect(p.neverMatureFraction).toBe(0);
  });

  it('an analog year with a gap before maturity is skipped and reported, and missing known days are listed', () => {
    const gappy = history.filter((d) => d.date !== '2022-05-10' && d.date < '2024-01-01');
    const observed = history.filter((d) => d.date >= '2024-04-01' && d.date <= '2024-04-20' && d.date !== '2024-04-05');
    const p = projectMaturity({ start: '2024-04-01', target: 700, method, observed, history: gappy, latitude: 45 });
    expect(p.missingDates).toEqual(['2024-04-05']);
    expect(p.skippedSeasons).toEqual([{ season: '2022', reason: 'history has no temperature for 2022-05-10' }]);
  });

  it('a cut-off counts scenarios that mature after it as never', () => {
    const p = projectMaturity({ start: '2024-09-01', target: 600, method, observed: [], history: history.filter((d) => d.date < '2024-01-01'), latitude: 45, cutoffDate: '2024-10-01' });
    expect(p.neverMatureFraction).toBe(1);
    expect(p.scenarios.every((s) => !s.beforeCutoff)).toBe(true);
  });

  it('south (35 °S): a season crossing New Year continues through each analog’s own January', () => {
    const south = syntheticWeather('2012-07-01', 365 * 8 + 2, { seed: 5, southern: true });
    const p = projectMaturity({ start: '2020-11-01', target: 900, method, observed: [], history: south, latitude: -35 });
    // The analog continues from the first counted day, the day after the start event.
    expect(p.scenarios[0]).toMatchObject({ season: '2019–20', analogStart: '2019-11-02' });
    expect(p.scenarios.map((s) => s.season)).toContain('2012–13');
    for (const s of p.scenarios) expect(s.maturityDate! > '2020-12-01' && s.maturityDate! < '2021-04-01').toBe(true);
  });

  it('Feb 29: an analog year without it starts on Feb 28', () => {
    const flat = constantDays('2019-01-01', 400, 20, 20);
    // Sown on Feb 28, so Feb 29 is the first counted day.
    const p = projectMaturity({ start: '2020-02-28', target: 100, method: { base: 10, method: 'average' }, observed: [], history: flat.filter((d) => d.date < '2020-01-01'), latitude: 45 });
    expect(p.scenarios).toEqual([{ season: '2019', analogStart: '2019-02-28', maturityDate: '2020-03-09', beforeCutoff: true }]);
  });
});

describe('days to maturity → degree-day target, and recalibration', () => {
  const history = syntheticWeather('2014-01-01', 365 * 10 + 2, { seed: 2 });
  const m: DegreeDayMethod = { base: 4.4, method: 'single-sine' };

  it('constant weather: 50 days of 10 °C-days → 500; counting from emergence adds the days to emergence (common practice, no source)', () => {
    const flat = constantDays('2015-01-01', 800, 14.4, 14.4);
    const base = { history: flat, method: m, window: { from: '04-01', to: '04-30' } };
    expect(degreeDayTargetFromDtm({ ...base, daysToMaturity: 50, countsFrom: 'sowing' }).target).toBeCloseTo(500, 9);
    const e = degreeDayTargetFromDtm({ ...base, daysToMaturity: 50, countsFrom: 'emergence', daysToEmergence: 7 });
    expect(e).toMatchObject({ countsFrom: 'sowing', days: 57 });
    expect(e.target).toBeCloseTo(570, 9);
    expect(degreeDayTargetFromDtm({ ...base, daysToMaturity: 50, countsFrom: 'transplant' }).countsFrom).toBe('transplant');
    expect(() => degreeDayTargetFromDtm({ ...base, daysToMaturity: 50, countsFrom: 'emergence' })).toThrow(/daysToEmergence/);
  });

  it('a later sowing window in spring needs more degree days for the same packet days', () => {
    const early = degreeDayTargetFromDtm({ history, method: m, daysToMaturity: 55, countsFrom: 'sowing', window: { from: '03-15', to: '04-05' } });
    const late = degreeDayTargetFromDtm({ history, method: m, daysToMaturity: 55, countsFrom: 'sowing', window: { from: '05-15', to: '06-05' } });
    expect(late.target).toBeGreaterThan(early.target);
    expect(early.p10).toBeLessThanOrEqual(early.p90);
  });

  it('southern window wrapping New Year (35 °S, Nov 15 – Jan 15)', () => {
    const south = syntheticWeather('2012-07-01', 365 * 6, { seed: 9, southern: true });
    const t = degreeDayTargetFromDtm({ history: south, method: m, daysToMaturity: 60, countsFrom: 'sowing', window: { from: '11-15', to: '01-15' } });
    expect(t.samples).toBeGreaterThan(200);
  });

  it('recalibration: the prior counts as three harvests, the records by their median (our own rule)', () => {
    expect(recalibrateTarget(500, []).target).toBe(500);
    expect(recalibrateTarget(500, [600, 620, 580]).target).toBeCloseTo((3 * 500 + 3 * 600) / 6, 9);
    expect(recalibrateTarget(500, [600, 620, 5000]).observedMedian).toBe(620);
    expect(() => recalibrateTarget(500, [0])).toThrow(/observedToHarvest\[0\]/);
  });
});

describe('sowing-window sweep', () => {
  const triggers = { heatThresholdC: 24, heatStreakDays: 2, criticalPhotoperiodH: 14.5 };

  /** Day-by-day re-simulation per candidate and analog year, through the public functions. */
  function bruteForce(history: DailyTemp[], sow: string, target: number, latitude: number, windowDays: number, cutoffMonthDay: string) {
    const fallFrosts = frostDates(history, latitude).seasons.map((x) => x.firstFallFrost).filter((d): d is string => d !== null);
    const byDate = new Map(history.map((d) => [d.date, d]));
    const offsets: number[] = [];
    let high = 0;
    let miss = 0;
    for (let y = 1; y < 40; y++) {
      const year = Number(sow.slice(0, 4)) - y;
      let start = `${year}${sow.slice(4)}`;
      if (sow.slice(5) === '02-29' && !(year % 4 === 0 && (year % 100 !== 0 || year % 400 === 0))) start = `${year}-02-28`;
      if (!byDate.has(start)) continue;
      let cum = 0;
      let k = 0;
      let matured = -1;
      // The sowing day is day 0; degree days count from the next day (start-event.ts).
      for (k = 1; k <= 366; k++) {
        const d = byDate.get(addDays(start, k));
        if (!d) break;
        const next = byDate.get(addDays(start, k + 1));
        cum += dailyDegreeDays(d.tmax, d.tmin, { ...method, tminNext: next?.tmin });
        if (cum >= target - 1e-9) {
          matured = k;
          break;
        }
      }
      if (matured < 0 && k <= 366) continue;
      offsets.push(matured < 0 ? Infinity : matured);
      if (matured >= 0) {
        const from = addDays(start, matured - 30);
        const span = history.filter((d) => d.date >= from && d.date < addDays(start, matured + windowDays));
        const risk = assessBoltRisk({ start: from, days: span, latitude, triggers, method, target: 1e-6 }).days;
        if (risk.some((r) => r.date >= addDays(start, matured) && r.level === 'high')) high++;
      }
      if (cutoffMonthDay === 'first-fall-frost') {
        const frost = fallFrosts.find((d) => d >= start);
        if (matured < 0 || (frost && addDays(start, matured) >= frost)) miss++;
      } else {
        const sameYear = `${sow.slice(0, 4)}-${cutoffMonthDay}`;
        const cutoff = sameYear < sow ? `${Number(sow.slice(0, 4)) + 1}-${cutoffMonthDay}` : sameYear;
        if (matured < 0 || addDays(sow, matured) > cutoff) miss++;
      }
    }
    offsets.sort((a, b) => a - b);
    const pick = (p: number) => {
      const v = offsets[Math.max(1, Math.ceil((p / 100) * offsets.length)) - 1];
      return Number.isFinite(v) ? v : null;
    };
    return { n: offsets.length, p10: pick(10), p50: pick(50), p90: pick(90), high: high / offsets.length, miss: miss / offsets.length };
  }

  for (const [name, latitude, southern, from, to, cutoff] of [
    ['north 45 °N, spring to summer sowings incl. Feb 29', 45, false, '2024-02-25', '2024-07-15', '09-20'],
    ['south 35 °S, spring sowings across New Year', -35, true, '2024-09-01', '2025-01-20', '03-31'],
    ['south 35 °S, late sowings against each analog year’s own first fall frost', -35, true, '2024-12-01', '2025-04-10', 'first-fall-frost'],
  ] as const) {
    it(`agrees with brute-force re-simulation: ${name}`, () => {
      const start = southern ? '2012-07-01' : '2012-01-01';
      const history = syntheticWeather(start, southern ? 365 * 12 + 3 : 365 * 12 + 3, { seed: 21, southern });
      const clim = prepareSowingSweep({ history, latitude, method, triggers });
      const sweep = sowingWindowSweep(clim, { from, to, target: 500, harvestWindowDays: 7, cutoff: cutoff === 'first-fall-frost' ? cutoff : { monthDay: cutoff } });
      const step = 9;
      for (let i = 0; i < sweep.candidates.length; i += step) {
        const c = sweep.candidates[i];
        const b = bruteForce(history, c.sowDate, 500, latitude, 7, cutoff);
        expect({ sow: c.sowDate, n: c.analogYears, ...c.maturityDays, high: c.highBoltShare, miss: c.missCutoffShare }).toEqual({ sow: c.sowDate, ...b });
      }
      expect(sweep.candidates.some((c) => c.highBoltShare > 0 || c.missCutoffShare > 0)).toBe(true);
    });
  }

  it('NOAA Seattle (vega-datasets): later spring sowings mature sooner, and maturity dates follow the sowing date', () => {
    const clim = prepareSowingSweep({ history: noaaDaily('Seattle'), latitude: 47.6, method: { base: 4.4, method: 'single-sine' }, triggers: BOLT_LIKE });
    const { candidates } = sowingWindowSweep(clim, { from: '2016-03-01', to: '2016-06-30', target: 600, cutoff: 'first-fall-frost' });
    const march = candidates.find((c) => c.sowDate === '2016-03-01')!;
    const june = candidates.find((c) => c.sowDate === '2016-06-01')!;
    expect(march.analogYears).toBe(4);
    expect(march.maturityDays.p50!).toBeGreaterThan(june.maturityDays.p50!);
    expect(march.maturity.p50).toBe(addDays('2016-03-01', march.maturityDays.p50!));
    expect(candidates.every((c) => c.missCutoffShare === 0)).toBe(true);
  });

  it('a season with missing autumn days keeps its own seen frost as the cut-off, never the next year’s', () => {
    // Hand-built: 20/8 °C every day (9.6 °C-days at base 4.4, simple average), a −2 °C low each
    // 10 October, and 2019 missing from 10 November to the year's end (its fall half is then
    // incomplete, so the frost-date statistics leave it out).
    const flat: DegreeDayMethod = { base: 4.4, method: 'average' };
    const history = constantDays('2014-01-01', 365 * 7 + 1, 20, 8)
      .map((d) => (d.date.slice(5) === '10-10' ? { ...d, tmin: -2 } : d))
      .filter((d) => !(d.date >= '2019-11-10' && d.date <= '2019-12-31'));
    const clim = prepareSowingSweep({ history, latitude: 45, method: flat });
    // Sown 20 September: 34 days of 9.6 and the frosty day's (20 − 2) / 2 − 4.4 = 4.6 make 331
    // °C-days on day 35 (25 October), after that year's frost.
    const [c] = sowingWindowSweep(clim, { from: '2021-09-20', to: '2021-09-20', target: 331, cutoff: 'first-fall-frost' }).candidates;
    expect(c.maturityDays.p50).toBe(35);
    expect(c.analogYears).toBe(7);
    // Every analog year, 2019 included, had its frost on 10 October, before the harvest.
    expect(c.missCutoffShare).toBe(1);
  });

  it('plans a whole season; at 35 °S that is July–June', () => {
    expect(seasonCandidates('2025-03-01', -35)).toEqual({ from: '2024-07-01', to: '2025-06-30' });
  });
});

const BOLT_LIKE = { heatThresholdC: 27, criticalPhotoperiodH: 14 };
