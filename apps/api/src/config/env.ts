import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { z } from 'zod';

/** The repository root, so that default paths work from any working directory. */
export const repoRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../../..');

const boolish = z
  .enum(['true', 'false', '1', '0', 'yes', 'no'])
  .transform((v) => v === 'true' || v === '1' || v === 'yes');
// An empty S3_* line (as copied from .env.example) counts as unset.
const unsetIfEmpty = <T extends z.ZodType>(schema: T) => z.preprocess((v) => (v === '' ? undefined : v), schema.optional());

const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
  HOST: z.string().default('127.0.0.1'),
  PORT: z.coerce.number().int().min(1).max(65535).default(8080),
  APP_URL: z.url().optional(),
  DB_HOST: z.string().default('127.0.0.1'),
  DB_PORT: z.coerce.number().int().min(1).max(65535).default(3307),
  DB_NAME: z.string().regex(/^[a-z0-9_]+$/, 'DB_NAME: lower-case letters, digits and _ only').default('stringfield'),
  DB_USER: z.string().default('stringfield'),
  DB_PASSWORD: z.string().default('stringfield-local'),
  DB_POOL_MAX: z.coerce.number().int().min(1).max(100).default(10),
  SESSION_SECRET: z.string().min(32, 'SESSION_SECRET must be at least 32 characters').optional(),
  SESSION_MAX_AGE_HOURS: z.coerce.number().min(1).max(24 * 30).default(12),
  COOKIE_SECURE: z.enum(['auto', 'true', 'false']).default('auto'),
  TRUST_PROXY: boolish.default(false),
  SMTP_URL: z.string().default('smtp://127.0.0.1:1025'),
  MAIL_FROM: z.string().default('Stringfield <no-reply@stringfield.test>'),
  MAIL_CATCHER_DIR: z.string().default(path.join(repoRoot, '.data/mail')),
  WEB_DIST: z.string().default(path.join(repoRoot, 'apps/web/dist')),
  UPLOADS_DIR: z.string().default(path.join(repoRoot, '.data/uploads')),
  UPLOAD_MAX_MB: z.coerce.number().min(1).max(200).default(25),
  UPLOAD_MAX_FILES: z.coerce.number().int().min(1).max(50).default(10),
  LOGIN_RATE_LIMIT: z.coerce.number().int().min(1).default(10),
  LOGIN_RATE_WINDOW_MIN: z.coerce.number().int().min(1).default(15),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  DEMO_SEED: boolish.default(true),
  // S3-compatible object storage for uploads; all unset keeps files on local disk under UPLOADS_DIR.
  S3_ENDPOINT: unsetIfEmpty(z.url({ protocol: /^https?$/, error: 'S3_ENDPOINT must be a URL like https://s3.eu-central-1.amazonaws.com' })),
  S3_BUCKET: unsetIfEmpty(z.string().regex(/^[a-z0-9][a-z0-9.-]{1,61}[a-z0-9]$/, 'S3_BUCKET: 3 to 63 lower-case letters, digits, dots and hyphens')),
  S3_REGION: unsetIfEmpty(z.string().regex(/^[a-z0-9-]+$/, 'S3_REGION: like us-east-1')),
  S3_ACCESS_KEY_ID: unsetIfEmpty(z.string().min(1)),
  S3_SECRET_ACCESS_KEY: unsetIfEmpty(z.string().min(1)),
  S3_FORCE_PATH_STYLE: unsetIfEmpty(boolish),
});

export type S3Config = { endpoint: string; bucket: string; region: string; accessKeyId: string; secretAccessKey: string; forcePathStyle: boolean };

export type Env = z.infer<typeof envSchema> & { APP_URL: string; SESSION_SECRET: string; s3: S3Config | null };

export function parseEnv(source: NodeJS.ProcessEnv): Env {
  const parsed = envSchema.safeParse(source);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`).join('\n');
    throw new Error(`Stringfield cannot start: the environment is not valid.\n${lines}`);
  }
  const e = parsed.data;
  const secret = e.SESSION_SECRET ?? (e.NODE_ENV === 'production' ? undefined : 'stringfield-development-session-secret-change-me');
  if (!secret) throw new Error('Stringfield cannot start: set SESSION_SECRET (32+ characters) in production.');
  return { ...e, APP_URL: e.APP_URL ?? `http://${e.HOST}:${e.PORT}`, SESSION_SECRET: secret, s3: s3Config(e) };
}

/** All or nothing: a partial S3 configuration would silently write evidence to local disk. */
function s3Config(e: z.infer<typeof envSchema>): S3Config | null {
  const given = [e.S3_ENDPOINT, e.S3_BUCKET, e.S3_REGION, e.S3_ACCESS_KEY_ID, e.S3_SECRET_ACCESS_KEY, e.S3_FORCE_PATH_STYLE];
  if (given.every((v) => v === undefined)) return null;
  const required = { S3_ENDPOINT: e.S3_ENDPOINT, S3_BUCKET: e.S3_BUCKET, S3_ACCESS_KEY_ID: e.S3_ACCESS_KEY_ID, S3_SECRET_ACCESS_KEY: e.S3_SECRET_ACCESS_KEY };
  const missing = Object.entries(required).filter(([, v]) => v === undefined).map(([k]) => k);
  if (missing.length) {
    throw new Error(
      `Stringfield cannot start: S3 storage is only partly configured; also set ${missing.join(', ')}, or unset every S3_* variable to keep uploads on local disk.`,
    );
  }
  return {
    endpoint: e.S3_ENDPOINT!,
    bucket: e.S3_BUCKET!,
    region: e.S3_REGION ?? 'us-east-1',
    accessKeyId: e.S3_ACCESS_KEY_ID!,
    secretAccessKey: e.S3_SECRET_ACCESS_KEY!,
    forcePathStyle: e.S3_FORCE_PATH_STYLE ?? false,
  };
}

/** Configuration, parsed once from the environment; the only place that reads `process.env`. */
export const env: Env = parseEnv(process.env);
