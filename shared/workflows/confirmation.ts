/**
 * Confirming one value of a published property set against its source: a librarian proposes the
 * location where the source shows the value; someone else approves it (the value becomes
 * confirmed, with who proposed and who approved) or rejects it with a comment. The server runs it
 * through `server/modules/library/confirmations.ts`.
 */
import type { StepRule } from './steps';

export const CONFIRMATION_STATUSES = ['proposed', 'approved', 'rejected'] as const;
export type ConfirmationStatus = (typeof CONFIRMATION_STATUSES)[number];
export type ConfirmationStepName = 'approve' | 'reject';
export type ConfirmationStep = StepRule<ConfirmationStatus, ConfirmationStepName>;

const OWN = 'You proposed this confirmation, so someone else must approve or reject it (four-eyes rule).';

export const CONFIRMATION_STEPS: readonly ConfirmationStep[] = [
  { name: 'approve', label: 'Approve the confirmation', from: ['proposed'], to: 'approved', permission: 'catalogue:approve', fourEyes: true, comment: 'none', notify: 'authors', tone: 'primary', refusals: { 'own-work': OWN } },
  { name: 'reject', label: 'Reject the confirmation', from: ['proposed'], to: 'rejected', permission: 'catalogue:approve', fourEyes: true, comment: 'required', commentAs: 'comment', notify: 'authors', tone: 'quiet', refusals: { 'own-work': OWN } },
];
