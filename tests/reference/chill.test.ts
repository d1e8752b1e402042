import { readFileSync } from 'node:fs';
import path from 'node:path';
import { parse } from 'csv-parse/sync';
import { describe, expect, it } from 'vitest';
import { chillOfHours, chillSeasonOf, dayLengthHours, estimatedHours, isChillHour, linvillHours, utahWeight } from '#shared/thermal';
import type { DailyTemp } from '#shared/thermal';

const day = (date: string, tmax: number, tmin: number): DailyTemp => ({ date, tmax, tmin, source: 'observed' });

describe('Utah chill units (Richardson, Seeley & Walker 1974, HortScience 9(4):331, via SCIENCE §8)', () => {
  it.each([
    [-5, 0], [1.4, 0], [1.5, 0.5], [2.4, 0.5], [2.5, 1], [7.2, 1], [9.1, 1], [9.2, 0.5], [12.4, 0.5],
    [12.5, 0], [15.9, 0], [16, -0.5], [18, -0.5], [18.1, -1], [30, -1],
  ])('when an hour is %s °C, then it weighs %s', (t, w) => {
    expect(utahWeight(t)).toBe(w);
  });

  it('when hand-built hours are summed, then the total is the sum of the published weights, never below zero', () => {
    // 10 h at 5 °C (1 each), 4 h at 10 °C (0.5), 3 h at 20 °C (−1), 2 h at 2 °C (0.5): 10 + 2 − 3 + 1 = 10.
    const hours = [...Array(10).fill(5), ...Array(4).fill(10), ...Array(3).fill(20), ...Array(2).fill(2)];
    expect(chillOfHours(hours).utahUnits).toBe(10);
    // Warm hours first leave no debt: 5 h at 25 °C then 3 h at 5 °C gives 3, not −2.
    expect(chillOfHours([...Array(5).fill(25), ...Array(3).fill(5)]).utahUnits).toBe(3);
  });

  it('when hours are at or below 7.2 °C (45 °F; Weinberger 1950), then they are chill hours, and 7.3 °C is not', () => {
    expect(isChillHour(7.2)).toBe(true);
    expect(isChillHour(7.3)).toBe(false);
    expect(chillOfHours([0, 7.2, 7.3, 12]).hoursAtOrBelow7C).toBe(2);
  });
});

describe('hourly temperatures from daily highs and lows (Linvill 1990, HortScience 25(1):14; form from memory)', () => {
  const lat = 40;
  const date = '2025-01-15';
  const hours = linvillHours(lat, date, day(date, 12, 0), day('2025-01-14', 12, 0), day('2025-01-16', 12, 0));
  const dl = dayLengthHours(lat, date);
  const sunrise = 12 - dl / 2;
  const sunset = 12 + dl / 2;

  it('when a day is 0–12 °C, then the hours stay within 0 and 12 °C and the warmest hour is about 2 h after solar noon', () => {
    expect(Math.min(...hours)).toBeGreaterThanOrEqual(0 - 1e-9);
    expect(Math.max(...hours)).toBeLessThanOrEqual(12 + 1e-9);
    const warmest = hours.indexOf(Math.max(...hours));
    // The sine over DL + 4 peaks at sunrise + (DL + 4) / 2 = 14:00 solar time.
    expect(warmest).toBe(14);
    expect(hours[14]).toBeGreaterThan(11.9);
  });

  it('when the night falls, then the curve is continuous at sunset and falls, ever more slowly, to the next low at sunrise', () => {
    const tAtSunset = 0 + 12 * Math.sin((Math.PI * (sunset - sunrise)) / (dl + 4));
    const firstNightHour = Math.ceil(sunset);
    // Within the first hour after sunset the curve holds the sunset temperature (ln 1 = 0).
    if (firstNightHour - sunset <= 1) expect(hours[firstNightHour]).toBeCloseTo(tAtSunset, 6);
    const night = hours.slice(firstNightHour, 24);
    for (let i = 1; i < night.length; i++) expect(night[i]).toBeLessThanOrEqual(night[i - 1] + 1e-9);
    const drops = night.slice(1).map((t, i) => night[i] - t);
    for (let i = 2; i < drops.length; i++) expect(drops[i]).toBeLessThanOrEqual(drops[i - 1] + 1e-9);
    // Before sunrise the previous night continues and is lowest just before the sun is up.
    const beforeSunrise = hours.slice(0, Math.floor(sunrise) + 1);
    expect(Math.min(...beforeSunrise)).toBeLessThan(1.5);
    expect(hours[Math.floor(sunrise)]).toBeLessThanOrEqual(hours[0]);
  });
});

describe('chill estimated from daily highs and lows against hourly NOAA normals (vega-datasets seattle-weather-hourly-normals.csv, NOAA 1981–2010, U.S. Government work)', () => {
  const file = path.join(process.cwd(), 'node_modules', 'vega-datasets', 'data', 'seattle-weather-hourly-normals.csv');
  const rows = parse(readFileSync(file, 'utf8'), { columns: true }) as { date: string; temperature: string }[];
  const SEATTLE_LAT = 47.45; // Seattle–Tacoma airport, NOAA station (from memory)
  // The normals are one year (2010 labels); the winter is Oct–Dec joined to Jan–Apr of the same normal year.
  const inWinter = (d: string) => d.slice(5, 7) >= '10' || d.slice(5, 7) <= '04';
  const hourly = rows.filter((r) => inWinter(r.date)).map((r) => ({ date: r.date.slice(0, 10), t: Number(r.temperature) }));
  const byDay = new Map<string, number[]>();
  for (const h of hourly) byDay.set(h.date, [...(byDay.get(h.date) ?? []), h.t]);
  // The estimate runs in the same order: October to December first, then January to April.
  const ordered = [...byDay].sort(([a], [b]) => (a.slice(5) >= '10' ? '0' : '1').localeCompare(b.slice(5) >= '10' ? '0' : '1') || a.localeCompare(b));
  const days = ordered.filter(([, ts]) => ts.length >= 20).map(([date, ts]) => day(date, Math.max(...ts), Math.min(...ts)));

  it('when the winter’s chill is counted both ways, then Linvill’s estimate is within 10 % of the hourly count (difference reported)', () => {
    const measured = chillOfHoursOfDays(days.map((d) => d.date), hourly);
    const estimated = chillOfHours(estimatedHours(SEATTLE_LAT, days));
    const diffHours = estimated.hoursAtOrBelow7C - measured.hoursAtOrBelow7C;
    const diffUtah = estimated.utahUnits - measured.utahUnits;
    console.info(
      `chill, Seattle normals, ${days.length} winter days: hourly ${measured.hoursAtOrBelow7C} h ≤ 7.2 °C and ${measured.utahUnits} Utah units; ` +
        `estimated ${estimated.hoursAtOrBelow7C} h (${diffHours >= 0 ? '+' : ''}${diffHours}, ${((100 * diffHours) / measured.hoursAtOrBelow7C).toFixed(1)} %) and ` +
        `${estimated.utahUnits} units (${diffUtah >= 0 ? '+' : ''}${diffUtah}, ${((100 * diffUtah) / measured.utahUnits).toFixed(1)} %)`,
    );
    // Measured here: 2,580 h against 2,759 h (−6.5 %) and 4,118 against 4,236.5 Utah units (−2.8 %).
    // 10 %: the spread of daily-to-hourly chill estimates commonly quoted for sine/log models
    // (from memory, no source read). Seattle's normals are mild and damp; a drier climate may differ.
    expect(Math.abs(diffHours) / measured.hoursAtOrBelow7C).toBeLessThan(0.1);
    expect(Math.abs(diffUtah) / measured.utahUnits).toBeLessThan(0.1);
  });
});

function chillOfHoursOfDays(dates: string[], hourly: { date: string; t: number }[]) {
  const keep = new Set(dates);
  // In calendar order from October: the normals file runs Jan → Dec, so put Oct–Dec first.
  const ordered = [...hourly.filter((h) => keep.has(h.date) && h.date.slice(5, 7) >= '10'), ...hourly.filter((h) => keep.has(h.date) && h.date.slice(5, 7) <= '04')];
  return chillOfHours(ordered.map((h) => h.t));
}

describe('the chill season (from 1 October in the north, 1 April in the south; common practice, no source)', () => {
  it.each([
    [45, '2026-12-01', '2026-10-01', '2027-04-30'],
    [45, '2027-02-10', '2026-10-01', '2027-04-30'],
    [45, '2026-07-10', '2025-10-01', '2026-04-30'],
    [-42, '2026-06-15', '2026-04-01', '2026-10-31'],
    [-42, '2026-02-01', '2025-04-01', '2025-10-31'],
  ])('when a garden at %s° is on %s, then its chill counts from %s to %s', (lat, today, since, until) => {
    expect(chillSeasonOf(lat, today)).toEqual({ since, until });
  });
});
