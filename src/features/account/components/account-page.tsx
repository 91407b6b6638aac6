import { useState } from 'react';
import { ROLE_LABELS, type SessionUserDto } from '@shared/schemas/auth';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { Panel } from '@/components/ui/states';
import { mapServerErrors } from '@/lib/field-errors';
import { useChangePassword } from '../api/account';
import { checkPasswordChange, type Errors } from '../password-form';
import { NewPasswordFields } from './password-fields';
import { FormError } from './public-card';

type Field = 'currentPassword' | 'newPassword' | 'repeat';

function ChangePassword() {
  const change = useChangePassword();
  const [values, setValues] = useState({ currentPassword: '', newPassword: '', repeat: '' });
  const [errors, setErrors] = useState<Errors<Field> & { root?: string | null }>({});
  const [done, setDone] = useState<string | null>(null);

  const submit = () => {
    setDone(null);
    const found = checkPasswordChange(values);
    if (Object.keys(found).length) return setErrors(found);
    setErrors({});
    change.mutate(
      { currentPassword: values.currentPassword, newPassword: values.newPassword },
      {
        onSuccess: (r) => {
          setDone(r.message);
          setValues({ currentPassword: '', newPassword: '', repeat: '' });
        },
        onError: (err) => {
          const mapped = mapServerErrors(err, { currentPassword: 'Current password', newPassword: 'New password' });
          setErrors({ ...mapped.fields, root: mapped.root });
        },
      },
    );
  };

  return (
    <form
      aria-label="Change your password"
      noValidate
      className="flex max-w-sm flex-col gap-3"
      onSubmit={(e) => {
        e.preventDefault();
        submit();
      }}
    >
      <TextField
        label="Current password"
        type="password"
        autoComplete="current-password"
        value={values.currentPassword}
        error={errors.currentPassword}
        onChange={(e) => setValues({ ...values, currentPassword: e.target.value })}
      />
      <NewPasswordFields
        password={values.newPassword}
        repeat={values.repeat}
        errors={{ password: errors.newPassword, repeat: errors.repeat }}
        onPassword={(v) => setValues({ ...values, newPassword: v })}
        onRepeat={(v) => setValues({ ...values, repeat: v })}
      />
      <FormError message={errors.root} />
      {done ? (
        <p role="status" className="text-sm font-bold text-verdict-pass">
          {done}
        </p>
      ) : null}
      <Button type="submit" disabled={change.isPending} className="self-start">
        {change.isPending ? 'Changing…' : 'Change password'}
      </Button>
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
