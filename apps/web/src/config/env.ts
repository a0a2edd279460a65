import { z } from 'zod';

/**
 * The web app's configuration, parsed once. Vite inlines `import.meta.env` at build time, so only
 * `VITE_`-prefixed values reach the browser; nothing secret belongs here.
 */
const envSchema = z.object({
  /** Where the API lives. Empty means the same origin (the API serves the built app, dev proxies /api). */
  VITE_API_BASE_URL: z
    .string()
    .trim()
    .default('')
    .refine((v) => v === '' || /^https?:\/\/[^\s]+$/.test(v), 'VITE_API_BASE_URL must be empty or an http(s) URL')
    .transform((v) => v.replace(/\/+$/, '')),
  MODE: z.string().default('production'),
  DEV: z.boolean().default(false),
});

export const env = envSchema.parse(import.meta.env);
