import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { passwordResetRequestSchema } from '@shared/schemas/projects';
import { SubmitButton } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { FormError } from '@/components/ui/form-error';
import { setServerErrors } from '@/lib/field-errors';
import { useRequestPasswordReset } from '../api/account';
import { PublicCard } from '@/components/public-card';

/** Asks for a reset link. The answer is the same whether or not the address has an account. */
export function ForgotPasswordPage() {
  const request = useRequestPasswordReset();
  const form = useForm({ resolver: zodResolver(passwordResetRequestSchema), defaultValues: { email: '' } });
  const { errors } = form.formState;
  const [sentTo, setSentTo] = useState<string | null>(null);

  const submit = form.handleSubmit(async () => {
    // The address as typed (the schema's output is lower-cased), for the message and the request.
    const email = form.getValues('email').trim();
    try {
      await request.mutateAsync({ email });
      setSentTo(email);
    } catch (err) {
      setServerErrors(form.setError, err, { email: 'E-mail' });
    }
  });

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
      <form aria-label="Ask for a reset link" noValidate className="flex flex-col gap-3" onSubmit={submit}>
        <TextField label="E-mail" type="email" autoComplete="username" autoFocus error={errors.email?.message} {...form.register('email')} />
        <FormError message={errors.root?.message} />
        <SubmitButton busy={request.isPending} busyLabel="Sending…">
          Send the link
        </SubmitButton>
      </form>
    </PublicCard>
  );
}
