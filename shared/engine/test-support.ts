/**
 * Helpers shared by the engine's tests (not used by the engine itself).
 */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { ratingTableContentSchema, type RatingTableContent } from '../schemas/rating-tables';
import type { RatingTable } from './types';

/** The seeded rating tables as written in data/rating-tables.json (not validated). */
export function seededRatingTableRows(): (RatingTableContent & { key: string; reference: string })[] {
  const seed = JSON.parse(readFileSync(fileURLToPath(new URL('../../data/rating-tables.json', import.meta.url)), 'utf8')) as {
    ratingTables: (RatingTableContent & { key: string; reference: string })[];
  };
  return seed.ratingTables;
}

/**
 * The seeded rating tables (data/rating-tables.json) by key, in file order, each validated by the
 * shared schema, with ids 1, 2, … in that order.
 */
export function seededRatingTables(): Record<string, RatingTable> {
  return Object.fromEntries(
    seededRatingTableRows().map(({ key, reference, name, geometry, includedAngle, limits, grade, note, data }, i) => {
      const content = ratingTableContentSchema.parse({ name, geometry, includedAngle, limits, grade, note, data });
      return [key, { ...content, source: reference, id: i + 1 }];
    }),
  );
}

/** Pa per psi: 1 lbf = 0.45359237 kg × 9.80665 m/s² over (0.0254 m)², all three exact [calc]. */
export const PSI = 6894.757293168;

/** Every number inside `value` (objects and arrays, recursively) is finite. */
export function everyNumberFinite(value: unknown): boolean {
  if (typeof value === 'number') return Number.isFinite(value);
  if (Array.isArray(value)) return value.every(everyNumberFinite);
  if (value !== null && typeof value === 'object') return Object.values(value).every(everyNumberFinite);
  return true;
}

/** JSON round trip gives back an equal value (no NaN, Infinity, undefined-in-array, functions). */
export function jsonSafe(value: unknown): boolean {
  return everyNumberFinite(value) && JSON.stringify(JSON.parse(JSON.stringify(value))) === JSON.stringify(value);
}
