/**
 * Helpers shared by the engine's tests (not used by the engine itself).
 */

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
