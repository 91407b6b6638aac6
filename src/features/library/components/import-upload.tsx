import { Link } from 'react-router-dom';
import { IMPORT_MAX_BYTES, IMPORT_MAX_ROWS, type ImportPreviewDto, type ImportResultDto } from '@shared/schemas/library';
import { Button } from '@/components/ui/button';
import { Panel } from '@/components/ui/states';
import { formatBytes } from '../labels';
import { ProgressBar } from './progress';

export type ImportPhase =
  | { name: 'idle' }
  | { name: 'uploading'; fraction: number }
  | { name: 'checking'; since: number }
  | { name: 'preview'; preview: ImportPreviewDto }
  | { name: 'refused'; message: string }
  | { name: 'done'; result: ImportResultDto };

interface UploadPanelProps {
  phase: ImportPhase;
  fileName: string | null;
  /** Data rows counted in the browser, for the "checking about N rows" line. */
  rowsInFile: number | null;
  /** Seconds the server has been checking. */
  seconds: number;
  onChoose: (file: File | null) => void;
  onCancel: () => void;
}

/** Choosing a file, sending and checking it, and what became of it (refused or imported). */
export function UploadPanel({ phase, fileName, rowsInFile, seconds, onChoose, onCancel }: UploadPanelProps) {
  return (
    <Panel title="Check a file">
      <div className="flex flex-col gap-3">
        <div className="flex flex-col gap-1">
          <label htmlFor="csv-file" className="text-xs font-bold uppercase tracking-wide text-ink-soft">
            CSV file
          </label>
          <input
            id="csv-file"
            type="file"
            accept=".csv,text/csv"
            aria-describedby="csv-file-hint"
            className="text-sm file:mr-3 file:rounded-plate file:border file:border-chart-line file:bg-chart-raised file:px-3 file:py-1.5 file:font-bold file:text-ink hover:file:bg-chart-deep"
            onChange={(e) => onChoose(e.target.files?.[0] ?? null)}
          />
          <p id="csv-file-hint" className="text-xs text-ink-faint">
            UTF-8, comma-separated, header row as in the template; up to {formatBytes(IMPORT_MAX_BYTES)} and {IMPORT_MAX_ROWS.toLocaleString('en-GB')} rows. Nothing is saved until you import.
          </p>
        </div>

        {phase.name === 'uploading' ? (
          <div className="flex flex-col gap-2">
            <ProgressBar label={`Sending ${fileName ?? 'the file'}`} fraction={phase.fraction} />
            <div>
              <Button tone="quiet" onClick={onCancel}>
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
  );
}
