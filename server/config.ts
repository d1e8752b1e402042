import type { OverloadSettings } from './lib/overload';
import { existsSync, readFileSync, writeFileSync, mkdirSync } from 'node:fs';
import { randomBytes } from 'node:crypto';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { z } from 'zod';

export const projectRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');

const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  HOST: z.string().default('127.0.0.1'),
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  DATABASE_URL: z.string().url().optional(),
  DB_HOST: z.string().default('127.0.0.1'),
  DB_PORT: z.coerce.number().int().positive().default(3306),
  DB_USER: z.string().default('heatclock'),
  DB_PASSWORD: z.string().default(''),
  DB_NAME: z.string().default('heatclock'),
  DB_TEST_NAME: z.string().default('heatclock_test'),
  DB_POOL_MAX: z.coerce.number().int().min(1).max(200).default(24),
  // Longest a statement may run (server-side max_statement_time), and, with 2 s more, how long a
  // connection may go silent (a frozen or partitioned node) before it is dropped. 0 turns both off.
  DB_QUERY_TIMEOUT_MS: z.coerce.number().int().min(0).max(600_000).default(8000),
  SESSION_SECRET: z.string().min(32).optional(),
  SESSION_IDLE_MINUTES: z.coerce.number().int().positive().default(8 * 60),
  SESSION_ABSOLUTE_HOURS: z.coerce.number().int().positive().default(7 * 24),
  LOGIN_MAX_FAILURES: z.coerce.number().int().positive().default(8),
  LOGIN_WINDOW_MINUTES: z.coerce.number().positive().default(15),
  // Per address, whatever the e-mail: a flood of made-up e-mails meets this one.
  LOGIN_MAX_FAILURES_PER_IP: z.coerce.number().int().positive().default(60),
  REGISTER_MAX_PER_IP: z.coerce.number().int().positive().default(10),
  REGISTER_MAX_PER_EMAIL: z.coerce.number().int().positive().default(3),
  REGISTER_WINDOW_MINUTES: z.coerce.number().positive().default(60),
  PASSWORD_RESET_MAX_PER_IP: z.coerce.number().int().positive().default(10),
  PASSWORD_RESET_MAX_PER_EMAIL: z.coerce.number().int().positive().default(3),
  PASSWORD_RESET_WINDOW_MINUTES: z.coerce.number().positive().default(60),
  TRUST_PROXY: z.string().optional(),
  COOKIE_SECURE: z.enum(['true', 'false']).optional(),
  LOG_LEVEL: z.enum(['silent', 'error', 'warn', 'info', 'debug']).optional(),
  UPLOADS_DIR: z.string().min(1).optional(),
  WEATHER_MODE: z.enum(['fake', 'live']).default('fake'),
  WEATHER_TIMEOUT_MS: z.coerce.number().int().positive().default(10_000),
  WEATHER_RETRIES: z.coerce.number().int().min(0).max(10).default(3),
  WEATHER_BACKOFF_MS: z.coerce.number().int().min(0).default(500),
  WEATHER_CRON: z.string().default('20 4 * * *'),
  WEATHER_CRON_TZ: z.string().default('UTC'),
  WEATHER_HISTORY_YEARS: z.coerce.number().int().min(1).max(40).default(11),
  WEATHER_CONCURRENCY: z.coerce.number().int().min(1).max(64).default(8),
  SCHEDULER: z.enum(['on', 'off']).default('on'),
  MAIL_MODE: z.enum(['fake', 'smtp']).optional(),
  SMTP_URL: z
    .string()
    .url()
    .refine((u) => /^smtps?:\/\//.test(u), 'must start with smtp:// or smtps://')
    .optional(),
  MAIL_FROM: z.string().min(3).default('Heatclock <alerts@heatclock.localhost>'),
  MAIL_FAKE_PORT: z.coerce.number().int().min(0).max(65535).default(0),
  APP_URL: z.string().url().optional(),
  MAX_IN_FLIGHT: z.coerce.number().int().min(1).max(10_000).default(64),
  MAX_QUEUED: z.coerce.number().int().min(0).max(100_000).default(256),
  MAX_QUEUE_WAIT_MS: z.coerce.number().int().min(1).default(3000),
});

export interface DbConfig {
  host: string;
  port: number;
  user: string;
  password: string;
  database: string;
  poolMax: number;
  /** Statement bound in ms (0: none); the socket gives up 2 s later. Default 8000 when absent. */
  queryTimeoutMs?: number;
}

export interface AppConfig {
  env: 'development' | 'production' | 'test';
  host: string;
  port: number;
  db: DbConfig;
  sessionSecret: string;
  sessionIdleMs: number;
  sessionAbsoluteMs: number;
  loginMaxFailures: number;
  loginWindowMs: number;
  loginMaxFailuresPerIp: number;
  registerMaxPerIp: number;
  registerMaxPerEmail: number;
  registerWindowMs: number;
  passwordResetMaxPerIp: number;
  passwordResetMaxPerEmail: number;
  passwordResetWindowMs: number;
  trustProxy: string | undefined;
  /** Secure cookies need HTTPS; a production server bound to loopback is assumed to be a local demo unless told otherwise. */
  cookieSecure: boolean;
  logLevel: 'silent' | 'error' | 'warn' | 'info' | 'debug';
  /** Uploaded photos live here, outside the static root; served only through an access-checked route. */
  uploads: { dir: string; maxBytes: number; maxPixels: number };
  weather: {
    /** 'fake' answers the weather service's URLs in-process from fixtures (MSW); 'live' calls Open-Meteo. */
    mode: 'fake' | 'live';
    timeoutMs: number;
    retries: number;
    backoffMs: number;
    cron: string;
    cronTimeZone: string;
    historyYears: number;
    concurrency: number;
  };
  scheduler: boolean;
  mail: MailConfig;
  /** API requests run at most maxInFlight at once; maxQueue more wait up to maxWaitMs; the rest get 503. */
  overload: OverloadSettings;
}

export interface MailConfig {
  /** 'fake' sends to the in-process capture server (fixtures/mail), 'smtp' to SMTP_URL. */
  mode: 'fake' | 'smtp';
  smtpUrl: string | null;
  /** Port of the local fake; 0 lets the system pick (server/index.ts fills in the real one). */
  fakePort: number;
  from: string;
  /** Links in messages (unsubscribe, open the garden) start here. */
  appUrl: string;
}

/** KEY=value lines of a file our scripts write (.data/db.env, .cluster/cluster.env); {} when it is missing. */
export function readEnvFile(file: string): Record<string, string> {
  if (!existsSync(file)) return {};
  const out: Record<string, string> = {};
  for (const line of readFileSync(file, 'utf8').split('\n')) {
    const m = /^([A-Z_]+)=(.*)$/.exec(line.trim());
    if (m) out[m[1]] = m[2];
  }
  return out;
}

/** Values written by scripts/db.sh for the project's own MariaDB; real environment variables win. */
function readLocalDbEnv(): Record<string, string> {
  return readEnvFile(path.join(projectRoot, '.data', 'db.env'));
}

/** A stable secret for local runs, kept out of git; production must set SESSION_SECRET. */
function localSessionSecret(): string {
  const dir = path.join(projectRoot, '.data');
  const file = path.join(dir, 'session-secret');
  if (existsSync(file)) return readFileSync(file, 'utf8').trim();
  mkdirSync(dir, { recursive: true });
  const secret = randomBytes(32).toString('hex');
  writeFileSync(file, secret, { mode: 0o600 });
  return secret;
}

function dbFromUrl(url: string, poolMax: number, queryTimeoutMs: number): DbConfig {
  const u = new URL(url);
  if (!/^(mariadb|mysql):$/.test(u.protocol)) {
    throw new Error(`DATABASE_URL must start with mariadb:// or mysql://, got ${u.protocol}`);
  }
  return {
    host: u.hostname,
    port: Number(u.port || 3306),
    user: decodeURIComponent(u.username),
    password: decodeURIComponent(u.password),
    database: u.pathname.replace(/^\//, ''),
    poolMax,
    queryTimeoutMs,
  };
}

function mailConfig(e: z.infer<typeof envSchema>): MailConfig {
  const mode = e.MAIL_MODE ?? (e.SMTP_URL ? 'smtp' : 'fake');
  // Either setting alone is clear; together they must agree, or messages would go somewhere unexpected.
  if (mode === 'smtp' && !e.SMTP_URL) throw new Error('Invalid configuration: MAIL_MODE=smtp needs SMTP_URL');
  if (mode === 'fake' && e.SMTP_URL) throw new Error('Invalid configuration: MAIL_MODE=fake cannot be used with SMTP_URL');
  const host = e.HOST.includes(':') ? `[${e.HOST}]` : e.HOST;
  return {
    mode,
    smtpUrl: mode === 'smtp' ? e.SMTP_URL! : null,
    fakePort: e.MAIL_FAKE_PORT,
    from: e.MAIL_FROM,
    appUrl: (e.APP_URL ?? `http://${host}:${e.PORT}`).replace(/\/+$/, ''),
  };
}

export function loadConfig(source: NodeJS.ProcessEnv = process.env): AppConfig {
  const parsed = envSchema.safeParse({ ...readLocalDbEnv(), ...source });
  if (!parsed.success) {
    const detail = parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`).join('; ');
    throw new Error(`Invalid configuration: ${detail}`);
  }
  const e = parsed.data;
  if (e.NODE_ENV === 'production' && !e.SESSION_SECRET && e.DATABASE_URL) {
    throw new Error('Invalid configuration: SESSION_SECRET (32+ characters) is required with DATABASE_URL in production');
  }
  const db: DbConfig = e.DATABASE_URL
    ? dbFromUrl(e.DATABASE_URL, e.DB_POOL_MAX, e.DB_QUERY_TIMEOUT_MS)
    : {
        host: e.DB_HOST,
        port: e.DB_PORT,
        user: e.DB_USER,
        password: e.DB_PASSWORD,
        database: e.NODE_ENV === 'test' ? e.DB_TEST_NAME : e.DB_NAME,
        poolMax: e.DB_POOL_MAX,
        queryTimeoutMs: e.DB_QUERY_TIMEOUT_MS,
      };
  return {
    env: e.NODE_ENV,
    host: e.HOST,
    port: e.PORT,
    db,
    sessionSecret: e.SESSION_SECRET ?? localSessionSecret(),
    sessionIdleMs: e.SESSION_IDLE_MINUTES * 60_000,
    sessionAbsoluteMs: e.SESSION_ABSOLUTE_HOURS * 3_600_000,
    loginMaxFailures: e.LOGIN_MAX_FAILURES,
    loginWindowMs: e.LOGIN_WINDOW_MINUTES * 60_000,
    loginMaxFailuresPerIp: e.LOGIN_MAX_FAILURES_PER_IP,
    registerMaxPerIp: e.REGISTER_MAX_PER_IP,
    registerMaxPerEmail: e.REGISTER_MAX_PER_EMAIL,
    registerWindowMs: e.REGISTER_WINDOW_MINUTES * 60_000,
    passwordResetMaxPerIp: e.PASSWORD_RESET_MAX_PER_IP,
    passwordResetMaxPerEmail: e.PASSWORD_RESET_MAX_PER_EMAIL,
    passwordResetWindowMs: e.PASSWORD_RESET_WINDOW_MINUTES * 60_000,
    trustProxy: e.TRUST_PROXY,
    cookieSecure: e.COOKIE_SECURE ? e.COOKIE_SECURE === 'true' : e.NODE_ENV === 'production' && !/^(127\.|localhost$|::1$)/.test(e.HOST),
    logLevel: e.LOG_LEVEL ?? (e.NODE_ENV === 'test' ? 'silent' : 'info'),
    uploads: {
      dir: path.resolve(e.UPLOADS_DIR ?? path.join(projectRoot, '.data', e.NODE_ENV === 'test' ? 'uploads-test' : 'uploads')),
      maxBytes: 12 * 1024 * 1024,
      maxPixels: 50_000_000,
    },
    weather: {
      mode: e.WEATHER_MODE,
      timeoutMs: e.WEATHER_TIMEOUT_MS,
      retries: e.WEATHER_RETRIES,
      backoffMs: e.NODE_ENV === 'test' ? Math.min(e.WEATHER_BACKOFF_MS, 20) : e.WEATHER_BACKOFF_MS,
      cron: e.WEATHER_CRON,
      cronTimeZone: e.WEATHER_CRON_TZ,
      historyYears: e.WEATHER_HISTORY_YEARS,
      concurrency: e.WEATHER_CONCURRENCY,
    },
    scheduler: e.SCHEDULER === 'on' && e.NODE_ENV !== 'test',
    mail: mailConfig(e),
    overload: { maxInFlight: e.MAX_IN_FLIGHT, maxQueue: e.MAX_QUEUED, maxWaitMs: e.MAX_QUEUE_WAIT_MS, retryAfterS: 2 },
  };
}
