import type { UseFormRegisterReturn } from 'react-hook-form';
import { TextField } from '@/components/ui/field';

/** A new password typed twice, with the length rule as a hint; both registered on the caller's form. */
export function NewPasswordFields({
  password,
  repeat,
  errors,
  label = 'New password',
}: {
  password: UseFormRegisterReturn;
  repeat: UseFormRegisterReturn;
  errors: { password?: string; repeat?: string };
  label?: string;
}) {
  return (
    <>
      <TextField
        label={label}
        type="password"
        autoComplete="new-password"
        error={errors.password}
        hint="At least 12 characters. A passphrase of several words is easy to remember and hard to guess."
        {...password}
      />
      <TextField label="Repeat it" type="password" autoComplete="new-password" error={errors.repeat} {...repeat} />
    </>
  );
}
