import path from 'node:path';
import { fileURLToPath } from 'node:url';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');

// TEST_SLOT=N (1–9) gives a second copy of the suite its own database, mail port and folders, so two
// runs on one machine (a developer's and a helper's) do not trample each other. Unset: the defaults.
const slot = Number(process.env.TEST_SLOT ?? 0);
const suffix = slot ? `_${slot}` : '';

/** The environment of the API test suite: its own database and its own mail catcher. */
export const apiTestEnv = {
  NODE_ENV: 'test',
  LOG_LEVEL: 'warn',
  DB_NAME: `stringfield_test${suffix}`,
  DB_PORT: process.env.DB_PORT ?? '3307',
  SMTP_URL: `smtp://127.0.0.1:${1026 + slot * 10}`,
  MAIL_PORT: String(1026 + slot * 10),
  MAIL_CATCHER_DIR: path.join(root, `.data/mail-test${suffix}`),
  UPLOADS_DIR: path.join(root, `.data/uploads-test${suffix}`),
  APP_URL: `http://127.0.0.1:${8090 + slot * 10}`,
  SESSION_SECRET: 'stringfield-api-tests-session-secret-0123456789',
  DEMO_SEED: 'true',
};
