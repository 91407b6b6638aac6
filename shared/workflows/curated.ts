/**
 * The review workflow of curated records (property sets, rating tables; reference versions and
 * value confirmations follow the same table): draft → in review → published → retired, with
 * revisions that supersede the published version. One table says, for each step, where it may
 * start, where it leads, who may take it, whether the four-eyes rule applies, whether a comment is
 * needed and who is told. The server runs steps from it (`server/workflows/curated-steps.ts`);
 * the client renders its buttons from `allowedSteps`, so both sides say the same thing.
 */
import { can, type Permission, type Role } from '../roles';

export const CURATED_STATUSES = ['draft', 'in-review', 'published', 'retired'] as const;
export type CuratedStatus = (typeof CURATED_STATUSES)[number];

export const CURATED_STATUS_LABELS: Record<CuratedStatus, string> = {
  draft: 'Draft',
  'in-review': 'In review',
  published: 'Published',
  retired: 'Retired',
};

export type CuratedStepName = 'submit' | 'approve' | 'return' | 'revise' | 'retire';

export interface StepRule<S extends string, N extends string> {
  name: N;
  /** Button text. */
  label: string;
  from: readonly S[];
  /** The status it leads to; 'new-version' creates a draft that supersedes the record. */
  to: S | 'new-version';
  permission: Permission;
  /** The author and last editor may not take this step (four-eyes rule). */
  fourEyes: boolean;
  /** What the step needs from the actor besides the lock version. */
  comment: 'none' | 'required';
  /** Who is told by e-mail after the commit. */
  notify: 'reviewers' | 'authors' | 'none';
}

export type CuratedStep = StepRule<CuratedStatus, CuratedStepName>;

export const CURATED_STEPS: readonly CuratedStep[] = [
  { name: 'submit', label: 'Submit for review', from: ['draft'], to: 'in-review', permission: 'catalogue:draft', fourEyes: false, comment: 'none', notify: 'reviewers' },
  { name: 'approve', label: 'Approve and publish', from: ['in-review'], to: 'published', permission: 'catalogue:approve', fourEyes: true, comment: 'none', notify: 'authors' },
  { name: 'return', label: 'Return to the author', from: ['in-review'], to: 'draft', permission: 'catalogue:approve', fourEyes: true, comment: 'required', notify: 'authors' },
  { name: 'revise', label: 'Revise', from: ['published'], to: 'new-version', permission: 'catalogue:draft', fourEyes: false, comment: 'none', notify: 'none' },
  { name: 'retire', label: 'Retire', from: ['published'], to: 'retired', permission: 'catalogue:approve', fourEyes: false, comment: 'required', notify: 'none' },
];

/** What a workflow needs to know of the record. */
export interface WorkflowSubject<S extends string> {
  status: S;
  /** Who drafted and who last edited it (the four-eyes rule keeps them from reviewing it). */
  authorIds: readonly (number | null | undefined)[];
}

export interface Viewer {
  id: number;
  role: Role;
}

export interface StepAvailability<R> {
  step: R;
  allowed: boolean;
  /** Why not, in words, when not allowed. */
  reason?: string;
}

/** Why a step may not be taken by this viewer on this record, or null when it may. */
export function stepRefusal<S extends string, N extends string>(step: StepRule<S, N>, subject: WorkflowSubject<S>, viewer: Viewer): string | null {
  if (!can(viewer.role, step.permission)) return 'Your role does not allow this step.';
  if (!step.from.includes(subject.status)) return `Not possible while the record is ${subject.status}.`;
  if (step.fourEyes && subject.authorIds.some((id) => id === viewer.id)) return 'You drafted or last edited it, so someone else must do this (four-eyes rule).';
  return null;
}

/** Every step of a workflow table with whether this viewer may take it now, and why not. */
export function allowedSteps<S extends string, N extends string>(
  steps: readonly StepRule<S, N>[],
  subject: WorkflowSubject<S>,
  viewer: Viewer,
): StepAvailability<StepRule<S, N>>[] {
  return steps.map((step) => {
    const reason = stepRefusal(step, subject, viewer);
    return reason === null ? { step, allowed: true } : { step, allowed: false, reason };
  });
}

export function findStep<S extends string, N extends string>(steps: readonly StepRule<S, N>[], name: string): StepRule<S, N> | undefined {
  return steps.find((s) => s.name === name);
}
