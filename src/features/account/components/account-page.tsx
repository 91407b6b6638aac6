import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { ROLE_LABELS, type SessionUserDto } from '@shared/schemas/auth';
import { SubmitButton } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { FormError, Notice } from '@/components/ui/form-error';
import { Panel } from '@/components/ui/states';
import { setServerErrors } from '@/lib/field-errors';
import { useChangePassword } from '../api/account';
import { passwordChangeFormSchema, type PasswordChangeForm } from '../password-form';
import { NewPasswordFields } from './password-fields';

const EMPTY: PasswordChangeForm = { currentPassword: '', newPassword: '', repeat: '' };
const LABELS = { currentPassword: 'Current password', newPassword: 'New password' };

function ChangePassword() {
  const change = useChangePassword();
  const form = useForm({ resolver: zodResolver(passwordChangeFormSchema), defaultValues: EMPTY });
  const { errors } = form.formState;
  const [done, setDone] = useState<string | null>(null);

  const submit = form.handleSubmit(async ({ currentPassword, newPassword }) => {
    try {
      const r = await change.mutateAsync({ currentPassword, newPassword });
      setDone(r.message);
      form.reset(EMPTY);
    } catch (err) {
      setServerErrors(form.setError, err, LABELS);
    }
  });

  return (
    <form aria-label="Change your password" noValidate className="flex max-w-sm flex-col gap-3" onSubmit={(e) => {
        setDone(null);
        void submit(e);
      }}
    >
      <TextField label="Current password" type="password" autoComplete="current-password" error={errors.currentPassword?.message} {...form.register('currentPassword')} />
      <NewPasswordFields
        password={form.register('newPassword')}
        repeat={form.register('repeat')}
        errors={{ password: errors.newPassword?.message, repeat: errors.repeat?.message }}
      />
      <FormError message={errors.root?.message} />
      <Notice message={done} />
      <SubmitButton busy={change.isPending} busyLabel="Changing…" className="self-start">
        Change password
      </SubmitButton>
    </form>
  );
}

export function AccountPage({ me }: { me: SessionUserDto }) {
  return (
    <div className="flex max-w-3xl flex-col gap-4">
      <div>
        <h1 className="text-2xl font-bold">Your account</h1>
        <p className="text-sm text-ink-soft">An administrator changes names, e-mail addresses and roles.</p>
      </div>
      <Panel title="Account">
        <dl className="grid grid-cols-[8rem_1fr] gap-y-1 text-sm">
          <dt className="text-ink-soft">Name</dt>
          <dd className="font-bold">{me.name}</dd>
          <dt className="text-ink-soft">E-mail</dt>
          <dd>{me.email}</dd>
          <dt className="text-ink-soft">Role</dt>
          <dd>{ROLE_LABELS[me.role]}</dd>
        </dl>
      </Panel>
      <Panel title="Change your password">
        <p className="mb-3 text-sm text-ink-soft">Your other sessions (other browsers, scripts using a session cookie) end when the password changes; this one stays.</p>
        <ChangePassword />
      </Panel>
    </div>
  );
}
