import { useEffect, useMemo, useState } from 'react';
import { Link } from 'react-router-dom';
import { createColumnHelper } from '@tanstack/react-table';
import type { ReferenceDetailDto } from '@shared/schemas/library';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { TableView, useSortableTable } from '@/components/ui/table-view';
import { EmptyState, ErrorState, Panel, QueryStatus, Spinner, Tag } from '@/components/ui/states';
import { documentUrl, useReference, useReferences } from '../api/references';
import { REFERENCE_KIND_LABELS, formatBytes } from '../labels';
import { ReferenceDocuments } from './reference-documents';
import { ReferenceEditor } from './reference-editor';
import { Breadcrumb } from '@/components/ui/breadcrumb';

function useDebounced<T>(value: T, ms: number): T {
  const [v, setV] = useState(value);
  useEffect(() => {
    const t = setTimeout(() => setV(value), ms);
    return () => clearTimeout(t);
  }, [value, ms]);
  return v;
}

const col = createColumnHelper<ReferenceDetailDto>();

function ReferencesTable({ items, canDraft, onEdit }: { items: ReferenceDetailDto[]; canDraft: boolean; onEdit: (id: number) => void }) {
  const columns = useMemo(
    () => [
      col.accessor('title', {
        header: 'Title',
        cell: (c) => (
          <div>
            <Link to={`/library/references/${c.row.original.id}`} className="font-bold text-sounding hover:underline">
              {c.getValue()}
            </Link>
            {c.row.original.authors ? <span className="block text-xs text-ink-soft">{c.row.original.authors}</span> : null}
          </div>
        ),
      }),
      col.accessor((r) => REFERENCE_KIND_LABELS[r.kind], { id: 'kind', header: 'Kind' }),
      col.accessor((r) => r.identifier ?? '', { id: 'identifier', header: 'Identifier', cell: (c) => <span className="font-mono text-xs">{c.getValue() || '—'}</span> }),
      col.accessor((r) => r.year ?? 0, { id: 'year', header: 'Year', cell: (c) => c.row.original.year ?? '—', meta: { numeric: true } }),
      col.accessor('usedBy', { header: 'Used by', cell: (c) => `${c.getValue()} set${c.getValue() === 1 ? '' : 's'}`, meta: { numeric: true } }),
      col.accessor((r) => r.version, {
        id: 'version',
        header: 'Version',
        cell: (c) => (
          <span>
            {c.getValue()}
            <span className="block text-xs text-ink-soft">{c.row.original.inUse ? 'in use' : 'drafts only'}</span>
          </span>
        ),
        meta: { numeric: true },
      }),
      col.accessor((r) => (r.document ? 1 : 0), {
        id: 'document',
        header: 'Document',
        cell: (c) => {
          const doc = c.row.original.document;
          return doc ? (
            <a href={documentUrl(c.row.original.id)} className="text-sounding underline" aria-label={`Download the PDF of ${c.row.original.title}`}>
              PDF v{doc.version}, {formatBytes(doc.size)}
            </a>
          ) : (
            <span className="text-ink-faint">none</span>
          );
        },
      }),
      ...(canDraft
        ? [
            col.display({
              id: 'edit',
              header: () => <span className="sr-only">Edit</span>,
              cell: (c) => (
                <Button tone="quiet" onClick={() => onEdit(c.row.original.id)} aria-label={`Edit ${c.row.original.title}`}>
                  Edit
                </Button>
              ),
            }),
          ]
        : []),
    ],
    [canDraft, onEdit],
  );
  const table = useSortableTable(items, columns);
  return (
    <div className="overflow-x-auto rounded-plate bg-chart-raised shadow-plate">
      <TableView table={table} label="References" />
    </div>
  );
}

/** References and their documents: everyone may read and download; librarians create, edit and upload. */
export function ReferencesPage({ canDraft }: { canDraft: boolean }) {
  const [q, setQ] = useState('');
  const term = useDebounced(q.trim(), 250);
  const list = useReferences(term);
  const [editing, setEditing] = useState<{ id: number | null; generation: number } | null>(null);
  const detail = useReference(editing?.id ?? null);

  const open = (id: number | null) => setEditing((e) => ({ id, generation: (e?.generation ?? 0) + 1 }));

  return (
    <div className="flex flex-col gap-4">
      <Breadcrumb trail={[{ to: '/library', label: 'Library desk' }, { label: 'References' }]} />
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 className="text-2xl font-bold">References</h1>
          <p className="text-sm text-ink-soft">The sources property sets cite: standards, handbooks, papers, test reports and data sheets.</p>
        </div>
        {canDraft ? <Button onClick={() => open(null)}>New reference</Button> : null}
      </div>

      <div className={`grid gap-4 ${editing ? 'lg:grid-cols-[1fr_24rem]' : ''}`}>
        <div className="flex min-w-0 flex-col gap-3">
          <form role="search" onSubmit={(e) => e.preventDefault()} className="max-w-md">
            <TextField label="Search" type="search" value={q} onChange={(e) => setQ(e.target.value)} hint="Title, authors or identifier" />
          </form>
          <p className="text-sm text-ink-soft" aria-live="polite">
            {list.data ? `${list.data.total} reference${list.data.total === 1 ? '' : 's'}${term ? ` match “${term}”` : ''}` : ' '}
          </p>
          {list.isPending || list.isError ? (
            <QueryStatus query={list} loading="Loading references…" />
          ) : list.data.items.length === 0 ? (
            <EmptyState
              title={term ? 'No reference matches' : 'No references yet'}
              action={canDraft ? <Button onClick={() => open(null)}>New reference</Button> : undefined}
            >
              {term ? 'Try fewer words, or an identifier such as a standard number.' : 'Add the first source, or create one while drafting a property set.'}
            </EmptyState>
          ) : (
            <ReferencesTable items={list.data.items} canDraft={canDraft} onEdit={(id) => open(id)} />
          )}
        </div>

        {editing ? (
          <div className="lg:sticky lg:top-4 lg:self-start">
            <Panel
              title={editing.id === null ? 'New reference' : 'Edit reference'}
              actions={
                editing.id !== null && detail.data ? (
                  <Tag tone={detail.data.document ? 'pass' : 'neutral'}>{detail.data.document ? 'has PDF' : 'no PDF'}</Tag>
                ) : undefined
              }
            >
              {editing.id !== null && detail.isPending ? (
                <Spinner label="Loading the reference…" />
              ) : editing.id !== null && detail.isError ? (
                <ErrorState error={detail.error} onRetry={() => void detail.refetch()} />
              ) : (
                <div className="flex flex-col gap-3">
                  <ReferenceEditor
                    // A new generation starts the form again; creating keeps it (the editor carries on with the new id).
                    key={editing.generation}
                    reference={editing.id === null ? null : (detail.data ?? null)}
                    onClose={() => setEditing(null)}
                    onCreated={(saved) => setEditing({ id: saved.id, generation: editing.generation })}
                    onReload={() => void detail.refetch().then(() => open(editing.id))}
                  />
                  {editing.id !== null && detail.data ? (
                    <>
                      <Link to={`/library/references/${detail.data.id}`} className="text-sm text-sounding underline">
                        Open its page: versions, review of a proposed change, documents
                      </Link>
                      <div className="flex flex-col gap-2 border-t border-chart-line pt-3">
                        <h3 className="text-sm font-bold">Documents</h3>
                        <ReferenceDocuments reference={detail.data} canDraft={canDraft} />
                      </div>
                    </>
                  ) : null}
                </div>
              )}
            </Panel>
          </div>
        ) : null}
      </div>
    </div>
  );
}
