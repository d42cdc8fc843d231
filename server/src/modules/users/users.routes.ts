import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { createUserBodySchema, updateUserBodySchema } from '@shared/schemas/users';
import { idParamSchema } from '@shared/schemas/common';
import { currentUser, requireRole } from '../../http/require-role';
import { parse } from '../../http/validate';
import { createUser, listUsers, updateUser } from './users.service';
import { presentUser } from './users.presenter';

export function usersRouter(deps: { db: DataSource; onUserLockedOut?: (userId: number) => void }) {
  const r = Router();
  r.use(requireRole('admin'));

  r.get('/', async (req, res) => {
    const users = await listUsers(deps.db, currentUser(req));
    res.json({ users: users.map(presentUser) });
  });

  r.post('/', async (req, res) => {
    const body = parse(createUserBodySchema, req.body);
    res.status(201).json(await createUser(deps.db, currentUser(req), body));
  });

  r.patch('/:id', async (req, res) => {
    const { id } = parse(idParamSchema, req.params, 'params');
    const body = parse(updateUserBodySchema, req.body);
    const user = await updateUser(deps.db, currentUser(req), id, body);
    if (body.active === false || body.password) deps.onUserLockedOut?.(id);
    res.json(user);
  });

  return r;
}
