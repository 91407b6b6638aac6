import { useEffect, useRef, useState } from 'react';
import { Link } from 'react-router-dom';
import { createColumnHelper, getPaginationRowModel } from '@tanstack/react-table';
import { FAMILY_LABELS, type Family } from '@shared/schemas/catalogue';
import { IMPORT_COLUMNS, IMPORT_MAX_BYTES, IMPORT_MAX_ROWS, type ImportIssueDto, type ImportPreviewDto, type ImportResultDto } from '@shared/schemas/library';
import { Button } from '@/components/ui/button';
import { TableView, useSortableTable } from '@/components/ui/table-view';
import { Panel, Tag } from '@/components/ui/states';
import { ApiError } from '@/lib/api-client';
import { useUnits } from '@/lib/unit-system';
import { previewImport, TEMPLATE_URL, useImportAll } from '../api/csv-import';
import { issuesFromImportError, countDataRows } from '../import-model';
import { formatBytes } from '../labels';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { ProgressBar } from './progress';

type Phase =
  | { name: 'idle' }
  | { name: 'uploading'; fraction: number }
  | { name: 'checking'; since: number }
  | { name: 'preview'; preview: ImportPreviewDto }
  | { name: 'refused'; message: string }
  | { name: 'done'; result: ImportResultDto };

function ColumnsTable() {
  return (
    <table className="w-full text-sm" aria-label="Template columns">
      <thead className="text-left text-xs uppercase tracking-wide text-ink-soft">
        <tr>
          <th scope="col" className="py-1 pr-3">Column</th>
          <th scope="col" className="py-1">Unit or what to enter</th>
        </tr>
      </thead>
      <tbody>
        {IMPORT_COLUMNS.map((c) => (
          <tr key={c.name} className="border-t border-chart-line/60 align-top">
            <th scope="row" className="py-1 pr-3 text-left font-normal">
              <span className="font-mono text-xs">{c.name}</span>
              <span className={`block text-xs ${c.required ? 'font-bold text-ink-soft' : 'text-ink-faint'}`}>{c.required ? 'required' : 'optional'}</span>
            </th>
            <td className="py-1 text-xs text-ink-soft">{c.help}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

const issueCol = createColumnHelper<ImportIssueDto>();
const ISSUE_COLUMNS = [
  issueCol.accessor('row', { header: 'Row', meta: { numeric: true } }),
  issueCol.accessor('field', {
    header: 'Column',
    // "_" (or nothing) marks a problem with the whole row, such as a wrong number of fields.
    cell: (c) => (c.getValue() && c.getValue() !== '_' ? <span className="font-mono text-xs">{c.getValue()}</span> : <span className="text-ink-soft">whole row</span>),
  }),
  issueCol.accessor('message', { header: 'Problem', enableSorting: false }),
];

/** The row-level problems, 25 to a page. */
export function IssuesTable({ issues, total }: { issues: ImportIssueDto[]; total: number }) {
  const table = useSortableTable(issues, ISSUE_COLUMNS, {
    getPaginationRowModel: getPaginationRowModel(),
    initialState: { pagination: { pageSize: 25 } },
  });
  const { pageIndex, pageSize } = table.getState().pagination;
  const first = pageIndex * pageSize + 1;
  const last = Math.min(issues.length, first + pageSize - 1);
  return (
    <div className="flex flex-col gap-2">
      <TableView table={table} label="Row issues" dense />
      <div className="flex flex-wrap items-center justify-between gap-2 text-sm">
        <span className="text-ink-soft" aria-live="polite">
          Issues {first}–{last} of {issues.length}
          {total > issues.length ? ` (the first ${issues.length} of ${total.toLocaleString('en-GB')} are listed; fix these and check again)` : ''}
        </span>
        {table.getPageCount() > 1 ? (
          <div className="flex items-center gap-2">
            <Button tone="quiet" onClick={() => table.previousPage()} disabled={!table.getCanPreviousPage()}>
              Previous
            </Button>
            <span>
              Page {pageIndex + 1} of {table.getPageCount()}
            </span>
            <Button tone="quiet" onClick={() => table.nextPage()} disabled={!table.getCanNextPage()}>
              Next
            </Button>
          </div>
        ) : null}
      </div>
    </div>
  );
}

function SampleTable({ sample }: { sample: ImportPreviewDto['sample'] }) {
  const { format, label } = useUnits();
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-sm" aria-label="Sample rows">
        <thead className="text-left text-xs uppercase tracking-wide text-ink-soft">
          <tr>
            <th scope="col" className="py-1 pr-3 text-right">Row</th>
            <th scope="col" className="py-1 pr-3">Material</th>
            <th scope="col" className="py-1 pr-3">Condition</th>
            <th scope="col" className="py-1 pr-3">Source</th>
            <th scope="col" className="py-1 pr-3 text-right">Tensile ({label('stress')})</th>
            <th scope="col" className="py-1 pr-3 text-right">Compressive ({label('stress')})</th>
            <th scope="col" className="py-1 text-right">Shear ({label('stress')})</th>
          </tr>
        </thead>
        <tbody>
          {sample.map((s) => (
            <tr key={s.row} className="border-t border-chart-line/60 align-top">
              <td className="py-1 pr-3 text-right">{s.row}</td>
              <td className="py-1 pr-3">
                {s.material}
                <span className="block text-xs text-ink-soft">{FAMILY_LABELS[s.family as Family] ?? s.family}</span>
              </td>
              <td className="py-1 pr-3">{s.condition}</td>
              <td className="py-1 pr-3 text-xs">{s.reference}</td>
              <td className="py-1 pr-3 text-right">{format('stress', s.tensileStrength, { unit: false })}</td>
              <td className="py-1 pr-3 text-right">{format('stress', s.compressiveStrength, { unit: false })}</td>
              <td className="py-1 text-right">{format('stress', s.shearStrength, { unit: false })}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

function NameList({ title, names, empty }: { title: string; names: string[]; empty: string }) {
  const [all, setAll] = useState(false);
  const shown = all ? names : names.slice(0, 10);
  return (
    <div>
      <h3 className="text-sm font-bold">
        {title} ({names.length})
      </h3>
      {names.length ? (
        <>
          <ul className="mt-1 list-inside list-disc text-sm">
            {shown.map((n, i) => (
              <li key={`${i}:${n}`}>{n}</li>
            ))}
          </ul>
          {names.length > shown.length ? (
            <button type="button" className="mt-1 text-sm font-bold text-sounding hover:underline" onClick={() => setAll(true)}>
              Show all {names.length}
            </button>
          ) : null}
        </>
      ) : (
        <p className="mt-1 text-sm text-ink-soft">{empty}</p>
      )}
    </div>
  );
}

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
  const [phase, setPhase] = useState<Phase>({ name: 'idle' });
  const [confirm, setConfirm] = useState(false);
  const [importIssues, setImportIssues] = useState<ImportIssueDto[] | null>(null);
  const [importFraction, setImportFraction] = useState<number | null>(null);
  const abort = useRef<AbortController | null>(null);
  const inputRef = useRef<HTMLInputElement>(null);
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
            setImportIssues(issuesFromImportError(e.fields));
          }
        },
      },
    );
  }

  const preview = phase.name === 'preview' ? phase.preview : null;
  const blocked = !preview || preview.issueCount > 0 || preview.rows === 0;

  return (
    <div className="flex flex-col gap-4">
      <nav aria-label="Breadcrumb" className="text-sm">
        <Link to="/library" className="text-sounding hover:underline">
          Library desk
        </Link>{' '}
        / Import CSV
      </nav>
      <div>
        <h1 className="text-2xl font-bold">Import property sets from CSV</h1>
        <p className="text-sm text-ink-soft">
          Every row becomes one of your drafts, all in one go or none at all. Materials and references are matched by name, or created.
        </p>
      </div>

      <div className="grid gap-4 lg:grid-cols-[1fr_30rem]">
        <div className="flex min-w-0 flex-col gap-4">
          <Panel title="Check a file">
            <div className="flex flex-col gap-3">
              <div className="flex flex-col gap-1">
                <label htmlFor="csv-file" className="text-xs font-bold uppercase tracking-wide text-ink-soft">
                  CSV file
                </label>
                <input
                  ref={inputRef}
                  id="csv-file"
                  type="file"
                  accept=".csv,text/csv"
                  aria-describedby="csv-file-hint"
                  className="text-sm file:mr-3 file:rounded-plate file:border file:border-chart-line file:bg-chart-raised file:px-3 file:py-1.5 file:font-bold file:text-ink hover:file:bg-chart-deep"
                  onChange={(e) => {
                    const chosen = e.target.files?.[0] ?? null;
                    setFile(chosen);
                    if (chosen) void check(chosen);
                    else setPhase({ name: 'idle' });
                  }}
                />
                <p id="csv-file-hint" className="text-xs text-ink-faint">
                  UTF-8, comma-separated, header row as in the template; up to {formatBytes(IMPORT_MAX_BYTES)} and {IMPORT_MAX_ROWS.toLocaleString('en-GB')} rows. Nothing is saved until you
                  import.
                </p>
              </div>

              {phase.name === 'uploading' ? (
                <div className="flex flex-col gap-2">
                  <ProgressBar label={`Sending ${file?.name ?? 'the file'}`} fraction={phase.fraction} />
                  <div>
                    <Button tone="quiet" onClick={() => abort.current?.abort()}>
                      Cancel
                    </Button>
                  </div>
                </div>
              ) : null}
              {phase.name === 'checking' ? (
                <ProgressBar
                  label={`Checking rows…${rowsInFile ? ` (about ${rowsInFile.toLocaleString('en-GB')})` : ''}`}
                  detail={seconds >= 2 ? `${seconds} s — every row and every value is checked; large files take a little while.` : undefined}
                />
              ) : null}
              {phase.name === 'refused' ? (
                <div role="alert" className="rounded-plate border border-verdict-fail/40 bg-white px-3 py-2 text-sm" data-testid="import-refused">
                  <p className="font-bold text-verdict-fail">This file cannot be imported</p>
                  <p className="mt-1">{phase.message}</p>
                </div>
              ) : null}
              {phase.name === 'done' ? (
                <div role="status" className="rounded-plate border border-verdict-pass/30 bg-white px-3 py-2 text-sm" data-testid="import-done">
                  <p className="font-bold text-verdict-pass">
                    Imported {phase.result.created} draft{phase.result.created === 1 ? '' : 's'}.
                  </p>
                  <p className="mt-1">
                    They are on your desk as drafts: check each and submit it for review.{' '}
                    <Link to="/library" className="font-bold text-sounding underline">
                      Open your drafts
                    </Link>
                  </p>
                </div>
              ) : null}
            </div>
          </Panel>

          {preview ? (
            <Panel title="Preview">
              <div className="flex flex-col gap-4">
                <dl className="grid grid-cols-3 gap-3 text-center" data-testid="import-summary">
                  <div className="rounded-plate bg-chart-deep/60 px-3 py-2">
                    <dt className="text-xs uppercase tracking-wide text-ink-soft">Rows</dt>
                    <dd className="text-xl font-bold">{preview.rows.toLocaleString('en-GB')}</dd>
                  </div>
                  <div className="rounded-plate bg-chart-deep/60 px-3 py-2">
                    <dt className="text-xs uppercase tracking-wide text-ink-soft">Valid</dt>
                    <dd className="text-xl font-bold text-verdict-pass">{preview.valid.toLocaleString('en-GB')}</dd>
                  </div>
                  <div className="rounded-plate bg-chart-deep/60 px-3 py-2">
                    <dt className="text-xs uppercase tracking-wide text-ink-soft">Issues</dt>
                    <dd className={`text-xl font-bold ${preview.issueCount ? 'text-verdict-fail' : ''}`}>{preview.issueCount.toLocaleString('en-GB')}</dd>
                  </div>
                </dl>

                {preview.issueCount ? (
                  <div className="flex flex-col gap-2">
                    <h3 className="text-sm font-bold">Fix these in the file, then choose it again</h3>
                    <IssuesTable issues={preview.issues} total={preview.issueCount} />
                  </div>
                ) : preview.rows === 0 ? (
                  <p className="text-sm text-ink-soft">The file has a header but no rows.</p>
                ) : (
                  <p className="text-sm font-bold text-verdict-pass">Every row is valid.</p>
                )}

                {preview.sample.length ? (
                  <div className="flex flex-col gap-2">
                    <h3 className="text-sm font-bold">First rows, as they will be saved</h3>
                    <SampleTable sample={preview.sample} />
                  </div>
                ) : null}

                <div className="grid gap-4 md:grid-cols-2">
                  <NameList title="New materials" names={preview.newMaterials} empty="None: every material already exists." />
                  <NameList title="New references" names={preview.newReferences} empty="None: every source already exists." />
                </div>

                {importIssues ? (
                  <div role="alert" className="flex flex-col gap-2">
                    <p className="text-sm font-bold text-verdict-fail">The server refused the import; nothing was saved.</p>
                    <IssuesTable issues={importIssues} total={importIssues.length} />
                  </div>
                ) : null}

                <div className="flex flex-wrap items-center gap-3 border-t border-chart-line pt-3">
                  <Button onClick={() => setConfirm(true)} disabled={blocked || importAll.isPending} aria-describedby="import-blocked">
                    Import all {preview.rows ? preview.rows.toLocaleString('en-GB') : ''} rows…
                  </Button>
                  <p id="import-blocked" className="text-xs text-ink-soft">
                    {preview.issueCount ? 'Import is possible once no row has an issue.' : 'All rows become drafts in one step; if one fails, none is saved.'}
                  </p>
                </div>
              </div>
            </Panel>
          ) : null}
        </div>

        <Panel title="The template">
          <div className="flex flex-col gap-3">
            <p className="text-sm">
              <a href={TEMPLATE_URL} download className="font-bold text-sounding underline">
                Download the template (CSV)
              </a>{' '}
              <Tag>two example rows</Tag>
            </p>
            <p className="text-xs text-ink-soft">Units are part of the column names; values are converted to SI on import.</p>
            <ColumnsTable />
          </div>
        </Panel>
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
