import { Sequelize } from 'sequelize';
import type { DbConfig } from '../config';

/**
 * One Sequelize instance per process. Dates are UTC on both sides of the wire; DATEONLY values
 * stay 'YYYY-MM-DD' strings. Short connect/acquire timeouts turn a lost database into a fast 503.
 * Every statement is bounded too: `queryTimeout` (the server's max_statement_time, errno 1969) ends
 * a slow statement, and `socketTimeout` drops a connection whose server went silent (a frozen or
 * partitioned Galera node never answers, so only the client side can give up).
 */
export function createSequelize(db: DbConfig, opts: { logging?: boolean; acquireMs?: number } = {}): Sequelize {
  const queryTimeout = db.queryTimeoutMs ?? 8000;
  return new Sequelize(db.database, db.user, db.password, {
    host: db.host,
    port: db.port,
    dialect: 'mariadb',
    timezone: '+00:00',
    logging: opts.logging ? (sql) => process.stdout.write(sql + '\n') : false,
    dialectOptions: {
      timezone: 'Etc/UTC',
      connectTimeout: 2000,
      bigIntAsNumber: true,
      decimalAsNumber: true,
      insertIdAsNumber: true,
      ...(queryTimeout > 0 ? { queryTimeout, socketTimeout: queryTimeout + 2000 } : {}),
    },
    pool: { max: db.poolMax, min: 0, acquire: opts.acquireMs ?? 4000, idle: 10_000, evict: 5_000 },
    retry: { max: 0 },
    define: { underscored: true },
  });
}
