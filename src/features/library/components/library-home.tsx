import { useEffect, useMemo, useState, type ReactNode } from 'react';
import { Link, useLocation, useNavigate } from 'react-router-dom';
import type { LibrarySetDto, PendingReferenceVersionDto } from '@shared/schemas/library';
import type { SessionUserDto } from '@shared/schemas/auth';
import { TextField } from '@/components/ui/field';
import { EmptyState, ErrorState, Panel, Spinner, Tag } from '@/components/ui/states';
import { useBulkSubmit, useLibrarySets, usePublishedSets } from '../api/library-sets';
import { useProposedVersions } from '../api/references';
import { ConfirmationQueue } from './confirmation-queue';
import { Button } from '@/components/ui/button';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { STATUS_LABELS, STATUS_TONE, formatDateTime } from '../labels';
import { isOwnWork } from './review-panel';
import { LinkButton } from '@/components/ui/link-button';
import { PlainTable } from '@/components/ui/column-heads';
import { Notice } from '@/components/ui/form-error';

const setLink = (s: { id: number; material: { name: string }; condition: string }) => (
  <Link to={`/library/sets/${s.id}`} className="font-bold text-sounding hover:underline">
    {s.material.name}
    <span className="block text-xs font-normal text-ink-soft">{s.condition}</span>
  </Link>
);

function SetTable({
  label,
  items,
  columns,
  selection,
}: {
  label: string;
  items: LibrarySetDto[];
  columns: { header: string; cell: (s: LibrarySetDto) => ReactNode }[];
  /** Tick boxes for choosing rows (bulk submit). */
  selection?: { selected: ReadonlySet<number>; toggle: (id: number) => void; toggleAll: () => void };
}) {
  const tickAll = selection ? (
    <input type="checkbox" aria-label="Choose every draft" checked={items.length > 0 && items.every((s) => selection.selected.has(s.id))} onChange={selection.toggleAll} />
  ) : null;
  return (
    <PlainTable label={label} columns={[...(tickAll ? [{ label: tickAll, className: 'w-6 pr-2' }] : []), 'Material and condition', ...columns.map((c) => c.header)]}>
      {items.map((s) => (
        <tr key={s.id} className="border-t border-chart-line/60 align-top">
          {selection ? (
            <td className="py-1.5 pr-2">
              <input type="checkbox" aria-label={`Choose ${s.material.name} — ${s.condition}`} checked={selection.selected.has(s.id)} onChange={() => selection.toggle(s.id)} />
            </td>
          ) : null}
          <td className="py-1.5 pr-3">{setLink(s)}</td>
          {columns.map((c) => (
            <td key={c.header} className="py-1.5 pr-3">
              {c.cell(s)}
            </td>
          ))}
        </tr>
      ))}
    </PlainTable>
  );
}

const ownChange = (v: PendingReferenceVersionDto, me: SessionUserDto) => v.draftedBy?.id === me.id || v.lastEditedBy?.id === me.id;

/** Proposed changes to references in use: the version, what it changes, and who proposed it. */
function ReferenceChangeTable({ label, items }: { label: string; items: PendingReferenceVersionDto[] }) {
  return (
    <PlainTable label={label} columns={['Reference', 'Changes', 'Proposed by', 'Status']}>
      {items.map((v) => (
        <tr key={v.id} className="border-t border-chart-line/60 align-top">
          <td className="py-1.5 pr-3">
            <Link to={`/library/references/${v.referenceId}`} className="font-bold text-sounding hover:underline">
              {v.current.title}
            </Link>
            <span className="block text-xs text-ink-soft">
              version {v.current.version} → {v.version}
            </span>
          </td>
          <td className="py-1.5 pr-3 text-xs">{v.changes.map((c) => c.field).join(', ') || '—'}</td>
          <td className="py-1.5 pr-3">
            {v.lastEditedBy?.name ?? v.draftedBy?.name ?? '—'}
            {v.submittedAt ? <span className="block text-xs text-ink-soft">{formatDateTime(v.submittedAt)}</span> : null}
          </td>
          <td className="py-1.5 pr-3">
            <Tag tone={STATUS_TONE[v.status]}>{STATUS_LABELS[v.status]}</Tag>
            {v.returnedComment && v.status === 'draft' ? <span className="block text-xs text-ink-soft">returned</span> : null}
          </td>
        </tr>
      ))}
    </PlainTable>
  );
}

/** Submit the chosen drafts for review at once (after a CSV import there may be dozens). */
function BulkSubmitBar({ drafts, selected, onDone }: { drafts: LibrarySetDto[]; selected: ReadonlySet<number>; onDone: () => void }) {
  const bulk = useBulkSubmit();
  const [confirming, setConfirming] = useState(false);
  const chosen = drafts.filter((d) => selected.has(d.id));
  const result = bulk.data;
  return (
    <div className="mb-3 flex flex-col gap-2">
      <div className="flex flex-wrap items-center gap-3">
        <Button disabled={chosen.length === 0 || bulk.isPending} onClick={() => setConfirming(true)}>
          {chosen.length ? `Submit ${chosen.length} for review…` : 'Submit for review…'}
        </Button>
        <span className="text-xs text-ink-soft">Tick drafts to submit several at once; another librarian reviews each.</span>
      </div>
      {result ? (
        <div role="status" className="text-sm" data-testid="bulk-submit-result">
          {result.submitted.length} submitted for review.
          {result.failed.length ? (
            <ul className="mt-1 list-disc pl-5 text-verdict-fail">
              {result.failed.map((f) => (
                <li key={f.id}>
                  {f.title}: {f.message}
                </li>
              ))}
            </ul>
          ) : null}
        </div>
      ) : null}
      <ConfirmDialog
        open={confirming}
        title={`Submit ${chosen.length} draft${chosen.length === 1 ? '' : 's'} for review?`}
        confirmLabel="Submit for review"
        busy={bulk.isPending}
        busyLabel="Submitting…"
        onConfirm={() =>
          bulk.mutate(chosen, {
            onSuccess: () => {
              setConfirming(false);
              onDone();
            },
          })
        }
        onClose={() => setConfirming(false)}
      >
        <p>Each goes to the review queue as it is now; you cannot edit it while it waits. Drafts the server refuses stay on your desk with the reason.</p>
        <ul className="mt-2 max-h-48 list-disc overflow-y-auto pl-5 text-sm">
          {chosen.map((d) => (
            <li key={d.id}>
              {d.material.name} — {d.condition}
            </li>
          ))}
        </ul>
      </ConfirmDialog>
    </div>
  );
}

function PublishedSearch() {
  const [q, setQ] = useState('');
  const term = q.trim().toLowerCase();
  const published = usePublishedSets(term.length >= 2);
  const matches = useMemo(
    () =>
      term.length < 2
        ? []
        : (published.data?.items ?? [])
            .filter((s) => [s.material.name, s.condition, s.reference?.title ?? '', s.reference?.identifier ?? ''].some((t) => t.toLowerCase().includes(term)))
            .slice(0, 8),
    [published.data, term],
  );
  return (
    <Panel title="Revise a published set">
      <div className="flex flex-col gap-3">
        <TextField label="Find a published set" type="search" value={q} onChange={(e) => setQ(e.target.value)} hint="Type two letters or more of the material, condition or source" />
        {term.length < 2 ? null : published.isPending ? (
          <Spinner label="Searching…" />
        ) : published.isError ? (
          <ErrorState error={published.error} onRetry={() => void published.refetch()} />
        ) : matches.length === 0 ? (
          <p className="text-sm text-ink-soft">No published set matches “{q.trim()}”.</p>
        ) : (
          <ul className="flex flex-col gap-1" aria-label="Published sets found">
            {matches.map((s) => (
              <li key={s.id} className="flex items-baseline justify-between gap-3 text-sm">
                {setLink(s)}
                <span className="shrink-0 text-xs text-ink-soft">version {s.version}</span>
              </li>
            ))}
          </ul>
        )}
      </div>
    </Panel>
  );
}

/** The library desk: what the caller is drafting, what came back, and what waits for their review. */
export function LibraryHome({ me }: { me: SessionUserDto | null | undefined }) {
  const [selected, setSelected] = useState<ReadonlySet<number>>(new Set());
  const location = useLocation();
  const navigate = useNavigate();
  // The notice is for this arrival only; a reload should not show it again.
  const [notice] = useState(() => (location.state as { notice?: string } | null)?.notice);
  useEffect(() => {
    if ((location.state as { notice?: string } | null)?.notice) navigate(location.pathname, { replace: true, state: null });
  }, [location, navigate]);
  const mine = useLibrarySets({ mine: true });
  const queue = useLibrarySets({ status: 'in-review' });

  const own = mine.data?.items ?? [];
  const returned = own.filter((s) => s.status === 'draft' && s.returnedComment);
  const drafts = own.filter((s) => s.status === 'draft' && !s.returnedComment);
  const waiting = own.filter((s) => s.status === 'in-review');
  const toReview = me ? (queue.data?.items ?? []).filter((s) => !isOwnWork(s, me)) : [];
  const changes = useProposedVersions();
  const changesToReview = me ? (changes.data?.items ?? []).filter((v) => v.status === 'in-review' && !ownChange(v, me)) : [];
  const ownChanges = me ? (changes.data?.items ?? []).filter((v) => ownChange(v, me)) : [];

  return (
    <div className="flex flex-col gap-5">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 className="text-2xl font-bold">Library desk</h1>
          <p className="text-sm text-ink-soft">Draft, check and publish cited property sets. Nothing reaches the catalogue without a second librarian’s approval.</p>
        </div>
        <nav aria-label="Library desk" className="flex flex-wrap gap-2">
          <LinkButton to="/library/sets/new">New property set</LinkButton>
          <LinkButton to="/library/import" tone="quiet">
            Import CSV
          </LinkButton>
          <LinkButton to="/library/references" tone="quiet">
            References
          </LinkButton>
          <LinkButton to="/library/rating-tables" tone="quiet">
            Rating tables
          </LinkButton>
        </nav>
      </div>

      <Notice message={notice} boxed />

      <div className="grid gap-5 xl:grid-cols-2">
        <div className="flex flex-col gap-5">
          {mine.isPending ? (
            <Spinner label="Loading your drafts…" />
          ) : mine.isError ? (
            <ErrorState error={mine.error} onRetry={() => void mine.refetch()} />
          ) : (
            <>
              {returned.length ? (
                <Panel title={`Returned to you (${returned.length})`}>
                  <SetTable
                    label="Returned to you"
                    items={returned}
                    columns={[
                      { header: 'Reviewer’s comment', cell: (s) => <p className="whitespace-pre-line">{s.returnedComment}</p> },
                      { header: 'Version', cell: (s) => s.version },
                    ]}
                  />
                </Panel>
              ) : null}
              <Panel title={`Your drafts (${drafts.length})`}>
                {drafts.length ? (
                  <>
                  <BulkSubmitBar drafts={drafts} selected={selected} onDone={() => setSelected(new Set())} />
                  <SetTable
                    label="Your drafts"
                    items={drafts}
                    selection={{
                      selected,
                      toggle: (id) =>
                        setSelected((prev) => {
                          const next = new Set(prev);
                          if (next.has(id)) next.delete(id);
                          else next.add(id);
                          return next;
                        }),
                      toggleAll: () => setSelected((prev) => (drafts.every((d) => prev.has(d.id)) ? new Set() : new Set(drafts.map((d) => d.id)))),
                    }}
                    columns={[
                      { header: 'Version', cell: (s) => s.version },
                      { header: 'Last saved', cell: (s) => formatDateTime(s.updatedAt) },
                      { header: 'Source', cell: (s) => (s.reference ? <span className="text-xs">{s.reference.title}</span> : <Tag tone="fail">none yet</Tag>) },
                    ]}
                  />
                  </>
                ) : (
                  <EmptyState
                    title="No drafts on your desk"
                    action={
                      <div className="flex justify-center gap-2">
                        <LinkButton to="/library/sets/new">New property set</LinkButton>
                        <LinkButton to="/library/import" tone="quiet">
                          Import CSV
                        </LinkButton>
                      </div>
                    }
                  >
                    Start a new property set from its source, import many at once from a CSV file, or revise a published set below.
                  </EmptyState>
                )}
              </Panel>
              {waiting.length ? (
                <Panel title={`Yours, waiting for review (${waiting.length})`}>
                  <SetTable
                    label="Yours, waiting for review"
                    items={waiting}
                    columns={[
                      { header: 'Submitted', cell: (s) => formatDateTime(s.submittedAt) },
                      { header: 'Status', cell: (s) => <Tag tone={STATUS_TONE[s.status]}>{STATUS_LABELS[s.status]}</Tag> },
                    ]}
                  />
                  <p className="mt-2 text-xs text-ink-soft">Another librarian must approve these; you are told by e-mail when they are approved or returned.</p>
                </Panel>
              ) : null}
            </>
          )}
        </div>

        <div className="flex flex-col gap-5">
          <Panel title={`Review queue (${toReview.length + changesToReview.length})`}>
            {queue.isPending || changes.isPending ? (
              <Spinner label="Loading the review queue…" />
            ) : queue.isError ? (
              <ErrorState error={queue.error} onRetry={() => void queue.refetch()} />
            ) : changes.isError ? (
              <ErrorState error={changes.error} onRetry={() => void changes.refetch()} />
            ) : toReview.length || changesToReview.length ? (
              <div className="flex flex-col gap-4">
                {toReview.length ? (
                  <SetTable
                    label="Review queue"
                    items={toReview}
                    columns={[
                      { header: 'Submitted by', cell: (s) => s.lastEditedBy?.name ?? s.draftedBy?.name ?? '—' },
                      { header: 'When', cell: (s) => formatDateTime(s.submittedAt) },
                      { header: 'Version', cell: (s) => s.version },
                    ]}
                  />
                ) : null}
                {changesToReview.length ? (
                  <div className="flex flex-col gap-1">
                    <h3 className="text-xs font-bold uppercase tracking-wide text-ink-soft">Reference changes</h3>
                    <ReferenceChangeTable label="Reference changes to review" items={changesToReview} />
                  </div>
                ) : null}
              </div>
            ) : (
              <EmptyState title="Nothing waits for your review">
                When another librarian submits a set or a change to a reference in use, it appears here and you get an e-mail. Your own submissions go to
                someone else.
              </EmptyState>
            )}
          </Panel>
          <ConfirmationQueue me={me} />
          {ownChanges.length ? (
            <Panel title={`Your reference changes (${ownChanges.length})`}>
              <ReferenceChangeTable label="Your reference changes" items={ownChanges} />
              <p className="mt-2 text-xs text-ink-soft">A change to a reference in use is published when another librarian approves it.</p>
            </Panel>
          ) : null}
          <PublishedSearch />
        </div>
      </div>
    </div>
  );
}
