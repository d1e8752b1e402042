/**
 * Client for the Open-Meteo daily weather API (no key): the forecast endpoint for recent days and
 * up to 16 days ahead, the archive endpoint for history. Every call has a timeout and bounded
 * retries with exponential backoff and jitter that honour Retry-After; each day of a response is
 * validated on its own, so one bad day is rejected and logged while the good days are kept.
 */
import axios from 'axios';
import type { AxiosError, AxiosInstance } from 'axios';
import axiosRetry, { isNetworkOrIdempotentRequestError } from 'axios-retry';
import { z } from 'zod';
import { fToC } from '#shared/thermal/units';
import type { Logger } from '../../lib/logger';

export const OPEN_METEO_FORECAST_URL = 'https://api.open-meteo.com/v1/forecast';
export const OPEN_METEO_ARCHIVE_URL = 'https://archive-api.open-meteo.com/v1/archive';

export interface WeatherClientOptions {
  timeoutMs: number;
  retries: number;
  /** First backoff step; doubles each retry, with random jitter. */
  backoffMs: number;
  forecastUrl?: string;
  archiveUrl?: string;
  logger: Logger;
}

export interface FetchedDay {
  date: string;
  tmax: number;
  tmin: number;
  /** Daily mean soil temperature near seed depth, °C, where the service gave enough hours of it. */
  soil?: number | null;
}

/**
 * The forecast endpoint's documented hourly soil variable at 6 cm (about sowing depth); the daily
 * mean is ours, over the local day's hours. History backfill does not ask for soil: sowing advice
 * needs the recent days and the forecast only.
 */
export const SOIL_VARIABLE = 'soil_temperature_6cm';
/** Hours a day needs for its soil mean to stand (our choice: common practice, no source). */
export const SOIL_MIN_HOURS = 20;

export interface RejectedDay {
  date: string | null;
  reason: string;
}

export interface FetchResult {
  days: FetchedDay[];
  rejected: RejectedDay[];
  /** HTTP requests made, retries included. */
  requests: number;
}

export class WeatherServiceError extends Error {
  constructor(
    message: string,
    readonly status?: number,
  ) {
    super(message);
    this.name = 'WeatherServiceError';
  }
}

const responseSchema = z.object({
  daily_units: z.object({ temperature_2m_max: z.string(), temperature_2m_min: z.string() }),
  daily: z.object({
    time: z.array(z.unknown()),
    temperature_2m_max: z.array(z.unknown()),
    temperature_2m_min: z.array(z.unknown()),
  }),
});

const dateSchema = z.iso.date();
// Plausible screen-level air temperatures; anything outside is a broken value, not weather.
const tempSchema = z.number().finite().min(-90).max(60);

function toCelsius(unit: string): ((v: number) => number) | null {
  if (unit === '°C') return (v) => v;
  // Unrounded, like station imports: a rounded 24 °F would no longer be a severe freeze.
  if (unit === '°F') return fToC;
  return null;
}

/** Splits a response into valid days and rejected ones, each with its reason. */
export function parseDaily(body: unknown): { days: FetchedDay[]; rejected: RejectedDay[] } {
  const parsed = responseSchema.safeParse(body);
  if (!parsed.success) throw new WeatherServiceError(`Unexpected response shape: ${parsed.error.issues[0]?.message ?? 'invalid'}`);
  const { daily, daily_units: units } = parsed.data;
  const convertMax = toCelsius(units.temperature_2m_max);
  const convertMin = toCelsius(units.temperature_2m_min);
  if (!convertMax || !convertMin) {
    throw new WeatherServiceError(`Unexpected temperature units ${units.temperature_2m_max}/${units.temperature_2m_min}`);
  }
  const days: FetchedDay[] = [];
  const rejected: RejectedDay[] = [];
  const seen = new Set<string>();
  daily.time.forEach((rawDate, i) => {
    const date = dateSchema.safeParse(rawDate);
    if (!date.success) return rejected.push({ date: null, reason: `day ${i}: date ${JSON.stringify(rawDate)} is not YYYY-MM-DD` });
    if (seen.has(date.data)) return rejected.push({ date: date.data, reason: 'date appears twice' });
    seen.add(date.data);
    const hi = tempSchema.safeParse(daily.temperature_2m_max[i]);
    const lo = tempSchema.safeParse(daily.temperature_2m_min[i]);
    if (!hi.success || !lo.success) {
      const [which, value]: [string, unknown] = !hi.success ? ['high', daily.temperature_2m_max[i]] : ['low', daily.temperature_2m_min[i]];
      return rejected.push({ date: date.data, reason: `${which} ${JSON.stringify(value)} is not a plausible temperature` });
    }
    const tmax = convertMax(hi.data);
    const tmin = convertMin(lo.data);
    if (tmin > tmax) return rejected.push({ date: date.data, reason: `low ${tmin} °C is above high ${tmax} °C` });
    days.push({ date: date.data, tmax, tmin });
  });
  return { days, rejected };
}

const hourlySchema = z.object({
  hourly_units: z.record(z.string(), z.string()),
  hourly: z.object({ time: z.array(z.unknown()) }).catchall(z.array(z.unknown())),
});
// Plausible soil temperatures near the surface, °C; outside is a broken value.
const soilSchema = z.number().finite().min(-60).max(80);

/** Daily means of an hourly soil variable, by local date; days short of SOIL_MIN_HOURS are left out. */
export function parseSoilDaily(body: unknown, variable = SOIL_VARIABLE): Map<string, number> {
  const out = new Map<string, number>();
  const parsed = hourlySchema.safeParse(body);
  if (!parsed.success) return out;
  const values = parsed.data.hourly[variable];
  const convert = toCelsius(parsed.data.hourly_units[variable] ?? '');
  if (!values || !convert) return out;
  const sums = new Map<string, { sum: number; n: number }>();
  parsed.data.hourly.time.forEach((t, i) => {
    const raw = values[i];
    const v = typeof raw === 'number' ? soilSchema.safeParse(convert(raw)) : null;
    if (typeof t !== 'string' || !/^\d{4}-\d{2}-\d{2}T/.test(t) || !v?.success) return;
    const date = t.slice(0, 10);
    const acc = sums.get(date) ?? { sum: 0, n: 0 };
    acc.sum += v.data;
    acc.n++;
    sums.set(date, acc);
  });
  for (const [date, { sum, n }] of sums) if (n >= SOIL_MIN_HOURS) out.set(date, Math.round((sum / n) * 10) / 10);
  return out;
}

function retryAfterMs(err: AxiosError): number {
  const raw: unknown = err.response?.headers?.['retry-after'];
  if (typeof raw !== 'string' && typeof raw !== 'number') return 0;
  const header = String(raw);
  if (!header) return 0;
  const secs = Number(header);
  if (Number.isFinite(secs)) return Math.max(0, secs * 1000);
  const at = Date.parse(header);
  return Number.isFinite(at) ? Math.max(0, at - Date.now()) : 0;
}

export interface WeatherClient {
  /** Recent observed days and the forecast, as local calendar days in timeZone. */
  recent(p: { latitude: number; longitude: number; timeZone: string; pastDays: number; forecastDays: number }): Promise<FetchResult>;
  /** Observed history for an inclusive date range. */
  history(p: { latitude: number; longitude: number; timeZone: string; from: string; to: string }): Promise<FetchResult>;
}

export function createWeatherClient(opts: WeatherClientOptions): WeatherClient {
  const http: AxiosInstance = axios.create({ timeout: opts.timeoutMs, headers: { Accept: 'application/json' } });
  let requests = 0;
  http.interceptors.request.use((config) => {
    requests++;
    return config;
  });
  axiosRetry(http, {
    retries: opts.retries,
    shouldResetTimeout: true,
    retryCondition: (err) =>
      isNetworkOrIdempotentRequestError(err) || err.code === 'ECONNABORTED' || err.code === 'ETIMEDOUT' || err.response?.status === 429,
    // Exponential with full jitter; a longer Retry-After from the service wins (capped at 60 s).
    retryDelay: (count, err) => {
      const backoff = opts.backoffMs * 2 ** (count - 1);
      return Math.min(60_000, Math.max(retryAfterMs(err), backoff / 2 + Math.random() * (backoff / 2)));
    },
    onRetry: (count, err, config) =>
      opts.logger.warn('weather request retry', { attempt: count, status: err.response?.status, code: err.code, url: config.url }),
  });

  async function get(url: string, params: Record<string, string | number>, withSoil = false): Promise<FetchResult> {
    const before = requests;
    try {
      const res = await http.get(url, { params, responseType: 'text', transformResponse: (x: string) => x });
      let body: unknown;
      try {
        body = JSON.parse(String(res.data));
      } catch {
        throw new WeatherServiceError('The weather service sent a body that is not JSON');
      }
      const out = parseDaily(body);
      if (withSoil) {
        const soil = parseSoilDaily(body);
        for (const d of out.days) d.soil = soil.get(d.date) ?? null;
      }
      for (const r of out.rejected) opts.logger.warn('weather day rejected', { date: r.date, reason: r.reason, url });
      return { ...out, requests: requests - before };
    } catch (err) {
      if (err instanceof WeatherServiceError) throw Object.assign(err, { requests: requests - before });
      const ax = err as AxiosError<string>;
      const status = ax.response?.status;
      const reason = ax.code === 'ECONNABORTED' || ax.code === 'ETIMEDOUT' ? `timed out after ${opts.timeoutMs} ms` : ax.message;
      throw Object.assign(new WeatherServiceError(`Weather service request failed: ${status ? `HTTP ${status}` : reason}`, status), {
        requests: requests - before,
      });
    }
  }

  const daily = 'temperature_2m_max,temperature_2m_min';
  return {
    recent: (p) =>
      get(opts.forecastUrl ?? OPEN_METEO_FORECAST_URL, {
        latitude: p.latitude,
        longitude: p.longitude,
        daily,
        timezone: p.timeZone,
        past_days: p.pastDays,
        forecast_days: p.forecastDays,
        hourly: SOIL_VARIABLE,
        temperature_unit: 'celsius',
      }, true),
    history: (p) =>
      get(opts.archiveUrl ?? OPEN_METEO_ARCHIVE_URL, {
        latitude: p.latitude,
        longitude: p.longitude,
        daily,
        timezone: p.timeZone,
        start_date: p.from,
        end_date: p.to,
        temperature_unit: 'celsius',
      }),
  };
}

export function requestsOf(err: unknown): number {
  return (err as { requests?: number })?.requests ?? 0;
}
