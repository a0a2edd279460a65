import { pino } from 'pino';
import { env } from '../config/env.ts';

export const logger = pino({
  level: env.NODE_ENV === 'test' && env.LOG_LEVEL === 'info' ? 'warn' : env.LOG_LEVEL,
  base: { service: 'stringfield-api' },
  redact: ['req.headers.cookie', 'req.headers["x-csrf-token"]', 'password', '*.password'],
});
