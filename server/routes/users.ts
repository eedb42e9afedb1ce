import { Router } from 'express';
import { z } from 'zod';
import { createUserInput, roleSchema, updateUserInput } from '../../shared/schemas/users';
import { actorOf, requireRole } from '../lib/auth';
import { idOf } from '../lib/params';
import { deps } from '../lib/validate';
import * as users from '../services/users';

const listQuery = z.object({ search: z.string().max(100).optional(), role: roleSchema.optional() });

export function usersRouter() {
  const r = Router();
  r.use(requireRole('admin'));
  r.get('/', async (req, res) => {
    res.json({ data: await users.listUsers(listQuery.parse(req.query)), meta: {} });
  });
  r.post('/', async (req, res) => {
    res.status(201).json(await users.createUser(deps(res), actorOf(res), createUserInput.parse(req.body)));
  });
  r.patch('/:id', async (req, res) => {
    const id = idOf(req.params.id, 'User');
    res.json(await users.updateUser(deps(res), actorOf(res), id, updateUserInput.parse(req.body)));
  });
  return r;
}
