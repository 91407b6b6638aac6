/**
 * Text that may end up in an e-mail's header (a shortlist's or a property set's name in a subject
 * line; people's and projects' names beside them) is one line: no line break, tab or other control
 * character, which in a header would end it or start another (header injection) or make the mail
 * server refuse the message.
 */
import { z } from 'zod';

/** C0 controls (line feed, carriage return, tab…), DEL, the C1 controls, and the Unicode line and paragraph separators. */
export const CONTROL_CHARACTERS = /[\u0000-\u001f\u007f-\u009f\u2028\u2029]/;

export const ONE_LINE_MESSAGE = 'must be one line, without line breaks, tabs or other control characters';

/** A trimmed one-line text of `min`…`max` characters (`required` is the message for an empty one). */
export function oneLineText({ min = 0, max, required }: { min?: number; max: number; required?: string }) {
  return z
    .string()
    .trim()
    .min(min, required)
    .max(max)
    .refine((v) => !CONTROL_CHARACTERS.test(v), ONE_LINE_MESSAGE);
}
