import { useMemo } from 'react';
import { Link } from 'react-router-dom';
import { createColumnHelper } from '@tanstack/react-table';
import { FAMILY_LABELS, type PropertySetDto, type ReferenceDto } from '@shared/schemas/catalogue';
import { useUnits } from '@/lib/unit-system';
import { TableView, useSortableTable } from '@/components/ui/table-view';

const col = createColumnHelper<PropertySetDto>();

/** "UFC 4-159-01N" for a standard; "Ashby & Jones, 2006" style for the rest. */
export function shortCitation(ref: ReferenceDto | null): string {
  if (!ref) return '—';
  if (ref.kind === 'standard' && ref.identifier) return ref.identifier.replace(/\s*\(.*\)\s*$/, '');
  const lead = ref.authors?.split(/[,;]/)[0]?.trim() || ref.title;
  return ref.year ? `${lead}, ${ref.year}` : lead;
}

export function CatalogueTable({ items, requiredThickness }: { items: PropertySetDto[]; requiredThickness?: ReadonlyMap<number, number | null> }) {
  const { format, label } = useUnits();

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
      ...(requiredThickness
        ? [
            col.accessor((r) => requiredThickness.get(r.id) ?? Number.POSITIVE_INFINITY, {
              id: 'requiredThickness',
              header: `Required t (${label('length')})`,
              cell: (c) => <span className="font-bold" data-testid="usable-thickness">{format('length', c.getValue(), { unit: false })}</span>,
              meta: { numeric: true },
            }),
          ]
        : []),
      col.accessor((r) => shortCitation(r.reference), {
        id: 'source',
        header: 'Source',
        cell: (c) => <span className="text-xs text-ink-soft" title={c.row.original.reference?.title}>{c.getValue()}</span>,
      }),
    ],
    [format, label, requiredThickness],
  );

  const table = useSortableTable(items, columns);

  return (
    <div className="overflow-x-auto rounded-plate bg-chart-raised shadow-plate">
      <TableView table={table} label="Property sets" rowClassName="hover:bg-chart-deep/40" />
    </div>
  );
}
