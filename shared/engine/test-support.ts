/**
 * Helpers shared by the engine's tests (not used by the engine itself).
 */

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
