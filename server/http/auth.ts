import type { RequestHandler } from 'express';
import { can, type Action } from '@shared/auth/permissions';
import { forbidden, unauthorized } from './errors';

/** Refuses with 401 unless someone is signed in. */
export const requireSignIn: RequestHandler = (req, _res, next) => {
  if (!req.user) throw unauthorized();
  next();
};

/** Refuses with 401 when signed out and 403 when the role may not perform the action. */
export function requirePermission(action: Action): RequestHandler {
  return (req, _res, next) => {
    if (!req.user) throw unauthorized();
    if (!can(req.user.role, action)) throw forbidden();
    next();
  };
}
