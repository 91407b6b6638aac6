import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { ROLES, ROLE_LABELS, type Role } from '@shared/schemas/auth';
import { invitationCreateSchema } from '@shared/schemas/projects';
import { Button, SubmitButton } from '@/components/ui/button';
import { ConfirmDialog, mutationState } from '@/components/ui/confirm-dialog';
import { SelectField, TextField, LabelledOptions } from '@/components/ui/field';
import { FormError, Notice } from '@/components/ui/form-error';
import { EmptyState, Panel, QueryStatus, Tag } from '@/components/ui/states';
import { ApiError, errorText } from '@/lib/api-client';
import { formatDateTime } from '@/lib/dates';
import { setServerErrors } from '@/lib/field-errors';
import type { AdminUserDto, InvitationDto, InvitationState, MailDeliveryDto, SignInLockDto } from '@shared/schemas/projects';
import { useClearSignInLock, useInvitationStep, useInvitations, useInvite, useSignInLocks, useUpdateUser, useUsers } from '../api/users';
import { AdminNav } from './admin-nav';
import { ColumnHeads } from '@/components/ui/column-heads';

const STATE_TONE: Record<InvitationState, 'sounding' | 'pass' | 'neutral'> = { waiting: 'sounding', accepted: 'pass', expired: 'neutral', revoked: 'neutral' };
const STATE_LABEL: Record<InvitationState, string> = { waiting: 'waiting', accepted: 'accepted', expired: 'expired', revoked: 'revoked' };

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
          <LabelledOptions values={ROLES} labels={ROLE_LABELS} />
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
          {...mutationState(update)}
          busyLabel="Changing…"
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
      const replaced = inv.replaced ? ' The earlier invitation to this address no longer works.' : '';
      setSent(
        inv.mail === 'sent'
          ? `Invitation sent to ${inv.email}; the link works once, until ${formatDateTime(inv.expiresAt)}.${replaced}`
          : `Invitation saved for ${inv.email}, but the mail server has not taken the message yet; Isobath keeps trying and shows how it goes under Invitations.${replaced}`,
      );
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
          <LabelledOptions values={ROLES} labels={ROLE_LABELS} />
        </SelectField>
        <SubmitButton busy={invite.isPending} busyLabel="Sending…" className="sm:mt-5">
          Send invitation
        </SubmitButton>
      </div>
      <FormError message={errors.root?.message} />
      <Notice message={sent} />
      <p className="text-xs text-ink-soft">They receive a one-time link to choose their name and password; it expires after 72 hours.</p>
    </form>
  );
}

function MailState({ mail }: { mail: MailDeliveryDto | null }) {
  if (!mail) return <span className="text-ink-faint">—</span>;
  if (mail.status === 'sent') return <Tag tone="pass">sent</Tag>;
  return (
    <span className="flex flex-col gap-0.5">
      <span>
        <Tag tone={mail.status === 'failed' ? 'fail' : 'brass'}>{mail.status === 'failed' ? 'not delivered' : 'not sent yet'}</Tag>{' '}
        <span className="text-xs text-ink-soft">
          {mail.status === 'failed'
            ? `gave up after ${mail.attempts} attempts; resend it once the mail server works`
            : `attempt ${mail.attempts} failed${mail.nextAttemptAt ? `; next at ${formatDateTime(mail.nextAttemptAt)}` : ''}`}
        </span>
      </span>
      {mail.lastError ? <span className="text-xs text-verdict-fail">{mail.lastError}</span> : null}
    </span>
  );
}

type InvitationAction = { invitation: InvitationDto; step: 'revoke' | 'resend' };

function Invitations() {
  const invitations = useInvitations();
  const step = useInvitationStep();
  const [action, setAction] = useState<InvitationAction | null>(null);
  if (invitations.isPending || invitations.isError) return <QueryStatus query={invitations} loading="Loading invitations…" />;
  if (!invitations.data.length) return <EmptyState title="No invitations yet">Invite a colleague above; the invitation shows here until it is accepted or expires.</EmptyState>;
  const ask = (invitation: InvitationDto, s: 'revoke' | 'resend') => {
    step.reset();
    setAction({ invitation, step: s });
  };
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-sm" aria-label="Invitations">
        <ColumnHeads columns={['E-mail', 'Role', 'State', 'Mail', 'Sent', 'Expires', { label: <span className="sr-only">Actions</span> }]} />
        <tbody>
          {invitations.data.map((i) => {
            const live = i.state === 'waiting' || i.state === 'expired';
            return (
              <tr key={i.id} className="border-t border-chart-line/60 align-top">
                <td className="py-1.5 pr-3">{i.email}</td>
                <td className="py-1.5 pr-3">{ROLE_LABELS[i.role]}</td>
                <td className="py-1.5 pr-3">
                  <Tag tone={STATE_TONE[i.state]}>{STATE_LABEL[i.state]}</Tag>
                </td>
                <td className="py-1.5 pr-3">{live || i.mail?.status !== 'sent' ? <MailState mail={i.mail} /> : <Tag tone="pass">sent</Tag>}</td>
                <td className="whitespace-nowrap py-1.5 pr-3">{formatDateTime(i.sentAt)}</td>
                <td className="whitespace-nowrap py-1.5 pr-3">{live ? formatDateTime(i.expiresAt) : '—'}</td>
                <td className="whitespace-nowrap py-1.5">
                  {live ? (
                    <span className="flex gap-1">
                      <Button tone="quiet" className="!px-2 !py-0.5 text-xs" onClick={() => ask(i, 'resend')} aria-label={`Resend the invitation to ${i.email}`}>
                        Resend…
                      </Button>
                      <Button tone="quiet" className="!px-2 !py-0.5 text-xs" onClick={() => ask(i, 'revoke')} aria-label={`Revoke the invitation to ${i.email}`}>
                        Revoke…
                      </Button>
                    </span>
                  ) : null}
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
      <ConfirmDialog
        open={action !== null}
        title={action?.step === 'revoke' ? `Revoke the invitation to ${action.invitation.email}?` : `Send the invitation to ${action?.invitation.email ?? ''} again?`}
        confirmLabel={action?.step === 'revoke' ? 'Revoke' : 'Send again'}
        tone={action?.step === 'revoke' ? 'danger' : 'primary'}
        {...mutationState(step)}
        busyLabel={action?.step === 'revoke' ? 'Revoking…' : 'Sending…'}
        onClose={() => setAction(null)}
        onConfirm={() => action && step.mutate({ id: action.invitation.id, step: action.step }, { onSuccess: () => setAction(null) })}
      >
        {action?.step === 'revoke' ? (
          <p>The link in the message stops working at once. You can invite the address again later.</p>
        ) : (
          <p>A new message goes out with a new link, valid for 72 hours; the link sent before stops working.</p>
        )}
      </ConfirmDialog>
    </div>
  );
}

function SignInLocks() {
  const locks = useSignInLocks();
  const clear = useClearSignInLock();
  const [clearing, setClearing] = useState<SignInLockDto | null>(null);
  if (locks.isPending || locks.isError) return <QueryStatus query={locks} loading="Loading sign-in locks…" />;
  if (!locks.data.length) return <EmptyState title="No failed sign-ins">Failed sign-ins are counted here per address, and per address and account name, until a quiet period passes.</EmptyState>;
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-sm" aria-label="Sign-in locks">
        <ColumnHeads columns={['Address', 'Account name', 'Failures', 'Waits until', 'Last failure', { label: <span className="sr-only">Actions</span> }]} />
        <tbody>
          {locks.data.map((l) => (
            <tr key={l.id} className="border-t border-chart-line/60">
              <td className="py-1.5 pr-3 font-mono text-xs">{l.address}</td>
              <td className="py-1.5 pr-3">{l.email ?? <span className="text-ink-soft">every name</span>}</td>
              <td className="py-1.5 pr-3">{l.failures}</td>
              <td className="whitespace-nowrap py-1.5 pr-3">{l.lockedUntil ? <Tag tone="fail">{formatDateTime(l.lockedUntil)}</Tag> : <span className="text-ink-faint">not locked</span>}</td>
              <td className="whitespace-nowrap py-1.5 pr-3">{formatDateTime(l.lastFailureAt)}</td>
              <td className="py-1.5">
                <Button
                  tone="quiet"
                  className="!px-2 !py-0.5 text-xs"
                  aria-label={`Clear the sign-in lock of ${l.email ?? 'every name'} from ${l.address}`}
                  onClick={() => {
                    clear.reset();
                    setClearing(l);
                  }}
                >
                  Clear…
                </Button>
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      <ConfirmDialog
        open={clearing !== null}
        title={clearing?.email ? `Let ${clearing.email} sign in from ${clearing.address} again?` : `Let ${clearing?.address ?? ''} sign in again?`}
        confirmLabel="Clear the lock"
        {...mutationState(clear)}
        busyLabel="Clearing…"
        onClose={() => setClearing(null)}
        onConfirm={() => clearing && clear.mutate(clearing.id, { onSuccess: () => setClearing(null) })}
      >
        <p>
          The count of failed sign-ins starts again from zero{clearing?.email ? ' for this name from this address' : ' for every name from this address'}. Clear it when you know who
          failed, for instance a colleague who mistyped their password; the audit log notes that you did.
        </p>
      </ConfirmDialog>
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
        {users.isPending || users.isError ? (
          <QueryStatus query={users} loading="Loading people…" />
        ) : (
          <div className="overflow-x-auto">
            <table className="w-full text-sm" aria-label="People">
              <ColumnHeads columns={['Name', 'E-mail', 'Role', 'Account', 'Last signed in']} />
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
      <Panel title="Sign-in locks">
        <p className="mb-2 text-xs text-ink-soft">
          After repeated failed sign-ins an address waits before it may try again: for one account name, and for every name when it fails across many. Only that
          address waits; the same person signing in from elsewhere is not held back.
        </p>
        <SignInLocks />
      </Panel>
      <ConfirmDialog
        open={toggling !== null}
        title={toggling?.active ? `Deactivate ${toggling.name}?` : `Reactivate ${toggling?.name ?? ''}?`}
        confirmLabel={toggling?.active ? 'Deactivate' : 'Reactivate'}
        tone={toggling?.active ? 'danger' : 'primary'}
        {...mutationState(update)}
        busyLabel="Saving…"
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
