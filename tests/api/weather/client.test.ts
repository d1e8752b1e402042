import { beforeEach, describe, expect, it } from 'vitest';
import { testDb } from '../../helpers/test-app';
import { fakeWeather } from '../../../fixtures/weather/control';
import { RECORDED_TEST_PLOT } from '../../../fixtures/weather/recorded';
import { createWeatherClient, WeatherServiceError } from '../../../server/integrations/weather/open-meteo';
import { createLogger } from '../../../server/lib/logger';

testDb();
const logger = createLogger('silent');
const client = (over: Partial<Parameters<typeof createWeatherClient>[0]> = {}) =>
  createWeatherClient({ timeoutMs: 2000, retries: 3, backoffMs: 10, logger, ...over });
const plot = { ...RECORDED_TEST_PLOT, from: '2024-04-01', to: '2024-04-05' };

beforeEach(() => fakeWeather.reset());

describe('weather service client (Open-Meteo format, answered by the MSW fake)', () => {
  it('when a normal range is asked for, then every day arrives with the recorded values', async () => {
    const res = await client().history(plot);
    expect(res.requests).toBe(1);
    expect(res.rejected).toEqual([]);
    expect(res.days).toEqual([
      { date: '2024-04-01', tmax: 14.2, tmin: 2.1 },
      { date: '2024-04-02', tmax: 16.8, tmin: 3.4 },
      { date: '2024-04-03', tmax: 18.1, tmin: 5 },
      { date: '2024-04-04', tmax: 12.5, tmin: 1.2 },
      { date: '2024-04-05', tmax: 9.8, tmin: -1.6 },
    ]);
    const url = new URL(fakeWeather.requests[0].url);
    expect(url.searchParams.get('daily')).toBe('temperature_2m_max,temperature_2m_min');
    expect(url.searchParams.get('timezone')).toBe('America/Denver');
  });

  it('when the service answers 503 twice, then the third try succeeds', async () => {
    fakeWeather.fail({ kind: 'status', status: 503 }, { kind: 'status', status: 503 });
    const res = await client().history(plot);
    expect(res.requests).toBe(3);
    expect(res.days).toHaveLength(5);
  });

  it('when the service says 429 with Retry-After: 1, then the retry waits at least a second', async () => {
    fakeWeather.fail({ kind: 'status', status: 429, retryAfter: '1' });
    const started = Date.now();
    const res = await client().history(plot);
    expect(Date.now() - started).toBeGreaterThanOrEqual(950);
    expect(res.requests).toBe(2);
  });

  it('when the service keeps failing, then the error says so after the bounded retries', async () => {
    fakeWeather.fail(...Array.from({ length: 4 }, () => ({ kind: 'status' as const, status: 500 })));
    await expect(client().history(plot)).rejects.toThrow(/HTTP 500/);
    expect(fakeWeather.requests).toHaveLength(4);
  });

  it('when the service is slower than the timeout, then the timeout really fires', async () => {
    fakeWeather.fail({ kind: 'delay', ms: 3000 });
    const started = Date.now();
    await expect(client({ timeoutMs: 200, retries: 0 }).history(plot)).rejects.toThrow(/timed out after 200 ms/);
    expect(Date.now() - started).toBeLessThan(1500);
  });

  it('when the body is not JSON, then a clear error and no day is kept', async () => {
    fakeWeather.fail({ kind: 'malformed' });
    await expect(client().history(plot)).rejects.toThrow(WeatherServiceError);
  });

  it('when a day is missing from the answer, then the other days are kept and that date is absent', async () => {
    fakeWeather.fail({ kind: 'drop-days', dates: ['2024-04-03'] });
    const res = await client().history(plot);
    expect(res.days.map((d) => d.date)).toEqual(['2024-04-01', '2024-04-02', '2024-04-04', '2024-04-05']);
  });

  it('when one temperature is a string, then only that day is rejected, with its reason', async () => {
    fakeWeather.fail({ kind: 'string-temp', date: '2024-04-02' });
    const res = await client().history(plot);
    expect(res.days.map((d) => d.date)).toEqual(['2024-04-01', '2024-04-03', '2024-04-04', '2024-04-05']);
    expect(res.rejected).toEqual([{ date: '2024-04-02', reason: 'high "warm" is not a plausible temperature' }]);
  });

  it('when values are null for a day, then that day is rejected and the rest kept', async () => {
    fakeWeather.fail({ kind: 'null-day', date: '2024-04-04' });
    const res = await client().history(plot);
    expect(res.days).toHaveLength(4);
    expect(res.rejected[0].date).toBe('2024-04-04');
  });

  it('when the answer states units we did not ask for, then unknown units are refused and °F is converted', async () => {
    fakeWeather.fail({ kind: 'units', unit: 'K' });
    await expect(client().history(plot)).rejects.toThrow(/Unexpected temperature units/);
    fakeWeather.fail({ kind: 'units', unit: '°F' });
    const res = await client().history(plot);
    // The fake still sent °C numbers, so reading them as °F must change them, unrounded:
    // 14.2 °F = (14.2 − 32) / 1.8 = −9.888… °C.
    expect(res.days[0].date).toBe('2024-04-01');
    expect(res.days[0].tmax).toBeCloseTo(-9.8889, 4);
    expect(res.days[0].tmin).toBeCloseTo(-16.6111, 4);
  });
});
