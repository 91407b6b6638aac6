import { Fragment, startTransition, useEffect, useMemo, useState } from 'react';
import { Link } from 'react-router-dom';
import {
  createColumnHelper,
  flexRender,
  getCoreRowModel,
  getSortedRowModel,
  useReactTable,
  type SortingState,
} from '@tanstack/react-table';
import type { CandidateResult } from '@shared/engine';
import { useUnits } from '@/lib/unit-system';
import { factorsText } from '@shared/labels';
import { SortableHeader } from '@/components/ui/sortable-header';
import { MarginCell, ModeTag, ModesTable, SizingSummary } from '@/components/failure-modes';
import { InputsMark } from '@/components/inputs-mark';
import { splitCandidateName } from '@shared/candidate-name';

/** Rows in the first paint of the ranking; the rest render right after. */
const FIRST_ROWS = 20;

const col = createColumnHelper<CandidateResult & { rank: number }>();

// The tags live with the shared failure-mode colours; re-exported for this feature's pages.
export { ModeTag, MarginCell };

function ModeBreakdown({ result }: { result: CandidateResult }) {
  const { format } = useUnits();
  return (
    <div className="flex flex-col gap-3 bg-chart px-3 py-3 text-sm" data-testid="mode-breakdown">
      {/* The modes table scrolls on its own where the screen is narrow; the notes below always wrap. */}
      <div className="overflow-x-auto">
        <ModesTable result={result} />
      </div>
      <div className="grid gap-3 md:grid-cols-2">
        <div className="min-w-0">
          <SizingSummary result={result} />
          <p className="mt-2 text-xs text-ink-soft">{factorsText(result.factors, (c) => format('temperature', c))}</p>
        </div>
        <div className="min-w-0">
          <p className="text-xs font-bold uppercase tracking-wide text-ink-soft">Warnings</p>
          {result.warnings.length ? (
            <ul className="mt-1 list-disc break-words pl-4 text-xs text-verdict-watch" aria-label={`Warnings for ${result.name}`}>
              {result.warnings.map((w) => (
                <li key={w}>{w}</li>
              ))}
            </ul>
          ) : (
            <p className="mt-1 text-xs text-ink-soft">None for this load case.</p>
          )}
        </div>
      </div>
    </div>
  );
}

/** The required thickness and, beneath it, what set it (a mode, or a rating table). */
function RequiredThickness({ result, start = false }: { result: CandidateResult; start?: boolean }) {
  const { format } = useUnits();
  const s = result.sizedBy;
  return (
    <span className={`inline-flex flex-col whitespace-nowrap ${start ? 'items-start' : 'items-end'}`}>
      <span>{result.requiredThickness === null ? 'none suffices' : format('length', result.requiredThickness, { unit: false })}</span>
      {s === null ? null : s.kind === 'mode' ? (
        <span className="text-xs text-ink-soft">
          set by <ModeTag mode={s.mode} small />
        </span>
      ) : (
        <span className="text-xs font-bold text-sounding" title={s.name}>
          set by rating table
        </span>
      )}
    </span>
  );
}

function CandidateName({ result }: { result: CandidateResult }) {
  const uncovered = result.coverage === 'not-covered';
  const { material: head, condition: tail } = result.propertySetId ? splitCandidateName(result.name) : { material: result.name, condition: '' };
  return (
    <div className="min-w-[9rem] max-w-[15rem]">
      {result.propertySetId ? (
        <Link to={`/sets/${result.propertySetId}`} className="font-bold text-sounding hover:underline" onClick={(e) => e.stopPropagation()}>
          {head}
        </Link>
      ) : (
        <span className="font-bold">{head}</span>
      )}
      {tail ? <div className="text-xs text-ink-soft">{tail}</div> : null}
      {uncovered ? <div className="text-xs font-bold text-verdict-fail">Not covered for human occupancy</div> : null}
    </div>
  );
}

function RowActions({ result, expanded, onShortlist, onToggle }: { result: CandidateResult; expanded: boolean; onShortlist?: (r: CandidateResult) => void; onToggle: () => void }) {
  return (
    <div className="flex flex-col items-stretch gap-1">
      {onShortlist && result.propertySetId !== undefined ? (
        <button
          type="button"
          aria-label={`Add ${result.name} to a shortlist`}
          onClick={(e) => {
            e.stopPropagation();
            onShortlist(result);
          }}
          className="whitespace-nowrap rounded-plate border border-chart-line px-2 py-0.5 text-xs font-bold text-sounding hover:bg-chart-deep"
        >
          + Shortlist
        </button>
      ) : null}
      <button
        type="button"
        aria-expanded={expanded}
        aria-label={`${expanded ? 'Hide' : 'Show'} modes of ${result.name}`}
        onClick={(e) => {
          e.stopPropagation();
          onToggle();
        }}
        className="whitespace-nowrap rounded-plate px-2 py-0.5 text-xs font-bold text-sounding hover:bg-chart-deep"
      >
        {expanded ? 'Less' : 'Modes'}
      </button>
    </div>
  );
}

/** True while the screen is narrower than Tailwind's md breakpoint (768 px): the ranking shows as cards. */
function useNarrow(): boolean {
  const query = '(max-width: 767px)';
  const [narrow, setNarrow] = useState(() => typeof window !== 'undefined' && window.matchMedia(query).matches);
  useEffect(() => {
    const m = window.matchMedia(query);
    const on = () => setNarrow(m.matches);
    m.addEventListener('change', on);
    return () => m.removeEventListener('change', on);
  }, []);
  return narrow;
}

export function ResultsTable({
  results,
  selectedKey,
  onSelect,
  hull,
  onShortlist,
}: {
  results: CandidateResult[];
  selectedKey: string | null;
  onSelect: (key: string) => void;
  hull: boolean;
  /** When given, catalogue candidates get an "Add to shortlist" action (only they can be shortlisted). */
  onShortlist?: (result: CandidateResult) => void;
}) {
  const { format, label } = useUnits();
  const narrow = useNarrow();
  const [sorting, setSorting] = useState<SortingState>([]);
  const [open, setOpen] = useState<Set<string>>(new Set());
  const data = useMemo(() => results.map((r, i) => ({ ...r, rank: i + 1 })), [results]);

  const columns = useMemo(
    () => [
      col.accessor('rank', { header: '#', meta: { numeric: true } }),
      col.accessor('name', { header: 'Candidate', cell: (c) => <CandidateName result={c.row.original} /> }),
      col.accessor((r) => (r.inputs ? r.inputs.confirmed / Math.max(r.inputs.total, 1) : -1), {
        id: 'inputs',
        header: 'Inputs confirmed',
        cell: (c) => <InputsMark inputs={c.row.original.inputs} />,
        meta: { numeric: true },
      }),
      col.accessor('governingMode', { header: 'Governed by', cell: (c) => <ModeTag mode={c.getValue()} /> }),
      col.accessor('safetyFactor', {
        header: 'Safety factor / target',
        // The target beside the factor, so the row reads "47.55 of 4" without a column of its own.
        cell: (c) => (
          <span className="whitespace-nowrap">
            {c.getValue().toFixed(2)} <span className="text-xs text-ink-faint">/ {c.row.original.targetSafetyFactor}</span>
          </span>
        ),
        meta: { numeric: true },
      }),
      col.accessor('margin', {
        header: 'Margin',
        // A table-sized window's margin is the table's (rated pressure / design pressure − 1), not the analytical factor beside it.
        cell: (c) => (
          <span className="whitespace-nowrap">
            <MarginCell margin={c.getValue()} />
            {c.row.original.sizedBy?.kind === 'rating-table' ? <span className="block text-xs text-ink-faint">by rating table</span> : null}
          </span>
        ),
        meta: { numeric: true },
      }),
      col.accessor((r) => r.requiredThickness ?? Number.POSITIVE_INFINITY, {
        id: 'requiredThickness',
        header: `Required t (${label('length')})`,
        cell: (c) => <RequiredThickness result={c.row.original} />,
        meta: { numeric: true },
      }),
      col.accessor((r) => r.massPerArea ?? Number.POSITIVE_INFINITY, {
        id: 'massPerArea',
        header: `Mass (${label('massPerArea')})`,
        cell: (c) => format('massPerArea', c.row.original.massPerArea, { unit: false }),
        meta: { numeric: true },
      }),
      ...(hull
        ? [
            col.accessor((r) => r.weightToDisplacement ?? Number.POSITIVE_INFINITY, {
              id: 'weightToDisplacement',
              header: 'Weight / displace\u00adment',
              cell: (c) => (c.row.original.weightToDisplacement === null ? '—' : c.row.original.weightToDisplacement.toFixed(2)),
              meta: { numeric: true },
            }),
          ]
        : []),
      col.accessor((r) => r.warnings.length, {
        id: 'warnings',
        header: 'Warnings',
        cell: (c) => (c.getValue() ? <span className="whitespace-nowrap font-bold text-verdict-watch">⚠ {c.getValue()}</span> : <span className="text-ink-faint">—</span>),
        meta: { numeric: true },
      }),
    ],
    [format, label, hull],
  );

  const table = useReactTable({ data, columns, state: { sorting }, onSortingChange: setSorting, getCoreRowModel: getCoreRowModel(), getSortedRowModel: getSortedRowModel() });
  // The best rows paint first; the rest follow in a transition right after, so a long ranking
  // does not hold back the first view of the table.
  const [painted, setPainted] = useState(FIRST_ROWS);
  useEffect(() => {
    setPainted(FIRST_ROWS);
    const id = setTimeout(() => startTransition(() => setPainted(Number.POSITIVE_INFINITY)), 0);
    return () => clearTimeout(id);
  }, [results]);
  const toggle = (key: string) =>
    setOpen((prev) => {
      const next = new Set(prev);
      if (next.has(key)) next.delete(key);
      else next.add(key);
      return next;
    });

  const rows = table.getRowModel().rows.slice(0, painted);

  if (narrow) {
    // On a phone: one card per candidate with every figure the table has, labelled.
    return (
      <ol className="flex flex-col gap-2" aria-label="Ranked candidates">
        {rows.map((row) => {
          const r = row.original;
          const key = resultKey(r);
          const expanded = open.has(key);
          return (
            <li
              key={key}
              className={`rounded-plate border border-chart-line p-3 ${selectedKey === key ? 'bg-sounding-light/70' : 'bg-chart-raised'}`}
              onClick={() => onSelect(key)}
              data-testid="result-card"
            >
              <div className="flex items-start justify-between gap-2">
                <div className="flex min-w-0 gap-2">
                  <span className="font-bold text-ink-soft">{r.rank}.</span>
                  <CandidateName result={r} />
                </div>
                <RowActions result={r} expanded={expanded} onShortlist={onShortlist} onToggle={() => (toggle(key), onSelect(key))} />
              </div>
              <dl className="mt-2 grid grid-cols-2 gap-x-3 gap-y-1 text-sm">
                <dt className="text-xs text-ink-soft">Governed by</dt>
                <dd>
                  <ModeTag mode={r.governingMode} />
                </dd>
                <dt className="text-xs text-ink-soft">Safety factor / target</dt>
                <dd>
                  {r.safetyFactor.toFixed(2)} <span className="text-xs text-ink-faint">/ {r.targetSafetyFactor}</span>
                </dd>
                <dt className="text-xs text-ink-soft">Margin</dt>
                <dd>
                  <MarginCell margin={r.margin} />
                </dd>
                <dt className="text-xs text-ink-soft">Required t ({label('length')})</dt>
                <dd>
                  <RequiredThickness result={r} start />
                </dd>
                <dt className="text-xs text-ink-soft">Mass ({label('massPerArea')})</dt>
                <dd>{format('massPerArea', r.massPerArea, { unit: false })}</dd>
                {hull ? (
                  <>
                    <dt className="text-xs text-ink-soft">Weight / displacement</dt>
                    <dd>{r.weightToDisplacement === null ? '—' : r.weightToDisplacement.toFixed(2)}</dd>
                  </>
                ) : null}
                <dt className="text-xs text-ink-soft">Inputs confirmed</dt>
                <dd>
                  <InputsMark inputs={r.inputs} />
                </dd>
                <dt className="text-xs text-ink-soft">Warnings</dt>
                <dd>{r.warnings.length ? <span className="font-bold text-verdict-watch">⚠ {r.warnings.length}</span> : '—'}</dd>
              </dl>
              {expanded ? (
                <div className="mt-2">
                  <ModeBreakdown result={r} />
                </div>
              ) : null}
            </li>
          );
        })}
      </ol>
    );
  }

  return (
    <div className="overflow-x-auto" data-testid="ranked-table-box">
      <table className="w-full text-sm" aria-label="Ranked candidates">
        <thead className="border-b border-chart-line text-left">
          {table.getHeaderGroups().map((hg) => (
            <tr key={hg.id}>
              {hg.headers.map((h) => (
                <SortableHeader key={h.id} header={h} wrap numeric={!!(h.column.columnDef.meta as { numeric?: boolean } | undefined)?.numeric}>
                  {flexRender(h.column.columnDef.header, h.getContext())}
                </SortableHeader>
              ))}
              <th scope="col" className="px-2">
                <span className="sr-only">Actions</span>
              </th>
            </tr>
          ))}
        </thead>
        <tbody>
          {rows.map((row) => {
            const key = resultKey(row.original);
            const expanded = open.has(key);
            return (
              <Fragment key={key}>
                <tr
                  className={`cursor-pointer border-b border-chart-line/60 align-top ${selectedKey === key ? 'bg-sounding-light/70' : 'hover:bg-chart-deep/40'}`}
                  onClick={() => onSelect(key)}
                  aria-selected={selectedKey === key}
                >
                  {row.getVisibleCells().map((cell) => (
                    <td key={cell.id} className={`px-2 py-2 ${(cell.column.columnDef.meta as { numeric?: boolean } | undefined)?.numeric ? 'text-right' : ''}`}>
                      {flexRender(cell.column.columnDef.cell, cell.getContext())}
                    </td>
                  ))}
                  <td className="px-2 py-1.5">
                    <RowActions result={row.original} expanded={expanded} onShortlist={onShortlist} onToggle={() => (toggle(key), onSelect(key))} />
                  </td>
                </tr>
                {expanded ? (
                  <tr>
                    <td colSpan={row.getVisibleCells().length + 1} className="p-0">
                      <ModeBreakdown result={row.original} />
                    </td>
                  </tr>
                ) : null}
              </Fragment>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}

export const resultKey = (r: CandidateResult) => `${r.propertySetId ?? 'inline'}:${r.name}`;
