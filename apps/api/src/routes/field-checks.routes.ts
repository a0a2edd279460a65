import { Router } from 'express';
import multer from 'multer';
import { z } from 'zod';
import { instrumentInputSchema, stringCheckInputSchema } from '@stringfield/shared';
import { AppError } from '../lib/app-error.ts';
import { requirePermission } from '../middleware/require-role.ts';
import { listStringChecks, listTicketChecks, recordCheck, reviseCheck } from '../services/field-checks.service.ts';
import { attachIvTrace, getIvTrace } from '../services/iv-traces.service.ts';
import { createInstrument, listInstruments, updateInstrument } from '../services/instruments.service.ts';

const idParams = z.object({ id: z.coerce.number({ error: 'Id must be a number' }).int().positive('Id must be a positive number') });
const flag = z.object({ includeSuperseded: z.enum(['true', 'false']).default('false').transform((v) => v === 'true') });
const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: 5 * 1024 * 1024, files: 1, fields: 5 } });

/** Mounted at /api/work-orders/:id/checks. */
export function ticketChecksRouter() {
  const r = Router({ mergeParams: true });
  r.get('/', requirePermission('workOrders:read'), async (req, res) => {
    res.json({ items: await listTicketChecks(req.user!, idParams.parse(req.params).id, flag.parse(req.query).includeSuperseded) });
  });
  r.post('/', requirePermission('checks:record'), async (req, res) => {
    const { check, isNew } = await recordCheck(req.user!, idParams.parse(req.params).id, stringCheckInputSchema.parse(req.body));
    res.status(isNew ? 201 : 200).json(check);
  });
  return r;
}

/** Mounted at /api/strings/:id/checks. */
export function stringChecksRouter() {
  const r = Router({ mergeParams: true });
  r.get('/', requirePermission('assets:read'), async (req, res) => {
    res.json({ items: await listStringChecks(req.user!, idParams.parse(req.params).id) });
  });
  return r;
}

/** Mounted at /api/checks. */
export function checksRouter() {
  const r = Router();
  r.post('/:id/revisions', requirePermission('checks:record'), async (req, res) => {
    res.status(201).json(await reviseCheck(req.user!, idParams.parse(req.params).id, stringCheckInputSchema.parse(req.body)));
  });
  r.post('/:id/iv-trace', requirePermission('checks:record'), upload.single('file'), async (req, res) => {
    if (!req.file) throw new AppError('VALIDATION_FAILED', 'Attach the I-V trace CSV as the form field "file".', { file: 'Choose a CSV file' });
    res.status(201).json(await attachIvTrace(req.user!, idParams.parse(req.params).id, req.file.originalname, req.file.buffer));
  });
  r.get('/:id/iv-trace', requirePermission('workOrders:read'), async (req, res) => {
    res.json(await getIvTrace(req.user!, idParams.parse(req.params).id));
  });
  return r;
}

export function instrumentsRouter() {
  const r = Router();
  r.get('/', requirePermission('workOrders:read'), async (req, res) => {
    const { includeArchived } = z.object({ includeArchived: z.enum(['true', 'false']).default('false').transform((v) => v === 'true') }).parse(req.query);
    res.json({ items: await listInstruments(includeArchived) });
  });
  r.post('/', requirePermission('instruments:manage'), async (req, res) => {
    res.status(201).json(await createInstrument(instrumentInputSchema.parse(req.body)));
  });
  r.patch('/:id', requirePermission('instruments:manage'), async (req, res) => {
    const input = instrumentInputSchema.partial().extend({ isArchived: z.boolean().optional() }).parse(req.body);
    res.json(await updateInstrument(idParams.parse(req.params).id, input));
  });
  return r;
}
