import { IMPORT_COLUMNS } from '@shared/schemas/library';
import { Panel, Tag } from '@/components/ui/states';
import { TEMPLATE_URL } from '../api/csv-import';
import { ColumnHeads } from '@/components/ui/column-heads';

/** The template's columns, read from the one column list: name, required or not, unit, what to enter. */
function ColumnsTable() {
  return (
    <table className="w-full text-sm" aria-label="Template columns">
      <ColumnHeads columns={['Column', 'Unit', 'What to enter']} />
      <tbody>
        {IMPORT_COLUMNS.map((c) => (
          <tr key={c.name} className="border-t border-chart-line/60 align-top">
            <th scope="row" className="py-1 pr-3 text-left font-normal">
              <span className="font-mono text-xs">{c.name}</span>
              <span className={`block text-xs ${c.required ? 'font-bold text-ink-soft' : 'text-ink-faint'}`}>{c.required ? 'required' : 'optional'}</span>
            </th>
            <td className="whitespace-nowrap py-1 pr-3 text-xs">{'unit' in c ? c.unit : ''}</td>
            <td className="py-1 text-xs text-ink-soft">{c.help}</td>
          </tr>
        ))}
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
          <Tag>two example rows</Tag>
        </p>
        <p className="text-xs text-ink-soft">Numbers are given in each column’s unit (it is also part of the column’s name) and converted to SI on import.</p>
        <ColumnsTable />
      </div>
    </Panel>
  );
}
