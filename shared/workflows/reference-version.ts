/**
 * The review of a change to a reference in use (cited by a published or retired set or rating
 * table, and so by any design record): the change is a new version of the reference, drafted by
 * a librarian, submitted, and approved by someone else (which publishes it: drafts cite it from
 * then on; published records keep the version they were approved with) or returned with a
 * comment. The curated table's own rows, without revise (proposing a change starts the next
 * version) and retire (a reference in use is never withdrawn). The server runs it through
 * `server/modules/references/versions.ts`.
 */
import { CURATED_STEPS, type CuratedStep } from './curated';

export type ReferenceVersionStepName = 'submit' | 'approve' | 'return';

export const REFERENCE_VERSION_STEPS: readonly CuratedStep[] = CURATED_STEPS.filter((s) => s.name === 'submit' || s.name === 'approve' || s.name === 'return');
