import type { ReactNode } from 'react';
import type { Header } from '@tanstack/react-table';

/** A column header that sorts on click or Enter/Space and tells assistive tech the order. */
export function SortableHeader<T>({
  header,
  children,
  numeric = false,
  wrap = false,
}: {
  header: Header<T, unknown>;
  children: ReactNode;
  numeric?: boolean;
  /** Let the title break over lines, for tables that must fit their box. */
  wrap?: boolean;
}) {
  const sorted = header.column.getIsSorted();
  const canSort = header.column.getCanSort();
  return (
    <th
      scope="col"
      aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : 'none'}
      className={`${wrap ? 'px-2 align-bottom' : 'whitespace-nowrap px-3'} py-2 text-xs font-bold uppercase tracking-wide text-ink-soft ${numeric ? 'text-right' : ''}`}
    >
      {canSort ? (
        <button type="button" onClick={header.column.getToggleSortingHandler()} className={`inline-flex items-center gap-1 uppercase hover:text-ink ${wrap ? 'text-left' : ''} ${wrap && numeric ? 'justify-end text-right' : ''}`}>
          {children}
          <span aria-hidden className="text-[10px]">{sorted === 'asc' ? '▲' : sorted === 'desc' ? '▼' : '↕'}</span>
        </button>
      ) : (
        children
      )}
    </th>
  );
}
