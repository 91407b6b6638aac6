import { useId, useState } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import { retireSchema, returnSchema, type LibrarySetDto } from '@shared/schemas/library';
import type { SessionUserDto } from '@shared/schemas/auth';
import { Button } from '@/components/ui/button';
import { Panel } from '@/components/ui/states';
import { ApiError } from '@/lib/api-client';
import { useSetStep } from '../api/library-sets';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';

/** Nobody publishes their own work: whoever drafted or last edited a set cannot approve or return it. */
export function isOwnWork(set: LibrarySetDto, me: SessionUserDto): boolean {
  return set.draftedBy?.id === me.id || set.lastEditedBy?.id === me.id;
}

function StepError({ error, onReload }: { error: unknown; onReload: () => void }) {
  if (!error) return null;
  const message = error instanceof ApiError ? error.message : 'The server did not answer.';
  const stale = error instanceof ApiError && error.status === 409;
  return (
    <>
      <p>{message}</p>
      {stale ? (
        <button type="button" className="mt-1 font-bold text-sounding underline" onClick={onReload}>
          Reload the set
        </button>
      ) : null}
    </>
  );
}

function TextArea({ label, value, onChange, error, hint }: { label: string; value: string; onChange: (v: string) => void; error?: string; hint?: string }) {
  const id = useId();
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-xs font-bold uppercase tracking-wide text-ink-soft">
        {label}
      </label>
      <textarea
        id={id}
        data-autofocus
        rows={4}
        value={value}
        onChange={(e) => onChange(e.target.value)}
        aria-invalid={!!error}
        aria-describedby={error ? `${id}-error` : hint ? `${id}-hint` : undefined}
        className={`w-full rounded-plate border bg-white px-2 py-1.5 text-sm ${error ? 'border-verdict-fail' : 'border-chart-line'}`}
      />
      {error ? (
        <p id={`${id}-error`} role="alert" className="text-xs font-bold text-verdict-fail">
          {error}
        </p>
      ) : hint ? (
        <p id={`${id}-hint`} className="text-xs text-ink-faint">
          {hint}
        </p>
      ) : null}
    </div>
  );
}

/** Approve or return a set in review (four-eyes), with the reason shown when the caller may not. */
export function ReviewPanel({ set, me, onReload, onNotice }: { set: LibrarySetDto; me: SessionUserDto; onReload: () => void; onNotice: (message: string) => void }) {
  const navigate = useNavigate();
  const step = useSetStep();
  const reasonId = useId();
  const [dialog, setDialog] = useState<'approve' | 'return' | null>(null);
  const [comment, setComment] = useState('');
  const [commentError, setCommentError] = useState<string>();

  const own = isOwnWork(set, me);
  const mayApprove = me.permissions.includes('catalogue:approve');
  const reason = own
    ? 'You drafted or last edited this set, so a second librarian must approve or return it (four-eyes).'
    : !mayApprove
      ? 'Your role cannot approve property sets.'
      : null;
  const approveReason = reason ?? (!set.reference ? 'It has no reference: return it so the author can add one.' : null);

  const open = (which: 'approve' | 'return') => {
    step.reset();
    setCommentError(undefined);
    setDialog(which);
  };

  const approve = () =>
    step.mutate(
      { step: 'approve', id: set.id, lockVersion: set.lockVersion },
      {
        onSuccess: () => {
          setDialog(null);
          onNotice('Approved and published: it is now in the catalogue and in Evaluate.');
        },
      },
    );

  const sendBack = () => {
    const parsed = returnSchema.shape.comment.safeParse(comment);
    if (!parsed.success) return setCommentError(parsed.error.issues[0]?.message);
    setCommentError(undefined);
    step.mutate(
      { step: 'return', id: set.id, lockVersion: set.lockVersion, comment: parsed.data },
      { onSuccess: () => navigate('/library', { state: { notice: `Returned “${set.material.name} — ${set.condition}” to its author.` } }) },
    );
  };

  return (
    <Panel title="Review" className="no-print">
      <div className="flex flex-col gap-3 text-sm">
        <p>
          Submitted by <strong>{set.lastEditedBy?.name ?? set.draftedBy?.name ?? 'unknown'}</strong>
          {set.submittedAt ? ` on ${new Date(set.submittedAt).toLocaleString('en-GB', { dateStyle: 'medium', timeStyle: 'short' })}` : ''}.
        </p>
        {approveReason ? (
          <p id={reasonId} className="rounded-plate bg-sounding-light px-3 py-2 text-sounding-dark" data-testid="four-eyes">
            {approveReason}
          </p>
        ) : (
          <p className="text-ink-soft">Check each value against the source, then approve to publish it, or return it with a comment.</p>
        )}
        <div className="flex flex-wrap gap-2">
          <Button onClick={() => open('approve')} disabled={!!approveReason} aria-describedby={approveReason ? reasonId : undefined}>
            Approve…
          </Button>
          <Button tone="quiet" onClick={() => open('return')} disabled={!!reason} aria-describedby={reason ? reasonId : undefined}>
            Return to author…
          </Button>
        </div>
      </div>

      <ConfirmDialog
        open={dialog === 'approve'}
        title="Approve and publish?"
        confirmLabel="Approve and publish"
        busy={step.isPending}
        busyLabel="Publishing…"
        error={step.isError ? <StepError error={step.error} onReload={onReload} /> : undefined}
        onClose={() => setDialog(null)}
        onConfirm={approve}
      >
        <p>
          Version {set.version} of <strong>{set.material.name} — {set.condition}</strong> becomes part of the published catalogue and is used by
          Evaluate from now on.
        </p>
        {set.supersedesId ? <p>Version {set.version - 1} will be retired; it stays readable and points to this one.</p> : null}
      </ConfirmDialog>

      <ConfirmDialog
        open={dialog === 'return'}
        title="Return to the author"
        confirmLabel="Return with comment"
        busy={step.isPending}
        busyLabel="Returning…"
        error={step.isError ? <StepError error={step.error} onReload={onReload} /> : undefined}
        onClose={() => setDialog(null)}
        onConfirm={sendBack}
      >
        <TextArea label="Comment for the author" value={comment} onChange={setComment} error={commentError} hint="Say what must change; the author gets it by e-mail." />
      </ConfirmDialog>
    </Panel>
  );
}

/** A published set: start its next version, or retire it. */
export function PublishedActions({ set, me, onReload, onNotice }: { set: LibrarySetDto; me: SessionUserDto; onReload: () => void; onNotice: (message: string) => void }) {
  const navigate = useNavigate();
  const revise = useSetStep();
  const retire = useSetStep();
  const [dialog, setDialog] = useState(false);
  const [reason, setReason] = useState('');
  const [reasonError, setReasonError] = useState<string>();
  const mayRetire = me.permissions.includes('catalogue:approve');

  const startRevision = () =>
    revise.mutate(
      { step: 'revise', id: set.id, lockVersion: set.lockVersion },
      { onSuccess: (draft) => draft && navigate(`/library/sets/${draft.id}`) },
    );

  const doRetire = () => {
    const parsed = retireSchema.shape.reason.safeParse(reason);
    if (!parsed.success) return setReasonError(parsed.error.issues[0]?.message);
    setReasonError(undefined);
    retire.mutate({ step: 'retire', id: set.id, lockVersion: set.lockVersion, reason: parsed.data }, {
      onSuccess: () => {
        setDialog(false);
        onNotice('Retired: it no longer appears in the catalogue or Evaluate.');
      },
    });
  };

  return (
    <Panel title="Published set" className="no-print">
      <div className="flex flex-col gap-3 text-sm">
        <p className="text-ink-soft">Published values are never edited in place: a revision is a new draft (version {set.version + 1}) that replaces this one once approved.</p>
        {revise.isError ? (
          <div role="alert" className="text-verdict-fail">
            <StepError error={revise.error} onReload={onReload} />
          </div>
        ) : null}
        <div className="flex flex-wrap gap-2">
          <Button onClick={startRevision} disabled={revise.isPending}>
            {revise.isPending ? 'Starting…' : 'Start a revision'}
          </Button>
          {mayRetire ? (
            <Button
              tone="quiet"
              onClick={() => {
                retire.reset();
                setDialog(true);
              }}
            >
              Retire…
            </Button>
          ) : null}
        </div>
        <Link to={`/materials/${set.material.id}?set=${set.id}`} className="text-sounding underline">
          Open in the catalogue
        </Link>
      </div>
      <ConfirmDialog
        open={dialog}
        title="Retire this set?"
        confirmLabel="Retire"
        tone="danger"
        busy={retire.isPending}
        busyLabel="Retiring…"
        error={retire.isError ? <StepError error={retire.error} onReload={onReload} /> : undefined}
        onClose={() => setDialog(false)}
        onConfirm={doRetire}
      >
        <p>It leaves the catalogue and Evaluate. Design records that used it keep it, and it stays readable here.</p>
        <TextArea label="Reason" value={reason} onChange={setReason} error={reasonError} hint="Kept in the audit log." />
      </ConfirmDialog>
    </Panel>
  );
}
