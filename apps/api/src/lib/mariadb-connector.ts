import mariadb, { type ConnectionConfig } from 'mariadb';

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
