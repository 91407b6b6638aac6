import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { ROLES, ROLE_LABELS, type Role } from '@shared/schemas/auth';
import { invitationCreateSchema } from '@shared/schemas/projects';
import { Button } from '@/components/ui/button';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { SelectField, TextField } from '@/components/ui/field';
import { FormError } from '@/components/ui/form-error';
import { EmptyState, ErrorState, Panel, Spinner, Tag } from '@/components/ui/states';
import { ApiError } from '@/lib/api-client';
import { formatDateTime } from '@/lib/dates';
import { setServerErrors } from '@/lib/field-errors';
import type { AdminUserDto, InvitationState } from '@shared/schemas/projects';
import { useInvitations, useInvite, useUpdateUser, useUsers } from '../api/users';
import { AdminNav } from './admin-nav';

const errorText = (err: unknown) => (err instanceof ApiError ? err.message : 'The server did not answer. Try again.');

const STATE_TONE: Record<InvitationState, 'sounding' | 'pass' | 'neutral'> = { waiting: 'sounding', accepted: 'pass', expired: 'neutral' };
const STATE_LABEL: Record<InvitationState, string> = { waiting: 'waiting', accepted: 'accepted', expired: 'expired' };

function UserRow({ user, self, onToggle }: { user: AdminUserDto; self: boolean; onToggle: (u: AdminUserDto) => void }) {
  const update = useUpdateUser();
  const [saved, setSaved] = useState(false);
  // A role change takes effect at once on the account's next request: it is confirmed first.
  const [proposed, setProposed] = useState<Role | null>(null);
  const confirm = () => {
    if (!proposed) return;
    update.mutate(
      { id: user.id, role: proposed },
      {
        onSuccess: () => {
          setSaved(true);
          setProposed(null);
        },
      },
    );
  };
  return (
    <tr className={`border-t border-chart-line/60 align-middle ${user.active ? '' : 'text-ink-faint'}`}>
      <td className="py-2 pr-3">
        <span className="font-bold">{user.name}</span> {self ? <Tag>you</Tag> : null}
      </td>
      <td className="py-2 pr-3">{user.email}</td>
      <td className="py-2 pr-3">
        <SelectField
          label={<span className="sr-only">Role of {user.name}</span>}
          value={user.role}
          disabled={self || update.isPending}
          error={update.isError && !proposed ? errorText(update.error) : undefined}
          hint={self ? 'Another administrator changes yours.' : saved ? 'Saved.' : undefined}
          onChange={(e) => {
            setSaved(false);
            update.reset();
            setProposed(e.target.value as Role);
          }}
          wrapperClassName="w-40"
        >
          {ROLES.map((r) => (
            <option key={r} value={r}>
              {ROLE_LABELS[r]}
            </option>
          ))}
        </SelectField>
      </td>
      <td className="py-2 pr-3">
        <div className="flex items-center gap-2">
          <Tag tone={user.active ? 'pass' : 'neutral'}>{user.active ? 'active' : 'deactivated'}</Tag>
          {!self ? (
            <Button tone="quiet" className="!px-2 !py-0.5 text-xs" onClick={() => onToggle(user)} aria-label={`${user.active ? 'Deactivate' : 'Reactivate'} ${user.name}`}>
              {user.active ? 'Deactivate…' : 'Reactivate…'}
            </Button>
          ) : null}
        </div>
      </td>
      <td className="whitespace-nowrap py-2">
        {user.lastLoginAt ? formatDateTime(user.lastLoginAt) : <span className="text-ink-faint">never</span>}
        <ConfirmDialog
          open={proposed !== null}
          title={`Make ${user.name} ${proposed ? ROLE_LABELS[proposed].toLowerCase() : ''}?`}
          confirmLabel="Change the role"
          busy={update.isPending}
          busyLabel="Changing…"
          error={update.isError ? errorText(update.error) : undefined}
          onConfirm={confirm}
          onClose={() => {
            setProposed(null);
            update.reset();
          }}
        >
          <p>
            {user.name} ({user.email}) is {ROLE_LABELS[user.role].toLowerCase()} now. As {proposed ? ROLE_LABELS[proposed].toLowerCase() : ''} they can use what that role
            allows from their next request on; the audit log records the change.
          </p>
        </ConfirmDialog>
      </td>
    </tr>
  );
}

const INVITE_LABELS = { email: 'E-mail', role: 'Role' };

function InviteForm() {
  const invite = useInvite();
  const form = useForm({ resolver: zodResolver(invitationCreateSchema), defaultValues: { email: '', role: 'engineer' as Role } });
  const { errors } = form.formState;
  const [sent, setSent] = useState<string | null>(null);

  const submit = form.handleSubmit(async (input) => {
    try {
      const inv = await invite.mutateAsync(input);
      setSent(`Invitation sent to ${inv.email}; the link works once, until ${formatDateTime(inv.expiresAt)}.`);
      form.resetField('email');
    } catch (err) {
      // An address that has an account belongs to that field.
      if (err instanceof ApiError && err.code === 'has_account') form.setError('email', { type: 'server', message: err.message });
      else setServerErrors(form.setError, err, INVITE_LABELS);
    }
  });

  return (
    <form
      aria-label="Invite someone"
      noValidate
      className="flex flex-col gap-3"
      onSubmit={(e) => {
        setSent(null);
        void submit(e);
      }}
    >
      <div className="grid gap-3 sm:grid-cols-[1fr_12rem_auto] sm:items-start">
        <TextField label="E-mail" type="email" autoComplete="off" error={errors.email?.message} placeholder="name@harrow.example" {...form.register('email')} />
        <SelectField label="Role" error={errors.role?.message} {...form.register('role')}>
          {ROLES.map((r) => (
            <option key={r} value={r}>
              {ROLE_LABELS[r]}
            </option>
          ))}
        </SelectField>
        <Button type="submit" className="sm:mt-5" disabled={invite.isPending}>
          {invite.isPending ? 'Sending…' : 'Send invitation'}
        </Button>
      </div>
      <FormError message={errors.root?.message} />
      {sent ? (
        <p role="status" className="text-sm text-verdict-pass">
          {sent}
        </p>
      ) : null}
      <p className="text-xs text-ink-soft">They receive a one-time link to choose their name and password; it expires after 72 hours.</p>
    </form>
  );
}

function Invitations() {
  const invitations = useInvitations();
  if (invitations.isPending) return <Spinner label="Loading invitations…" />;
  if (invitations.isError) return <ErrorState error={invitations.error} onRetry={() => void invitations.refetch()} />;
  if (!invitations.data.length) return <EmptyState title="No invitations yet">Invite a colleague above; the invitation shows here until it is accepted or expires.</EmptyState>;
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-sm" aria-label="Invitations">
        <thead className="text-left text-xs uppercase tracking-wide text-ink-soft">
          <tr>
            <th scope="col" className="py-1 pr-3">E-mail</th>
            <th scope="col" className="py-1 pr-3">Role</th>
            <th scope="col" className="py-1 pr-3">State</th>
            <th scope="col" className="py-1 pr-3">Sent</th>
            <th scope="col" className="py-1">Expires</th>
          </tr>
        </thead>
        <tbody>
          {invitations.data.map((i) => (
            <tr key={i.id} className="border-t border-chart-line/60">
              <td className="py-1.5 pr-3">{i.email}</td>
              <td className="py-1.5 pr-3">{ROLE_LABELS[i.role]}</td>
              <td className="py-1.5 pr-3">
                <Tag tone={STATE_TONE[i.state]}>{STATE_LABEL[i.state]}</Tag>
              </td>
              <td className="whitespace-nowrap py-1.5 pr-3">{formatDateTime(i.createdAt)}</td>
              <td className="whitespace-nowrap py-1.5">{i.state === 'accepted' ? '—' : formatDateTime(i.expiresAt)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

/** People and their roles; deactivation; invitations by e-mail. */
export function TeamPage({ meId }: { meId: number }) {
  const users = useUsers();
  const update = useUpdateUser();
  const [toggling, setToggling] = useState<AdminUserDto | null>(null);

  return (
    <div className="flex flex-col gap-4">
      <AdminNav />
      <div>
        <h1 className="text-2xl font-bold">Team</h1>
        <p className="text-sm text-ink-soft">Everyone with an Isobath account, their role, and who has been invited.</p>
      </div>
      <Panel title="People">
        {users.isPending ? (
          <Spinner label="Loading people…" />
        ) : users.isError ? (
          <ErrorState error={users.error} onRetry={() => void users.refetch()} />
        ) : (
          <div className="overflow-x-auto">
            <table className="w-full text-sm" aria-label="People">
              <thead className="text-left text-xs uppercase tracking-wide text-ink-soft">
                <tr>
                  <th scope="col" className="py-1 pr-3">Name</th>
                  <th scope="col" className="py-1 pr-3">E-mail</th>
                  <th scope="col" className="py-1 pr-3">Role</th>
                  <th scope="col" className="py-1 pr-3">Account</th>
                  <th scope="col" className="py-1">Last signed in</th>
                </tr>
              </thead>
              <tbody>
                {users.data.map((u) => (
                  <UserRow
                    key={u.id}
                    user={u}
                    self={u.id === meId}
                    onToggle={(user) => {
                      update.reset();
                      setToggling(user);
                    }}
                  />
                ))}
              </tbody>
            </table>
          </div>
        )}
      </Panel>
      <Panel title="Invite someone">
        <InviteForm />
      </Panel>
      <Panel title="Invitations">
        <Invitations />
      </Panel>
      <ConfirmDialog
        open={toggling !== null}
        title={toggling?.active ? `Deactivate ${toggling.name}?` : `Reactivate ${toggling?.name ?? ''}?`}
        confirmLabel={toggling?.active ? 'Deactivate' : 'Reactivate'}
        tone={toggling?.active ? 'danger' : 'primary'}
        busy={update.isPending}
        busyLabel="Saving…"
        error={update.isError ? errorText(update.error) : undefined}
        onClose={() => setToggling(null)}
        onConfirm={() => toggling && update.mutate({ id: toggling.id, active: !toggling.active }, { onSuccess: () => setToggling(null) })}
      >
        {toggling?.active ? (
          <p>They are signed out everywhere at once and cannot sign in again. What they wrote, checked or approved stays as it is. You can reactivate the account later.</p>
        ) : (
          <p>They can sign in again with their password, with the role shown.</p>
        )}
      </ConfirmDialog>
    </div>
  );
}
