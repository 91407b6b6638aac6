import { zodResolver } from '@hookform/resolvers/zod';
import type { FieldErrors, FieldValues, ResolverOptions } from 'react-hook-form';
import type { z } from 'zod';

const OPTIONS = { fields: {}, shouldUseNativeValidation: false } as ResolverOptions<FieldValues>;

/** For unit tests: the message of each top-level field that zodResolver finds wrong, as a form would show it. */
export async function formErrors(schema: z.ZodType<unknown, FieldValues>, values: FieldValues): Promise<Record<string, string | undefined>> {
  const { errors } = (await zodResolver(schema)(values, undefined, OPTIONS)) as { errors: FieldErrors };
  return Object.fromEntries(Object.entries(errors).map(([field, error]) => [field, error?.message as string | undefined]));
}
