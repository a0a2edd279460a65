import path from 'node:path';
import { fileURLToPath } from 'node:url';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');

/** The environment of the API test suite: its own database and its own mail catcher. */
export const apiTestEnv = {
  NODE_ENV: 'test',
  LOG_LEVEL: 'warn',
  DB_NAME: 'stringfield_test',
  DB_PORT: process.env.DB_PORT ?? '3307',
  SMTP_URL: 'smtp://127.0.0.1:1026',
  MAIL_PORT: '1026',
  MAIL_CATCHER_DIR: path.join(root, '.data/mail-test'),
  UPLOADS_DIR: path.join(root, '.data/uploads-test'),
  APP_URL: 'http://127.0.0.1:8090',
  SESSION_SECRET: 'stringfield-api-tests-session-secret-0123456789',
  DEMO_SEED: 'true',
} as const;
