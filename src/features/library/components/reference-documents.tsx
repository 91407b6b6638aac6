import { useEffect, useRef, useState } from 'react';
import { DOCUMENT_MAX_BYTES, type ReferenceDocumentDto, type ReferencePageDto } from '@shared/schemas/library';
import { Notice } from '@/components/ui/form-error';
import { Button } from '@/components/ui/button';
import { ColumnHeads } from '@/components/ui/column-heads';
import { ApiError } from '@/lib/api-client';
import { documentVersionUrl, useUploadDocument } from '../api/references';
import { formatBytes, formatDateTime } from '../labels';
import { ProgressBar } from './progress';

/** Every document version of a reference, newest first, each downloadable. */
export function DocumentVersions({ referenceId, documents, title }: { referenceId: number; documents: ReferenceDocumentDto[]; title: string }) {
  if (!documents.length) return <p className="text-sm text-ink-soft">No document yet.</p>;
  return (
    <table className="w-full text-sm" aria-label="Document versions" data-testid="document-versions">
      <ColumnHeads columns={['Version', 'File', { label: 'Uploaded', className: 'pr-3' }]} />
      <tbody>
        {documents.map((d, i) => (
          <tr key={d.version} className="border-t border-chart-line/60 align-top">
            <td className="py-1.5 pr-3">
              {d.version}
              {i === 0 ? <span className="block text-xs text-ink-soft">latest</span> : null}
            </td>
            <td className="py-1.5 pr-3">
              <a href={documentVersionUrl(referenceId, d.version)} className="font-bold text-sounding underline" aria-label={`Download version ${d.version} of the document of ${title}`}>
                {d.name}
              </a>{' '}
              <span className="text-ink-soft">({formatBytes(d.size)})</span>
            </td>
            <td className="py-1.5 pr-3 text-ink-soft">
              {formatDateTime(d.uploadedAt)}
              {d.uploadedBy ? <span className="block text-xs">by {d.uploadedBy.name}</span> : null}
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

/** Pick a PDF, check it here (type, 20 MB), send it with progress: it becomes the next document version. */
export function DocumentUpload({ reference }: { reference: ReferencePageDto }) {
  const upload = useUploadDocument(reference.id);
  const [file, setFile] = useState<File | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const [fraction, setFraction] = useState(0);
  const [done, setDone] = useState<number | null>(null);
  const abort = useRef<AbortController | null>(null);
  useEffect(() => () => abort.current?.abort(), []);

  function choose(chosen: File | null) {
    setDone(null);
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
      { onSuccess: (saved) => setDone(saved.document?.version ?? null) },
    );
  }

  const inputId = `doc-${reference.id}`;
  return (
    <div className="flex flex-col gap-2">
      <div className="flex flex-col gap-1">
        <label htmlFor={inputId} className="text-xs font-bold uppercase tracking-wide text-ink-soft">
          {reference.document ? 'Add a new version (PDF)' : 'PDF file'}
        </label>
        <input
          id={inputId}
          type="file"
          accept="application/pdf"
          aria-describedby={`${inputId}-hint`}
          disabled={upload.isPending}
          onChange={(e) => choose(e.target.files?.[0] ?? null)}
          className="text-sm file:mr-3 file:rounded-plate file:border file:border-chart-line file:bg-chart-raised file:px-3 file:py-1.5 file:font-bold file:text-ink hover:file:bg-chart-deep"
        />
        <p id={`${inputId}-hint`} className="text-xs text-ink-faint">
          PDF only, at most {formatBytes(DOCUMENT_MAX_BYTES)}. {reference.document ? 'Earlier versions stay downloadable; design records keep the one they were frozen with.' : ''}
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
      <Notice message={done !== null ? `Document stored as version ${done}.` : null} />
    </div>
  );
}

/** The documents of a reference: its versions, and (for librarians) the upload of the next one. */
export function ReferenceDocuments({ reference, canDraft }: { reference: ReferencePageDto; canDraft: boolean }) {
  return (
    <div className="flex flex-col gap-3">
      {reference.documents.length === 0 ? (
        <p className="text-sm text-ink-soft">
          No document yet.{canDraft ? ' Attach the source as a PDF so reviewers and engineers can check the values.' : ''}
        </p>
      ) : (
        <DocumentVersions referenceId={reference.id} documents={reference.documents} title={reference.title} />
      )}
      {canDraft ? <DocumentUpload reference={reference} /> : null}
    </div>
  );
}
