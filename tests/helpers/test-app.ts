import { afterAll } from 'vitest';
import request from 'supertest';
import type { Sequelize } from 'sequelize';
import { loadConfig } from '../../server/config';
import type { AppConfig } from '../../server/config';
import { createSequelize } from '../../server/db/sequelize';
import { initModels } from '../../server/db/models';
import { createApp, createWeatherService } from '../../server/app';
import type { WeatherService } from '../../server/modules/weather/weather.service';
import { createLogger } from '../../server/lib/logger';
import { startFakeWeather } from '../../fixtures/weather/server';
import { fakeWeather } from '../../fixtures/weather/control';

let shared: { sequelize: Sequelize; config: AppConfig } | null = null;
const services: WeatherService[] = [];

/**
 * One Sequelize per test file against the real test database, and the fake weather service
 * (MSW) answering the weather hosts, with any other outgoing request an error: no test reaches
 * the network. Background weather work is awaited before the connection closes.
 */
export function testDb() {
  if (!shared) {
    // Every test signs up and fails sign-ins from 127.0.0.1, and the counts live in the shared test
    // database: per-address limits are raised here; the tests of the limits set their own.
    const config = loadConfig({ LOGIN_MAX_FAILURES_PER_IP: '100000', REGISTER_MAX_PER_IP: '100000', REGISTER_MAX_PER_EMAIL: '100000', PASSWORD_RESET_MAX_PER_IP: '100000', ...process.env, NODE_ENV: 'test' });
    const sequelize = createSequelize(config.db);
    initModels(sequelize);
    const fake = startFakeWeather('error');
    shared = { sequelize, config };
    afterAll(async () => {
      await Promise.all(services.map((s) => s.idle()));
      fake.close();
      fakeWeather.reset();
      await shared?.sequelize.close();
      shared = null;
    });
  }
  return shared;
}

/** A weather service as a separate app instance would have it (its own leases and id). */
export function testWeather(settings: Partial<AppConfig['weather']> = {}, now?: () => Date) {
  const { sequelize, config } = testDb();
  const service = createWeatherService({ ...config, weather: { ...config.weather, ...settings } }, sequelize, createLogger('silent'), now);
  services.push(service);
  return service;
}

export function testApp(overrides: Partial<AppConfig> = {}, weather?: WeatherService) {
  const { sequelize, config } = testDb();
  const app = createApp({ config: { ...config, ...overrides }, sequelize, clientDir: null, weather });
  services.push(app.locals.weather as WeatherService);
  return app;
}

export type TestAgent = ReturnType<typeof request.agent>;

export function agent(app: ReturnType<typeof testApp>): TestAgent {
  return request.agent(app);
}
