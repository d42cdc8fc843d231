import type { Request, RequestHandler } from 'express';
import type { Role } from '@shared/schemas/common';
import type { SessionUser } from '@shared/schemas/auth';
import { forbidden, unauthenticated } from './errors';

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace -- Express's own way to type req.user
  namespace Express {
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type -- merged with the signed-in user's shape
    interface User extends SessionUser {}
  }
}

export const ANY_SIGNED_IN: readonly Role[] = ['agent', 'supervisor', 'finance', 'admin'];

/** Every route declares who may call it: 401 when nobody is signed in, 403 when the role is not in the list. */
export function requireRole(...roles: Role[]): RequestHandler {
  return (req, _res, next) => {
    if (!req.user) throw unauthenticated();
    if (!roles.includes(req.user.role)) throw forbidden();
    next();
  };
}

export function currentUser(req: Request): SessionUser {
  if (!req.user) throw unauthenticated();
  return req.user;
}

/** Routes ask the services' own station-scope question. */
export { canSeeStation } from '../domain/station-scope';
