import { useEffect, useRef, useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Link } from 'react-router-dom';
import { shortlistItemUpdateSchema, type ShortlistDto, type ShortlistItemDto } from '@shared/schemas/projects';
import { Button, SubmitButton } from '@/components/ui/button';
import { ConfirmDialog, mutationState } from '@/components/ui/confirm-dialog';
import { LinkButton } from '@/components/ui/link-button';
import { EmptyState, Panel, QueryStatus, Tag } from '@/components/ui/states';
import { TextAreaField } from '@/components/ui/text-area';
import { ApiError, isStale, errorText } from '@/lib/api-client';
import { setServerErrors } from '@/lib/field-errors';
import { StaleBanner } from '@/components/stale-banner';
import { FormError } from '@/components/ui/form-error';
import { useUnits } from '@/lib/unit-system';
import { useProject } from '../api/projects';
import { useShortlist, useShortlistStep } from '../api/shortlists';
import { moveItem, shortlistRights, type ShortlistRights, type Viewer } from '../shortlist-model';
import { LoadCaseFacts, SetName } from './bits';
import { ComparisonTable } from './comparison-table';
import { SignOff, StatusBanner } from './sign-off';
import { Rounds } from './rounds';
import { formatDateTime } from '@/lib/dates';
import { Breadcrumb } from '@/components/ui/breadcrumb';

/** A reorder refused because the shortlist moved on (stale) or is no longer open. */
const isOutdated = (err: unknown) => err instanceof ApiError && err.status === 409 && (err.code === 'stale' || err.code === 'wrong_status');

/** The note alone, checked by the shared schema of PATCH …/items/:itemId (the lock version goes beside it). */
const noteFormSchema = shortlistItemUpdateSchema.pick({ note: true });
const NOTE_LABELS = { note: 'Note' };

function NoteEditor({ item, shortlistId, onDone, onReload }: { item: ShortlistItemDto; shortlistId: number; onDone: () => void; onReload: () => Promise<ShortlistDto | undefined> }) {
  const step = useShortlistStep(shortlistId);
  const form = useForm({ resolver: zodResolver(noteFormSchema), defaultValues: { note: item.note } });
  const { errors, isSubmitting } = form.formState;
  // The version this note was read at; it moves on only when the saved note is loaded again.
  const readVersion = useRef(item.lockVersion);
  const [stale, setStale] = useState<ApiError | null>(null);

  const save = form.handleSubmit(async ({ note }) => {
    setStale(null);
    try {
      await step.mutateAsync({ step: 'note', itemId: item.id, note, lockVersion: readVersion.current });
      onDone();
    } catch (err) {
      if (isStale(err)) setStale(err);
      else setServerErrors(form.setError, err, NOTE_LABELS);
    }
  });

  const reload = async () => {
    const fresh = (await onReload())?.items.find((i) => i.id === item.id);
    if (!fresh) return onDone();
    form.reset({ note: fresh.note });
    readVersion.current = fresh.lockVersion;
    setStale(null);
  };

  return (
    <form
      className="flex flex-col gap-2"
      noValidate
      aria-label={`Note on ${item.propertySet.material.name}`}
      onSubmit={(e) => void save(e)}
      onKeyDown={(e) => {
        if (e.key === 'Escape') onDone();
      }}
    >
      {stale ? <StaleBanner testId="note-stale" message={stale.message} onReload={() => void reload()} reloadLabel="Load the saved note (discards your edit)" /> : null}
      <TextAreaField
        label={
          <>
            Note<span className="sr-only"> on {item.propertySet.material.name}</span>
          </>
        }
        autoFocus
        maxLength={2000}
        error={errors.note?.message}
        hint="Why it is on the list, and what to confirm with the supplier."
        {...form.register('note')}
      />
      <FormError message={errors.root?.message} />
      <div className="flex gap-2">
        <SubmitButton busy={isSubmitting} busyLabel="Saving…" className="!py-1 text-xs">
          Save note
        </SubmitButton>
        <Button tone="quiet" onClick={onDone} className="!py-1 text-xs">
          Cancel
        </Button>
      </div>
    </form>
  );
}

function Items({ shortlist, rights, onReload, readAgain }: { shortlist: ShortlistDto; rights: ShortlistRights; onReload: () => void; readAgain: () => Promise<ShortlistDto | undefined> }) {
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
          {isOutdated(reorder.error) ? (
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
                    onReload={readAgain}
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
        {...mutationState(remove)}
        busyLabel="Removing…"
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

export function ShortlistPage({ id, me }: { id: number; me: Viewer }) {
  const { format } = useUnits();
  const shortlist = useShortlist(id);
  const project = useProject(shortlist.data?.projectId ?? 0);

  if (shortlist.isPending || shortlist.isError) return <QueryStatus query={shortlist} loading="Loading the shortlist…" />;
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
      {s.frozenInputs ? (
        <p className="rounded-plate border border-chart-line bg-white px-4 py-2 text-sm" role="note" data-testid="frozen-inputs">
          The load case, candidates and results below are those submitted on {formatDateTime(s.submittedAt)}: the check reviews and freezes exactly these. Later
          edits to the load case apply to a new submission.
        </p>
      ) : null}
      {newer.length ? (
        <p className="rounded-plate border-l-4 border-brass bg-brass-light/60 px-4 py-2 text-sm" role="note">
          <strong>Newer data exists</strong> for {newer.length === 1 ? 'one candidate' : `${newer.length} candidates`}: the catalogue has published a newer version since
          it was shortlisted. The results here use the shortlisted versions.
        </p>
      ) : null}
      <SignOff shortlist={s} rights={rights} viewer={me} memberIds={project.data ? project.data.members.map((m) => m.id) : null} onReload={reload} />

      <div className="grid gap-4 lg:grid-cols-[1fr_22rem]">
        <Panel title="Candidates in order">
          <Items shortlist={s} rights={rights} onReload={reload} readAgain={async () => (await shortlist.refetch()).data} />
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

      {s.rounds.length ? (
        <Panel title="Rounds of checking">
          <Rounds rounds={s.rounds} />
        </Panel>
      ) : null}

      {s.items.length ? (
        <Panel title="Side by side">
          <ComparisonTable items={s.items} />
        </Panel>
      ) : null}
    </div>
  );
}
