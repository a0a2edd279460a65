import { Sequelize } from 'sequelize';
import { env } from '../config/env.ts';
import { logger } from './logger.ts';
import { connector } from './mariadb-connector.ts';

/**
 * The one Sequelize instance. Connector decisions are made here, once:
 * - `mariadb` is pinned exactly (3.5.4) and handed to Sequelize through `connector`, which keeps
 *   Sequelize 6's raw queries working on connectors after 3.0 (see `withDeletableMeta`).
 * - BIGINT and DECIMAL come back as JavaScript numbers (our ids and measured values fit in a double);
 *   DTOs never see strings or BigInt.
 * - Short connect and acquire timeouts, so that a database that is down answers 503 within seconds
 *   instead of hanging requests; the pool reconnects by itself when the database returns.
 */
export const sequelize = new Sequelize(env.DB_NAME, env.DB_USER, env.DB_PASSWORD, {
  dialect: 'mariadb',
  dialectModule: connector,
  host: env.DB_HOST,
  port: env.DB_PORT,
  logging: (sql) => logger.trace({ sql }, 'sql'),
  timezone: '+00:00',
  dialectOptions: {
    connectTimeout: 2000,
    bigIntAsNumber: true,
    decimalAsNumber: true,
    insertIdAsNumber: true,
  },
  pool: { max: env.DB_POOL_MAX, min: 0, acquire: 3000, idle: 10000, evict: 5000 },
  define: { underscored: true },
});

/** Whether the database answers right now (for /api/health). */
export async function isDatabaseUp(): Promise<boolean> {
  try {
    await sequelize.query('SELECT 1');
    return true;
  } catch {
    return false;
  }
}
