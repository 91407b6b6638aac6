import { useEffect, useMemo, useState, type ReactNode } from 'react';
import { Link, useLocation, useNavigate } from 'react-router-dom';
import type { LibrarySetDto, PendingReferenceVersionDto } from '@shared/schemas/library';
import type { SessionUserDto } from '@shared/schemas/auth';
import { TextField } from '@/components/ui/field';
import { EmptyState, ErrorState, Panel, Spinner, Tag } from '@/components/ui/states';
import { useLibrarySets, usePublishedSets } from '../api/library-sets';
import { useProposedVersions } from '../api/references';
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

function SetTable({ label, items, columns }: { label: string; items: LibrarySetDto[]; columns: { header: string; cell: (s: LibrarySetDto) => ReactNode }[] }) {
  return (
    <PlainTable label={label} columns={['Material and condition', ...columns.map((c) => c.header)]}>
      {items.map((s) => (
        <tr key={s.id} className="border-t border-chart-line/60 align-top">
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
    <div className="overflow-x-auto">
      <table className="w-full text-sm" aria-label={label}>
        <thead className="text-left text-xs uppercase tracking-wide text-ink-soft">
          <tr>
            <th scope="col" className="py-1 pr-3">Reference</th>
            <th scope="col" className="py-1 pr-3">Changes</th>
            <th scope="col" className="py-1 pr-3">Proposed by</th>
            <th scope="col" className="py-1 pr-3">Status</th>
          </tr>
        </thead>
        <tbody>
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
        </tbody>
      </table>
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
                  <SetTable
                    label="Your drafts"
                    items={drafts}
                    columns={[
                      { header: 'Version', cell: (s) => s.version },
                      { header: 'Last saved', cell: (s) => formatDateTime(s.updatedAt) },
                      { header: 'Source', cell: (s) => (s.reference ? <span className="text-xs">{s.reference.title}</span> : <Tag tone="fail">none yet</Tag>) },
                    ]}
                  />
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
