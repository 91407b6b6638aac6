import { z } from 'zod';

/** What a form model's check says of the typed form: the input to send, or messages by form path. */
export type FormCheck<T> = { ok: true; value: T } | { ok: false; errors: Partial<Record<string, string>> };

/**
 * The zod schema a form gives zodResolver when its fields hold text as typed (numbers in the units
 * on screen) rather than the API's input: `check` builds the input in SI and checks it with the
 * shared schema, naming each problem by form path ("root": the form as a whole). The schema's
 * output, what handleSubmit receives, is the input to send.
 */
export function checkedFormSchema<F, T>(check: (form: F) => FormCheck<T>) {
  return z.custom<F>().transform((form, ctx): T => {
    const result = check(form);
    if (result.ok) return result.value;
    for (const [path, message] of Object.entries(result.errors)) {
      if (message) ctx.addIssue({ code: 'custom', path: path.split('.'), message });
    }
    return z.NEVER;
  });
}
