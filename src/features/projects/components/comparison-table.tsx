import type { ShortlistItemDto } from '@shared/schemas/projects';
import { MarginCell, ModeTag } from '@/components/failure-modes';
import { useUnits } from '@/lib/unit-system';
import { comparisonRows, type ComparisonCell } from '../shortlist-model';

function Cell({ cell }: { cell: ComparisonCell }) {
  if (cell.mode) return <ModeTag mode={cell.mode} />;
  if (cell.margin !== undefined) return <MarginCell margin={cell.margin} />;
  if (cell.warnings?.length) {
    return (
      <ul className="list-disc pl-4 text-left text-xs text-verdict-watch">
        {cell.warnings.map((w) => (
          <li key={w}>{w}</li>
        ))}
      </ul>
    );
  }
  return <>{cell.text}</>;
}

/** Candidates side by side: their data and how each fares in the shortlist's load case. */
export function ComparisonTable({ items }: { items: ShortlistItemDto[] }) {
  const { system } = useUnits();
  const rows = comparisonRows(items, system);
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-sm" aria-label="Candidates side by side">
        <thead className="border-b border-chart-line">
          <tr>
            <td className="py-1 pr-3" />
            {items.map((item, i) => (
              <th key={item.id} scope="col" className="min-w-[10rem] px-3 py-1 text-left align-bottom">
                <span className="text-xs text-ink-faint">#{i + 1}</span>
                <span className="block font-bold">{item.propertySet.material.name}</span>
                <span className="block text-xs font-normal text-ink-soft">{item.propertySet.condition}</span>
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {rows.map((row) => (
            <tr key={row.key} className="border-t border-chart-line/60 align-top">
              <th scope="row" className="whitespace-nowrap py-1.5 pr-3 text-left text-xs font-bold uppercase tracking-wide text-ink-soft">
                {row.label}
                {row.unit ? <span className="font-normal normal-case"> ({row.unit})</span> : null}
              </th>
              {row.cells.map((cell, i) => (
                <td key={items[i].id} className="px-3 py-1.5">
                  <Cell cell={cell} />
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
