import { useState } from 'react';
import { FAMILY_LABELS, type Family } from '@shared/schemas/catalogue';
import type { ImportIssueDto, ImportPreviewDto } from '@shared/schemas/library';
import { Button } from '@/components/ui/button';
import { Panel } from '@/components/ui/states';
import { useUnits } from '@/lib/unit-system';
import { IssuesTable } from './import-issues-table';
import { numeric, PlainTable } from '@/components/ui/column-heads';

function SampleTable({ sample }: { sample: ImportPreviewDto['sample'] }) {
  const { format, label } = useUnits();
  return (
    <PlainTable label="Sample rows" columns={[numeric('Row'), 'Material', 'Condition', 'Source', numeric(`Tensile (${label('stress')})`), numeric(`Compressive (${label('stress')})`), numeric(`Shear (${label('stress')})`), 'Values confirmed']}>
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
          <td className="py-1 pr-3 text-right">{format('stress', s.shearStrength, { unit: false })}</td>
          <td className="whitespace-nowrap py-1 text-xs">
            {s.status.confirmed} of {s.status.total}
            {s.status.demo ? <span className="block text-ink-soft">demo data</span> : null}
          </td>
        </tr>
      ))}
    </PlainTable>
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

function Summary({ preview }: { preview: ImportPreviewDto }) {
  const cells = [
    ['Rows', preview.rows.toLocaleString('en-GB'), ''],
    ['Valid', preview.valid.toLocaleString('en-GB'), 'text-verdict-pass'],
    ['Issues', preview.issueCount.toLocaleString('en-GB'), preview.issueCount ? 'text-verdict-fail' : ''],
  ];
  return (
    <dl className="grid grid-cols-3 gap-3 text-center" data-testid="import-summary">
      {cells.map(([term, value, tone]) => (
        <div key={term} className="rounded-plate bg-chart-deep/60 px-3 py-2">
          <dt className="text-xs uppercase tracking-wide text-ink-soft">{term}</dt>
          <dd className={`text-xl font-bold ${tone}`}>{value}</dd>
        </div>
      ))}
    </dl>
  );
}

interface PreviewPanelProps {
  preview: ImportPreviewDto;
  /** The issues the server gave when it refused the import (the file changed since the check). */
  refused: { issues: ImportIssueDto[]; issueCount: number } | null;
  busy: boolean;
  onImport: () => void;
}

/** What the check found: counts, row issues, the first rows in SI, new materials and references. */
export function PreviewPanel({ preview, refused, busy, onImport }: PreviewPanelProps) {
  const blocked = preview.issueCount > 0 || preview.rows === 0;
  return (
    <Panel title="Preview">
      <div className="flex flex-col gap-4">
        <Summary preview={preview} />

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

        {refused ? (
          <div role="alert" className="flex flex-col gap-2">
            <p className="text-sm font-bold text-verdict-fail">The server refused the import; nothing was saved.</p>
            <IssuesTable issues={refused.issues} total={refused.issueCount} />
          </div>
        ) : null}

        <div className="flex flex-wrap items-center gap-3 border-t border-chart-line pt-3">
          <Button onClick={onImport} disabled={blocked || busy} aria-describedby="import-blocked">
            Import all {preview.rows ? preview.rows.toLocaleString('en-GB') : ''} rows…
          </Button>
          <p id="import-blocked" className="text-xs text-ink-soft">
            {preview.issueCount ? 'Import is possible once no row has an issue.' : 'All rows become drafts in one step; if one fails, none is saved.'}
          </p>
        </div>
      </div>
    </Panel>
  );
}
