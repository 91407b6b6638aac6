import { useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { LinkButton } from '@/components/ui/link-button';
import { ApiError } from '@/lib/api-client';
import { mapServerErrors } from '@/lib/field-errors';
import { useResetPassword } from '../api/account';
import { checkNewPassword, plausibleToken, type Errors } from '../password-form';
import { NewPasswordFields } from './password-fields';
import { FormError, PublicCard } from './public-card';

/** /reset-password?token=…: choose a new password, then sign in with it. */
export function ResetPasswordPage() {
  const [params] = useSearchParams();
  const token = params.get('token');
  const reset = useResetPassword();
  const [values, setValues] = useState({ password: '', repeat: '' });
  const [errors, setErrors] = useState<Errors<'password' | 'repeat'> & { root?: string | null }>({});

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

  const submit = () => {
    const found = checkNewPassword(values.password, values.repeat);
    if (Object.keys(found).length) return setErrors(found);
    setErrors({});
    reset.mutate(
      { token, password: values.password },
      {
        onError: (err) => {
          if (err instanceof ApiError && err.code === 'invalid_token') return setErrors({ root: err.message });
          const mapped = mapServerErrors(err, { password: 'Password' });
          setErrors({ ...mapped.fields, root: mapped.root });
        },
      },
    );
  };

  return (
    <PublicCard title="Choose a new password">
      <form
        aria-label="Choose a new password"
        noValidate
        className="flex flex-col gap-3"
        onSubmit={(e) => {
          e.preventDefault();
          submit();
        }}
      >
        <NewPasswordFields
          password={values.password}
          repeat={values.repeat}
          errors={errors}
          onPassword={(v) => setValues({ ...values, password: v })}
          onRepeat={(v) => setValues({ ...values, repeat: v })}
        />
        <FormError message={errors.root} />
        {errors.root && reset.error instanceof ApiError && reset.error.code === 'invalid_token' ? (
          <Link to="/forgot-password" className="text-sm font-bold text-sounding underline">
            Ask for a new link
          </Link>
        ) : null}
        <Button type="submit" disabled={reset.isPending}>
          {reset.isPending ? 'Saving…' : 'Save the new password'}
        </Button>
      </form>
    </PublicCard>
  );
}
