import { useState } from 'react';
import {
  flexRender,
  getCoreRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnDef,
  type SortingState,
  type Table,
  type TableOptions,
} from '@tanstack/react-table';
import { SortableHeader } from './sortable-header';

const isNumeric = (meta: unknown) => !!(meta as { numeric?: boolean } | undefined)?.numeric;

/** A react-table with click- and keyboard-sortable columns; extra options (paging…) pass through. */
// Column value types differ per column, hence `any` (as react-table's own examples do).
export function useSortableTable<T>(data: T[], columns: ColumnDef<T, any>[], extra: Partial<TableOptions<T>> = {}): Table<T> {
  const [sorting, setSorting] = useState<SortingState>([]);
  return useReactTable({
    data,
    columns,
    state: { sorting },
    onSortingChange: setSorting,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    ...extra,
  });
}

/**
 * Renders a react-table: sortable headers that say their order to assistive tech, numeric
 * columns (meta.numeric) right-aligned, the current page of rows.
 */
export function TableView<T>({ table, label, rowClassName = '', dense = false }: { table: Table<T>; label: string; rowClassName?: string; dense?: boolean }) {
  return (
    <table className="w-full text-sm" aria-label={label}>
      <thead className="border-b border-chart-line text-left">
        {table.getHeaderGroups().map((hg) => (
          <tr key={hg.id}>
            {hg.headers.map((h) => (
              <SortableHeader key={h.id} header={h} numeric={isNumeric(h.column.columnDef.meta)}>
                {flexRender(h.column.columnDef.header, h.getContext())}
              </SortableHeader>
            ))}
          </tr>
        ))}
      </thead>
      <tbody>
        {table.getRowModel().rows.map((row) => (
          <tr key={row.id} className={`border-b border-chart-line/60 last:border-0 ${rowClassName}`}>
            {row.getVisibleCells().map((cell) => (
              <td key={cell.id} className={`px-3 ${dense ? 'py-1' : 'py-2'} align-top ${isNumeric(cell.column.columnDef.meta) ? 'text-right tabular-nums' : ''}`}>
                {flexRender(cell.column.columnDef.cell, cell.getContext())}
              </td>
            ))}
          </tr>
        ))}
      </tbody>
    </table>
  );
}
