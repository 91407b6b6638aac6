import type { RequestHandler } from 'express';
import { can, type Permission } from '../../shared/schemas/auth';
import { forbidden, unauthorized } from '../errors';

/** 401 without a session. */
export const requireSignIn: RequestHandler = (req, _res, next) => {
  if (!req.user) return next(unauthorized());
  next();
};

/**
 * The one role check: every API route names the permission it needs, and the caller's
 * role must grant it (see ROLE_PERMISSIONS in shared/schemas/auth.ts).
 */
export function authorize(permission: Permission): RequestHandler {
  return (req, _res, next) => {
    if (!req.user) return next(unauthorized());
    if (!can(req.user.role, permission)) return next(forbidden());
    next();
  };
}
