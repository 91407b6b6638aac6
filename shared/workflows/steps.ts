/**
 * Review workflows as data. Each reviewed kind of record has one table of steps (curated records
 * in `curated.ts`, shortlists in `shortlist.ts`): where a step may start, where it leads, who may
 * take it, the four-eyes rule, whether a comment is asked for and who is told. `allowedSteps`
 * says, for one viewer and one record, which steps are open and why the others are not; the
 * server runs steps from the same table (`server/workflows/run-step.ts`), so both sides agree.
 */
import { z } from 'zod';
import { can, type Permission, type Role } from '../roles';

export interface StepRule<S extends string, N extends string> {
  name: N;
  /** Button text. */
  label: string;
  from: readonly S[];
  /** The status it leads to; 'new-version' creates a draft that supersedes the record. */
  to: S | 'new-version';
  permission: Permission;
  /** The record's authors may not take this step (four-eyes rule). */
  fourEyes: boolean;
  /** Only the record's author may take this step. */
  authorOnly?: boolean;
  /** Only members of the record's project may take it (administrators excepted). */
  membersOnly?: boolean;
  /** Whether the step asks for words from the actor, and under which name the audit log keeps them. */
  comment: 'none' | 'optional' | 'required';
  commentAs?: 'comment' | 'reason';
  /** A fact of the record that must hold first, and the words when it does not. */
  requires?: { fact: string; field: string; reason: string };
  /** Who is told by e-mail after the commit. */
  notify: 'reviewers' | 'authors' | 'checkers' | 'none';
  /** How the button looks: the step a record waits for, an everyday one, or one that ends its life. */
  tone: 'primary' | 'quiet' | 'danger';
  /** This workflow's own words for a refusal, where the general ones would be vague. */
  refusals?: Partial<Record<RefusalCode, string>>;
}

/** What a workflow needs to know of the record. */
export interface WorkflowSubject<S extends string> {
  status: S;
  /** Who wrote it: the drafter and last editor, or a shortlist's author. */
  authorIds: readonly (number | null | undefined)[];
  /** Members of the record's project, when steps are for members only (null: not known here). */
  memberIds?: readonly number[] | null;
  /** Facts that steps may require (e.g. hasItems). */
  facts?: Readonly<Record<string, boolean>>;
}

export interface Viewer {
  id: number;
  role: Role;
}

export type RefusalCode = 'no-role' | 'wrong-status' | 'not-author' | 'own-work' | 'not-member' | 'unmet';

export interface Refusal {
  code: RefusalCode;
  reason: string;
}

export interface StepAvailability<R> {
  step: R;
  allowed: boolean;
  /** Why not, in words, when not allowed. */
  reason?: string;
  code?: RefusalCode;
}

/** Why a step may not be taken by this viewer on this record, or null when it may. */
export function stepRefusal<S extends string, N extends string>(step: StepRule<S, N>, subject: WorkflowSubject<S>, viewer: Viewer): Refusal | null {
  const refusal = generalRefusal(step, subject, viewer);
  return refusal && { code: refusal.code, reason: step.refusals?.[refusal.code] ?? refusal.reason };
}

function generalRefusal<S extends string, N extends string>(step: StepRule<S, N>, subject: WorkflowSubject<S>, viewer: Viewer): Refusal | null {
  const isAuthor = subject.authorIds.some((id) => id === viewer.id);
  if (!step.from.includes(subject.status)) return { code: 'wrong-status', reason: `Not possible while the record is ${subject.status}.` };
  if (step.authorOnly && !isAuthor) return { code: 'not-author', reason: 'Only the author can take this step.' };
  if (step.fourEyes && isAuthor) return { code: 'own-work', reason: 'You wrote or last edited it, so someone else must do this (four-eyes rule).' };
  if (!can(viewer.role, step.permission)) return { code: 'no-role', reason: 'Your role does not allow this step.' };
  if (step.membersOnly && viewer.role !== 'admin' && subject.memberIds && !subject.memberIds.includes(viewer.id)) {
    return { code: 'not-member', reason: 'Only a member of the project can take this step.' };
  }
  if (step.requires && subject.facts?.[step.requires.fact] === false) return { code: 'unmet', reason: step.requires.reason };
  return null;
}

/** Every step of a workflow table with whether this viewer may take it now, and why not. */
export function allowedSteps<S extends string, N extends string>(
  steps: readonly StepRule<S, N>[],
  subject: WorkflowSubject<S>,
  viewer: Viewer,
): StepAvailability<StepRule<S, N>>[] {
  return steps.map((step) => {
    const refusal = stepRefusal(step, subject, viewer);
    return refusal === null ? { step, allowed: true } : { step, allowed: false, reason: refusal.reason, code: refusal.code };
  });
}

export function findStep<S extends string, N extends string>(steps: readonly StepRule<S, N>[], name: string): StepRule<S, N> | undefined {
  return steps.find((s) => s.name === name);
}

/** The words a step asks for, as the step dialog validates them before sending. */
export function stepCommentSchema<S extends string, N extends string>(step: StepRule<S, N>) {
  const reason = step.commentAs === 'reason';
  const text = z
    .string()
    .trim()
    .max(reason ? 2000 : 4000, `Keep it under ${reason ? 2000 : 4000} characters.`);
  return z.object({
    comment: step.comment === 'required' ? text.min(3, reason ? 'Give the reason, in a few words at least.' : 'Say what the author must change.') : text.optional(),
  });
}
