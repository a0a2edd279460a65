import mariadb, { type ConnectionConfig } from 'mariadb';
import { Sequelize } from 'sequelize';
import { env } from '../config/env.ts';
import { logger } from './logger.ts';

/**
 * A result whose `meta` (the column definitions) may be deleted. Since connector 3.1 it is defined without
 * `configurable`, and Sequelize 6 deletes it from every raw query's rows, which then throws "Cannot delete
 * property 'meta'" (sequelize/sequelize#15701). A shallow copy with the same rows and the same meta.
 */
export function withDeletableMeta<T>(result: T): T {
  if (!Array.isArray(result)) return result;
  const meta = Object.getOwnPropertyDescriptor(result, 'meta');
  if (!meta || meta.configurable) return result;
  const rows = result.slice();
  Object.defineProperty(rows, 'meta', { value: meta.value, writable: true, enumerable: false, configurable: true });
  return rows as T;
}

/** The connector as Sequelize loads it, its connections answering with `withDeletableMeta`. */
export const connector = {
  ...mariadb,
  createConnection: async (config: ConnectionConfig) => {
    const connection = await mariadb.createConnection(config);
    const query = connection.query.bind(connection);
    connection.query = (async (...args: Parameters<typeof query>) => withDeletableMeta(await query(...args)));
    return connection;
  },
};

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
