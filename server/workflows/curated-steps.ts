// The curated workflow (shared/workflows/curated.ts) as the runner needs it: what each step does
// to a curated record (property sets, rating tables, reference versions), the revision that supersedes a published
// version, and the mail to reviewers and authors. A kind of curated record says only what is its
// own (`CuratedKind`: its model, title and page, what a revision copies, what must hold first).
import { Op, UniqueConstraintError, type Model, type ModelStatic, type Transaction } from 'sequelize';
import { User } from '../db/models';
import { conflict } from '../errors';
import { recordAudit } from '../services/audit';
import { appLink } from '../services/app-link';
import { auditSnapshot, lockCurrent } from '../services/optimistic-lock';
import { CURATED_STEPS, type CuratedStatus, type CuratedStep, type CuratedStepName } from '../../shared/workflows/curated';
import { mailInChunks, runStep, type Actor, type WorkflowKind } from './run-step';

export type { Actor } from './run-step';
export { auditSnapshot, lockCurrent } from '../services/optimistic-lock';

/** The columns every curated kind of record has. */
export interface CuratedAttributes {
  id: number;
  status: CuratedStatus;
  version: number;
  lineageId: number | null;
  referenceId: number | null;
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

/** What is particular to one kind of curated record. */
export interface CuratedKind<M extends CuratedRow> {
  /** Audit entity type, e.g. 'rating-table'. */
  entityType: string;
  /** In sentences: "rating table"; `staleNoun` in the stale message when shorter. */
  noun: string;
  staleNoun?: string;
  model: ModelStatic<M>;
  /** The rows of CURATED_STEPS this kind takes (default: all of them). */
  steps?: readonly CuratedStep[];
  /** One line naming the record, for mail. */
  title(row: M): Promise<string>;
  /** Its page on the library desk (path after the app's address). */
  path(row: M): string;
  /** Refuses publishing what may not be published (a reference is required by the table). */
  checkPublishable?(row: M, transaction: Transaction): Promise<void>;
  /** Work of its own when the record is published, in the approval's transaction (before it is saved). */
  onPublish?(row: M, actor: Actor, transaction: Transaction): Promise<void>;
  /** Work of its own when a published record leaves the catalogue (retired or superseded), in that step's transaction. */
  onRetire?(row: M, reason: string, actor: Actor, transaction: Transaction): Promise<void>;
  /** The attributes of a new draft revising `row` (content only: the runner sets the workflow columns). */
  revisionOf(row: M): Record<string, unknown>;
  /** After any committed step (e.g. drop the catalogue snapshot). */
  afterCommit?(): void;
}

const capital = (s: string) => s[0].toUpperCase() + s.slice(1);

/** The workflow columns of a new draft by `actorId`: version 1 of a new lineage unless told otherwise. */
export function draftWorkflowColumns(actorId: number, of: { version?: number; lineageId?: number | null; supersedesId?: number | null } = {}) {
  return {
    status: 'draft' as const,
    version: of.version ?? 1,
    lineageId: of.lineageId ?? null,
    supersedesId: of.supersedesId ?? null,
    supersededById: null,
    draftedById: actorId,
    lastEditedById: actorId,
    approvedById: null,
    publishedAt: null,
    retiredAt: null,
    returnedComment: null,
    submittedAt: null,
  };
}
const revisionOpen = (noun: string) => conflict(`This ${noun} already has a revision in draft or in review. Open that one instead of starting another.`, 'revision_open');

/** A new draft copying a published record: version + 1, same lineage, supersedes it. */
async function revise<M extends CuratedRow>(kind: CuratedKind<M>, row: M, actor: Actor, transaction: Transaction): Promise<number> {
  const lineageId = row.lineageId ?? row.id;
  const open = await kind.model.count({ where: { lineageId, status: ['draft', 'in-review'] } as never, transaction });
  if (open > 0) throw revisionOpen(kind.noun);
  const latest = (await kind.model.max<number, M>('version', { where: { lineageId } as never, transaction })) ?? row.version;
  const copy = await kind.model.create(
    { ...kind.revisionOf(row), ...draftWorkflowColumns(actor.id, { version: Math.max(latest, row.version) + 1, lineageId, supersedesId: row.id }) } as never,
    { transaction },
  );
  await recordAudit(transaction, { actorId: actor.id, action: 'revise', entityType: kind.entityType, entityId: copy.id, before: auditSnapshot(row), after: auditSnapshot(copy) });
  return copy.id;
}

/** Publishes `row`; the version it supersedes is retired first and points at its successor. */
async function publish<M extends CuratedRow>(kind: CuratedKind<M>, row: M, actor: Actor, now: Date, transaction: Transaction): Promise<void> {
  await kind.checkPublishable?.(row, transaction);
  if (row.supersedesId) {
    const old = await lockCurrent(kind.model, transaction, row.supersedesId, null, capital(kind.noun));
    const oldBefore = auditSnapshot(old);
    // Retire the old version first: a lineage has at most one published version (unique index).
    const wasPublished = old.status === 'published';
    old.set({ supersededById: row.id, ...(wasPublished ? { status: 'retired', retiredAt: now } : {}) } as never);
    await old.save({ transaction });
    if (wasPublished) await kind.onRetire?.(old, `the ${kind.noun} was superseded by version ${row.version}`, actor, transaction);
    await recordAudit(transaction, { actorId: actor.id, action: 'supersede', entityType: kind.entityType, entityId: old.id, before: oldBefore, after: auditSnapshot(old) });
  }
  await kind.onPublish?.(row, actor, transaction);
  row.set({ status: 'published', approvedById: actor.id, publishedAt: now, returnedComment: null } as never);
}

async function notify<M extends CuratedRow>(kind: CuratedKind<M>, row: M, step: CuratedStep, actor: Actor, comment: string | undefined): Promise<void> {
  const title = await kind.title(row);
  const where = appLink(kind.path(row));
  if (step.notify === 'reviewers') {
    const reviewers = await User.findAll({ where: { role: ['librarian', 'admin'], active: true, id: { [Op.ne]: actor.id } }, attributes: ['email'], order: [['id', 'ASC']] });
    await mailInChunks(
      reviewers.map((u) => u.email),
      `${capital(kind.noun)} waiting for review: ${title}`,
      [`${actor.name} submitted a ${kind.noun} for review:`, '', `  ${title} (version ${row.version})`, '', `Review it on the library desk: ${where}`, '', 'Approve it or return it with a comment. The author and the last editor cannot approve their own work.'].join('\n'),
    );
    return;
  }
  const ids = [...new Set([row.draftedById, row.lastEditedById].filter((v): v is number => typeof v === 'number'))];
  const authors = ids.length ? await User.findAll({ where: { id: ids, active: true }, attributes: ['email'] }) : [];
  const published = step.name === 'approve';
  await mailInChunks(
    authors.map((u) => u.email),
    `${capital(kind.noun)} ${published ? 'published' : 'returned'}: ${title}`,
    published
      ? [`${actor.name} approved your ${kind.noun}; it is now published:`, '', `  ${title} (version ${row.version})`, ...(row.supersedesId ? ['', `It supersedes record ${row.supersedesId}, which is now retired.`] : []), '', where].join('\n')
      : [`${actor.name} returned your ${kind.noun} to draft:`, '', `  ${title} (version ${row.version})`, '', 'Comment:', '', comment ?? '', '', `Edit it and submit it again: ${where}`].join('\n'),
  );
}

/** The runner's view of a curated kind. */
function workflowOf<M extends CuratedRow>(kind: CuratedKind<M>): WorkflowKind<CuratedStatus, CuratedStepName, M> {
  return {
    steps: kind.steps ?? CURATED_STEPS,
    model: kind.model,
    entityType: kind.entityType,
    noun: kind.noun,
    staleNoun: kind.staleNoun,
    subject: async (row) => ({ status: row.status, authorIds: [row.draftedById, row.lastEditedById], facts: { cited: row.referenceId != null } }),
    async apply(row, step, { actor, comment, now, transaction }) {
      switch (step.name) {
        case 'revise':
          return { resultId: await revise(kind, row, actor, transaction), audited: true };
        case 'approve':
          await publish(kind, row, actor, now, transaction);
          return;
        case 'submit':
          row.set({ status: 'in-review', submittedAt: now } as never);
          return;
        case 'return':
          row.set({ status: 'draft', returnedComment: comment ?? null, submittedAt: null } as never);
          return;
        case 'retire':
          row.set({ status: 'retired', retiredAt: now } as never);
          await kind.onRetire?.(row, `the ${kind.noun} was retired${comment ? ` (${comment})` : ''}`, actor, transaction);
      }
    },
    afterCommit: kind.afterCommit,
    async notify(resultId, step, actor, comment) {
      const row = await kind.model.findByPk(resultId);
      if (row) await notify(kind, row, step, actor, comment);
    },
  };
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
  try {
    return await runStep(workflowOf(kind), id, stepName, input, actor);
  } catch (err) {
    // Two revisions started at once: the partial unique index lets only one in.
    if (err instanceof UniqueConstraintError && stepName === 'revise') throw revisionOpen(kind.noun);
    throw err;
  }
}
