import { Link, useNavigate } from 'react-router-dom';
import type { LibrarySetDto } from '@shared/schemas/library';
import type { SessionUserDto } from '@shared/schemas/auth';
import { allowedSteps, CURATED_STEPS, type CuratedStatus, type CuratedStepName, type WorkflowSubject } from '@shared/workflows/curated';
import { Panel } from '@/components/ui/states';
import { formatDateTime } from '@/lib/dates';
import { WorkflowSteps } from '@/components/workflow-steps';
import { useSetStep } from '../api/library-sets';

const REVIEW_STEPS = CURATED_STEPS.filter((s) => s.name === 'approve' || s.name === 'return');
const PUBLISHED_STEPS = CURATED_STEPS.filter((s) => s.name === 'revise' || s.name === 'retire');

const subjectOf = (set: LibrarySetDto): WorkflowSubject<CuratedStatus> => ({
  status: set.status,
  authorIds: [set.draftedBy?.id, set.lastEditedBy?.id],
  facts: { cited: set.reference !== null },
});

/** Nobody publishes their own work: whoever drafted or last edited a set cannot approve or return it. */
export function isOwnWork(set: LibrarySetDto, me: SessionUserDto): boolean {
  return subjectOf(set).authorIds.includes(me.id);
}

type Props = { set: LibrarySetDto; me: SessionUserDto; onReload: () => void; onNotice: (message: string) => void };

/**
 * Runs a set's step and answers what the step returned (the new draft, for a revision); `stepProps`
 * are what both panels give their WorkflowSteps alike.
 */
function useStepRunner(set: LibrarySetDto, me: SessionUserDto, onReload: () => void) {
  const step = useSetStep();
  const run = (name: CuratedStepName, comment: string | undefined) => {
    const base = { id: set.id, lockVersion: set.lockVersion };
    if (name === 'return') return step.mutateAsync({ ...base, step: name, comment: comment ?? '' });
    if (name === 'retire') return step.mutateAsync({ ...base, step: name, reason: comment ?? '' });
    return step.mutateAsync({ ...base, step: name });
  };
  const stepProps = { subject: subjectOf(set), viewer: { id: me.id, role: me.role }, busy: step.isPending, onReload, empty: null };
  return { run, stepProps };
}

/** Why the viewer cannot approve, in this desk's words, or null when they can. */
function approveBlocker(set: LibrarySetDto, me: SessionUserDto): string | null {
  const approve = allowedSteps(REVIEW_STEPS, subjectOf(set), { id: me.id, role: me.role })[0];
  if (approve.allowed) return null;
  if (approve.code === 'own-work') return 'You drafted or last edited this set, so a second librarian must approve or return it (four-eyes).';
  if (approve.code === 'no-role') return 'Your role cannot approve property sets.';
  return approve.reason ?? null;
}

/** Approve or return a set in review (four-eyes), with the reason shown when the caller may not. */
export function ReviewPanel({ set, me, onReload, onNotice }: Props) {
  const navigate = useNavigate();
  const { run, stepProps } = useStepRunner(set, me, onReload);
  const blocker = approveBlocker(set, me);
  const onStep = async (name: CuratedStepName, comment: string | undefined) => {
    await run(name, comment);
    if (name === 'approve') onNotice('Approved and published: it is now in the catalogue and in Evaluate.');
    else navigate('/library', { state: { notice: `Returned “${set.material.name} — ${set.condition}” to its author.` } });
  };
  return (
    <Panel title="Review" className="no-print">
      <div className="flex flex-col gap-3 text-sm">
        <p>
          Submitted by <strong>{set.lastEditedBy?.name ?? set.draftedBy?.name ?? 'unknown'}</strong>
          {set.submittedAt ? ` on ${formatDateTime(set.submittedAt)}` : ''}.
        </p>
        {blocker ? (
          <p className="rounded-plate bg-sounding-light px-3 py-2 text-sounding-dark" data-testid="four-eyes">
            {blocker}
          </p>
        ) : (
          <p className="text-ink-soft">Check each value against the source, then approve to publish it, or return it with a comment.</p>
        )}
        <WorkflowSteps
          {...stepProps}
          steps={REVIEW_STEPS}
          onStep={onStep}
          buttonLabels={{ approve: 'Approve…', return: 'Return to author…' }}
          reasons="none"
          describe={(step) =>
            step.name === 'approve' ? (
              <>
                <p>
                  Version {set.version} of <strong>{set.material.name} — {set.condition}</strong> becomes part of the published catalogue and is
                  used by Evaluate from now on.
                </p>
                {set.supersedesId ? <p>Version {set.version - 1} will be retired; it stays readable and points to this one.</p> : null}
              </>
            ) : null
          }
        />
      </div>
    </Panel>
  );
}

/** A published set: start its next version, or retire it. */
export function PublishedActions({ set, me, onReload, onNotice }: Props) {
  const navigate = useNavigate();
  const { run, stepProps } = useStepRunner(set, me, onReload);
  const onStep = async (name: CuratedStepName, comment: string | undefined) => {
    const result = await run(name, comment);
    if (name === 'revise' && result) navigate(`/library/sets/${result.id}`);
    else if (name === 'retire') onNotice('Retired: it no longer appears in the catalogue or Evaluate.');
  };
  return (
    <Panel title="Published set" className="no-print">
      <div className="flex flex-col gap-3 text-sm">
        <p className="text-ink-soft">Published values are never edited in place: a revision is a new draft (version {set.version + 1}) that replaces this one once approved.</p>
        <WorkflowSteps
          {...stepProps}
          steps={PUBLISHED_STEPS}
          onStep={onStep}
          buttonLabels={{ revise: 'Start a revision…', retire: 'Retire…' }}
          describe={(step) =>
            step.name === 'retire' ? <p>It leaves the catalogue and Evaluate. Design records that used it keep it, and it stays readable here.</p> : null
          }
        />
        <Link to={`/materials/${set.material.id}?set=${set.id}`} className="text-sounding underline">
          Open in the catalogue
        </Link>
      </div>
    </Panel>
  );
}
