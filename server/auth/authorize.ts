import type { RequestHandler } from 'express';
import { can, type Permission } from '../../shared/schemas/auth';
import { forbidden, unauthorized } from '../errors';

/** Who may call a route: a permission, any signed-in user, or anyone. */
export type Access = Permission | 'signed-in' | 'public';

/** A guard that says which access it enforces, so the route table can be read back (OpenAPI, role matrix). */
export type Guard = RequestHandler & { access: Access };

const tag = (handler: RequestHandler, access: Access): Guard => Object.assign(handler, { access });

/** 401 without a session. */
export const requireSignIn: Guard = tag((req, _res, next) => {
  if (!req.user) return next(unauthorized());
  next();
}, 'signed-in');

/**
 * The one role check: every API route names the permission it needs, and the caller's
 * role must grant it (see ROLE_PERMISSIONS in shared/schemas/auth.ts).
 */
export function authorize(permission: Permission): Guard {
  return tag((req, _res, next) => {
    if (!req.user) return next(unauthorized());
    if (!can(req.user.role, permission)) return next(forbidden());
    next();
  }, permission);
}

/** Marks a route anyone may call (sign-in, health, account recovery). */
export const open: Guard = tag((_req, _res, next) => next(), 'public');
