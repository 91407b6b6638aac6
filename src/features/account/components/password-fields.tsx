import { TextField } from '@/components/ui/field';

/** A new password typed twice, with the length rule as a hint. */
export function NewPasswordFields({
  password,
  repeat,
  errors,
  onPassword,
  onRepeat,
  label = 'New password',
}: {
  password: string;
  repeat: string;
  errors: { password?: string; repeat?: string };
  onPassword: (v: string) => void;
  onRepeat: (v: string) => void;
  label?: string;
}) {
  return (
    <>
      <TextField
        label={label}
        type="password"
        autoComplete="new-password"
        value={password}
        error={errors.password}
        hint="At least 12 characters. A passphrase of several words is easy to remember and hard to guess."
        onChange={(e) => onPassword(e.target.value)}
      />
      <TextField label="Repeat it" type="password" autoComplete="new-password" value={repeat} error={errors.repeat} onChange={(e) => onRepeat(e.target.value)} />
    </>
  );
}
