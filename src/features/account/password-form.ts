import { z } from 'zod';
import { invitationAcceptSchema, passwordChangeSchema, passwordResetSchema } from '@shared/schemas/projects';

/**
 * The account forms' zod schemas, for zodResolver: the shared request schemas (the link token
 * comes from the address, not the form) plus the new password typed a second time.
 */

const REPEAT = 'The two new passwords differ; type the same one twice.';

/** A check on one field that runs only once that field itself is valid. */
const onceValid = (field: string) => (payload: z.core.ParsePayload) => !payload.issues.some((issue) => issue.path?.[0] === field);

export const passwordChangeFormSchema = passwordChangeSchema
  .extend({ repeat: z.string() })
  .refine((v) => v.repeat === v.newPassword, { path: ['repeat'], message: REPEAT, when: onceValid('newPassword') })
  .refine((v) => v.newPassword !== v.currentPassword, {
    path: ['newPassword'],
    message: 'Choose a password different from the current one.',
    when: onceValid('newPassword'),
  });
export type PasswordChangeForm = z.input<typeof passwordChangeFormSchema>;

/** Reset: a new password typed twice. */
export const newPasswordFormSchema = passwordResetSchema
  .omit({ token: true })
  .extend({ repeat: z.string() })
  .refine((v) => v.repeat === v.password, { path: ['repeat'], message: REPEAT, when: onceValid('password') });
export type NewPasswordForm = z.input<typeof newPasswordFormSchema>;

/** Invitation: a name and a new password typed twice. */
export const welcomeFormSchema = invitationAcceptSchema
  .omit({ token: true })
  .extend({ repeat: z.string() })
  .refine((v) => v.repeat === v.password, { path: ['repeat'], message: REPEAT, when: onceValid('password') });
export type WelcomeForm = z.input<typeof welcomeFormSchema>;

/** A link token as the server issues them (base64url, 43 characters for 32 bytes); anything else is not worth sending. */
export const plausibleToken = (token: string | null): token is string => !!token && /^[A-Za-z0-9_-]{20,200}$/.test(token);
