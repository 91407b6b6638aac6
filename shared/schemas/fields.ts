/**
 * Small builders for the calculation's request fields, with human messages: whole sentences
 * naming the field, for `{ error: { fields } }`. Numbers must be finite; objects are strict.
 */
import { z } from 'zod';

interface NumberRule {
  /** Inclusive lower bound. */
  min?: number;
  /** Exclusive lower bound. */
  gt?: number;
  /** Inclusive upper bound. */
  max?: number;
  /** Exclusive upper bound. */
  lt?: number;
  int?: boolean;
  /** Unit appended to bounds in messages, e.g. "m" or "Pa". */
  unit?: string;
}

const withUnit = (v: number, unit?: string) => (unit ? `${v} ${unit}` : `${v}`);

/** A finite number field named `label` in messages, with bounds. */
export function num(label: string, rule: NumberRule = {}) {
  const kind = rule.int ? 'a whole number' : 'a number';
  let s = z.number({
    error: (iss) => (iss.input === undefined ? `${label} is required.` : `${label} must be ${kind}.`),
  });
  if (rule.int) s = s.int({ error: `${label} must be a whole number.` });
  if (rule.gt !== undefined) s = s.gt(rule.gt, { error: `${label} must be greater than ${withUnit(rule.gt, rule.unit)}.` });
  if (rule.min !== undefined)
    s = s.min(rule.min, {
      error: rule.min === 0 ? `${label} must be zero or more.` : `${label} must be at least ${withUnit(rule.min, rule.unit)}.`,
    });
  if (rule.lt !== undefined) s = s.lt(rule.lt, { error: `${label} must be less than ${withUnit(rule.lt, rule.unit)}.` });
  if (rule.max !== undefined) s = s.max(rule.max, { error: `${label} must be at most ${withUnit(rule.max, rule.unit)}.` });
  return s;
}

/** A strict object whose unknown fields are refused with a sentence naming them. */
export function strict<T extends z.core.$ZodLooseShape>(label: string, shape: T) {
  return z.strictObject(shape, {
    error: (iss) => {
      if (iss.code === 'unrecognized_keys') {
        const keys = iss.keys.map((k) => `"${k}"`).join(', ');
        const allowed = Object.keys(shape).join(', ');
        return `${label} has unknown field${iss.keys.length > 1 ? 's' : ''} ${keys}; allowed: ${allowed}.`;
      }
      if (iss.code === 'invalid_type') return iss.input === undefined ? `${label} is required.` : `${label} must be an object.`;
      return undefined;
    },
  });
}

/**
 * A union of strict objects told apart by which fields are present. Zod reports a failed union
 * as one issue; this picks the option whose distinguishing field is present and repeats that
 * option's own messages, so the user learns what is wrong rather than "invalid input".
 */
export function keyedUnionMessage(label: string, expected: string, options: { key: string; index: number }[]) {
  return (iss: z.core.$ZodRawIssue): string => {
    if (iss.code !== 'invalid_union') return `${label} must be ${expected}.`;
    const input = iss.input;
    if (input === undefined) return `${label} is required.`;
    if (typeof input !== 'object' || input === null || Array.isArray(input)) return `${label} must be ${expected}.`;
    const chosen = options.find((o) => Object.prototype.hasOwnProperty.call(input, o.key));
    const errors = (iss as unknown as { errors?: { message: string }[][] }).errors;
    if (!chosen || !errors || !errors[chosen.index]) return `${label} must be ${expected}.`;
    const messages = errors[chosen.index].map((e) => e.message);
    return `${label}: ${[...new Set(messages)].join(' ')}`;
  };
}
