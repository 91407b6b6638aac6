import { PROVENANCE_KEYS, PROVENANCE_LABELS, VALUE_STATUSES, VALUE_STATUS_LABELS } from '@shared/schemas/provenance';
import { CellInput, CellSelect } from './cells';
import { Fieldset, type SetEditorSectionProps } from './set-editor-fieldset';
import { PlainTable } from '@/components/ui/column-heads';
import { LabelledOptions } from '@/components/ui/field';

/**
 * The status of each value: not said (recalled), confirmed with where the source shows it,
 * derived with its rule, or demo. A claimed confirmation is checked by the set's reviewer, and
 * approving the set records who confirmed it and who approved it.
 */
export function StatusSection({ form, err }: SetEditorSectionProps) {
  return (
    <Fieldset
      legend="Status of each value"
      hint="Confirmed: give the table, page, figure or clause of the cited source (or another public source, named). Derived: give the rule. The reviewer checks each claim before approving."
    >
      <PlainTable label="Status of each value" columns={['Value', { label: 'Status', className: 'w-44' }, 'Location, or rule', 'Other source (when not the reference)']}>
        {PROVENANCE_KEYS.map((k) => {
          const name = PROVENANCE_LABELS[k];
          const status = form.watch(`provenance.${k}.status`);
          const lower = name.charAt(0).toLowerCase() + name.slice(1);
          return (
            <tr key={k} className="border-t border-chart-line/60 align-top">
              <th scope="row" className="py-1.5 pr-3 text-left font-normal">
                {name}
              </th>
              <td className="py-1.5 pr-3">
                <CellSelect label={`Status of ${lower}`} error={err(`provenance.${k}.status`)} {...form.register(`provenance.${k}.status`)}>
                  <option value="">not said (recalled)</option>
                  <LabelledOptions values={VALUE_STATUSES} labels={VALUE_STATUS_LABELS} />
                </CellSelect>
              </td>
              <td className="py-1.5 pr-3">
                {status === 'derived' ? (
                  <CellInput label={`Rule of ${lower}`} placeholder="e.g. tensile yield/√3 (von Mises)" error={err(`provenance.${k}.rule`)} {...form.register(`provenance.${k}.rule`)} />
                ) : (
                  <CellInput label={`Location of ${lower}`} placeholder="e.g. Table 3-1, p. 12" error={err(`provenance.${k}.location`)} {...form.register(`provenance.${k}.location`)} />
                )}
              </td>
              <td className="py-1.5">
                <CellInput label={`Other source of ${lower}`} error={err(`provenance.${k}.source`)} {...form.register(`provenance.${k}.source`)} />
              </td>
            </tr>
          );
        })}
      </PlainTable>
    </Fieldset>
  );
}
