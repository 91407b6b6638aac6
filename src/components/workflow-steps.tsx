import { useState, type ReactNode } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { allowedSteps, stepCommentSchema, type StepAvailability, type StepRule, type Viewer, type WorkflowSubject } from '@shared/workflows/steps';
import { Button } from '@/components/ui/button';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { TextAreaField } from '@/components/ui/text-area';
import { StaleBanner } from '@/components/stale-banner';
import { ApiError, isStale } from '@/lib/api-client';
import { mapServerErrors } from '@/lib/field-errors';

/** The steps worth showing: those open now, and those the viewer could take but may not yet (with why). */
export function visibleSteps<R>(available: readonly StepAvailability<R>[]): StepAvailability<R>[] {
  return available.filter((a) => a.allowed || (a.code !== 'no-role' && a.code !== 'wrong-status'));
}

const NOTIFIED: Record<StepRule<string, string>['notify'], string | null> = {
  reviewers: 'The other librarians and administrators are told by e-mail.',
  authors: 'The author is told by e-mail.',
  checkers: 'The checkers of the project are told by e-mail.',
  none: null,
};

function commentLabel(step: StepRule<string, string>): string {
  if (step.commentAs === 'reason') return 'Reason (kept in the audit log)';
  return step.comment === 'optional' ? 'Comment (optional)' : 'Comment for the author';
}

/**
 * The step dialog: what the step does, who is told, the words it asks for, and the server's
 * answer; a record changed meanwhile (409) shows as a StaleBanner with a reload, the words kept.
 */
function StepDialog<S extends string, N extends string>({
  step,
  open,
  busy,
  title,
  describe,
  onReload,
  onClose,
  onStep,
}: {
  step: StepRule<S, N>;
  open: boolean;
  busy: boolean;
  title?: (step: StepRule<S, N>) => string;
  describe?: (step: StepRule<S, N>) => ReactNode;
  onReload?: () => void;
  onClose: () => void;
  onStep: (step: N, comment: string | undefined) => Promise<unknown>;
}) {
  const form = useForm<{ comment: string | undefined }>({ resolver: zodResolver(stepCommentSchema(step)), defaultValues: { comment: '' } });
  const [error, setError] = useState<{ message: string; stale: boolean } | null>(null);
  const submit = form.handleSubmit(async ({ comment }) => {
    setError(null);
    try {
      await onStep(step.name, comment || undefined);
      onClose();
    } catch (err) {
      const mapped = mapServerErrors(err, { comment: 'Comment', reason: 'Reason' });
      const field = mapped.fields.comment ?? mapped.fields.reason;
      if (field) form.setError('comment', { message: field });
      // Stale, or the status moved on under the reader: either way the page must be reloaded.
      const stale = isStale(err) || (err instanceof ApiError && err.status === 409 && err.code === 'wrong_status');
      setError({ message: mapped.root ?? (field ? 'Check the comment.' : 'The step did not go through.'), stale });
    }
  });
  return (
    <ConfirmDialog
      open={open}
      title={title?.(step) ?? `${step.label}?`}
      confirmLabel={step.label}
      tone={step.tone === 'danger' ? 'danger' : 'primary'}
      busy={busy || form.formState.isSubmitting}
      error={error && !(error.stale && onReload) ? <p>{error.message}</p> : undefined}
      onClose={onClose}
      onConfirm={() => void submit()}
    >
      {describe?.(step)}
      {NOTIFIED[step.notify] ? <p>{NOTIFIED[step.notify]}</p> : null}
      {step.to === 'new-version' ? <p>A new draft copies this version; this one stays published until the revision is approved.</p> : null}
      {step.comment !== 'none' ? (
        <TextAreaField label={commentLabel(step)} error={form.formState.errors.comment?.message} data-autofocus rows={4} {...form.register('comment')} />
      ) : null}
      {error?.stale && onReload ? (
        <StaleBanner
          testId="step-stale"
          message={error.message}
          onReload={onReload}
          reloadLabel="Reload to see the change"
          detail={
            step.comment === 'none'
              ? 'Nothing was done. Reload to see what changed, then decide again.'
              : 'Your comment is still here: copy it if you need it, then reload to see what changed.'
          }
        />
      ) : null}
    </ConfirmDialog>
  );
}

/**
 * The review or sign-off steps of a record, rendered from its workflow table: every step the
 * viewer's role could take, enabled when allowed now and otherwise saying why not; one dialog for
 * all, asking for the words a step needs. `buttonLabels` gives a panel its own short button text.
 */
export function WorkflowSteps<S extends string, N extends string>({
  steps,
  subject,
  viewer,
  busy,
  onStep,
  onReload,
  title,
  describe,
  buttonLabels,
  reasons = 'list',
  empty = 'No review step is open to you on this record.',
}: {
  steps: readonly StepRule<S, N>[];
  subject: WorkflowSubject<S>;
  viewer: Viewer;
  busy: boolean;
  onStep: (step: N, comment: string | undefined) => Promise<unknown>;
  onReload?: () => void;
  /** The dialog's title, when the step's label alone would not name the record. */
  title?: (step: StepRule<S, N>) => string;
  describe?: (step: StepRule<S, N>) => ReactNode;
  buttonLabels?: Partial<Record<N, string>>;
  /** 'list': say under the buttons why a step is closed; 'none': the panel says it its own way. */
  reasons?: 'list' | 'none';
  empty?: string | null;
}) {
  // The last step chosen stays mounted while closed, so the dialog can hand the focus back.
  const [chosen, setChosen] = useState<{ step: StepRule<S, N>; open: boolean; n: number } | null>(null);
  const available = visibleSteps(allowedSteps(steps, subject, viewer));
  if (available.length === 0) return empty ? <p className="text-sm text-ink-soft">{empty}</p> : null;
  return (
    <div className="flex flex-col gap-2">
      <div className="flex flex-wrap gap-2">
        {available.map(({ step, allowed, reason }) => (
          <Button key={step.name} tone={step.tone} disabled={!allowed || busy} title={reason} onClick={() => setChosen((c) => ({ step, open: true, n: (c?.n ?? 0) + 1 }))}>
            {buttonLabels?.[step.name] ?? `${step.label}…`}
          </Button>
        ))}
      </div>
      {reasons === 'list'
        ? available
            .filter((a) => !a.allowed)
            .map((a) => (
              <p key={a.step.name} className="text-xs text-ink-soft">
                {a.step.label}: {a.reason}
              </p>
            ))
        : null}
      {chosen ? (
        <StepDialog
          key={chosen.n}
          step={chosen.step}
          open={chosen.open}
          busy={busy}
          title={title}
          describe={describe}
          onReload={onReload}
          onClose={() => setChosen((c) => c && { ...c, open: false })}
          onStep={onStep}
        />
      ) : null}
    </div>
  );
}
