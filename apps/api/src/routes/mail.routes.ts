import { Router } from 'express';
import { z } from 'zod';
import { pageQuerySchema } from '@stringfield/shared';
import { requirePermission } from '../middleware/require-role.ts';
import { getMail, listMail } from '../services/mail.service.ts';

export function mailRouter() {
  const router = Router();
  router.use(requirePermission('mail:read'));

  router.get('/', async (req, res) => {
    res.json(await listMail(pageQuerySchema.parse(req.query)));
  });

  router.get('/:id', async (req, res) => {
    const { id } = z.object({ id: z.string().max(64) }).parse(req.params);
    res.json(await getMail(id));
  });

  return router;
}
