import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { mapServerErrors } from '@/lib/field-errors';
import { useRequestPasswordReset } from '../api/account';
import { checkResetRequest } from '../password-form';
import { FormError, PublicCard } from './public-card';

/** Asks for a reset link. The answer is the same whether or not the address has an account. */
export function ForgotPasswordPage() {
  const request = useRequestPasswordReset();
  const [email, setEmail] = useState('');
  const [errors, setErrors] = useState<{ email?: string; root?: string | null }>({});
  const [sentTo, setSentTo] = useState<string | null>(null);

  const submit = () => {
    const found = checkResetRequest(email);
    if (found.email) return setErrors(found);
    setErrors({});
    request.mutate(
      { email: email.trim() },
      {
        onSuccess: () => setSentTo(email.trim()),
        onError: (err) => {
          const mapped = mapServerErrors(err, { email: 'E-mail' });
          setErrors({ ...mapped.fields, root: mapped.root });
        },
      },
    );
  };

  if (sentTo) {
    return (
      <PublicCard title="Check your e-mail">
        <p role="status" className="text-sm" data-testid="reset-requested">
          If <strong>{sentTo}</strong> belongs to an Isobath account, a link to choose a new password is on its way. It works once, within an hour.
        </p>
        <p className="mt-2 text-xs text-ink-soft">Nothing arrived after a few minutes? Look in the spam folder, or ask an administrator.</p>
      </PublicCard>
    );
  }

  return (
    <PublicCard title="Forgot your password?">
      <p className="mb-3 text-sm text-ink-soft">Enter the e-mail address you sign in with; we send a link to choose a new password.</p>
      <form
        aria-label="Ask for a reset link"
        noValidate
        className="flex flex-col gap-3"
        onSubmit={(e) => {
          e.preventDefault();
          submit();
        }}
      >
        <TextField label="E-mail" type="email" autoComplete="username" autoFocus value={email} error={errors.email} onChange={(e) => setEmail(e.target.value)} />
        <FormError message={errors.root} />
        <Button type="submit" disabled={request.isPending}>
          {request.isPending ? 'Sending…' : 'Send the link'}
        </Button>
      </form>
    </PublicCard>
  );
}
