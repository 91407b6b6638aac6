// One runner for the steps of every reviewed kind of record, from its table in shared/workflows:
// lock the row, check the lock version, the status, the author and four-eyes rules and what the
// step requires, apply the step, write the audit entry in the same transaction, commit, then drop
// caches and send mail. A kind of record says only what is its own (`WorkflowKind`).
import type { Model, ModelStatic, Transaction } from 'sequelize';
import { sequelize } from '../db/sequelize';
import { AppError, badRequest, conflict, forbidden, notFound } from '../errors';
import { recordAudit } from '../services/audit';
import { queueMail } from '../services/outbox';
import { assertCurrent, auditSnapshot, lockCurrent } from '../services/optimistic-lock';
import { findStep, stepRefusal, type Refusal, type StepRule, type WorkflowSubject } from '../../shared/workflows/steps';
import type { Role } from '../../shared/roles';

export interface Actor {
  id: number;
  name: string;
  role: Role;
}

export type WorkflowRow<S extends string> = Model & { id: number; status: S; lockVersion: number };

export interface StepContext {
  actor: Actor;
  comment: string | undefined;
  now: Date;
  transaction: Transaction;
}

/** What a step's own work leaves to the runner. */
export interface Applied {
  /** The record the caller is left on (a revision's new draft); the stepped record by default. */
  resultId?: number;
  /** The step wrote its own audit entries (e.g. on a new record). */
  audited?: boolean;
  /** More to keep in the audit entry's "after", e.g. the design record a check froze. */
  auditExtra?: Record<string, unknown>;
}

export interface WorkflowKind<S extends string, N extends string, M extends WorkflowRow<S>> {
  steps: readonly StepRule<S, N>[];
  model: ModelStatic<M>;
  /** Audit entity type, e.g. 'rating-table'. */
  entityType: string;
  /** In sentences: "rating table"; `staleNoun` in the stale message when shorter ("set"). */
  noun: string;
  staleNoun?: string;
  /** Refuses, with 404, a caller who may not see the record (before any rule is checked). */
  admit?(row: M, actor: Actor, transaction: Transaction): Promise<void>;
  /** The record as the step table sees it. */
  subject(row: M, transaction: Transaction): Promise<WorkflowSubject<S>>;
  /** The step's own work on the locked row (set its fields; the runner saves it). */
  apply(row: M, step: StepRule<S, N>, context: StepContext): Promise<Applied | void>;
  /** After any committed step (e.g. drop a cache). */
  afterCommit?(): void;
  /** E-mail after the commit, for steps whose rule notifies someone. */
  notify?(resultId: number, step: StepRule<S, N>, actor: Actor, comment: string | undefined): Promise<void>;
}

const capital = (s: string) => s[0].toUpperCase() + s.slice(1);

/** A refusal in the contract's words: 403 for who, 409 for when, 400 for what is missing. */
function refusalError<S extends string, N extends string>(refusal: Refusal, step: StepRule<S, N>, noun: string, status: string): AppError {
  switch (refusal.code) {
    case 'wrong-status':
      return conflict(step.refusals?.['wrong-status'] ?? `${step.label} is not possible: this ${noun} is ${status}.`, 'wrong_status');
    case 'own-work':
      return new AppError(403, 'own_work', refusal.reason);
    case 'unmet':
      return badRequest(refusal.reason, { [step.requires!.field]: refusal.reason });
    default:
      return forbidden(refusal.reason);
  }
}

/** Runs step `stepName` on record `id`; returns the id of the record it leaves the caller on. */
export async function runStep<S extends string, N extends string, M extends WorkflowRow<S>>(
  kind: WorkflowKind<S, N, M>,
  id: number,
  stepName: string,
  input: { lockVersion: number; comment?: string },
  actor: Actor,
): Promise<number> {
  const step = findStep(kind.steps, stepName);
  if (!step) throw notFound('Step');
  const comment = step.comment === 'none' ? undefined : input.comment?.trim() || undefined;
  const resultId = await sequelize().transaction(async (transaction) => {
    const row = await lockCurrent(kind.model, transaction, id, null, capital(kind.noun));
    await kind.admit?.(row, actor, transaction);
    assertCurrent(row, input.lockVersion, kind.staleNoun ?? kind.noun);
    const refusal = stepRefusal(step, await kind.subject(row, transaction), actor);
    if (refusal) throw refusalError(refusal, step, kind.noun, row.status);
    if (step.comment === 'required' && !comment) throw badRequest('This step needs a comment.', { [step.commentAs ?? 'comment']: 'is required' });
    const before = auditSnapshot(row);
    const applied = (await kind.apply(row, step, { actor, comment, now: new Date(), transaction })) ?? {};
    await row.save({ transaction });
    if (!applied.audited) {
      await recordAudit(transaction, {
        actorId: actor.id,
        action: step.name,
        entityType: kind.entityType,
        entityId: id,
        before,
        after: { ...auditSnapshot(row), ...applied.auditExtra, ...(comment ? { [step.commentAs ?? 'comment']: comment } : {}) },
      });
    }
    return applied.resultId ?? id;
  });
  kind.afterCommit?.();
  if (step.notify !== 'none') await kind.notify?.(resultId, step, actor, comment);
  return resultId;
}

/** A one-line subject of at most 200 characters (the mail service refuses longer). */
export function subjectLine(text: string): string {
  const line = text.replace(/\s+/g, ' ').trim();
  return line.length <= 200 ? line : `${line.slice(0, 199)}…`;
}

/** One message to many, in batches of 50 recipients. */
export async function mailInChunks(to: string[], subject: string, text: string): Promise<void> {
  for (let i = 0; i < to.length; i += 50) await queueMail({ to: to.slice(i, i + 50), subject: subjectLine(subject), text });
}
