import { invitationAcceptSchema, passwordChangeSchema, passwordResetRequestSchema, passwordSchema } from '@shared/schemas/projects';

export type Errors<K extends string> = Partial<Record<K, string>>;

const firstByField = <K extends string>(issues: { path: PropertyKey[]; message: string }[], fields: readonly K[]): Errors<K> => {
  const out: Errors<K> = {};
  for (const issue of issues) {
    const key = String(issue.path[0]) as K;
    if (fields.includes(key)) out[key] ??= issue.message;
  }
  return out;
};

const REPEAT = 'The two new passwords differ; type the same one twice.';

/** The change-password form, checked with the shared schema, plus the repeated new password. */
export function checkPasswordChange(v: { currentPassword: string; newPassword: string; repeat: string }): Errors<'currentPassword' | 'newPassword' | 'repeat'> {
  const parsed = passwordChangeSchema.safeParse({ currentPassword: v.currentPassword, newPassword: v.newPassword });
  const errors: Errors<'currentPassword' | 'newPassword' | 'repeat'> = parsed.success ? {} : firstByField(parsed.error.issues, ['currentPassword', 'newPassword'] as const);
  if (!errors.newPassword && v.repeat !== v.newPassword) errors.repeat = REPEAT;
  if (!errors.newPassword && v.newPassword && v.newPassword === v.currentPassword) errors.newPassword = 'Choose a password different from the current one.';
  return errors;
}

/** A new password typed twice (reset or invitation). */
export function checkNewPassword(password: string, repeat: string): Errors<'password' | 'repeat'> {
  const parsed = passwordSchema.safeParse(password);
  if (!parsed.success) return { password: parsed.error.issues[0]?.message };
  return repeat === password ? {} : { repeat: REPEAT };
}

/** The welcome form: name and a new password typed twice. */
export function checkWelcome(v: { token: string; name: string; password: string; repeat: string }): Errors<'name' | 'password' | 'repeat'> {
  const parsed = invitationAcceptSchema.safeParse({ token: v.token, name: v.name, password: v.password });
  const errors: Errors<'name' | 'password' | 'repeat'> = parsed.success ? {} : firstByField(parsed.error.issues, ['name', 'password'] as const);
  if (!errors.password && v.repeat !== v.password) errors.repeat = REPEAT;
  return errors;
}

export function checkResetRequest(email: string): Errors<'email'> {
  const parsed = passwordResetRequestSchema.safeParse({ email });
  return parsed.success ? {} : firstByField(parsed.error.issues, ['email'] as const);
}

/** A link token as the server issues them (base64url, 43 characters for 32 bytes); anything else is not worth sending. */
export const plausibleToken = (token: string | null): token is string => !!token && /^[A-Za-z0-9_-]{20,200}$/.test(token);
