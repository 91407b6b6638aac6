/**
 * The review workflow of curated records (property sets, rating tables; reference versions and
 * value confirmations follow the same table): draft → in review → published → retired, with
 * revisions that supersede the published version. The server runs it through
 * `server/workflows/curated-steps.ts`; the client renders its buttons from `allowedSteps`.
 */
import type { StepRule } from './steps';

export const CURATED_STATUSES = ['draft', 'in-review', 'published', 'retired'] as const;
export type CuratedStatus = (typeof CURATED_STATUSES)[number];

export const CURATED_STATUS_LABELS: Record<CuratedStatus, string> = {
  draft: 'Draft',
  'in-review': 'In review',
  published: 'Published',
  retired: 'Retired',
};

export type CuratedStepName = 'submit' | 'approve' | 'return' | 'revise' | 'retire';
export type CuratedStep = StepRule<CuratedStatus, CuratedStepName>;

const OWN_WORK = 'You drafted or last edited it, so someone else must do this (four-eyes rule).';

export const CURATED_STEPS: readonly CuratedStep[] = [
  { name: 'submit', label: 'Submit for review', from: ['draft'], to: 'in-review', permission: 'catalogue:draft', fourEyes: false, comment: 'none', notify: 'reviewers', tone: 'primary' },
  {
    name: 'approve',
    label: 'Approve and publish',
    from: ['in-review'],
    to: 'published',
    permission: 'catalogue:approve',
    fourEyes: true,
    comment: 'none',
    requires: { fact: 'cited', field: 'referenceId', reason: 'It cites no reference: a published record must. Return it so the author can add one.' },
    notify: 'authors',
    tone: 'primary',
    refusals: { 'own-work': OWN_WORK },
  },
  { name: 'return', label: 'Return to the author', from: ['in-review'], to: 'draft', permission: 'catalogue:approve', fourEyes: true, comment: 'required', commentAs: 'comment', notify: 'authors', tone: 'quiet', refusals: { 'own-work': OWN_WORK } },
  { name: 'revise', label: 'Revise', from: ['published'], to: 'new-version', permission: 'catalogue:draft', fourEyes: false, comment: 'none', notify: 'none', tone: 'quiet' },
  { name: 'retire', label: 'Retire', from: ['published'], to: 'retired', permission: 'catalogue:approve', fourEyes: false, comment: 'required', commentAs: 'reason', notify: 'none', tone: 'danger' },
];

export { allowedSteps, findStep, stepRefusal } from './steps';
export type { Refusal, RefusalCode, StepAvailability, StepRule, Viewer, WorkflowSubject } from './steps';
