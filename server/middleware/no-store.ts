import type { RequestHandler } from 'express';

/**
 * `Cache-Control: no-store` on every API answer, set before the route runs (a route may replace
 * it, e.g. a download's `private, no-store`). Signed-in answers hold what only their reader may
 * see; public ones (sign-in, health) gain nothing from a cached copy either.
 */
export const noStore: RequestHandler = (_req, res, next) => {
  res.setHeader('Cache-Control', 'no-store');
  next();
};
