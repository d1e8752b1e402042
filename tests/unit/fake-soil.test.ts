import { describe, expect, it } from 'vitest';
import { addDays } from '#shared/thermal';
import { syntheticDay, syntheticSoil, syntheticSoilHour } from '../../fixtures/weather/generator';

/** The local fake weather service's soil (invented data): it must behave like soil, lagging and damping the air. */
describe('the fake weather service’s soil temperatures', () => {
  const lat = 44.5;
  const lon = -72.8;
  const dates = Array.from({ length: 365 }, (_, k) => addDays('2025-01-01', k));
  const air = dates.map((d) => {
    const x = syntheticDay(lat, lon, d);
    return (x.tmax + x.tmin) / 2;
  });
  const soil = dates.map((d) => syntheticSoil(lat, lon, d));
  const corr = (a: number[], b: number[]) => {
    const ma = a.reduce((s, x) => s + x, 0) / a.length;
    const mb = b.reduce((s, x) => s + x, 0) / b.length;
    let sab = 0;
    let saa = 0;
    let sbb = 0;
    a.forEach((x, i) => {
      sab += (x - ma) * (b[i]! - mb);
      saa += (x - ma) ** 2;
      sbb += (b[i]! - mb) ** 2;
    });
    return sab / Math.sqrt(saa * sbb);
  };
  const steps = (xs: number[]) => xs.slice(1).reduce((s, x, i) => s + Math.abs(x - xs[i]!), 0);

  it('when compared day by day, then soil follows the air of the days before more closely than the days after (a lag)', () => {
    const soilNow = soil.slice(3, -3);
    expect(corr(soilNow, air.slice(1, -5))).toBeGreaterThan(corr(soilNow, air.slice(5, -1)));
  });

  it('when compared over a year, then soil swings less from day to day than the air (damped), and its hours average to its daily mean', () => {
    expect(steps(soil)).toBeLessThan(steps(air) * 0.6);
    const hours = Array.from({ length: 24 }, (_, h) => syntheticSoilHour(12.3, 10, h));
    expect(hours.reduce((s, x) => s + x, 0) / 24).toBeCloseTo(12.3, 1);
    expect(Math.max(...hours) - Math.min(...hours)).toBeLessThan(10 / 2);
  });
});
