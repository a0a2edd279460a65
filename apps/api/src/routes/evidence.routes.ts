import { Router } from 'express';
import multer from 'multer';
import { z } from 'zod';
import { diodeReplacementInputSchema, thermalFindingInputSchema } from '@stringfield/shared';
import { requirePermission } from '../middleware/require-role.ts';
import {
  listDiodeReplacements,
  listPhotos,
  readPhotoFile,
  recordDiodeReplacement,
  recordThermalFinding,
  updateDiodeReplacement,
  uploadLimits,
  uploadPhotos,
} from '../services/evidence.service.ts';

const idParams = z.object({ id: z.coerce.number({ error: 'Id must be a number' }).int().positive('Id must be a positive number') });
const upload = multer({ storage: multer.memoryStorage(), limits: { ...uploadLimits, fields: 10, fieldSize: 64 * 1024 } });

/** Mounted at /api/work-orders/:id/photos. */
export function ticketPhotosRouter() {
  const r = Router({ mergeParams: true });
  r.get('/', requirePermission('workOrders:read'), async (req, res) => {
    res.json({ items: await listPhotos(req.user!, idParams.parse(req.params).id) });
  });
  r.post('/', requirePermission('evidence:add'), upload.array('files'), async (req, res) => {
    const files = (req.files as Express.Multer.File[] | undefined) ?? [];
    const meta = typeof (req.body as { meta?: unknown })?.meta === 'string' ? (req.body as { meta: string }).meta : undefined;
    res.status(201).json({ items: await uploadPhotos(req.user!, idParams.parse(req.params).id, files, meta) });
  });
  return r;
}

/** Mounted at /api/work-orders/:id/diode-replacements. */
export function ticketDiodesRouter() {
  const r = Router({ mergeParams: true });
  r.get('/', requirePermission('workOrders:read'), async (req, res) => {
    res.json({ items: await listDiodeReplacements(req.user!, { workOrderId: idParams.parse(req.params).id }) });
  });
  r.post('/', requirePermission('evidence:add'), async (req, res) => {
    res.status(201).json(await recordDiodeReplacement(req.user!, idParams.parse(req.params).id, diodeReplacementInputSchema.parse(req.body)));
  });
  return r;
}

export function photosRouter() {
  const r = Router();
  r.get('/:id/:size', requirePermission('workOrders:read'), async (req, res) => {
    const { id, size } = idParams.extend({ size: z.enum(['thumb', 'screen', 'original']) }).parse(req.params);
    const file = await readPhotoFile(req.user!, id, size);
    if ('redirectUrl' in file) {
      // The signed URL expires within a minute, so the redirect itself must not be cached.
      res.setHeader('Cache-Control', 'private, no-store');
      res.redirect(302, file.redirectUrl);
      return;
    }
    res.setHeader('Content-Type', file.contentType);
    res.setHeader('Cache-Control', 'private, max-age=86400');
    res.setHeader('Content-Disposition', 'inline');
    res.send(file.data);
  });
  r.put('/:id/thermal', requirePermission('evidence:add'), async (req, res) => {
    res.json(await recordThermalFinding(req.user!, idParams.parse(req.params).id, thermalFindingInputSchema.parse(req.body)));
  });
  return r;
}

export function diodesRouter() {
  const r = Router();
  r.get('/', requirePermission('workOrders:read'), async (req, res) => {
    const { stringId } = z.object({ stringId: z.coerce.number().int().positive() }).parse(req.query);
    res.json({ items: await listDiodeReplacements(req.user!, { stringId }) });
  });
  r.put('/:id', requirePermission('evidence:add'), async (req, res) => {
    res.json(await updateDiodeReplacement(req.user!, idParams.parse(req.params).id, diodeReplacementInputSchema.parse(req.body)));
  });
  return r;
}
