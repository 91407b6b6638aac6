import { Fragment } from 'react';
import { IMPORT_COLUMNS, IMPORT_PER_VALUE_PARTS } from '@shared/schemas/library';
import { PROVENANCE_LABELS } from '@shared/schemas/provenance';
import { Panel, Tag } from '@/components/ui/states';
import { TEMPLATE_URL } from '../api/csv-import';
import { ColumnHeads } from '@/components/ui/column-heads';

/** The row's own columns (everything but the columns of one value). */
const ROW_COLUMNS = IMPORT_COLUMNS.filter((c) => !c.perValue);

/** A column name that may wrap after its underscores on a narrow screen, and nowhere else. */
function breakable(name: string) {
  return name.split('_').map((part, i, all) => (
    <Fragment key={i}>
      {part}
      {i < all.length - 1 ? (
        <>
          _<wbr />
        </>
      ) : null}
    </Fragment>
  ));
}

/** One line of a columns table: the name (or pattern), required or not, unit, what to enter. */
function ColumnRow({ name, required, unit, help }: { name: string; required: boolean; unit: string; help: string }) {
  return (
    <tr className="border-t border-chart-line/60 align-top">
      <th scope="row" className="py-1 pr-3 text-left font-normal">
        <span className="font-mono text-xs">{breakable(name)}</span>
        <span className={`block text-xs ${required ? 'font-bold text-ink-soft' : 'text-ink-faint'}`}>{required ? 'required' : 'optional'}</span>
      </th>
      <td className="whitespace-nowrap py-1 pr-3 text-xs">{unit}</td>
      <td className="py-1 text-xs text-ink-soft">{help}</td>
    </tr>
  );
}

const unitOf = (c: object) => ('unit' in c && typeof c.unit === 'string' ? c.unit : '');

/** The template's columns, read from the one column list: name, required or not, unit, what to enter. */
function ColumnsTable() {
  return (
    <table className="w-full text-sm" aria-label="Template columns">
      <ColumnHeads columns={['Column', 'Unit', 'What to enter']} />
      <tbody>
        {ROW_COLUMNS.map((c) => (
          <ColumnRow key={c.name} name={c.name} required={c.required} unit={unitOf(c)} help={c.help} />
        ))}
      </tbody>
    </table>
  );
}

/** The columns of one value, one line per kind, with the values each kind exists for. */
function PerValueTable() {
  const stems = (suffix: string) => IMPORT_COLUMNS.filter((c) => c.perValue?.suffix === suffix).map((c) => ({ key: c.perValue!.key, stem: c.name.slice(0, -suffix.length - 1) }));
  return (
    <table className="w-full text-sm" aria-label="Columns of one value">
      <ColumnHeads columns={['Column', 'Unit', 'What to enter']} />
      <tbody>
        {IMPORT_PER_VALUE_PARTS.map((part) => (
          <ColumnRow key={part.suffix} name={`<value>_${part.suffix}`} required={false} unit={unitOf(part)} help={part.help} />
        ))}
        <tr className="border-t border-chart-line/60 align-top">
          <th scope="row" className="py-1 pr-3 text-left text-xs font-normal">
            &lt;value&gt;
          </th>
          <td colSpan={2} className="py-1 text-xs text-ink-soft">
            {stems('status').map(({ key, stem }, i) => (
              <span key={key}>
                {i ? ', ' : ''}
                <span className="font-mono">{breakable(stem)}</span> ({PROVENANCE_LABELS[key].toLowerCase()})
              </span>
            ))}
            . Basis, test method and test temperature exist for the quantities, not for the service range or the lists of points.
          </td>
        </tr>
      </tbody>
    </table>
  );
}

/** Where to get the template, and what each of its columns takes. */
export function TemplatePanel() {
  return (
    <Panel title="The template">
      <div className="flex flex-col gap-3">
        <p className="text-sm">
          <a href={TEMPLATE_URL} download className="font-bold text-sounding underline">
            Download the template (CSV)
          </a>{' '}
          <Tag>two example rows, demo data</Tag>
        </p>
        <p className="text-xs text-ink-soft">
          Numbers are given in each column’s unit (it is also part of the column’s name) and converted to SI on import. Optional columns may be left out of the
          file.
        </p>
        <ColumnsTable />
        <h3 className="text-sm font-bold">Columns of one value</h3>
        <p className="text-xs text-ink-soft">
          The row’s basis, test method and test temperature apply to its strengths and yields, and its status to every value it has. Where one value differs, fill that
          value’s own column: <span className="font-mono">shear_yield_status</span> and <span className="font-mono">shear_yield_rule</span>, or{' '}
          <span className="font-mono">compressive_strength_test_method</span>. A blank cell takes the row’s; a value with its own status takes none of the row’s status
          columns.
        </p>
        <PerValueTable />
      </div>
    </Panel>
  );
}
