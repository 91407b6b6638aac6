import { useState } from 'react';
import { useParams } from 'react-router-dom';
import type { ReferencePageDto, ReferenceVersionDto } from '@shared/schemas/library';
import type { SessionUserDto } from '@shared/schemas/auth';
import { can } from '@shared/roles';
import { ErrorState, Panel, Spinner, Tag } from '@/components/ui/states';
import { useReference } from '../api/references';
import { REFERENCE_KIND_LABELS, STATUS_LABELS, STATUS_TONE, formatDate } from '../labels';
import { ReferenceDocuments } from './reference-documents';
import { ReferenceEditor } from './reference-editor';
import { CitationChanges, ProposedChange } from './reference-review';
import { Notice } from '@/components/ui/form-error';
import { Breadcrumb } from '@/components/ui/breadcrumb';

const citationLine = (c: ReferenceVersionDto['citation']) => [c.authors, c.year].filter(Boolean).join(', ') + (c.location ? ` — ${c.location}` : '');

/** Every version of the citation, newest first, with what each changed. */
function VersionHistory({ reference }: { reference: ReferencePageDto }) {
  const settled = reference.versions.filter((v) => v.status === 'published' || v.status === 'retired');
  if (!settled.length) {
    return <p className="text-sm text-ink-soft">No version is frozen yet: nothing published cites this reference, so it is edited in place.</p>;
  }
  return (
    <ol className="flex flex-col gap-3" aria-label="Versions of the citation" data-testid="reference-versions">
      {settled.map((v) => (
        <li key={v.id} className="border-t border-chart-line/60 pt-2 text-sm first:border-t-0 first:pt-0">
          <p className="flex flex-wrap items-center gap-2">
            <strong>Version {v.version}</strong>
            <Tag tone={STATUS_TONE[v.status]}>{v.status === 'retired' ? 'superseded' : STATUS_LABELS[v.status]}</Tag>
            <span className="text-xs text-ink-soft">
              {v.publishedAt ? `published ${formatDate(v.publishedAt)}` : ''}
              {v.approvedBy ? `, approved by ${v.approvedBy.name}` : ''}
            </span>
          </p>
          <p className="font-bold">{v.citation.title}</p>
          <p className="text-ink-soft">{citationLine(v.citation)}</p>
          {v.changes.length ? (
            <details className="mt-1">
              <summary className="cursor-pointer text-xs text-sounding underline">What version {v.version} changed</summary>
              <CitationChanges version={v} label={`Changes in version ${v.version}`} />
            </details>
          ) : null}
        </li>
      ))}
    </ol>
  );
}

/**
 * One reference: its citation as published, its versions and documents; for librarians the
 * editor (in place, or proposing a new version when it is in use) and the review of a proposed change.
 */
export function ReferencePage({ me }: { me: SessionUserDto | null | undefined }) {
  const id = Number(useParams().id);
  const query = useReference(id);
  const [notice, setNotice] = useState<string | null>(null);
  const canDraft = !!me && can(me.role, 'catalogue:draft');

  const crumbs = (
    <Breadcrumb
      trail={[...(canDraft ? [{ to: '/library', label: 'Library desk' }] : []), { to: '/library/references', label: 'References' }, { label: query.data?.title ?? 'Reference' }]}
    />
  );
  if (query.isPending) return <div className="flex flex-col gap-4">{crumbs}<Spinner label="Loading the reference…" /></div>;
  if (query.isError) return <div className="flex flex-col gap-4">{crumbs}<ErrorState error={query.error} onRetry={() => void query.refetch()} /></div>;
  const r = query.data;
  const reload = () => void query.refetch();

  return (
    <div className="flex flex-col gap-4">
      {crumbs}
      <div>
        <h1 className="text-2xl font-bold">{r.title}</h1>
        <p className="mt-1 flex flex-wrap items-center gap-2 text-sm">
          <Tag tone="brass">{REFERENCE_KIND_LABELS[r.kind]}</Tag>
          {r.identifier ? <span className="font-mono text-xs">{r.identifier}</span> : null}
          <span data-testid="reference-version">version {r.version}</span>
          {r.inUse ? <Tag tone="pass">in use: changes are reviewed</Tag> : <Tag tone="neutral">cited by drafts at most: edited in place</Tag>}
          <span className="text-ink-soft">
            cited by {r.usedBy} set{r.usedBy === 1 ? '' : 's'} or table{r.usedBy === 1 ? '' : 's'}
          </span>
        </p>
      </div>
      <Notice message={notice} boxed />

      <div className={`grid gap-4 ${canDraft ? 'lg:grid-cols-[1fr_26rem]' : ''}`}>
        <div className="flex min-w-0 flex-col gap-4">
          <Panel title="Citation as published">
            <div className="text-sm" data-testid="published-citation">
              <p className="font-bold">{r.title}</p>
              <p className="text-ink-soft">{citationLine(r)}</p>
              {r.note ? <p className="mt-1 whitespace-pre-line text-xs text-ink-soft">{r.note}</p> : null}
            </div>
          </Panel>
          {canDraft && me && r.pending ? (
            <Panel title="Proposed change">
              <ProposedChange reference={r} me={me} onReload={reload} onNotice={setNotice} />
            </Panel>
          ) : null}
          <Panel title="Versions">
            <VersionHistory reference={r} />
          </Panel>
          <Panel title="Documents">
            <ReferenceDocuments reference={r} canDraft={canDraft} />
          </Panel>
        </div>
        {canDraft ? (
          <div className="lg:sticky lg:top-4 lg:self-start">
            <Panel title={r.inUse ? 'Change the citation' : 'Edit'}>
              {/* A newly published version starts the form again from its content and lock version. */}
              <ReferenceEditor key={`${r.id}:${r.version}`} reference={r} onReload={reload} />
            </Panel>
          </div>
        ) : null}
      </div>
    </div>
  );
}
