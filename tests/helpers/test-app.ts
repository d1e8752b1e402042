import { afterAll } from 'vitest';
import request from 'supertest';
import type { Sequelize } from 'sequelize';
import { loadConfig } from '../../server/config';
import type { AppConfig } from '../../server/config';
import { createSequelize } from '../../server/db/sequelize';
import { initModels } from '../../server/db/models';
import { createApp } from '../../server/app';

let shared: { sequelize: Sequelize; config: AppConfig } | null = null;

/** One Sequelize per test file against the real test database; closed after the file. */
export function testDb() {
  if (!shared) {
    const config = loadConfig({ ...process.env, NODE_ENV: 'test' });
    const sequelize = createSequelize(config.db);
    initModels(sequelize);
    shared = { sequelize, config };
    afterAll(async () => {
      await shared?.sequelize.close();
      shared = null;
    });
  }
  return shared;
}

export function testApp(overrides: Partial<AppConfig> = {}) {
  const { sequelize, config } = testDb();
  return createApp({ config: { ...config, ...overrides }, sequelize, clientDir: null });
}

export type TestAgent = ReturnType<typeof request.agent>;

export function agent(app: ReturnType<typeof testApp>): TestAgent {
  return request.agent(app);
}
