import { Router } from 'express';
import type { HealthResponse } from '@stringfield/shared';
import { isDatabaseUp } from '../lib/db.ts';
import { version } from '../lib/version.ts';
import { publicRoute } from '../middleware/require-role.ts';

export function healthRouter() {
  const router = Router();
  router.get('/', publicRoute, async (_req, res) => {
    const up = await isDatabaseUp();
    const body: HealthResponse = { status: up ? 'ok' : 'degraded', database: up ? 'up' : 'down', version };
    res.status(up ? 200 : 503).json(body);
  });
  return router;
}
