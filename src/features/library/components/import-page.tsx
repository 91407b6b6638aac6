import { useEffect, useRef, useState } from 'react';
import { IMPORT_MAX_BYTES, type ImportIssueDto } from '@shared/schemas/library';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { ApiError } from '@/lib/api-client';
import { previewImport, useImportAll } from '../api/csv-import';
import { countDataRows, importIssuesOf } from '../import-model';
import { formatBytes } from '../labels';
import { PreviewPanel } from './import-preview';
import { TemplatePanel } from './import-template';
import { UploadPanel, type ImportPhase } from './import-upload';
import { ProgressBar } from './progress';
import { Breadcrumb } from '@/components/ui/breadcrumb';

function useSeconds(since: number | null) {
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    if (since === null) return;
    const t = setInterval(() => setNow(Date.now()), 1000);
    return () => clearInterval(t);
  }, [since]);
  return since === null ? 0 : Math.max(0, Math.round((now - since) / 1000));
}

/** Import property sets from a CSV file: template, check every row, preview, then all rows at once. */
export function ImportPage() {
  const [file, setFile] = useState<File | null>(null);
  const [rowsInFile, setRowsInFile] = useState<number | null>(null);
  const [phase, setPhase] = useState<ImportPhase>({ name: 'idle' });
  const [confirm, setConfirm] = useState(false);
  const [importIssues, setImportIssues] = useState<{ issues: ImportIssueDto[]; issueCount: number } | null>(null);
  const [importFraction, setImportFraction] = useState<number | null>(null);
  const abort = useRef<AbortController | null>(null);
  const importAll = useImportAll();
  const seconds = useSeconds(phase.name === 'checking' ? phase.since : null);

  useEffect(() => () => abort.current?.abort(), []);

  async function check(chosen: File) {
    abort.current?.abort();
    setImportIssues(null);
    importAll.reset();
    if (chosen.size === 0) return setPhase({ name: 'refused', message: 'The file is empty. Start from the template and add one row per property set.' });
    if (chosen.size > IMPORT_MAX_BYTES)
      return setPhase({
        name: 'refused',
        message: `The file is ${formatBytes(chosen.size)}; at most ${formatBytes(IMPORT_MAX_BYTES)} can be imported at once. Split it into smaller files.`,
      });
    setRowsInFile(countDataRows(await chosen.slice(0, IMPORT_MAX_BYTES).text()));
    const controller = new AbortController();
    abort.current = controller;
    setPhase({ name: 'uploading', fraction: 0 });
    try {
      const preview = await previewImport(chosen, {
        signal: controller.signal,
        onProgress: (loaded, total) => setPhase({ name: 'uploading', fraction: total ? loaded / total : 0 }),
        onSent: () => setPhase({ name: 'checking', since: Date.now() }),
      });
      setPhase({ name: 'preview', preview });
    } catch (e) {
      if (e instanceof ApiError && e.code === 'aborted') return setPhase({ name: 'idle' });
      setPhase({ name: 'refused', message: e instanceof ApiError ? e.message : 'The file could not be checked.' });
    }
  }

  function choose(chosen: File | null) {
    setFile(chosen);
    if (chosen) void check(chosen);
    else setPhase({ name: 'idle' });
  }

  function doImport() {
    if (!file) return;
    setImportFraction(0);
    importAll.mutate(
      { file, onProgress: (loaded, total) => setImportFraction(total ? loaded / total : 0), onSent: () => setImportFraction(null) },
      {
        onSuccess: (result) => {
          setConfirm(false);
          setPhase({ name: 'done', result });
        },
        onError: (e) => {
          setImportFraction(null);
          if (e instanceof ApiError && e.code === 'import_invalid') {
            setConfirm(false);
            setImportIssues(importIssuesOf(e));
          }
        },
      },
    );
  }

  const preview = phase.name === 'preview' ? phase.preview : null;

  return (
    <div className="flex flex-col gap-4">
      <Breadcrumb trail={[{ to: '/library', label: 'Library desk' }, { label: 'Import CSV' }]} />
      <div>
        <h1 className="text-2xl font-bold">Import property sets from CSV</h1>
        <p className="text-sm text-ink-soft">
          Every row becomes one of your drafts, all in one go or none at all. Materials and references are matched by name, or created.
        </p>
      </div>

      <div className="grid gap-4 lg:grid-cols-[1fr_30rem]">
        <div className="flex min-w-0 flex-col gap-4">
          <UploadPanel phase={phase} fileName={file?.name ?? null} rowsInFile={rowsInFile} seconds={seconds} onChoose={choose} onCancel={() => abort.current?.abort()} />
          {preview ? <PreviewPanel preview={preview} refused={importIssues} busy={importAll.isPending} onImport={() => setConfirm(true)} /> : null}
        </div>
        <TemplatePanel />
      </div>

      <ConfirmDialog
        open={confirm}
        title="Import every row?"
        confirmLabel={`Import ${preview?.rows ?? ''} drafts`}
        busy={importAll.isPending}
        busyLabel={importFraction === null ? 'Saving drafts…' : 'Sending…'}
        error={importAll.isError && !importIssues ? (importAll.error instanceof ApiError ? importAll.error.message : 'The import failed.') : undefined}
        onClose={() => setConfirm(false)}
        onConfirm={doImport}
      >
        <p>
          {preview?.rows} rows of <strong>{file?.name}</strong> become drafts on your desk
          {preview && (preview.newMaterials.length || preview.newReferences.length)
            ? `, with ${preview.newMaterials.length} new material${preview.newMaterials.length === 1 ? '' : 's'} and ${preview.newReferences.length} new reference${preview.newReferences.length === 1 ? '' : 's'}`
            : ''}
          . Each still needs a second librarian’s approval before it is published.
        </p>
        {importAll.isPending ? <ProgressBar label={importFraction === null ? 'Saving drafts…' : 'Sending the file'} fraction={importFraction ?? undefined} /> : null}
      </ConfirmDialog>
    </div>
  );
}
