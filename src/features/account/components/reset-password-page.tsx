import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Link, useSearchParams } from 'react-router-dom';
import { SubmitButton } from '@/components/ui/button';
import { FormError } from '@/components/ui/form-error';
import { LinkButton } from '@/components/ui/link-button';
import { ApiError } from '@/lib/api-client';
import { setServerErrors } from '@/lib/field-errors';
import { useResetPassword } from '../api/account';
import { newPasswordFormSchema, plausibleToken } from '../password-form';
import { NewPasswordFields } from './password-fields';
import { PublicCard } from '@/components/public-card';

/** /reset-password?token=…: choose a new password, then sign in with it. */
export function ResetPasswordPage() {
  const [params] = useSearchParams();
  const token = params.get('token');
  const reset = useResetPassword();
  const form = useForm({ resolver: zodResolver(newPasswordFormSchema), defaultValues: { password: '', repeat: '' } });
  const { errors } = form.formState;

  if (!plausibleToken(token)) {
    return (
      <PublicCard title="Choose a new password">
        <p role="alert" className="text-sm">
          This link is incomplete. Open the link from the e-mail again, or{' '}
          <Link to="/forgot-password" className="font-bold text-sounding underline">
            ask for a new one
          </Link>
          .
        </p>
      </PublicCard>
    );
  }

  if (reset.isSuccess) {
    return (
      <PublicCard title="Password changed">
        <p role="status" className="mb-4 text-sm">
          {reset.data.message}
        </p>
        <LinkButton to="/sign-in">Sign in</LinkButton>
      </PublicCard>
    );
  }

  const submit = form.handleSubmit(async ({ password }) => {
    try {
      await reset.mutateAsync({ token, password });
    } catch (err) {
      if (err instanceof ApiError && err.code === 'invalid_token') form.setError('root', { type: 'server', message: err.message });
      else setServerErrors(form.setError, err, { password: 'Password' });
    }
  });

  return (
    <PublicCard title="Choose a new password">
      <form aria-label="Choose a new password" noValidate className="flex flex-col gap-3" onSubmit={submit}>
        <NewPasswordFields password={form.register('password')} repeat={form.register('repeat')} errors={{ password: errors.password?.message, repeat: errors.repeat?.message }} />
        <FormError message={errors.root?.message} />
        {errors.root && reset.error instanceof ApiError && reset.error.code === 'invalid_token' ? (
          <Link to="/forgot-password" className="text-sm font-bold text-sounding underline">
            Ask for a new link
          </Link>
        ) : null}
        <SubmitButton busy={reset.isPending} busyLabel="Saving…">
          Save the new password
        </SubmitButton>
      </form>
    </PublicCard>
  );
}
