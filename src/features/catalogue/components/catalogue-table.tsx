import { useMemo, useState } from 'react';
import { Link } from 'react-router-dom';
import {
  createColumnHelper,
  flexRender,
  getCoreRowModel,
  getSortedRowModel,
  useReactTable,
  type SortingState,
} from '@tanstack/react-table';
import { FAMILY_LABELS, type PropertySetDto, type ReferenceDto } from '@shared/schemas/catalogue';
import { useUnits } from '@/lib/unit-system';
import { SortableHeader } from '@/components/ui/sortable-header';

const col = createColumnHelper<PropertySetDto>();

/** "UFC 4-159-01N" for a standard; "Ashby & Jones, 2006" style for the rest. */
export function shortCitation(ref: ReferenceDto | null): string {
  if (!ref) return '—';
  if (ref.kind === 'standard' && ref.identifier) return ref.identifier.replace(/\s*\(.*\)\s*$/, '');
  const lead = ref.authors?.split(/[,;]/)[0]?.trim() || ref.title;
  return ref.year ? `${lead}, ${ref.year}` : lead;
}

export function CatalogueTable({ items }: { items: PropertySetDto[] }) {
  const { format, label } = useUnits();
  const [sorting, setSorting] = useState<SortingState>([]);

  const columns = useMemo(
    () => [
      col.accessor((r) => r.material.name, {
        id: 'material',
        header: 'Material and condition',
        cell: (c) => (
          <div>
            <Link to={`/materials/${c.row.original.material.id}?set=${c.row.original.id}`} className="font-bold text-sounding hover:underline">
              {c.getValue()}
            </Link>
            <div className="text-xs text-ink-soft">{c.row.original.condition}</div>
          </div>
        ),
      }),
      col.accessor((r) => FAMILY_LABELS[r.material.family], { id: 'family', header: 'Family' }),
      col.accessor((r) => r.material.transparent, {
        id: 'transparent',
        header: 'Clear',
        cell: (c) => (c.getValue() ? 'yes' : '—'),
      }),
      col.accessor('density', { header: `Density (${label('density')})`, cell: (c) => format('density', c.getValue(), { unit: false }), meta: { numeric: true } }),
      col.accessor('youngsModulus', { header: `E (${label('modulus')})`, cell: (c) => format('modulus', c.getValue(), { unit: false }), meta: { numeric: true } }),
      col.accessor('tensileStrength', { header: `Tensile (${label('stress')})`, cell: (c) => format('stress', c.getValue(), { unit: false }), meta: { numeric: true } }),
      col.accessor('compressiveStrength', { header: `Compressive (${label('stress')})`, cell: (c) => format('stress', c.getValue(), { unit: false }), meta: { numeric: true } }),
      col.accessor('shearStrength', { header: `Shear (${label('stress')})`, cell: (c) => format('stress', c.getValue(), { unit: false }), meta: { numeric: true } }),
      col.accessor((r) => r.serviceTemperature.min, {
        id: 'service',
        header: `Service (${label('temperature')})`,
        cell: (c) => `${format('temperature', c.row.original.serviceTemperature.min, { unit: false })} to ${format('temperature', c.row.original.serviceTemperature.max, { unit: false })}`,
      }),
      col.accessor((r) => shortCitation(r.reference), {
        id: 'source',
        header: 'Source',
        cell: (c) => <span className="text-xs text-ink-soft" title={c.row.original.reference?.title}>{c.getValue()}</span>,
      }),
    ],
    [format, label],
  );

  const table = useReactTable({
    data: items,
    columns,
    state: { sorting },
    onSortingChange: setSorting,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
  });

  return (
    <div className="overflow-x-auto rounded-plate bg-chart-raised shadow-plate">
      <table className="w-full text-sm" aria-label="Property sets">
        <thead className="border-b border-chart-line text-left">
          {table.getHeaderGroups().map((hg) => (
            <tr key={hg.id}>
              {hg.headers.map((h) => (
                <SortableHeader key={h.id} header={h} numeric={!!(h.column.columnDef.meta as { numeric?: boolean } | undefined)?.numeric}>
                  {flexRender(h.column.columnDef.header, h.getContext())}
                </SortableHeader>
              ))}
            </tr>
          ))}
        </thead>
        <tbody>
          {table.getRowModel().rows.map((row) => (
            <tr key={row.id} className="border-b border-chart-line/60 last:border-0 hover:bg-chart-deep/40">
              {row.getVisibleCells().map((cell) => (
                <td key={cell.id} className={`px-3 py-2 align-top ${(cell.column.columnDef.meta as { numeric?: boolean } | undefined)?.numeric ? 'text-right' : ''}`}>
                  {flexRender(cell.column.columnDef.cell, cell.getContext())}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
