import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { loginSchema, type LoginInput } from '@shared/schemas/auth';
import { useSignIn } from '../api/session';
import { TextField } from '@/components/ui/field';
import { SubmitButton } from '@/components/ui/button';
import { FormError } from '@/components/ui/form-error';
import { setServerErrors } from '@/lib/field-errors';
import { PublicCard } from '@/components/public-card';

export function SignInPage() {
  const navigate = useNavigate();
  const [params] = useSearchParams();
  const signIn = useSignIn();
  const form = useForm<LoginInput>({ resolver: zodResolver(loginSchema), defaultValues: { email: '', password: '' } });
  const next = params.get('next');
  const safeNext = next && next.startsWith('/') && !next.startsWith('//') ? next : '/';

  const onSubmit = form.handleSubmit(async (values) => {
    try {
      await signIn.mutateAsync(values);
      navigate(safeNext, { replace: true });
    } catch (err) {
      setServerErrors(form.setError, err, { email: 'E-mail', password: 'Password' });
    }
  });

  const { errors, isSubmitting } = form.formState;
  return (
    <PublicCard>
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-3" aria-label="Sign in">
        <TextField label="E-mail" type="email" autoComplete="username" autoFocus error={errors.email?.message} {...form.register('email')} />
        <TextField label="Password" type="password" autoComplete="current-password" error={errors.password?.message} {...form.register('password')} />
        <FormError message={errors.root?.message} />
        <SubmitButton busy={isSubmitting} busyLabel="Signing in…">
          Sign in
        </SubmitButton>
      </form>
      <p className="mt-4 text-center text-sm">
        <Link to="/forgot-password" className="text-sounding underline hover:text-sounding-dark">
          Forgot your password?
        </Link>
      </p>
    </PublicCard>
  );
}
