import { execFileSync } from 'node:child_process';
import fs from 'node:fs/promises';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { Sequelize } from 'sequelize';
import { apiTestEnv } from './test-env.ts';
import { startMailCatcher } from '../../scripts/mail-catcher.ts';

/**
 * Once per API test run: a fresh `stringfield_test` database, migrated forward, and a mail catcher on
 * 127.0.0.1:1026 writing to .data/mail-test/. MariaDB itself is started by `npm test` (scripts/db.mjs).
 */
const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');

export default async function setup() {
  Object.assign(process.env, apiTestEnv);
  const admin = new Sequelize('', process.env.DB_USER ?? 'stringfield', process.env.DB_PASSWORD ?? 'stringfield-local', {
    dialect: 'mariadb',
    host: '127.0.0.1',
    port: Number(apiTestEnv.DB_PORT),
    logging: false,
  });
  await admin.query(`DROP DATABASE IF EXISTS \`${apiTestEnv.DB_NAME}\``);
  await admin.query(`CREATE DATABASE \`${apiTestEnv.DB_NAME}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
  await admin.close();

  // Migrations are TypeScript files that umzug imports natively, so they run under tsx as in production.
  execFileSync(path.join(root, 'node_modules/.bin/tsx'), ['apps/api/src/cli/migrate.ts', 'up'], {
    cwd: root,
    env: { ...process.env, ...apiTestEnv },
    stdio: ['ignore', 'ignore', 'inherit'],
  });

  await fs.rm(apiTestEnv.MAIL_CATCHER_DIR, { recursive: true, force: true });
  const catcher = await startMailCatcher({ port: Number(apiTestEnv.MAIL_PORT), dir: apiTestEnv.MAIL_CATCHER_DIR });
  return async () => {
    await catcher.close();
  };
}
