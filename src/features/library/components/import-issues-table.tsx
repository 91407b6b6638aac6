import { createColumnHelper, getPaginationRowModel } from '@tanstack/react-table';
import type { ImportIssueDto } from '@shared/schemas/library';
import { Button } from '@/components/ui/button';
import { TableView, useSortableTable } from '@/components/ui/table-view';

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

/** The row-level problems of a CSV file (row, column, problem), 25 to a page. */
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
