/**
 * The sign-off workflow of a shortlist: its author submits it, a second engineer who may check
 * and belongs to the project checks it (freezing a design record) or returns it with a comment.
 * The server runs it through `server/modules/projects/shortlist-steps.ts`.
 */
import type { ShortlistStatus } from '../schemas/projects';
import type { StepRule } from './steps';

export type ShortlistStepName = 'submit' | 'check' | 'return';
export type ShortlistStep = StepRule<ShortlistStatus, ShortlistStepName>;

export const SHORTLIST_STEPS: readonly ShortlistStep[] = [
  {
    name: 'submit',
    label: 'Submit for checking',
    from: ['open', 'returned'],
    to: 'submitted',
    permission: 'project:write',
    fourEyes: false,
    authorOnly: true,
    comment: 'none',
    requires: { fact: 'hasItems', field: 'items', reason: 'Add at least one candidate before submitting.' },
    notify: 'checkers',
    tone: 'primary',
    refusals: { 'not-author': 'Only the author submits a shortlist.' },
  },
  {
    name: 'check',
    label: 'Check and freeze the record',
    from: ['submitted'],
    to: 'checked',
    permission: 'shortlist:check',
    fourEyes: true,
    membersOnly: true,
    comment: 'optional',
    commentAs: 'comment',
    notify: 'authors',
    tone: 'primary',
    refusals: {
      'no-role': 'Only checkers can check shortlists.',
      'own-work': 'A shortlist is checked by a second engineer, never by its author.',
      'not-member': 'Only a checker who is a member of the project can check its shortlists.',
      'wrong-status': 'This shortlist is not waiting for a check.',
    },
  },
  {
    name: 'return',
    label: 'Return to the author',
    from: ['submitted'],
    to: 'returned',
    permission: 'shortlist:check',
    fourEyes: true,
    membersOnly: true,
    comment: 'required',
    commentAs: 'comment',
    notify: 'authors',
    tone: 'quiet',
    refusals: {
      'no-role': 'Only checkers can return shortlists.',
      'own-work': 'A shortlist is checked by a second engineer, never by its author.',
      'not-member': 'Only a checker who is a member of the project can return its shortlists.',
      'wrong-status': 'This shortlist is not waiting for a check.',
    },
  },
];
