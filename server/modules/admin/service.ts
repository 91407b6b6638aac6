// The admin's view of what happened: the audit log and the mail the local catcher caught.
import { Op, type WhereOptions } from 'sequelize';
import { AuditEntry, User } from '../../db/models';
import { env } from '../../config/env';
import { getCaughtMail, listCaughtMail, type CaughtMail } from '../../services/mail';
import { listOutbox, type OutboxStatus } from '../../services/outbox';
import type { AuditEntryDto, AuditPageDto, CaughtMailDto, CaughtMailListDto, OutboxMailDto } from '../../../shared/schemas/library';

export interface AuditQuery {
  entityType?: string;
  entityId?: string;
  limit: number;
  /** Entries older than this id (the last id of the previous page). */
  before?: number;
}

function auditEntryDto(e: AuditEntry): AuditEntryDto {
  return {
    id: Number(e.id), // BIGSERIAL arrives as a string
    at: e.createdAt.toISOString(),
    actor: e.actor ? { id: e.actor.id, name: e.actor.name } : null,
    action: e.action,
    entityType: e.entityType,
    entityId: e.entityId,
    before: e.before ?? null,
    after: e.after ?? null,
  };
}

/** Newest first; page on with `before` = the last id received. */
export async function listAudit(query: AuditQuery): Promise<AuditPageDto> {
  const where: WhereOptions<AuditEntry> = {};
  if (query.entityType) Object.assign(where, { entityType: query.entityType });
  if (query.entityId) Object.assign(where, { entityId: query.entityId });
  if (query.before !== undefined) Object.assign(where, { id: { [Op.lt]: query.before } });
  const rows = await AuditEntry.findAll({
    where,
    include: [{ model: User, as: 'actor', attributes: ['id', 'name'] }],
    order: [['id', 'DESC']],
    limit: query.limit,
  });
  return { items: rows.map(auditEntryDto) };
}

const caughtMailDto = (m: CaughtMail): CaughtMailDto => ({
  id: m.id,
  receivedAt: m.receivedAt,
  from: m.from,
  to: m.to,
  subject: m.subject,
  text: m.text,
});

/** enabled = the app knows where the local catcher saves mail (MAIL_CATCHER_DIR). */
export async function listMail(query: { limit: number }): Promise<CaughtMailListDto> {
  const enabled = !!env().MAIL_CATCHER_DIR;
  return { enabled, items: enabled ? (await listCaughtMail({ limit: query.limit })).map(caughtMailDto) : [] };
}

export async function getMail(id: string): Promise<CaughtMailDto> {
  return caughtMailDto(await getCaughtMail(id));
}

/** What Isobath sends and how it fared, newest first (the last week's sent, the last month's failed). */
export async function listOutgoingMail(query: { status?: OutboxStatus }): Promise<OutboxMailDto[]> {
  return (await listOutbox({ status: query.status })).map((r) => ({
    id: r.id,
    to: r.recipients,
    subject: r.subject,
    status: r.status,
    attempts: r.attempts,
    lastError: r.status === 'sent' ? null : r.lastError,
    nextAttemptAt: r.status === 'pending' ? r.nextAttemptAt.toISOString() : null,
    createdAt: r.createdAt.toISOString(),
    sentAt: r.sentAt?.toISOString() ?? null,
    ref: r.ref,
  }));
}
