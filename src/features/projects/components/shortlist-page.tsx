import { useEffect, useRef, useState } from 'react';
import { Link } from 'react-router-dom';
import { shortlistItemUpdateSchema, shortlistReturnSchema, type ShortlistDto, type ShortlistItemDto } from '@shared/schemas/projects';
import { Button } from '@/components/ui/button';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { LinkButton } from '@/components/ui/link-button';
import { EmptyState, ErrorState, Panel, Spinner, Tag } from '@/components/ui/states';
import { TextAreaField } from '@/components/ui/text-area';
import { ApiError } from '@/lib/api-client';
import { formatDateTime } from '@/lib/dates';
import { useUnits } from '@/lib/unit-system';
import { useProject } from '../api/projects';
import { useShortlist, useShortlistStep } from '../api/shortlists';
import { moveItem, shortlistRights, type ShortlistRights, type Viewer } from '../shortlist-model';
import { Breadcrumb, LoadCaseFacts, SetName, ShortlistStatusTag } from './bits';
import { ComparisonTable } from './comparison-table';

const errorText = (err: unknown) => (err instanceof ApiError ? err.message : 'The server did not answer. Try again.');
const isStale = (err: unknown) => err instanceof ApiError && err.status === 409 && (err.code === 'stale' || err.code === 'wrong_status');

function StatusBanner({ shortlist }: { shortlist: ShortlistDto }) {
  const s = shortlist;
  const box = 'rounded-plate border-l-4 px-4 py-3 text-sm';
  switch (s.status) {
    case 'open':
      return (
        <div className={`${box} border-sounding bg-sounding-light/60`} data-testid="shortlist-status">
          <p>
            <ShortlistStatusTag status="open" /> <strong>{s.author.name}</strong> is choosing candidates. When the list and its notes are ready, the author submits it for
            checking.
          </p>
        </div>
      );
    case 'submitted':
      return (
        <div className={`${box} border-brass bg-brass-light/60`} data-testid="shortlist-status">
          <p>
            <ShortlistStatusTag status="submitted" /> Submitted by <strong>{s.author.name}</strong> on {formatDateTime(s.submittedAt)}; waiting for a second engineer to check
            it. It cannot be changed meanwhile.
          </p>
        </div>
      );
    case 'checked':
      return (
        <div className={`${box} border-verdict-pass bg-verdict-pass/10`} data-testid="shortlist-status">
          <p>
            <ShortlistStatusTag status="checked" /> Checked by <strong>{s.checker?.name ?? 'a checker'}</strong> on {formatDateTime(s.checkedAt)}. Its design record is
            frozen.
          </p>
          {s.checkComment ? <blockquote className="mt-2 whitespace-pre-line border-l-2 border-verdict-pass/40 pl-3 italic">{s.checkComment}</blockquote> : null}
          {s.designRecordId ? (
            <LinkButton to={`/records/${s.designRecordId}`} className="mt-3">
              Open the design record
            </LinkButton>
          ) : null}
        </div>
      );
    case 'returned':
      return (
        <div className={`${box} border-verdict-fail bg-verdict-fail/5`} data-testid="shortlist-status">
          <p>
            <ShortlistStatusTag status="returned" /> Returned by <strong>{s.checker?.name ?? 'a checker'}</strong> with this comment; the author changes it and submits it
            again.
          </p>
          {s.returnedComment ? <blockquote className="mt-2 whitespace-pre-line border-l-2 border-verdict-fail/40 pl-3 italic">{s.returnedComment}</blockquote> : null}
        </div>
      );
  }
}

function NoteEditor({ item, shortlistId, onDone }: { item: ShortlistItemDto; shortlistId: number; onDone: () => void }) {
  const step = useShortlistStep(shortlistId);
  const [note, setNote] = useState(item.note);
  const [error, setError] = useState<string>();
  const save = () => {
    const parsed = shortlistItemUpdateSchema.shape.note.safeParse(note);
    if (!parsed.success) return setError(parsed.error.issues[0]?.message);
    step.mutate({ step: 'note', itemId: item.id, note: parsed.data }, { onSuccess: onDone, onError: (err) => setError(errorText(err)) });
  };
  return (
    <form
      className="flex flex-col gap-2"
      onSubmit={(e) => {
        e.preventDefault();
        save();
      }}
      onKeyDown={(e) => {
        if (e.key === 'Escape') onDone();
      }}
    >
      <TextAreaField
        label={
          <>
            Note<span className="sr-only"> on {item.propertySet.material.name}</span>
          </>
        }
        autoFocus
        value={note}
        maxLength={2000}
        error={error}
        hint="Why it is on the list, and what to confirm with the supplier."
        onChange={(e) => setNote(e.target.value)}
      />
      <div className="flex gap-2">
        <Button type="submit" disabled={step.isPending} className="!py-1 text-xs">
          {step.isPending ? 'Saving…' : 'Save note'}
        </Button>
        <Button tone="quiet" onClick={onDone} className="!py-1 text-xs">
          Cancel
        </Button>
      </div>
    </form>
  );
}

function Items({ shortlist, rights, onReload }: { shortlist: ShortlistDto; rights: ShortlistRights; onReload: () => void }) {
  const { format } = useUnits();
  const reorder = useShortlistStep(shortlist.id);
  const remove = useShortlistStep(shortlist.id);
  const listRef = useRef<HTMLOListElement>(null);
  const [editing, setEditing] = useState<number | null>(null);
  const [removing, setRemoving] = useState<ShortlistItemDto | null>(null);
  // When a note editor closes, the keyboard focus goes back to that item's "Edit note".
  const lastEdited = useRef<number | null>(null);
  useEffect(() => {
    if (editing !== null || lastEdited.current === null) return;
    listRef.current?.querySelector<HTMLButtonElement>(`[data-edit-note="${lastEdited.current}"]`)?.focus();
    lastEdited.current = null;
  }, [editing]);
  // After a move, keep the keyboard focus on the moved item's button.
  const focusAfterMove = useRef<{ itemId: number; dir: 'up' | 'down' } | null>(null);

  useEffect(() => {
    const want = focusAfterMove.current;
    if (!want || reorder.isPending) return;
    focusAfterMove.current = null;
    const root = listRef.current;
    const same = root?.querySelector<HTMLButtonElement>(`[data-move="${want.itemId}-${want.dir}"]`);
    const other = root?.querySelector<HTMLButtonElement>(`[data-move="${want.itemId}-${want.dir === 'up' ? 'down' : 'up'}"]`);
    (same && !same.disabled ? same : other)?.focus();
  }, [shortlist.items, reorder.isPending]);

  const move = (index: number, delta: -1 | 1) => {
    const ids = moveItem(
      shortlist.items.map((i) => i.id),
      index,
      delta,
    );
    focusAfterMove.current = { itemId: shortlist.items[index].id, dir: delta < 0 ? 'up' : 'down' };
    reorder.mutate({ step: 'reorder', lockVersion: shortlist.lockVersion, itemIds: ids });
  };

  if (!shortlist.items.length) {
    return (
      <EmptyState title="No candidates on this shortlist">
        {rights.canEdit ? (
          <>
            Open its load case in Evaluate and use “+ Shortlist” on a candidate from the ranked table.
            <div className="mt-3">
              <LinkButton to={`/evaluate?loadCase=${shortlist.loadCase.id}`}>Open the load case in Evaluate</LinkButton>
            </div>
          </>
        ) : (
          'Its author has not added any candidates yet.'
        )}
      </EmptyState>
    );
  }

  return (
    <>
      {reorder.isError ? (
        <div role="alert" className="mb-3 rounded-plate border border-verdict-fail/40 bg-white px-3 py-2 text-sm text-verdict-fail">
          {errorText(reorder.error)}{' '}
          {isStale(reorder.error) ? (
            <button type="button" className="font-bold text-sounding underline" onClick={onReload}>
              Reload the shortlist
            </button>
          ) : null}
        </div>
      ) : null}
      <ol ref={listRef} className="flex flex-col divide-y divide-chart-line/60" aria-label="Candidates in order">
        {shortlist.items.map((item, index) => (
          <li key={item.id} className="flex gap-3 py-3" data-testid="shortlist-item">
            <span className="w-6 shrink-0 pt-0.5 text-right font-bold text-ink-faint">{index + 1}</span>
            <div className="min-w-0 flex-1">
              <div className="flex flex-wrap items-start justify-between gap-2">
                <div>
                  <SetName set={item.propertySet} />
                  <span className="mt-0.5 block text-xs text-ink-faint">
                    Property set #{item.propertySet.id}, version {item.propertySet.version}
                    {item.result ? ` · safety factor ${item.result.safetyFactor.toFixed(2)} · needs ${item.result.requiredThickness === null ? 'more than any thickness' : format('length', item.result.requiredThickness)}` : ''}
                  </span>
                </div>
                {rights.canEdit ? (
                  <div className="no-print flex items-center gap-1">
                    <Button
                      tone="quiet"
                      className="!px-2 !py-0.5 text-xs"
                      data-move={`${item.id}-up`}
                      aria-label={`Move ${item.propertySet.material.name} up`}
                      disabled={index === 0 || reorder.isPending}
                      onClick={() => move(index, -1)}
                    >
                      ↑ Up
                    </Button>
                    <Button
                      tone="quiet"
                      className="!px-2 !py-0.5 text-xs"
                      data-move={`${item.id}-down`}
                      aria-label={`Move ${item.propertySet.material.name} down`}
                      disabled={index === shortlist.items.length - 1 || reorder.isPending}
                      onClick={() => move(index, 1)}
                    >
                      ↓ Down
                    </Button>
                    <Button
                      tone="quiet"
                      className="!px-2 !py-0.5 text-xs"
                      aria-label={`Remove ${item.propertySet.material.name} from the shortlist`}
                      onClick={() => {
                        remove.reset();
                        setRemoving(item);
                      }}
                    >
                      Remove
                    </Button>
                  </div>
                ) : null}
              </div>
              {item.newerVersionId ? (
                <p className="mt-1 text-xs" data-testid="newer-data">
                  <Tag tone="brass">newer data</Tag> The catalogue has a newer published version of this set.{' '}
                  <Link to={`/sets/${item.newerVersionId}`} className="font-bold text-sounding underline">
                    See it
                  </Link>
                </p>
              ) : null}
              <div className="mt-2">
                {editing === item.id ? (
                  <NoteEditor
                    item={item}
                    shortlistId={shortlist.id}
                    onDone={() => {
                      lastEdited.current = item.id;
                      setEditing(null);
                    }}
                  />
                ) : (
                  <div className="flex items-start gap-2">
                    <p className={`whitespace-pre-line text-sm ${item.note ? '' : 'italic text-ink-faint'}`} data-testid="item-note">
                      {item.note || 'No note yet.'}
                    </p>
                    {rights.canEdit ? (
                      <button
                        type="button"
                        className="no-print shrink-0 text-xs font-bold text-sounding underline"
                        data-edit-note={item.id}
                        aria-label={`Edit the note on ${item.propertySet.material.name}`}
                        onClick={() => setEditing(item.id)}
                      >
                        Edit note
                      </button>
                    ) : null}
                  </div>
                )}
              </div>
            </div>
          </li>
        ))}
      </ol>
      <ConfirmDialog
        open={removing !== null}
        title="Remove this candidate from the shortlist?"
        confirmLabel="Remove"
        tone="danger"
        busy={remove.isPending}
        busyLabel="Removing…"
        error={remove.isError ? errorText(remove.error) : undefined}
        onClose={() => setRemoving(null)}
        onConfirm={() => removing && remove.mutate({ step: 'remove', itemId: removing.id }, { onSuccess: () => setRemoving(null) })}
      >
        <p>
          <strong>{removing?.propertySet.material.name}</strong> ({removing?.propertySet.condition}) and its note leave the shortlist. You can add it again from Evaluate.
        </p>
      </ConfirmDialog>
    </>
  );
}

function Decision({ shortlist, rights, onReload }: { shortlist: ShortlistDto; rights: ShortlistRights; onReload: () => void }) {
  const step = useShortlistStep(shortlist.id);
  const [dialog, setDialog] = useState<'submit' | 'check' | 'return' | null>(null);
  const [comment, setComment] = useState('');
  const [commentError, setCommentError] = useState<string>();
  const open = (which: 'submit' | 'check' | 'return') => {
    step.reset();
    setComment('');
    setCommentError(undefined);
    setDialog(which);
  };
  const close = () => setDialog(null);

  const confirm = () => {
    if (dialog === 'submit') return step.mutate({ step: 'submit', lockVersion: shortlist.lockVersion }, { onSuccess: close });
    if (dialog === 'check') return step.mutate({ step: 'check', lockVersion: shortlist.lockVersion, comment: comment.trim() || undefined }, { onSuccess: close });
    if (dialog === 'return') {
      const parsed = shortlistReturnSchema.shape.comment.safeParse(comment);
      if (!parsed.success) return setCommentError(parsed.error.issues[0]?.message);
      setCommentError(undefined);
      step.mutate({ step: 'return', lockVersion: shortlist.lockVersion, comment: parsed.data }, { onSuccess: close });
    }
  };

  const stepError = step.isError ? (
    <>
      {errorText(step.error)}
      {isStale(step.error) ? (
        <button
          type="button"
          className="ml-1 font-bold text-sounding underline"
          onClick={() => {
            close();
            onReload();
          }}
        >
          Reload the shortlist
        </button>
      ) : null}
    </>
  ) : undefined;

  const { status } = shortlist;
  const submittable = status === 'open' || status === 'returned';
  let body: React.ReactNode = null;
  if (rights.canEdit && submittable) {
    body = (
      <div className="flex flex-wrap items-center gap-3">
        <Button onClick={() => open('submit')} disabled={!rights.canSubmit}>
          Submit for checking…
        </Button>
        <p className="text-sm text-ink-soft">
          {rights.canSubmit ? 'A second engineer, a checker in this project, then checks it or returns it with comments.' : 'Add at least one candidate before submitting.'}
        </p>
      </div>
    );
  } else if (status === 'submitted') {
    body =
      rights.decision === 'allowed' ? (
        <div className="flex flex-wrap items-center gap-3">
          <Button onClick={() => open('check')}>Check…</Button>
          <Button tone="quiet" onClick={() => open('return')}>
            Return with comments…
          </Button>
          <p className="text-sm text-ink-soft">Check each candidate's data and note against the load case before you decide.</p>
        </div>
      ) : (
        <p className="rounded-plate bg-sounding-light px-3 py-2 text-sm text-sounding-dark" data-testid="second-engineer">
          {rights.decision === 'own-work'
            ? 'You wrote this shortlist, so a second engineer must check it: a checker who is a member of this project.'
            : rights.decision === 'not-member'
              ? 'Only a checker who is a member of this project can check it.'
              : 'A checker who is a member of this project checks it.'}
        </p>
      );
  }
  if (!body) return null;

  return (
    <Panel title="Sign-off" className="no-print">
      {body}
      <ConfirmDialog
        open={dialog === 'submit'}
        title={`Submit “${shortlist.name}” for checking?`}
        confirmLabel="Submit for checking"
        busy={step.isPending}
        busyLabel="Submitting…"
        error={stepError}
        onClose={close}
        onConfirm={confirm}
      >
        <p>
          Its {shortlist.items.length} candidate{shortlist.items.length === 1 ? '' : 's'} and notes are locked while it waits. The project's checkers are told by e-mail.
        </p>
      </ConfirmDialog>
      <ConfirmDialog
        open={dialog === 'check'}
        title={`Check “${shortlist.name}”?`}
        confirmLabel="Check and freeze the record"
        busy={step.isPending}
        busyLabel="Checking…"
        error={stepError}
        onClose={close}
        onConfirm={confirm}
      >
        <p>
          Checking freezes a design record: the load case, each candidate's results, the property set versions and both names, as they are now. It cannot be changed
          afterwards.
        </p>
        <TextAreaField label="Comment (optional)" data-autofocus value={comment} maxLength={4000} onChange={(e) => setComment(e.target.value)} hint="Kept in the design record." />
      </ConfirmDialog>
      <ConfirmDialog
        open={dialog === 'return'}
        title={`Return “${shortlist.name}” to ${shortlist.author.name}?`}
        confirmLabel="Return with comments"
        busy={step.isPending}
        busyLabel="Returning…"
        error={stepError}
        onClose={close}
        onConfirm={confirm}
      >
        <TextAreaField
          label="What must change"
          data-autofocus
          value={comment}
          maxLength={4000}
          rows={4}
          error={commentError}
          onChange={(e) => setComment(e.target.value)}
          hint="The author reads this on the shortlist and by e-mail."
        />
      </ConfirmDialog>
    </Panel>
  );
}

export function ShortlistPage({ id, me }: { id: number; me: Viewer }) {
  const { format } = useUnits();
  const shortlist = useShortlist(id);
  const project = useProject(shortlist.data?.projectId ?? 0);

  if (shortlist.isPending) return <Spinner label="Loading the shortlist…" />;
  if (shortlist.isError) return <ErrorState error={shortlist.error} onRetry={() => void shortlist.refetch()} />;
  const s = shortlist.data;
  const rights = shortlistRights(s, me, project.data ? project.data.members.map((m) => m.id) : null);
  const reload = () => void shortlist.refetch();
  const newer = s.items.filter((i) => i.newerVersionId !== null);
  const canEvaluate = me.permissions.includes('evaluate');

  return (
    <div className="flex flex-col gap-4">
      <Breadcrumb
        trail={[
          { to: '/projects', label: 'Projects' },
          { to: `/projects/${s.projectId}`, label: project.data?.name ?? 'Project' },
          { label: s.name },
        ]}
      />
      <div>
        <h1 className="text-2xl font-bold">{s.name}</h1>
        <p className="text-sm text-ink-soft">
          Shortlist by {s.author.name} for the load case “{s.loadCase.name}” · {s.items.length} candidate{s.items.length === 1 ? '' : 's'}
        </p>
      </div>
      <StatusBanner shortlist={s} />
      {newer.length ? (
        <p className="rounded-plate border-l-4 border-brass bg-brass-light/60 px-4 py-2 text-sm" role="note">
          <strong>Newer data exists</strong> for {newer.length === 1 ? 'one candidate' : `${newer.length} candidates`}: the catalogue has published a newer version since
          it was shortlisted. The results here use the shortlisted versions.
        </p>
      ) : null}
      <Decision shortlist={s} rights={rights} onReload={reload} />

      <div className="grid gap-4 lg:grid-cols-[1fr_22rem]">
        <Panel title="Candidates in order">
          <Items shortlist={s} rights={rights} onReload={reload} />
        </Panel>
        <Panel
          title="Load case"
          actions={
            canEvaluate ? (
              <Link to={`/evaluate?loadCase=${s.loadCase.id}`} className="no-print text-xs font-bold text-sounding underline">
                Open in Evaluate
              </Link>
            ) : null
          }
        >
          <p className="mb-2 font-bold">{s.loadCase.name}</p>
          <LoadCaseFacts
            loadCase={s.loadCase.loadCase}
            extra={
              s.evaluation
                ? [
                    { label: 'Design pressure', value: format('pressure', s.evaluation.pressure) },
                    { label: 'Proof test', value: format('pressure', s.evaluation.proofTestPressure) },
                  ]
                : []
            }
          />
          {s.evaluation ? <p className="mt-2 text-xs text-ink-faint">{s.evaluation.pressureMethod}</p> : null}
          {s.loadCase.notes ? <p className="mt-2 whitespace-pre-line text-sm text-ink-soft">{s.loadCase.notes}</p> : null}
        </Panel>
      </div>

      {s.items.length ? (
        <Panel title="Side by side">
          <ComparisonTable items={s.items} />
        </Panel>
      ) : null}
    </div>
  );
}
