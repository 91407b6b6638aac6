import { QUANTITIES, QUANTITY_LABELS, type PropertySetDto, type Quantity } from '@shared/schemas/catalogue';
import { useUnits } from '@/lib/unit-system';
import { changedCells, type ValueCell } from '../changes';
import { QUANTITY_KIND } from '../draft-form';
import { VALUE_BASIS_LABELS } from '../labels';
import { ColumnHeads, numeric } from '@/components/ui/column-heads';
import { ValueStatusNote } from '@/components/inputs-mark';

type Row = Quantity | 'serviceTemperature.min' | 'serviceTemperature.max';

/** A cell that shows "before → after" when it changed since the previous version. */
function DiffCell({ now, before, changed, numeric = false }: { now: string; before?: string; changed: boolean; numeric?: boolean }) {
  return (
    <td className={`py-1 pr-3 ${numeric ? 'text-right' : ''} ${changed ? 'bg-brass-light' : ''}`} data-changed={changed || undefined}>
      {changed ? (
        <>
          <del className="text-ink-faint">
            <span className="sr-only">was </span>
            {before}
          </del>
          <span aria-hidden> → </span>
          <ins className="font-bold no-underline">
            <span className="sr-only">now </span>
            {now}
          </ins>
        </>
      ) : (
        <span className={numeric ? 'font-bold' : ''}>{now}</span>
      )}
    </td>
  );
}

/**
 * The values of a set, read-only, each with its status (confirmed where, recalled, derived, demo);
 * with `previous`, the cells that changed show before → after.
 */
export function SetValues({ set, previous = null }: { set: PropertySetDto; previous?: PropertySetDto | null }) {
  const { format } = useUnits();
  const changes = changedCells(set, previous);
  const show = (s: PropertySetDto, q: Quantity) => {
    const v = s[q];
    const kind = QUANTITY_KIND[q];
    // Exact, as entered: a reviewer checks the value itself, not a rounding of it (2.35 GPa, not 2.4).
    return v === null || v === undefined ? '—' : kind ? format(kind, v as number, { exact: true }) : String(Number((v as number).toPrecision(12)));
  };
  const detail = (s: PropertySetDto | null, q: Quantity, cell: Exclude<ValueCell, 'value'>) => {
    const d = s?.valueDetails[q];
    if (!d) return '—';
    if (cell === 'basis') return VALUE_BASIS_LABELS[d.basis];
    if (cell === 'testMethod') return d.testMethod ?? '—';
    return d.temperature === undefined ? '—' : format('temperature', d.temperature, { exact: true });
  };
  const rows = QUANTITIES.filter((q) => set[q] !== null || (previous && previous[q] !== null));
  const has = (row: Row, cell: ValueCell) => changes.get(row)?.has(cell) ?? false;

  return (
    <div className="overflow-x-auto">
      <table className="w-full text-sm" aria-label={previous ? 'Values against the previous version' : 'Values'}>
        <ColumnHeads columns={['Quantity', numeric('Value'), 'Basis', 'Test method', 'Tested at', 'Status']} />
        <tbody>
          {rows.map((q) => (
            <tr key={q} className="border-t border-chart-line/60">
              <th scope="row" className="py-1 pr-3 text-left font-normal">
                {QUANTITY_LABELS[q]}
              </th>
              <DiffCell numeric now={show(set, q)} before={previous ? show(previous, q) : undefined} changed={has(q, 'value')} />
              <DiffCell now={detail(set, q, 'basis')} before={detail(previous, q, 'basis')} changed={has(q, 'basis')} />
              <DiffCell now={detail(set, q, 'testMethod')} before={detail(previous, q, 'testMethod')} changed={has(q, 'testMethod')} />
              <DiffCell now={detail(set, q, 'temperature')} before={detail(previous, q, 'temperature')} changed={has(q, 'temperature')} />
              <td className="min-w-32 py-1">{set[q] === null || set[q] === undefined ? null : <ValueStatusNote provenance={set.provenance} field={q} />}</td>
            </tr>
          ))}
          {(['min', 'max'] as const).map((end) => (
            <tr key={end} className="border-t border-chart-line/60">
              <th scope="row" className="py-1 pr-3 text-left font-normal">
                Service temperature, {end === 'min' ? 'lowest' : 'highest'}
              </th>
              <DiffCell
                numeric
                now={format('temperature', set.serviceTemperature[end], { exact: true })}
                before={previous ? format('temperature', previous.serviceTemperature[end], { exact: true }) : undefined}
                changed={has(`serviceTemperature.${end}`, 'value')}
              />
              <td colSpan={3} />
              {end === 'min' ? (
                <td rowSpan={2} className="py-1 align-top">
                  <ValueStatusNote provenance={set.provenance} field="serviceTemperature" />
                </td>
              ) : null}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
