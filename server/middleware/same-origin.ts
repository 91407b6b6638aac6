import type { RequestHandler } from 'express';
import { AppError } from '../errors';

const SAFE = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Refuses state-changing requests from other origins. Browsers send Origin (and
 * Sec-Fetch-Site) on cross-origin requests; scripts such as curl send neither and are
 * allowed, since they hold the cookie themselves. Bodies must be JSON (or multipart on
 * upload routes), which a cross-site HTML form cannot send without a preflight.
 */
export const sameOriginOnly: RequestHandler = (req, _res, next) => {
  if (SAFE.has(req.method)) return next();
  const origin = req.get('origin');
  const site = req.get('sec-fetch-site');
  if (origin && origin !== 'null') {
    const expected = `${req.protocol}://${req.get('host')}`;
    if (origin !== expected) return next(new AppError(403, 'cross_origin', 'Requests from another site are refused.'));
  } else if (origin === 'null' || (site && site !== 'same-origin' && site !== 'none')) {
    return next(new AppError(403, 'cross_origin', 'Requests from another site are refused.'));
  }
  const length = Number(req.get('content-length') ?? 0);
  const chunked = !!req.get('transfer-encoding');
  if (length > 0 || chunked) {
    const type = (req.get('content-type') ?? '').toLowerCase();
    if (!type.startsWith('application/json') && !type.startsWith('multipart/form-data')) {
      return next(new AppError(415, 'unsupported_media_type', 'Send the body as application/json.'));
    }
  }
  next();
};
