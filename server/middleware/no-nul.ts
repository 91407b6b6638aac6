import type { RequestHandler } from 'express';
import { badRequest } from '../errors';

/** Dotted path of the first string (key or value) holding a NUL character, or null. */
function findNul(value: unknown, path: string[], depth: number): string | null {
  if (typeof value === 'string') return value.includes('\u0000') ? path.join('.') || '_' : null;
  if (depth > 64 || value === null || typeof value !== 'object') return null;
  for (const [key, child] of Object.entries(value)) {
    if (key.includes('\u0000')) return [...path, key.replace(/\u0000/g, '')].join('.') || '_';
    const found = findNul(child, [...path, key], depth + 1);
    if (found) return found;
  }
  return null;
}

/**
 * Text with NUL characters cannot be stored (PostgreSQL refuses it) and never means anything
 * here: refuse it as bad input, naming the field, before any service sees it.
 */
export const rejectNulCharacters: RequestHandler = (req, _res, next) => {
  const field = findNul(req.body, [], 0);
  if (field) return next(badRequest('Text may not contain NUL characters.', { [field]: 'contains a NUL character' }));
  next();
};
