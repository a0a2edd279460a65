import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { Umzug, SequelizeStorage } from 'umzug';
import type { QueryInterface, Sequelize } from 'sequelize';
import { logger } from './logger.ts';

const migrationsDir = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../migrations');

export type MigrationContext = QueryInterface;

/** Umzug over the `migrations/` folder, recording what ran in `schema_migrations`. */
export function createMigrator(sequelize: Sequelize) {
  return new Umzug<MigrationContext>({
    migrations: { glob: ['*.ts', { cwd: migrationsDir, ignore: ['*.d.ts'] }] },
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: {
      info: (m) => logger.debug(m, 'migration'),
      warn: (m) => logger.warn(m, 'migration'),
      error: (m) => logger.error(m, 'migration'),
      debug: (m) => logger.trace(m, 'migration'),
    },
  });
}
