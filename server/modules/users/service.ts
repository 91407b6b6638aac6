import { createHash, randomBytes } from 'node:crypto';
import { Op, type Transaction } from 'sequelize';
import { sequelize } from '../../db/sequelize';
import { User } from '../../db/models';
import { Invitation, PasswordReset } from '../../db/models/projects';
import type { Role } from '../../../shared/schemas/auth';
import { ROLE_LABELS } from '../../../shared/schemas/auth';
import type { AdminUserDto, InvitationCreatedDto, InvitationDto, InvitationState, MailDeliveryDto, SignInLockDto } from '../../../shared/schemas/projects';
import { AppError, badRequest, conflict, notFound } from '../../errors';
import { hashPassword, verifyPassword } from '../../auth/passwords';
import { recordAudit } from '../../services/audit';
import { enqueueJob, enqueueMail, latestByRef, registerOutboxJob, sendQueued, type OutboxRow } from '../../services/outbox';
import { appLink } from '../../services/app-link';
import { announce } from '../../services/change-feed';
import { clearThrottle, listThrottles, type ThrottleRow } from '../../auth/sign-in-throttle';

export const INVITATION_HOURS = 72;
export const RESET_HOURS = 1;

/** Tokens travel by e-mail; only their SHA-256 is stored, so a database leak reveals none. */
const newToken = () => randomBytes(32).toString('base64url');
const tokenHash = (token: string) => createHash('sha256').update(token).digest('hex');

const adminUserDto = (u: User): AdminUserDto => ({
  id: u.id,
  email: u.email,
  name: u.name,
  role: u.role,
  active: u.active,
  lastLoginAt: u.lastLoginAt?.toISOString() ?? null,
  createdAt: u.createdAt.toISOString(),
});

export async function listUsers(): Promise<AdminUserDto[]> {
  return (await User.findAll({ order: [['active', 'DESC'], ['name', 'ASC']] })).map(adminUserDto);
}

/**
 * Ends every stored session of a user (but `exceptSid`), in the transaction of the change that
 * calls for it: the rows go and every process drops its cached copies when it commits.
 */
export async function endSessionsOf(transaction: Transaction, userId: number, exceptSid?: string): Promise<number> {
  const [, result] = await sequelize().query(
    `DELETE FROM session WHERE (sess -> 'passport' ->> 'user') = :user ${exceptSid ? 'AND sid <> :sid' : ''}`,
    { replacements: { user: String(userId), sid: exceptSid ?? '' }, transaction },
  );
  await announce({ kind: 'sessions', userId }, transaction);
  return (result as { rowCount?: number })?.rowCount ?? 0;
}

export async function updateUser(actorId: number, userId: number, change: { role?: Role; active?: boolean }): Promise<AdminUserDto> {
  const user = await sequelize().transaction(async (transaction) => {
    // Every active administrator's row is locked first, in id order, so two changes that would
    // each leave one administrator (two admins demoting each other at once) queue here; the
    // second one then reads the first one's result (READ COMMITTED re-checks the rows it waited for).
    const admins = await User.findAll({ where: { role: 'admin', active: true }, attributes: ['id'], order: [['id', 'ASC']], lock: transaction.LOCK.UPDATE, transaction });
    const u = await User.findByPk(userId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!u) throw notFound('User');
    if (u.id === actorId && (change.active === false || (change.role && change.role !== 'admin'))) {
      throw conflict('You cannot deactivate yourself or give up your own administrator role; ask another administrator.', 'self_change');
    }
    const losesAdmin = u.role === 'admin' && u.active && (change.active === false || (change.role !== undefined && change.role !== 'admin'));
    if (losesAdmin && !admins.some((a) => a.id !== u.id)) {
      throw conflict(`${u.name} is the last active administrator; make someone else an administrator first.`, 'last_admin');
    }
    const before = { role: u.role, active: u.active };
    await u.update(change, { transaction });
    await recordAudit(transaction, { actorId, action: change.active === false ? 'deactivate' : 'update', entityType: 'user', entityId: String(u.id), before, after: change });
    if (change.active === false) await endSessionsOf(transaction, u.id);
    return u;
  });
  return adminUserDto(user);
}

const invitationRef = (id: number) => `invitation:${id}`;

const deliveryDto = (row: OutboxRow | undefined): MailDeliveryDto | null =>
  row
    ? {
        status: row.status,
        attempts: row.attempts,
        lastError: row.status === 'sent' ? null : row.lastError,
        nextAttemptAt: row.status === 'pending' ? row.nextAttemptAt.toISOString() : null,
        sentAt: row.sentAt?.toISOString() ?? null,
      }
    : null;

function invitationState(i: Invitation, now = Date.now()): InvitationState {
  if (i.usedAt) return 'accepted';
  if (i.revokedAt) return 'revoked';
  return i.expiresAt.getTime() < now ? 'expired' : 'waiting';
}

export async function listInvitations(): Promise<InvitationDto[]> {
  const rows = await Invitation.findAll({ order: [['createdAt', 'DESC'], ['id', 'DESC']], limit: 200 });
  const mail = await latestByRef(rows.map((i) => invitationRef(i.id)));
  return rows.map((i) => ({
    id: i.id,
    email: i.email,
    role: i.role,
    createdAt: i.createdAt.toISOString(),
    expiresAt: i.expiresAt.toISOString(),
    state: invitationState(i),
    sentAt: (i.sentAt ?? i.createdAt).toISOString(),
    revokedAt: i.revokedAt?.toISOString() ?? null,
    mail: deliveryDto(mail.get(invitationRef(i.id))),
  }));
}

const invitationMail = (invitation: Invitation, token: string) => ({
  to: invitation.email,
  subject: 'You are invited to Isobath',
  text:
    `You have been invited to Isobath as ${ROLE_LABELS[invitation.role].toLowerCase()}.\n\n` +
    `Choose your password within ${INVITATION_HOURS} hours: ${appLink(`/welcome?token=${token}`)}\n\n` +
    `The link works once. If you did not expect this, ignore this message.\n\n— Isobath`,
  ref: invitationRef(invitation.id),
});

/** One invitation change at a time per address (a transaction-scoped advisory lock). */
const lockAddress = (email: string, transaction: Transaction) =>
  sequelize().query(`SELECT pg_advisory_xact_lock(hashtext(:key))`, { replacements: { key: `invitation:${email}` }, transaction });

/**
 * Invites by e-mail with a one-time link; an address that already has an account is refused.
 * A live invitation to the same address is revoked by the new one: one link per address works.
 * The message is queued in the same transaction and tried at once; if the mail server does not
 * take it, the outbox tries again and the invitation's row says how it fared.
 */
export async function invite(actorId: number, email: string, role: Role): Promise<InvitationCreatedDto> {
  const token = newToken();
  const { invitation, mailId, replaced } = await sequelize().transaction(async (transaction) => {
    await lockAddress(email, transaction);
    if (await User.findOne({ where: { email }, transaction })) {
      throw conflict('That address already has an account; change its role instead.', 'has_account');
    }
    const [replaced] = await Invitation.update(
      { revokedAt: new Date(), revokedById: actorId },
      { where: { email, usedAt: { [Op.is]: null }, revokedAt: { [Op.is]: null } }, transaction },
    );
    const inv = await Invitation.create(
      { email, role, tokenHash: tokenHash(token), expiresAt: new Date(Date.now() + INVITATION_HOURS * 3600_000), usedAt: null, invitedById: actorId },
      { transaction },
    );
    await recordAudit(transaction, { actorId, action: 'invite', entityType: 'user', entityId: email, before: null, after: { email, role, replaced } });
    return { invitation: inv, mailId: await enqueueMail(transaction, invitationMail(inv, token)), replaced };
  });
  const mail = await sendQueued([mailId]);
  return { id: invitation.id, email, role, expiresAt: invitation.expiresAt.toISOString(), mail, replaced };
}

/** A live (waiting or expired, not accepted or revoked) invitation, locked, with its address locked too. */
async function liveInvitation(id: number, transaction: Transaction, action: string): Promise<Invitation> {
  const found = await Invitation.findByPk(id, { attributes: ['email'], transaction });
  if (!found) throw notFound('Invitation');
  await lockAddress(found.email, transaction);
  const inv = (await Invitation.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE }))!;
  const state = invitationState(inv);
  if (state === 'accepted' || state === 'revoked') throw conflict(`This invitation is ${state}; it cannot be ${action}.`, 'wrong_status');
  return inv;
}

/** Revokes an invitation: its link stops working at once. */
export async function revokeInvitation(actorId: number, id: number): Promise<InvitationDto> {
  await sequelize().transaction(async (transaction) => {
    const inv = await liveInvitation(id, transaction, 'revoked');
    await inv.update({ revokedAt: new Date(), revokedById: actorId }, { transaction });
    await recordAudit(transaction, { actorId, action: 'revoke-invitation', entityType: 'user', entityId: inv.email, before: { invitationId: id, expiresAt: inv.expiresAt }, after: { revokedAt: inv.revokedAt } });
  });
  return (await listInvitations()).find((i) => i.id === id)!;
}

/** Sends an invitation again with a new link and a new expiry; the old link stops working. */
export async function resendInvitation(actorId: number, id: number): Promise<InvitationCreatedDto> {
  const token = newToken();
  const { invitation, mailId } = await sequelize().transaction(async (transaction) => {
    const inv = await liveInvitation(id, transaction, 'sent again');
    if (await User.findOne({ where: { email: inv.email }, transaction })) {
      throw conflict('That address already has an account; change its role instead.', 'has_account');
    }
    const before = { expiresAt: inv.expiresAt };
    const now = new Date();
    await inv.update({ tokenHash: tokenHash(token), expiresAt: new Date(now.getTime() + INVITATION_HOURS * 3600_000), sentAt: now }, { transaction });
    await recordAudit(transaction, { actorId, action: 'resend-invitation', entityType: 'user', entityId: inv.email, before, after: { invitationId: id, expiresAt: inv.expiresAt } });
    return { invitation: inv, mailId: await enqueueMail(transaction, invitationMail(inv, token)) };
  });
  const mail = await sendQueued([mailId]);
  return { id, email: invitation.email, role: invitation.role, expiresAt: invitation.expiresAt.toISOString(), mail, replaced: 0 };
}

const invalidLink = () => new AppError(400, 'invalid_token', 'This link is invalid, already used or expired. Ask for a new one.', { token: 'invalid, used or expired' });

/** Accepts an invitation: creates the account once; the link cannot be used again. */
export async function acceptInvitation(token: string, name: string, password: string): Promise<User> {
  const passwordHash = await hashPassword(password);
  return sequelize().transaction(async (transaction) => {
    const inv = await Invitation.findOne({ where: { tokenHash: tokenHash(token) }, transaction, lock: transaction.LOCK.UPDATE });
    if (!inv || inv.usedAt || inv.revokedAt || inv.expiresAt.getTime() < Date.now()) throw invalidLink();
    if (await User.findOne({ where: { email: inv.email }, transaction })) throw invalidLink();
    const user = await User.create({ email: inv.email, name, role: inv.role, passwordHash, lastLoginAt: null }, { transaction });
    await inv.update({ usedAt: new Date() }, { transaction });
    await recordAudit(transaction, { actorId: user.id, action: 'accept-invitation', entityType: 'user', entityId: String(user.id), before: null, after: { email: user.email, role: user.role } });
    return user;
  });
}

/**
 * Starts a password reset. Whether or not the address has an account, the request does the same
 * work — it queues a job for the address — and the answer goes before anything is looked up, so
 * neither the answer nor its timing says who has an account. The worker then makes the link and
 * the message for an active account, and drops the job for any other address.
 */
export async function requestPasswordReset(email: string): Promise<number> {
  return enqueueJob('password-reset', email);
}

/** The outbox job behind requestPasswordReset: the reset link and its message, or null. */
async function preparePasswordReset(email: string, transaction: Transaction) {
  const user = await User.findOne({ where: { email, active: true }, transaction });
  if (!user) return null;
  const token = newToken();
  await PasswordReset.create({ userId: user.id, tokenHash: tokenHash(token), expiresAt: new Date(Date.now() + RESET_HOURS * 3600_000), usedAt: null }, { transaction });
  return {
    subject: 'Reset your Isobath password',
    text:
      `Someone asked to reset the password of your Isobath account.\n\n` +
      `Choose a new one within ${RESET_HOURS} hour: ${appLink(`/reset-password?token=${token}`)}\n\n` +
      `The link works once. If it was not you, ignore this message; your password stays as it is.\n\n— Isobath`,
    ref: `password-reset:${user.id}`,
  };
}
registerOutboxJob('password-reset', preparePasswordReset);

export async function resetPassword(token: string, password: string): Promise<void> {
  const passwordHash = await hashPassword(password);
  await sequelize().transaction(async (transaction) => {
    const reset = await PasswordReset.findOne({ where: { tokenHash: tokenHash(token) }, transaction, lock: transaction.LOCK.UPDATE });
    if (!reset || reset.usedAt || reset.expiresAt.getTime() < Date.now()) throw invalidLink();
    const user = await User.findByPk(reset.userId, { transaction });
    if (!user || !user.active) throw invalidLink();
    await user.update({ passwordHash }, { transaction });
    await reset.update({ usedAt: new Date() }, { transaction });
    // Any other outstanding reset links of this account stop working too.
    await PasswordReset.update({ usedAt: new Date() }, { where: { userId: user.id, usedAt: { [Op.is]: null } }, transaction });
    await recordAudit(transaction, { actorId: user.id, action: 'reset-password', entityType: 'user', entityId: String(user.id), before: null, after: null });
    await endSessionsOf(transaction, user.id);
  });
}

export async function changePassword(userId: number, currentPassword: string, newPassword: string, keepSid: string): Promise<void> {
  const user = await User.findByPk(userId);
  if (!user || !(await verifyPassword(currentPassword, user.passwordHash))) {
    throw badRequest('The current password is not right.', { currentPassword: 'is not right' });
  }
  const passwordHash = await hashPassword(newPassword);
  await sequelize().transaction(async (transaction) => {
    await user.update({ passwordHash }, { transaction });
    await recordAudit(transaction, { actorId: user.id, action: 'change-password', entityType: 'user', entityId: String(user.id), before: null, after: null });
    await endSessionsOf(transaction, user.id, keepSid);
  });
}

// ---- Sign-in locks ---------------------------------------------------------------------------

const signInLockDto = (r: ThrottleRow): SignInLockDto => ({
  id: r.id,
  address: r.address,
  email: r.email || null,
  failures: r.failures,
  lockedUntil: r.lockedUntil && r.lockedUntil.getTime() > Date.now() ? r.lockedUntil.toISOString() : null,
  lastFailureAt: r.lastFailureAt.toISOString(),
});

/** Failed sign-ins still counted, locked ones first. */
export async function listSignInLocks(): Promise<SignInLockDto[]> {
  return (await listThrottles()).map(signInLockDto);
}

/** Clears one counter (and its lock), with an audit entry. */
export async function clearSignInLock(actorId: number, id: number): Promise<void> {
  await sequelize().transaction(async (transaction) => {
    const row = await clearThrottle(id, transaction);
    if (!row) throw notFound('Sign-in lock');
    await recordAudit(transaction, { actorId, action: 'clear-sign-in-lock', entityType: 'user', entityId: row.email || row.address, before: signInLockDto(row), after: null });
  });
}
