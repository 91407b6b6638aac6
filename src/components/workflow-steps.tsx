import { useState } from 'react';
import { allowedSteps, type StepRule, type Viewer, type WorkflowSubject } from '@shared/workflows/curated';
import { Button } from '@/components/ui/button';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { TextAreaField } from '@/components/ui/text-area';

/**
 * The review steps of a record, rendered from the shared workflow table: every step the viewer's
 * role could take, enabled when allowed now and otherwise saying why not; one dialog for all,
 * asking for the comment a step needs.
 */
export function WorkflowSteps<S extends string, N extends string>({
  steps,
  subject,
  viewer,
  busy,
  error,
  onStep,
}: {
  steps: readonly StepRule<S, N>[];
  subject: WorkflowSubject<S>;
  viewer: Viewer;
  busy: boolean;
  error?: string | null;
  onStep: (step: N, comment: string | undefined) => Promise<unknown>;
}) {
  const [open, setOpen] = useState<StepRule<S, N> | null>(null);
  const [comment, setComment] = useState('');
  const available = allowedSteps(steps, subject, viewer).filter((a) => a.allowed || a.step.from.includes(subject.status));
  if (available.length === 0) return <p className="text-sm text-ink-soft">No review step is open to you on this record.</p>;
  const needsComment = open?.comment === 'required';
  return (
    <div className="flex flex-col gap-2">
      <div className="flex flex-wrap gap-2">
        {available.map(({ step, allowed, reason }) => (
          <Button
            key={step.name}
            tone={step.name === 'retire' ? 'danger' : step.name === 'approve' || step.name === 'submit' ? 'primary' : 'quiet'}
            disabled={!allowed || busy}
            title={reason}
            onClick={() => {
              setComment('');
              setOpen(step);
            }}
          >
            {step.label}
          </Button>
        ))}
      </div>
      {available
        .filter((a) => !a.allowed)
        .map((a) => (
          <p key={a.step.name} className="text-xs text-ink-soft">
            {a.step.label}: {a.reason}
          </p>
        ))}
      <ConfirmDialog
        open={open !== null}
        title={open ? `${open.label}?` : ''}
        confirmLabel={open?.label ?? ''}
        tone={open?.name === 'retire' ? 'danger' : 'primary'}
        busy={busy}
        error={error}
        confirmDisabled={needsComment && comment.trim().length < 3}
        onClose={() => setOpen(null)}
        onConfirm={() => {
          if (!open) return;
          void onStep(open.name, needsComment ? comment.trim() : undefined).then(
            () => setOpen(null),
            () => undefined,
          );
        }}
      >
        {open?.notify === 'reviewers' ? <p>The other librarians and administrators are told by e-mail.</p> : null}
        {open?.notify === 'authors' ? <p>The author and the last editor are told by e-mail.</p> : null}
        {open?.to === 'new-version' ? <p>A new draft copies this version; this one stays published until the revision is approved.</p> : null}
        {needsComment ? (
          <TextAreaField
            label={open?.name === 'retire' ? 'Reason (kept in the audit log)' : 'Comment for the author'}
            value={comment}
            onChange={(e) => setComment(e.target.value)}
            data-autofocus
            rows={4}
          />
        ) : null}
      </ConfirmDialog>
    </div>
  );
}
