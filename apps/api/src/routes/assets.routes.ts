import { Router } from 'express';
import multer from 'multer';
import { z } from 'zod';
import {
  combinerBoxInputSchema,
  inverterInputSchema,
  inverterModelInputSchema,
  listQuerySchema,
  moduleModelInputSchema,
  pageQuerySchema,
  pvStringInputSchema,
  pvStringUpdateSchema,
  siteInputSchema,
  siteUpdateSchema,
  stringListQuerySchema,
  tagSchema,
} from '@stringfield/shared';
import { AppError } from '../lib/app-error.ts';
import { requirePermission } from '../middleware/require-role.ts';
import { createSite, deleteSite, getSite, listSites, updateSite } from '../services/sites.service.ts';
import { createString, deleteString, getString, listStrings, updateString } from '../services/strings.service.ts';
import * as lib from '../services/libraries.service.ts';
import * as eq from '../services/equipment.service.ts';
import { importLayout } from '../services/layout-import.service.ts';

const idParams = z.object({ id: z.coerce.number({ error: 'Id must be a number' }).int().positive('Id must be a positive number') });
const siteQuery = z.object({ siteId: z.coerce.number({ error: 'Give siteId as a number' }).int().positive() });
const archivedOnly = z.object({ isArchived: z.boolean({ error: 'isArchived must be true or false' }) }).strict();
const read = requirePermission('assets:read');
const write = requirePermission('assets:write');

export const MAX_IMPORT_BYTES = 10 * 1024 * 1024;
const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: MAX_IMPORT_BYTES, files: 1, fields: 5 } });

export function sitesRouter() {
  const r = Router();
  r.get('/', read, async (req, res) => {
    const q = listQuerySchema
      .extend({ sort: z.enum(['name', '-name', 'code', '-code']).default('name') })
      .and(pageQuerySchema)
      .parse(req.query);
    res.json(await listSites(req.user!, q));
  });
  r.post('/', write, async (req, res) => {
    res.status(201).json(await createSite(siteInputSchema.parse(req.body)));
  });
  r.get('/:id', read, async (req, res) => {
    res.json(await getSite(req.user!, idParams.parse(req.params).id));
  });
  r.patch('/:id', write, async (req, res) => {
    res.json(await updateSite(req.user!, idParams.parse(req.params).id, siteUpdateSchema.parse(req.body)));
  });
  r.delete('/:id', write, async (req, res) => {
    await deleteSite(req.user!, idParams.parse(req.params).id);
    res.status(204).end();
  });
  r.get('/:id/strings', read, async (req, res) => {
    const q = stringListQuerySchema.and(pageQuerySchema).parse(req.query);
    res.json(await listStrings(req.user!, idParams.parse(req.params).id, q));
  });
  r.post('/:id/strings', write, async (req, res) => {
    res.status(201).json(await createString(req.user!, idParams.parse(req.params).id, pvStringInputSchema.parse(req.body)));
  });
  r.post('/:id/import', write, upload.single('file'), async (req, res) => {
    const { id } = idParams.parse(req.params);
    const { mode } = z.object({ mode: z.enum(['dry-run', 'commit']).default('dry-run') }).parse(req.query);
    if (!req.file) throw new AppError('VALIDATION_FAILED', 'Attach the layout CSV as the form field "file".', { file: 'Choose a CSV file' });
    const preview = await importLayout(req.user!, id, req.file.buffer, mode === 'commit');
    res.status(preview.committed ? 201 : 200).json(preview);
  });
  return r;
}

export function stringsRouter() {
  const r = Router();
  r.get('/:id', read, async (req, res) => {
    res.json(await getString(req.user!, idParams.parse(req.params).id));
  });
  r.patch('/:id', write, async (req, res) => {
    res.json(await updateString(req.user!, idParams.parse(req.params).id, pvStringUpdateSchema.parse(req.body)));
  });
  r.delete('/:id', write, async (req, res) => {
    await deleteString(req.user!, idParams.parse(req.params).id);
    res.status(204).end();
  });
  return r;
}

/** The routes of one datasheet library (module or inverter models): list, add, replace, archive, delete. */
function libraryRouter<I>(input: { parse(body: unknown): I }, service: {
  list: (q: Parameters<typeof lib.listModuleModels>[0]) => Promise<unknown>;
  create: (i: I) => Promise<unknown>;
  update: (id: number, i: I) => Promise<unknown>;
  setArchived: (id: number, isArchived: boolean) => Promise<unknown>;
  remove: (id: number) => Promise<void>;
}) {
  const r = Router();
  r.get('/', read, async (req, res) => {
    res.json(await service.list(listQuerySchema.and(pageQuerySchema).parse(req.query)));
  });
  r.post('/', write, async (req, res) => {
    res.status(201).json(await service.create(input.parse(req.body)));
  });
  r.put('/:id', write, async (req, res) => {
    res.json(await service.update(idParams.parse(req.params).id, input.parse(req.body)));
  });
  r.patch('/:id', write, async (req, res) => {
    res.json(await service.setArchived(idParams.parse(req.params).id, archivedOnly.parse(req.body).isArchived));
  });
  r.delete('/:id', write, async (req, res) => {
    await service.remove(idParams.parse(req.params).id);
    res.status(204).end();
  });
  return r;
}

export function moduleModelsRouter() {
  return libraryRouter(moduleModelInputSchema, {
    list: lib.listModuleModels,
    create: lib.createModuleModel,
    update: lib.updateModuleModel,
    setArchived: lib.setModuleModelArchived,
    remove: lib.deleteModuleModel,
  });
}

export function inverterModelsRouter() {
  return libraryRouter(inverterModelInputSchema, {
    list: lib.listInverterModels,
    create: lib.createInverterModel,
    update: lib.updateInverterModel,
    setArchived: lib.setInverterModelArchived,
    remove: lib.deleteInverterModel,
  });
}

const inverterUpdate = z
  .object({
    tag: tagSchema('Inverter tag').optional(),
    inverterModelId: z.number().int().positive().optional(),
    serial: z.string().trim().max(80).optional(),
    isArchived: z.boolean().optional(),
  })
  .strict();
const combinerUpdate = z
  .object({
    tag: tagSchema('Combiner box tag').optional(),
    fuseRatingA: z.number().min(1).max(100).nullable().optional(),
    isArchived: z.boolean().optional(),
  })
  .strict();
const includeArchived = z.object({ includeArchived: z.enum(['true', 'false']).default('false').transform((v) => v === 'true') });

export function invertersRouter() {
  const r = Router();
  r.get('/', read, async (req, res) => {
    const { siteId } = siteQuery.parse(req.query);
    res.json(await eq.listInverters(req.user!, siteId, includeArchived.parse(req.query).includeArchived));
  });
  r.post('/', write, async (req, res) => {
    res.status(201).json(await eq.createInverter(req.user!, inverterInputSchema.parse(req.body)));
  });
  r.patch('/:id', write, async (req, res) => {
    res.json(await eq.updateInverter(req.user!, idParams.parse(req.params).id, inverterUpdate.parse(req.body)));
  });
  r.delete('/:id', write, async (req, res) => {
    await eq.deleteInverter(req.user!, idParams.parse(req.params).id);
    res.status(204).end();
  });
  return r;
}

export function combinerBoxesRouter() {
  const r = Router();
  r.get('/', read, async (req, res) => {
    const { siteId } = siteQuery.parse(req.query);
    res.json(await eq.listCombinerBoxes(req.user!, siteId, includeArchived.parse(req.query).includeArchived));
  });
  r.post('/', write, async (req, res) => {
    res.status(201).json(await eq.createCombinerBox(req.user!, combinerBoxInputSchema.parse(req.body)));
  });
  r.patch('/:id', write, async (req, res) => {
    res.json(await eq.updateCombinerBox(req.user!, idParams.parse(req.params).id, combinerUpdate.parse(req.body)));
  });
  r.delete('/:id', write, async (req, res) => {
    await eq.deleteCombinerBox(req.user!, idParams.parse(req.params).id);
    res.status(204).end();
  });
  return r;
}
