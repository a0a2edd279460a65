import { Router } from 'express';
import { z } from 'zod';
import {
  commentInputSchema,
  createWorkOrderInputSchema,
  mailPreferencesSchema,
  pageQuerySchema,
  slaPolicySchema,
  transitionInputSchema,
  updateWorkOrderInputSchema,
  workOrderListQuerySchema,
} from '@stringfield/shared';
import { requireAuth, requirePermission } from '../middleware/require-role.ts';
import { findVisibleSite } from '../services/site-access.ts';
import {
  addComment,
  createWorkOrders,
  getWorkOrder,
  listAssignableTechnicians,
  listEvents,
  listWorkOrders,
  setSlaHours,
  slaHoursFor,
  transitionWorkOrder,
  updateWorkOrder,
} from '../services/work-orders.service.ts';
import { getMailPreferences, setMailPreferences } from '../services/mail-preferences.service.ts';

const idParams = z.object({ id: z.coerce.number({ error: 'Id must be a number' }).int().positive('Id must be a positive number') });

export function workOrdersRouter() {
  const r = Router();
  r.get('/', requirePermission('workOrders:read'), async (req, res) => {
    res.json(await listWorkOrders(req.user!, workOrderListQuerySchema.and(pageQuerySchema).parse(req.query)));
  });
  r.post('/', requirePermission('workOrders:create'), async (req, res) => {
    const created = await createWorkOrders(req.user!, createWorkOrderInputSchema.parse(req.body));
    res.status(201).json({ items: created });
  });
  r.get('/:id', requirePermission('workOrders:read'), async (req, res) => {
    res.json(await getWorkOrder(req.user!, idParams.parse(req.params).id));
  });
  r.patch('/:id', requirePermission('workOrders:dispatch'), async (req, res) => {
    res.json(await updateWorkOrder(req.user!, idParams.parse(req.params).id, updateWorkOrderInputSchema.parse(req.body)));
  });
  // Which role may take which transition is decided in the service from the declared lifecycle table.
  r.post('/:id/transitions', requireAuth, async (req, res) => {
    res.json(await transitionWorkOrder(req.user!, idParams.parse(req.params).id, transitionInputSchema.parse(req.body)));
  });
  r.get('/:id/events', requirePermission('workOrders:read'), async (req, res) => {
    res.json({ items: await listEvents(req.user!, idParams.parse(req.params).id) });
  });
  r.post('/:id/comments', requirePermission('workOrders:comment'), async (req, res) => {
    res.status(201).json(await addComment(req.user!, idParams.parse(req.params).id, commentInputSchema.parse(req.body).body));
  });
  return r;
}

export function techniciansRouter() {
  const r = Router();
  // Everyone who reads the board may filter it by technician; only dispatchers assign.
  r.get('/', requirePermission('workOrders:read'), async (_req, res) => {
    res.json({ items: await listAssignableTechnicians() });
  });
  return r;
}

export function slaRouter() {
  const r = Router({ mergeParams: true });
  r.get('/', requirePermission('assets:read'), async (req, res) => {
    const { id } = idParams.parse(req.params);
    await findVisibleSite(req.user!, id);
    res.json(await slaHoursFor(id));
  });
  r.put('/', requirePermission('sla:manage'), async (req, res) => {
    res.json(await setSlaHours(req.user!, idParams.parse(req.params).id, slaPolicySchema.parse(req.body)));
  });
  return r;
}

export function meRouter() {
  const r = Router();
  r.get('/mail-preferences', requireAuth, async (req, res) => {
    res.json(await getMailPreferences(req.user!.id));
  });
  r.put('/mail-preferences', requireAuth, async (req, res) => {
    res.json(await setMailPreferences(req.user!.id, mailPreferencesSchema.parse(req.body)));
  });
  return r;
}
