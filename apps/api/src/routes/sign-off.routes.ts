import { Router } from 'express';
import { z } from 'zod';
import { offlineQueueReportSchema, signOffInputSchema } from '@stringfield/shared';
import { requirePermission } from '../middleware/require-role.ts';
import { buildReport } from '../services/report.service.ts';
import { getGates, getSignOff, reportOfflineQueue, signOffWorkOrder, verifySignOff } from '../services/sign-off.service.ts';

const idParams = z.object({ id: z.coerce.number({ error: 'Id must be a number' }).int().positive('Id must be a positive number') });

/** Mounted at /api/work-orders/:id. */
export function signOffRouter() {
  const r = Router({ mergeParams: true });
  r.get('/sign-off-gates', requirePermission('workOrders:read'), async (req, res) => {
    res.json(await getGates(req.user!, idParams.parse(req.params).id));
  });
  r.get('/sign-off', requirePermission('workOrders:read'), async (req, res) => {
    res.json({ signOff: await getSignOff(req.user!, idParams.parse(req.params).id) });
  });
  r.post('/sign-off', requirePermission('workOrders:review'), async (req, res) => {
    res.status(201).json(await signOffWorkOrder(req.user!, idParams.parse(req.params).id, signOffInputSchema.parse(req.body)));
  });
  r.get('/sign-off/verify', requirePermission('workOrders:read'), async (req, res) => {
    res.json(await verifySignOff(req.user!, idParams.parse(req.params).id));
  });
  r.put('/offline-queue', requirePermission('workOrders:work'), async (req, res) => {
    res.json(await reportOfflineQueue(req.user!, idParams.parse(req.params).id, offlineQueueReportSchema.parse(req.body).pending));
  });
  r.get('/report.pdf', requirePermission('workOrders:read'), async (req, res) => {
    const { pdf, fileName } = await buildReport(req.user!, idParams.parse(req.params).id);
    res.setHeader('Content-Type', 'application/pdf');
    // The web app shows the report in a frame of its own origin; nothing else may frame it.
    res.setHeader('Content-Security-Policy', "default-src 'none'; style-src 'unsafe-inline'; frame-ancestors 'self'");
    res.setHeader('X-Frame-Options', 'SAMEORIGIN');
    res.setHeader('Content-Disposition', `inline; filename="${fileName}"`);
    res.setHeader('Cache-Control', 'private, no-store');
    res.send(pdf);
  });
  return r;
}
