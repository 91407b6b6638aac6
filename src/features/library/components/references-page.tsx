import { useEffect, useMemo, useRef, useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { createColumnHelper } from '@tanstack/react-table';
import { REFERENCE_KINDS, type ReferenceInput } from '@shared/schemas/catalogue';
import { DOCUMENT_MAX_BYTES, type ReferenceDetailDto } from '@shared/schemas/library';
import { Button } from '@/components/ui/button';
import { SelectField, TextField, LabelledOptions } from '@/components/ui/field';
import { TableView, useSortableTable } from '@/components/ui/table-view';
import { EmptyState, ErrorState, Panel, Spinner, Tag } from '@/components/ui/states';
import { StaleBanner } from '@/components/stale-banner';
import { FormError, Notice } from '@/components/ui/form-error';
import { ApiError, isStale } from '@/lib/api-client';
import { setServerErrors } from '@/lib/field-errors';
import { documentUrl, useCreateReference, useReference, useReferences, useUpdateReference, useUploadDocument } from '../api/references';
import { REFERENCE_KIND_LABELS, formatBytes, formatDate } from '../labels';
import { emptyReferenceForm, REFERENCE_FIELD_LABELS, referenceFormFrom, referenceFormSchema, type ReferenceForm } from '../reference-form';
import { ProgressBar } from './progress';
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
            <span className="font-bold">{c.getValue()}</span>
            {c.row.original.authors ? <span className="block text-xs text-ink-soft">{c.row.original.authors}</span> : null}
          </div>
        ),
      }),
      col.accessor((r) => REFERENCE_KIND_LABELS[r.kind], { id: 'kind', header: 'Kind' }),
      col.accessor((r) => r.identifier ?? '', { id: 'identifier', header: 'Identifier', cell: (c) => <span className="font-mono text-xs">{c.getValue() || '—'}</span> }),
      col.accessor((r) => r.year ?? 0, { id: 'year', header: 'Year', cell: (c) => c.row.original.year ?? '—', meta: { numeric: true } }),
      col.accessor('usedBy', { header: 'Used by', cell: (c) => `${c.getValue()} set${c.getValue() === 1 ? '' : 's'}`, meta: { numeric: true } }),
      col.accessor((r) => (r.document ? 1 : 0), {
        id: 'document',
        header: 'Document',
        cell: (c) => {
          const doc = c.row.original.document;
          return doc ? (
            <a href={documentUrl(c.row.original.id)} className="text-sounding underline" aria-label={`Download the PDF of ${c.row.original.title}`}>
              PDF, {formatBytes(doc.size)}
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

/** Pick a PDF, check it here (type, 20 MB), send it with progress. */
function DocumentUpload({ reference }: { reference: ReferenceDetailDto }) {
  const upload = useUploadDocument(reference.id);
  const [file, setFile] = useState<File | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const [fraction, setFraction] = useState(0);
  const [done, setDone] = useState(false);
  const abort = useRef<AbortController | null>(null);
  useEffect(() => () => abort.current?.abort(), []);

  function choose(chosen: File | null) {
    setDone(false);
    upload.reset();
    setFile(null);
    setProblem(null);
    if (!chosen) return;
    if (chosen.type !== 'application/pdf' && !/\.pdf$/i.test(chosen.name)) return setProblem('Choose a PDF file: other formats cannot be attached.');
    if (chosen.size > DOCUMENT_MAX_BYTES) return setProblem(`The file is ${formatBytes(chosen.size)}; a document may be at most ${formatBytes(DOCUMENT_MAX_BYTES)}.`);
    if (chosen.size === 0) return setProblem('The file is empty.');
    setFile(chosen);
  }

  function send() {
    if (!file) return;
    const controller = new AbortController();
    abort.current = controller;
    setFraction(0);
    upload.mutate(
      { file, signal: controller.signal, onProgress: (loaded, total) => setFraction(total ? loaded / total : 0) },
      { onSuccess: () => setDone(true) },
    );
  }

  return (
    <div className="flex flex-col gap-2 border-t border-chart-line pt-3">
      <h3 className="text-sm font-bold">Document</h3>
      {reference.document ? (
        <p className="text-sm">
          <a href={documentUrl(reference.id)} className="font-bold text-sounding underline">
            {reference.document.name}
          </a>{' '}
          <span className="text-ink-soft">
            ({formatBytes(reference.document.size)}, uploaded {formatDate(reference.document.uploadedAt)})
          </span>
        </p>
      ) : (
        <p className="text-sm text-ink-soft">No document yet. Attach the source as a PDF so reviewers and engineers can check the values.</p>
      )}
      <div className="flex flex-col gap-1">
        <label htmlFor={`doc-${reference.id}`} className="text-xs font-bold uppercase tracking-wide text-ink-soft">
          {reference.document ? 'Replace with a PDF' : 'PDF file'}
        </label>
        <input
          id={`doc-${reference.id}`}
          type="file"
          accept="application/pdf"
          aria-describedby={`doc-${reference.id}-hint`}
          disabled={upload.isPending}
          onChange={(e) => choose(e.target.files?.[0] ?? null)}
          className="text-sm file:mr-3 file:rounded-plate file:border file:border-chart-line file:bg-chart-raised file:px-3 file:py-1.5 file:font-bold file:text-ink hover:file:bg-chart-deep"
        />
        <p id={`doc-${reference.id}-hint`} className="text-xs text-ink-faint">
          PDF only, at most {formatBytes(DOCUMENT_MAX_BYTES)}.
        </p>
      </div>
      {problem ? (
        <p role="alert" className="text-sm font-bold text-verdict-fail">
          {problem}
        </p>
      ) : null}
      {upload.isPending ? (
        <div className="flex flex-col gap-2">
          <ProgressBar label={fraction >= 1 ? 'Storing the document…' : `Uploading ${file?.name}`} fraction={fraction >= 1 ? undefined : fraction} />
          <div>
            <Button tone="quiet" onClick={() => abort.current?.abort()}>
              Cancel upload
            </Button>
          </div>
        </div>
      ) : file ? (
        <div>
          <Button onClick={send}>
            Upload {file.name} ({formatBytes(file.size)})
          </Button>
        </div>
      ) : null}
      {upload.isError ? (
        <p role="alert" className="text-sm font-bold text-verdict-fail">
          {upload.error instanceof ApiError ? upload.error.message : 'The upload failed.'}
        </p>
      ) : null}
      {done ? (
        <p role="status" className="text-sm font-bold text-verdict-pass">
          Document stored.
        </p>
      ) : null}
    </div>
  );
}

function ReferenceEditor({
  reference,
  onCreated,
  onReload,
  onClose,
}: {
  reference: ReferenceDetailDto | null;
  onCreated: (r: ReferenceDetailDto) => void;
  onReload: () => void;
  onClose: () => void;
}) {
  const create = useCreateReference();
  const update = useUpdateReference(reference?.id ?? 0);
  const [lockVersion, setLockVersion] = useState(reference?.lockVersion ?? 0);
  const [notice, setNotice] = useState<string | null>(null);
  const [stale, setStale] = useState<ApiError | null>(null);
  const form = useForm<ReferenceForm, unknown, ReferenceInput>({
    resolver: zodResolver(referenceFormSchema),
    defaultValues: reference ? referenceFormFrom(reference) : emptyReferenceForm(),
  });
  const { register, handleSubmit, formState, reset, setFocus, setError } = form;
  const err = (k: keyof ReferenceForm) => formState.errors[k]?.message;

  useEffect(() => setFocus('kind'), [setFocus]);

  const submit = handleSubmit(async (input) => {
    setNotice(null);
    setStale(null);
    try {
      const saved = reference ? await update.mutateAsync({ lockVersion, reference: input }) : await create.mutateAsync(input);
      setLockVersion(saved.lockVersion);
      reset(referenceFormFrom(saved));
      setNotice(reference ? 'Reference saved.' : 'Reference created. You can attach its document now.');
      if (!reference) onCreated(saved);
    } catch (e) {
      if (isStale(e)) setStale(e);
      // A PUT names the fields under "reference.".
      else setServerErrors(setError, e, REFERENCE_FIELD_LABELS, (path) => path.replace(/^reference\./, ''));
    }
  });

  const busy = create.isPending || update.isPending;
  return (
    <div className="flex flex-col gap-3">
      <form onSubmit={submit} noValidate aria-label={reference ? 'Edit reference' : 'New reference'} className="flex flex-col gap-3">
        <SelectField label="Kind" error={err('kind')} {...register('kind')}>
          <option value="">Choose a kind…</option>
          <LabelledOptions values={REFERENCE_KINDS} labels={REFERENCE_KIND_LABELS} />
        </SelectField>
        <TextField label="Title" error={err('title')} {...register('title')} />
        <TextField label="Authors or issuer" error={err('authors')} {...register('authors')} />
        <div className="grid grid-cols-2 gap-3">
          <TextField label="Year" inputMode="numeric" error={err('year')} {...register('year')} />
          <TextField label="Table or page" error={err('location')} {...register('location')} />
        </div>
        <TextField label="Identifier" error={err('identifier')} hint="Standard number, DOI or report number" {...register('identifier')} />
        <TextField label="Note" error={err('note')} {...register('note')} />
        {stale ? <StaleBanner message={stale.message} onReload={onReload} /> : null}
        <FormError message={formState.errors.root?.message} />
        <Notice message={notice} />
        <div className="flex gap-2">
          <Button type="submit" disabled={busy}>
            {busy ? 'Saving…' : reference ? 'Save reference' : 'Create reference'}
          </Button>
          <Button tone="quiet" onClick={onClose}>
            Close
          </Button>
        </div>
      </form>
      {reference ? (
        <p className="text-xs text-ink-soft">
          Cited by {reference.usedBy} property set{reference.usedBy === 1 ? '' : 's'}; changes show on each of them.
        </p>
      ) : null}
      {reference ? <DocumentUpload reference={reference} /> : null}
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
          {list.isPending ? (
            <Spinner label="Loading references…" />
          ) : list.isError ? (
            <ErrorState error={list.error} onRetry={() => void list.refetch()} />
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
                <ReferenceEditor
                  // A new generation starts the form again; creating keeps it (the editor carries on with the new id).
                  key={editing.generation}
                  reference={editing.id === null ? null : (detail.data ?? null)}
                  onClose={() => setEditing(null)}
                  onCreated={(saved) => setEditing({ id: saved.id, generation: editing.generation })}
                  onReload={() => void detail.refetch().then(() => open(editing.id))}
                />
              )}
            </Panel>
          </div>
        ) : null}
      </div>
    </div>
  );
}
