// The server behind the browser tests: a fresh `stringfield_e2e` database, migrated and seeded, a mail
// catcher on 127.0.0.1:1027, and the API serving the built web app on E2E_PORT (default 8091).
import { execFileSync } from 'node:child_process';
import fs from 'node:fs/promises';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { Sequelize } from 'sequelize';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
// TEST_SLOT=N: a second copy of the browser suite gets its own database and mail folder (set E2E_PORT and
// E2E_MAIL_PORT too); see tests/api/test-env.ts.
const slot = Number(process.env.TEST_SLOT ?? 0);
const port = process.env.E2E_PORT ?? '8091';
const mailPort = Number(process.env.E2E_MAIL_PORT ?? 1027);
export const e2eEnv = {
  NODE_ENV: 'test',
  LOG_LEVEL: 'warn',
  DB_NAME: slot ? `stringfield_e2e_${slot}` : 'stringfield_e2e',
  PORT: port,
  APP_URL: `http://127.0.0.1:${port}`,
  SMTP_URL: `smtp://127.0.0.1:${mailPort}`,
  MAIL_CATCHER_DIR: path.join(root, slot ? `.data/mail-e2e-${slot}` : '.data/mail-e2e'),
  // Photos of this run (the demo seed's included) live beside its database and go with it.
  UPLOADS_DIR: path.join(root, slot ? `.data/uploads-e2e-${slot}` : '.data/uploads-e2e'),
  SESSION_SECRET: 'stringfield-e2e-tests-session-secret-0123456789',
};
Object.assign(process.env, e2eEnv);

const admin = new Sequelize('', 'stringfield', process.env.DB_PASSWORD ?? 'stringfield-local', {
  dialect: 'mariadb',
  host: '127.0.0.1',
  port: Number(process.env.DB_PORT ?? 3307),
  logging: false,
});
await admin.query(`DROP DATABASE IF EXISTS \`${e2eEnv.DB_NAME}\``);
await admin.query(`CREATE DATABASE \`${e2eEnv.DB_NAME}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
await admin.close();
await fs.rm(e2eEnv.UPLOADS_DIR, { recursive: true, force: true });
execFileSync(path.join(root, 'node_modules/.bin/tsx'), ['apps/api/src/cli/migrate.ts', 'up'], {
  cwd: root,
  env: process.env,
  stdio: ['ignore', 'ignore', 'inherit'],
});
const { seedDemo } = await import('../../apps/api/seeders/demo.ts');
await seedDemo();

await fs.rm(e2eEnv.MAIL_CATCHER_DIR, { recursive: true, force: true });
const { startMailCatcher } = await import('../../scripts/mail-catcher.ts');
await startMailCatcher({ port: mailPort, dir: e2eEnv.MAIL_CATCHER_DIR });

await import('../../apps/api/src/server.ts');
