import { pipeline } from 'node:stream/promises';
import { Router } from 'express';
import { z } from 'zod';
import { exportQuerySchema, metricsQuerySchema } from '@stringfield/shared';
import { logger } from '../lib/logger.ts';
import { requirePermission } from '../middleware/require-role.ts';
import { energyAtRisk, healthMap, metrics } from '../services/fleet.service.ts';
import { exportCsv } from '../services/exports.service.ts';

const idParams = z.object({ id: z.coerce.number({ error: 'Id must be a number' }).int().positive() });

export function fleetRouter() {
  const r = Router();
  r.get('/sites/:id/health-map', requirePermission('fleet:read'), async (req, res) => {
    res.json(await healthMap(req.user!, idParams.parse(req.params).id));
  });
  r.get('/energy-at-risk', requirePermission('fleet:read'), async (req, res) => {
    const { siteId } = z.object({ siteId: z.coerce.number().int().positive().optional() }).parse(req.query);
    res.json({ items: await energyAtRisk(req.user!, siteId), note: 'Estimate: expected Pmp at the design irradiance minus what the latest check implies, times the site’s assumed peak sun hours.' });
  });
  r.get('/metrics', requirePermission('fleet:read'), async (req, res) => {
    res.json(await metrics(req.user!, metricsQuerySchema.parse(req.query)));
  });
  r.get('/exports/:name.csv', requirePermission('exports:read'), async (req, res) => {
    const { name } = z.object({ name: z.enum(['tickets', 'checks', 'diode-replacements'], { error: 'Export tickets, checks or diode-replacements' }) }).parse(req.params);
    const { stream, fileName } = await exportCsv(req.user!, name, exportQuerySchema.parse(req.query));
    res.setHeader('Content-Type', 'text/csv; charset=utf-8');
    res.setHeader('Content-Disposition', `attachment; filename="${fileName}"`);
    try {
      await pipeline(stream, res);
    } catch (err) {
      // Headers are gone once rows flow; a failure mid-way can only cut the download short.
      logger.warn({ err: (err as Error).message }, 'export stream ended early');
      res.destroy();
    }
  });
  return r;
}
