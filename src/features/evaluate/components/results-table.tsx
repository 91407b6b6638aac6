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
    <div className="grid gap-3 bg-chart px-4 py-3 text-sm md:grid-cols-[2fr_1fr]">
      <ModesTable result={result} />
      <div className="flex flex-col gap-2">
        <SizingSummary result={result} />
        <p className="text-xs font-bold uppercase tracking-wide text-ink-soft">Warnings</p>
        {result.warnings.length ? (
          <ul className="mt-1 list-disc pl-4 text-xs text-verdict-watch">
            {result.warnings.map((w) => (
              <li key={w}>{w}</li>
            ))}
          </ul>
        ) : (
          <p className="mt-1 text-xs text-ink-soft">None for this load case.</p>
        )}
        <p className="mt-2 text-xs text-ink-soft">
          {factorsText(result.factors, (c) => format('temperature', c))}
        </p>
      </div>
    </div>
  );
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
  const [sorting, setSorting] = useState<SortingState>([]);
  const [open, setOpen] = useState<Set<string>>(new Set());
  const data = useMemo(() => results.map((r, i) => ({ ...r, rank: i + 1 })), [results]);

  const columns = useMemo(
    () => [
      col.accessor('rank', { header: '#', meta: { numeric: true } }),
      col.accessor('name', {
        header: 'Candidate',
        cell: (c) => {
          // Catalogue names read "Material (condition)": show the condition on its own line.
          const name = c.getValue();
          const uncovered = c.row.original.coverage === 'not-covered';
          const { material: head, condition: tail } = c.row.original.propertySetId ? splitCandidateName(name) : { material: name, condition: '' };
          return (
            <div className="min-w-[13rem] max-w-[20rem]">
              {c.row.original.propertySetId ? (
                <Link to={`/sets/${c.row.original.propertySetId}`} className="font-bold text-sounding hover:underline" onClick={(e) => e.stopPropagation()}>
                  {head}
                </Link>
              ) : (
                <span className="font-bold">{head}</span>
              )}
              {tail ? <div className="text-xs text-ink-soft">{tail}</div> : null}
              {uncovered ? <div className="text-xs font-bold text-verdict-fail">Not covered for human occupancy</div> : null}
            </div>
          );
        },
      }),
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
        cell: (c) => (c.row.original.requiredThickness === null ? 'none suffices' : format('length', c.row.original.requiredThickness, { unit: false })),
        meta: { numeric: true },
      }),
      col.accessor((r) => (r.sizedBy === null ? '' : r.sizedBy.kind === 'mode' ? r.sizedBy.mode : 'table'), {
        id: 'sizedBy',
        header: 'Sized by',
        cell: (c) => {
          const s = c.row.original.sizedBy;
          if (s === null) return <span className="text-ink-faint">—</span>;
          return s.kind === 'mode' ? <ModeTag mode={s.mode} /> : <span className="text-xs font-bold text-sounding" title={s.name}>Rating table</span>;
        },
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
              header: 'Weight / displacement',
              cell: (c) => (c.row.original.weightToDisplacement === null ? '—' : c.row.original.weightToDisplacement.toFixed(2)),
              meta: { numeric: true },
            }),
          ]
        : []),
      col.accessor((r) => r.warnings.length, {
        id: 'warnings',
        header: 'Warnings',
        cell: (c) => (c.getValue() ? <span className="font-bold text-verdict-watch">⚠ {c.getValue()}</span> : <span className="text-ink-faint">—</span>),
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

  return (
    <div className="overflow-x-auto">
      <table className="w-full text-sm" aria-label="Ranked candidates">
        <thead className="border-b border-chart-line text-left">
          {table.getHeaderGroups().map((hg) => (
            <tr key={hg.id}>
              {hg.headers.map((h) => (
                <SortableHeader key={h.id} header={h} numeric={!!(h.column.columnDef.meta as { numeric?: boolean } | undefined)?.numeric}>
                  {flexRender(h.column.columnDef.header, h.getContext())}
                </SortableHeader>
              ))}
              <th className="sticky right-0 bg-chart-raised px-2">
                <span className="sr-only">Actions</span>
              </th>
            </tr>
          ))}
        </thead>
        <tbody>
          {table.getRowModel().rows.slice(0, painted).map((row) => {
            const key = resultKey(row.original);
            const expanded = open.has(key);
            return (
              <Fragment key={key}>
                <tr
                  className={`cursor-pointer border-b border-chart-line/60 ${selectedKey === key ? 'bg-sounding-light/70' : 'hover:bg-chart-deep/40'}`}
                  onClick={() => onSelect(key)}
                  aria-selected={selectedKey === key}
                >
                  {row.getVisibleCells().map((cell) => (
                    <td key={cell.id} className={`px-3 py-2 ${(cell.column.columnDef.meta as { numeric?: boolean } | undefined)?.numeric ? 'text-right' : ''}`}>
                      {flexRender(cell.column.columnDef.cell, cell.getContext())}
                    </td>
                  ))}
                  {/* Kept in view at the right edge while the wide table scrolls sideways. */}
                  <td className={`sticky right-0 whitespace-nowrap px-2 ${selectedKey === key ? 'bg-sounding-light' : 'bg-chart-raised'}`}>
                    {onShortlist && row.original.propertySetId !== undefined ? (
                      <button
                        type="button"
                        aria-label={`Add ${row.original.name} to a shortlist`}
                        onClick={(e) => {
                          e.stopPropagation();
                          onShortlist(row.original);
                        }}
                        className="mr-1 rounded-plate border border-chart-line px-2 py-0.5 text-xs font-bold text-sounding hover:bg-chart-deep"
                      >
                        + Shortlist
                      </button>
                    ) : null}
                    <button
                      type="button"
                      aria-expanded={expanded}
                      aria-label={`${expanded ? 'Hide' : 'Show'} modes of ${row.original.name}`}
                      onClick={(e) => {
                        e.stopPropagation();
                        toggle(key);
                        onSelect(key);
                      }}
                      className="rounded-plate px-2 py-0.5 text-xs font-bold text-sounding hover:bg-chart-deep"
                    >
                      {expanded ? 'Less' : 'Modes'}
                    </button>
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
