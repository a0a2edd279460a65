import { Router } from 'express';
import { z } from 'zod';
import { inviteUserInputSchema, pageQuerySchema, updateUserInputSchema, userListQuerySchema } from '@stringfield/shared';
import { requirePermission } from '../middleware/require-role.ts';
import { inviteUser, listUsers, updateUser } from '../services/users.service.ts';

const idParamsSchema = z.object({ id: z.coerce.number({ error: 'Id must be a number' }).int().positive('Id must be a positive number') });

export function usersRouter() {
  const router = Router();
  router.use(requirePermission('users:manage'));

  router.get('/', async (req, res) => {
    const query = userListQuerySchema.and(pageQuerySchema).parse(req.query);
    res.json(await listUsers(query));
  });

  router.post('/', async (req, res) => {
    const input = inviteUserInputSchema.parse(req.body);
    res.status(201).json(await inviteUser(input));
  });

  router.patch('/:id', async (req, res) => {
    const { id } = idParamsSchema.parse(req.params);
    const input = updateUserInputSchema.parse(req.body);
    res.json(await updateUser(id, input, req.user!.id));
  });

  return router;
}
