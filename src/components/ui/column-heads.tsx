import type { ReactNode } from 'react';

/** A column of a plain table: its heading, right-aligned when it holds numbers. */
export type ColumnHead = string | { label: ReactNode; numeric?: boolean; className?: string; title?: string };

/**
 * The heading row of Isobath's plain tables (small capitals, soft ink), one place for its look.
 * Tables that sort use TableView instead.
 */
export function ColumnHeads({ columns, className = '' }: { columns: ColumnHead[]; className?: string }) {
  return (
    <thead className={`text-left text-xs uppercase tracking-wide text-ink-soft ${className}`}>
      <tr>
        {columns.map((c, i) => {
          const col = typeof c === 'string' ? { label: c } : c;
          const pad = i < columns.length - 1 ? 'py-1 pr-3' : 'py-1';
          return (
            <th key={i} scope="col" title={col.title} className={`${pad} ${col.numeric ? 'text-right' : ''} ${col.className ?? ''}`}>
              {col.label}
            </th>
          );
        })}
      </tr>
    </thead>
  );
}

/** A right-aligned column of numbers. */
export const numeric = (label: ReactNode): ColumnHead => ({ label, numeric: true });

/** A plain (unsorted) table that scrolls sideways on a narrow screen: its label, headings and rows. */
export function PlainTable({ label, columns, children }: { label: string; columns: ColumnHead[]; children: ReactNode }) {
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-sm" aria-label={label}>
        <ColumnHeads columns={columns} />
        <tbody>{children}</tbody>
      </table>
    </div>
  );
}
