import type { z } from 'zod';
import { badRequest, fieldErrorsFromZod } from '../errors';

/** Parse input with a shared zod schema, or throw a 400 naming every bad field. */
export function parse<S extends z.ZodType>(schema: S, input: unknown, what = 'request'): z.output<S> {
  const result = schema.safeParse(input);
  if (!result.success) {
    throw badRequest(`The ${what} has invalid fields.`, fieldErrorsFromZod(result.error));
  }
  return result.data;
}

export const parseId = (raw: unknown, what = 'id'): number => {
  const value = typeof raw === 'string' && /^[1-9][0-9]{0,9}$/.test(raw) ? Number(raw) : NaN;
  if (!Number.isSafeInteger(value) || value > 2_147_483_647) {
    throw badRequest(`The ${what} must be a positive whole number.`, { [what]: 'must be a positive whole number' });
  }
  return value;
};
