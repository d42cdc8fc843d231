import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { createUserBodySchema, updateUserBodySchema } from '@shared/schemas/users';
import { idParamSchema } from '@shared/schemas/common';
import { currentUser, requireRole } from '../../http/require-role';
import { parse } from '../../http/validate';
import type { SignInThrottle } from '../auth/throttle';
import { createUser, listUsers, updateUser } from './users.service';

export interface UsersRouterDeps {
  db: DataSource;
  throttle: SignInThrottle;
  /** Deactivated or given a new password: every live connection of the user ends. */
  onUserSignedOut?: (userId: number) => void;
  /** Role or stations changed: live connections drop what the user may no longer watch. */
  onUserAccessChanged?: (userId: number) => void;
}

export function usersRouter(deps: UsersRouterDeps) {
  const r = Router();
  r.use(requireRole('admin'));

  r.get('/', async (req, res) => {
    res.json(await listUsers(deps.db, currentUser(req)));
  });

  r.post('/', async (req, res) => {
    const body = parse(createUserBodySchema, req.body);
    res.status(201).json(await createUser(deps.db, currentUser(req), body));
  });

  r.patch('/:id', async (req, res) => {
    const { id } = parse(idParamSchema, req.params, 'params');
    const body = parse(updateUserBodySchema, req.body);
    const { user, effects } = await updateUser(deps.db, currentUser(req), id, body);
    // A reset password is the admin's answer to a user who cannot get in: their failure counts go with it.
    if (effects.passwordReset) await deps.throttle.clearAccount(effects.email);
    if (effects.signedOut) deps.onUserSignedOut?.(id);
    else if (effects.accessChanged) deps.onUserAccessChanged?.(id);
    res.json(user);
  });

  return r;
}
