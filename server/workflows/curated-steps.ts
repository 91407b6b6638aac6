// One runner for the review steps of every curated kind of record (the table is
// shared/workflows/curated.ts): lock the row, check the version, the status and the four-eyes
// rule, apply the step, write the audit entry in the same transaction, commit, then drop caches
// and send mail. A kind of record only says what is its own (its model, its title and link, what
// a revision copies, what must hold before it is published).
import { Op, UniqueConstraintError, type Model, type ModelStatic, type Transaction } from 'sequelize';
import { sequelize } from '../db/sequelize';
import { User } from '../db/models';
import { AppError, conflict, forbidden, notFound } from '../errors';
import { recordAudit } from '../services/audit';
import { sendMailSafely } from '../services/mail';
import { env } from '../config/env';
import { CURATED_STEPS, findStep, stepRefusal, type CuratedStatus, type CuratedStepName } from '../../shared/workflows/curated';
import type { Role } from '../../shared/roles';

/** The columns every curated kind of record has. */
export interface CuratedAttributes {
  id: number;
  status: CuratedStatus;
  version: number;
  lineageId: number | null;
  supersedesId: number | null;
  supersededById: number | null;
  draftedById: number | null;
  lastEditedById: number | null;
  approvedById: number | null;
  publishedAt: Date | null;
  retiredAt: Date | null;
  returnedComment: string | null;
  submittedAt: Date | null;
  lockVersion: number;
}

export type CuratedRow = Model & CuratedAttributes;

export interface Actor {
  id: number;
  name: string;
  role: Role;
}

/** What is particular to one kind of curated record. */
export interface CuratedKind<M extends CuratedRow> {
  /** Audit entity type, e.g. 'rating-table'. */
  entityType: string;
  /** In sentences: "rating table". */
  noun: string;
  model: ModelStatic<M>;
  /** One line naming the record, for mail. */
  title(row: M): Promise<string>;
  /** Its page on the library desk (path after the app's address). */
  path(id: number): string;
  /** Refuses publishing what may not be published (e.g. without a reference). */
  checkPublishable?(row: M, transaction: Transaction): Promise<void>;
  /** The attributes of a new draft revising `row` (content only: the runner sets the workflow columns). */
  revisionOf(row: M): Record<string, unknown>;
  /** After any committed step (e.g. drop the catalogue snapshot). */
  afterCommit?(): void;
}

export const STALE_MESSAGE = 'Someone saved this record after you opened it. Reload to see their changes; your edits are still in the form.';
export const stale = (message = STALE_MESSAGE) => conflict(message, 'stale');

/** Reads the row with SELECT … FOR UPDATE and checks the lock version the caller read. */
export async function lockCurrent<M extends Model & { lockVersion: number }>(
  model: ModelStatic<M>,
  transaction: Transaction,
  id: number,
  lockVersion: number | null,
  what: string,
): Promise<M> {
  const row = await model.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
  if (!row) throw notFound(what);
  if (lockVersion !== null && row.lockVersion !== lockVersion) throw stale();
  return row;
}

/** The row as stored, for the audit log's before/after. */
export function auditSnapshot(row: Model): Record<string, unknown> {
  const { createdAt: _c, updatedAt: _u, ...rest } = row.get({ plain: true }) as Record<string, unknown>;
  return rest;
}

function subjectLine(text: string): string {
  const line = text.replace(/\s+/g, ' ').trim();
  return line.length <= 200 ? line : `${line.slice(0, 199)}…`;
}

async function mailInChunks(to: string[], subject: string, text: string): Promise<void> {
  for (let i = 0; i < to.length; i += 50) await sendMailSafely({ to: to.slice(i, i + 50), subject: subjectLine(subject), text });
}

const link = (p: string) => `${env().APP_URL.replace(/\/+$/, '')}${p}`;

async function notify(kind: CuratedKind<CuratedRow>, step: CuratedStepName, row: CuratedRow, actor: Actor, comment: string | undefined): Promise<void> {
  const rule = findStep(CURATED_STEPS, step)!;
  if (rule.notify === 'none') return;
  const title = await kind.title(row);
  const where = link(kind.path(row.id));
  if (rule.notify === 'reviewers') {
    const reviewers = await User.findAll({ where: { role: ['librarian', 'admin'], active: true, id: { [Op.ne]: actor.id } }, attributes: ['email'], order: [['id', 'ASC']] });
    await mailInChunks(
      reviewers.map((u) => u.email),
      `${kind.noun[0].toUpperCase()}${kind.noun.slice(1)} waiting for review: ${title}`,
      [`${actor.name} submitted a ${kind.noun} for review:`, '', `  ${title} (version ${row.version})`, '', `Review it on the library desk: ${where}`, '', 'Approve it or return it with a comment. The author and the last editor cannot approve their own work.'].join('\n'),
    );
    return;
  }
  const ids = [...new Set([row.draftedById, row.lastEditedById].filter((v): v is number => typeof v === 'number'))];
  const authors = ids.length ? await User.findAll({ where: { id: ids, active: true }, attributes: ['email'] }) : [];
  const published = step === 'approve';
  await mailInChunks(
    authors.map((u) => u.email),
    `${kind.noun[0].toUpperCase()}${kind.noun.slice(1)} ${published ? 'published' : 'returned'}: ${title}`,
    published
      ? [`${actor.name} approved your ${kind.noun}; it is now published:`, '', `  ${title} (version ${row.version})`, ...(row.supersedesId ? ['', `It supersedes record ${row.supersedesId}, which is now retired.`] : []), '', where].join('\n')
      : [`${actor.name} returned your ${kind.noun} to draft:`, '', `  ${title} (version ${row.version})`, '', 'Comment:', '', comment ?? '', '', `Edit it and submit it again: ${where}`].join('\n'),
  );
}

/**
 * Runs one step of the curated workflow on record `id` of `kind`. Returns the id of the record
 * the step leaves the caller on (the new draft for a revision).
 */
export async function runCuratedStep<M extends CuratedRow>(
  kind: CuratedKind<M>,
  id: number,
  stepName: CuratedStepName,
  input: { lockVersion: number; comment?: string },
  actor: Actor,
): Promise<number> {
  const rule = findStep(CURATED_STEPS, stepName);
  if (!rule) throw notFound('Step');
  const what = kind.noun[0].toUpperCase() + kind.noun.slice(1);
  let resultId = id;
  let changed: M | undefined;
  try {
    await sequelize().transaction(async (transaction) => {
      const row = await lockCurrent(kind.model, transaction, id, input.lockVersion, what);
      const refusal = stepRefusal(rule, { status: row.status, authorIds: [row.draftedById, row.lastEditedById] }, actor);
      if (refusal !== null) {
        if (!rule.from.includes(row.status)) throw conflict(`${rule.label} is not possible: this ${kind.noun} is ${row.status}.`, 'wrong_status');
        if (rule.fourEyes && (row.draftedById === actor.id || row.lastEditedById === actor.id)) {
          throw new AppError(403, 'own_work', `You drafted or last edited this ${kind.noun}, so someone else must ${stepName} it (four-eyes rule).`);
        }
        throw forbidden();
      }
      const before = auditSnapshot(row);
      const now = new Date();
      if (stepName === 'revise') {
        const lineageId = row.lineageId ?? row.id;
        const open = await kind.model.count({ where: { lineageId, status: ['draft', 'in-review'] } as never, transaction });
        if (open > 0) throw revisionOpen(kind.noun);
        const latest = (await kind.model.max<number, M>('version', { where: { lineageId } as never, transaction })) ?? row.version;
        const copy = await kind.model.create(
          {
            ...kind.revisionOf(row),
            status: 'draft',
            version: Math.max(latest, row.version) + 1,
            lineageId,
            supersedesId: row.id,
            supersededById: null,
            draftedById: actor.id,
            lastEditedById: actor.id,
            approvedById: null,
            publishedAt: null,
            retiredAt: null,
            returnedComment: null,
            submittedAt: null,
          } as never,
          { transaction },
        );
        await recordAudit(transaction, { actorId: actor.id, action: 'revise', entityType: kind.entityType, entityId: copy.id, before, after: auditSnapshot(copy) });
        resultId = copy.id;
        changed = copy;
        return;
      }
      if (stepName === 'approve') {
        await kind.checkPublishable?.(row, transaction);
        if (row.supersedesId) {
          const old = await lockCurrent(kind.model, transaction, row.supersedesId, null, what);
          const oldBefore = auditSnapshot(old);
          // Retire the old version first: a lineage has at most one published version (unique index).
          old.set({ supersededById: row.id, ...(old.status === 'published' ? { status: 'retired', retiredAt: now } : {}) } as never);
          await old.save({ transaction });
          await recordAudit(transaction, { actorId: actor.id, action: 'supersede', entityType: kind.entityType, entityId: old.id, before: oldBefore, after: auditSnapshot(old) });
        }
        row.set({ status: 'published', approvedById: actor.id, publishedAt: now, returnedComment: null } as never);
      } else if (stepName === 'submit') row.set({ status: 'in-review', submittedAt: now } as never);
      else if (stepName === 'return') row.set({ status: 'draft', returnedComment: input.comment ?? null, submittedAt: null } as never);
      else row.set({ status: 'retired', retiredAt: now } as never);
      await row.save({ transaction });
      await recordAudit(transaction, {
        actorId: actor.id,
        action: stepName,
        entityType: kind.entityType,
        entityId: id,
        before,
        after: input.comment ? { ...auditSnapshot(row), comment: input.comment } : auditSnapshot(row),
      });
      changed = row;
    });
  } catch (err) {
    // Two revisions started at once: the partial unique index lets only one in.
    if (err instanceof UniqueConstraintError && stepName === 'revise') throw revisionOpen(kind.noun);
    throw err;
  }
  kind.afterCommit?.();
  if (changed) await notify(kind as unknown as CuratedKind<CuratedRow>, stepName, changed, actor, input.comment);
  return resultId;
}

const revisionOpen = (noun: string) => conflict(`This ${noun} already has a revision in draft or in review. Open that one instead of starting another.`, 'revision_open');
