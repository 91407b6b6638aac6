import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Link, useSearchParams } from 'react-router-dom';
import type { SessionUserDto } from '@shared/schemas/auth';
import { SubmitButton } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { FormError } from '@/components/ui/form-error';
import { ApiError } from '@/lib/api-client';
import { setServerErrors } from '@/lib/field-errors';
import { useAcceptInvitation } from '../api/account';
import { plausibleToken, welcomeFormSchema } from '../password-form';
import { NewPasswordFields } from './password-fields';
import { PublicCard } from '@/components/public-card';

/** /welcome?token=…: accept an invitation with a name and a password; signs in. */
export function WelcomePage({ onSignedIn }: { onSignedIn: (user: SessionUserDto) => void }) {
  const [params] = useSearchParams();
  const token = params.get('token');
  const accept = useAcceptInvitation();
  const form = useForm({ resolver: zodResolver(welcomeFormSchema), defaultValues: { name: '', password: '', repeat: '' } });
  const { errors } = form.formState;

  if (!plausibleToken(token)) {
    return (
      <PublicCard title="Invitation">
        <p role="alert" className="text-sm">
          This link is incomplete. Open the link from your invitation e-mail again, or ask an administrator for a new invitation.
        </p>
      </PublicCard>
    );
  }

  const submit = form.handleSubmit(async ({ name, password }) => {
    try {
      const { user } = await accept.mutateAsync({ token, name, password });
      onSignedIn(user);
    } catch (err) {
      if (err instanceof ApiError && err.code === 'invalid_token') form.setError('root', { type: 'server', message: err.message });
      else setServerErrors(form.setError, err, { name: 'Name', password: 'Password' });
    }
  });

  return (
    <PublicCard title="Welcome: set up your account">
      <p className="mb-3 text-sm text-ink-soft">You were invited to Isobath. Tell your colleagues who you are and choose a password.</p>
      <form aria-label="Accept the invitation" noValidate className="flex flex-col gap-3" onSubmit={submit}>
        <TextField label="Your name" autoComplete="name" autoFocus error={errors.name?.message} {...form.register('name')} />
        <NewPasswordFields
          label="Password"
          password={form.register('password')}
          repeat={form.register('repeat')}
          errors={{ password: errors.password?.message, repeat: errors.repeat?.message }}
        />
        <FormError message={errors.root?.message} />
        {errors.root && accept.error instanceof ApiError && accept.error.code === 'invalid_token' ? (
          <p className="text-xs text-ink-soft">
            Already set up? <Link to="/sign-in" className="font-bold text-sounding underline">Sign in</Link>.
          </p>
        ) : null}
        <SubmitButton busy={accept.isPending} busyLabel="Setting up…">
          Set up my account
        </SubmitButton>
      </form>
    </PublicCard>
  );
}
