import { useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import type { SessionUserDto } from '@shared/schemas/auth';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { ApiError } from '@/lib/api-client';
import { mapServerErrors } from '@/lib/field-errors';
import { useAcceptInvitation } from '../api/account';
import { checkWelcome, plausibleToken, type Errors } from '../password-form';
import { NewPasswordFields } from './password-fields';
import { FormError, PublicCard } from './public-card';

/** /welcome?token=…: accept an invitation with a name and a password; signs in. */
export function WelcomePage({ onSignedIn }: { onSignedIn: (user: SessionUserDto) => void }) {
  const [params] = useSearchParams();
  const token = params.get('token');
  const accept = useAcceptInvitation();
  const [values, setValues] = useState({ name: '', password: '', repeat: '' });
  const [errors, setErrors] = useState<Errors<'name' | 'password' | 'repeat'> & { root?: string | null }>({});

  if (!plausibleToken(token)) {
    return (
      <PublicCard title="Invitation">
        <p role="alert" className="text-sm">
          This link is incomplete. Open the link from your invitation e-mail again, or ask an administrator for a new invitation.
        </p>
      </PublicCard>
    );
  }

  const submit = () => {
    const found = checkWelcome({ token, ...values });
    if (Object.keys(found).length) return setErrors(found);
    setErrors({});
    accept.mutate(
      { token, name: values.name.trim(), password: values.password },
      {
        onSuccess: ({ user }) => onSignedIn(user),
        onError: (err) => {
          if (err instanceof ApiError && err.code === 'invalid_token') return setErrors({ root: err.message });
          const mapped = mapServerErrors(err, { name: 'Name', password: 'Password' });
          setErrors({ ...mapped.fields, root: mapped.root });
        },
      },
    );
  };

  return (
    <PublicCard title="Welcome: set up your account">
      <p className="mb-3 text-sm text-ink-soft">You were invited to Isobath. Tell your colleagues who you are and choose a password.</p>
      <form
        aria-label="Accept the invitation"
        noValidate
        className="flex flex-col gap-3"
        onSubmit={(e) => {
          e.preventDefault();
          submit();
        }}
      >
        <TextField label="Your name" autoComplete="name" autoFocus value={values.name} error={errors.name} onChange={(e) => setValues({ ...values, name: e.target.value })} />
        <NewPasswordFields
          label="Password"
          password={values.password}
          repeat={values.repeat}
          errors={{ password: errors.password, repeat: errors.repeat }}
          onPassword={(v) => setValues({ ...values, password: v })}
          onRepeat={(v) => setValues({ ...values, repeat: v })}
        />
        <FormError message={errors.root} />
        {errors.root && accept.error instanceof ApiError && accept.error.code === 'invalid_token' ? (
          <p className="text-xs text-ink-soft">
            Already set up? <Link to="/sign-in" className="font-bold text-sounding underline">Sign in</Link>.
          </p>
        ) : null}
        <Button type="submit" disabled={accept.isPending}>
          {accept.isPending ? 'Setting up…' : 'Set up my account'}
        </Button>
      </form>
    </PublicCard>
  );
}
