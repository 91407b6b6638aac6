import { useRef } from 'react';
import { useFieldArray } from 'react-hook-form';
import { QUANTITIES, QUANTITY_LABELS, VALUE_BASES, type Quantity } from '@shared/schemas/catalogue';
import { TextField, LabelledOptions } from '@/components/ui/field';
import { useUnits } from '@/lib/unit-system';
import { unitOf } from '@/lib/units';
import { QUANTITY_KIND, REQUIRED_QUANTITIES } from '../draft-form';
import { VALUE_BASIS_LABELS } from '../labels';
import { CellInput, CellSelect } from './cells';
import { Fieldset, type SetEditorSectionProps } from './set-editor-fieldset';
import { PlainTable } from '@/components/ui/column-heads';

/** The property-set editor's numbers: the values grid (value, basis, method, test temperature) and the dependence points. */

export function ValuesSection({ form, err }: SetEditorSectionProps) {
  const { system, label } = useUnits();
  const transparent = form.watch('material.transparent');
  return (
    <Fieldset legend="Values" hint={`Enter values in ${system === 'SI' ? 'SI' : 'US customary'} units (switch at the top right); they are saved in SI.`}>
      <PlainTable label="Values to enter" columns={['Quantity', { label: 'Value', className: 'w-32' }, { label: 'Basis', className: 'w-44' }, 'Test method', { label: `Tested at (${label('temperature')})`, className: 'w-28' }]}>
        {QUANTITIES.map((q: Quantity) => {
          const kind = QUANTITY_KIND[q];
          const unit = kind ? unitOf(kind, system).label : '';
          const name = QUANTITY_LABELS[q];
          const required = REQUIRED_QUANTITIES.includes(q);
          const lower = name.charAt(0).toLowerCase() + name.slice(1);
          return (
            <tr key={q} className="border-t border-chart-line/60 align-top">
              <th scope="row" className="py-1.5 pr-3 text-left font-normal">
                {name} {unit ? <span className="text-ink-faint">({unit})</span> : null}
                {required ? <span className="ml-1 text-xs text-ink-faint">required</span> : null}
                {q === 'luminousTransmittance' && !transparent && form.watch('materialMode') === 'new' ? (
                  <span className="block text-xs text-ink-faint">for transparent materials</span>
                ) : null}
              </th>
              <td className="py-1.5 pr-3">
                <CellInput label={name} inputMode="decimal" error={err(q)} {...form.register(q)} />
              </td>
              <td className="py-1.5 pr-3">
                <CellSelect label={`Basis of ${lower}`} error={err(`valueDetails.${q}.basis`)} {...form.register(`valueDetails.${q}.basis`)}>
                  <option value="">—</option>
                  <LabelledOptions values={VALUE_BASES} labels={VALUE_BASIS_LABELS} />
                </CellSelect>
              </td>
              <td className="py-1.5 pr-3">
                <CellInput label={`Test method of ${lower}`} placeholder="e.g. ASTM D638" error={err(`valueDetails.${q}.testMethod`)} {...form.register(`valueDetails.${q}.testMethod`)} />
              </td>
              <td className="py-1.5">
                <CellInput label={`Test temperature of ${lower}`} inputMode="decimal" error={err(`valueDetails.${q}.temperature`)} {...form.register(`valueDetails.${q}.temperature`)} />
              </td>
            </tr>
          );
        })}
      </PlainTable>
      <div className="grid max-w-md grid-cols-2 gap-3">
        <TextField label="Service temperature from" unit={label('temperature')} inputMode="decimal" error={err('serviceTemperature.min')} {...form.register('serviceTemperature.min')} />
        <TextField label="Service temperature to" unit={label('temperature')} inputMode="decimal" error={err('serviceTemperature.max')} {...form.register('serviceTemperature.max')} />
      </div>
    </Fieldset>
  );
}

type PointsName = 'temperatureFactors' | 'sustainedLoadFactors' | 'cyclicFactors';
const POINTS: Record<PointsName, { title: string; x: 'temperature' | 'hours' | 'cycles'; xLabel: (temp: string) => string; blank: () => Record<string, string> }> = {
  temperatureFactors: { title: 'Strength vs temperature', x: 'temperature', xLabel: (t) => `Temperature (${t})`, blank: () => ({ temperature: '', factor: '' }) },
  sustainedLoadFactors: { title: 'Strength vs sustained load', x: 'hours', xLabel: () => 'Hours at load', blank: () => ({ hours: '', factor: '' }) },
  cyclicFactors: { title: 'Strength vs pressure cycles', x: 'cycles', xLabel: () => 'Cycles', blank: () => ({ cycles: '', factor: '' }) },
};

function PointsTable({ form, name, err }: SetEditorSectionProps & { name: PointsName }) {
  const { label } = useUnits();
  const spec = POINTS[name];
  const { fields, append, remove } = useFieldArray({ control: form.control, name } as never) as unknown as {
    fields: { id: string }[];
    append: (v: Record<string, string>) => void;
    remove: (i: number) => void;
  };
  const addRef = useRef<HTMLButtonElement>(null);
  const xLabel = spec.xLabel(label('temperature'));
  return (
    <div className="flex flex-col gap-2">
      <h3 className="text-sm font-bold">{spec.title}</h3>
      {fields.length ? (
        <table className="text-sm" aria-label={spec.title}>
          <thead className="text-left text-xs uppercase tracking-wide text-ink-soft">
            <tr>
              <th scope="col" className="pr-2">{xLabel}</th>
              <th scope="col" className="pr-2">Strength factor</th>
              <th scope="col">
                <span className="sr-only">Remove</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {fields.map((f, i) => (
              <tr key={f.id} className="align-top">
                <td className="py-1 pr-2">
                  <CellInput label={`${xLabel}, point ${i + 1}`} inputMode="decimal" error={err(`${name}.${i}.${spec.x}`)} {...form.register(`${name}.${i}.${spec.x}` as never)} />
                </td>
                <td className="py-1 pr-2">
                  <CellInput label={`Strength factor, point ${i + 1}`} inputMode="decimal" error={err(`${name}.${i}.factor`)} {...form.register(`${name}.${i}.factor` as never)} />
                </td>
                <td className="py-1">
                  <button
                    type="button"
                    className="rounded-plate px-2 py-1 text-xs text-ink-soft hover:bg-chart-deep hover:text-verdict-fail"
                    aria-label={`Remove point ${i + 1} of ${spec.title.toLowerCase()}`}
                    onClick={() => {
                      remove(i);
                      addRef.current?.focus();
                    }}
                  >
                    Remove
                  </button>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      ) : (
        <p className="text-xs text-ink-soft">No points: evaluations will say this set has no such data.</p>
      )}
      {err(name) ? <p role="alert" className="text-xs font-bold text-verdict-fail">{err(name)}</p> : null}
      <div>
        <button ref={addRef} type="button" className="text-sm font-bold text-sounding hover:underline" onClick={() => append(spec.blank())}>
          + Add point
        </button>
      </div>
    </div>
  );
}

export function DependenceSection({ form, err }: SetEditorSectionProps) {
  return (
    <Fieldset legend="Dependence data" hint="Strength factor: the multiplier on the strengths above (1 at the test condition).">
      <div className="grid gap-6 lg:grid-cols-3">
        <PointsTable form={form} name="temperatureFactors" err={err} />
        <PointsTable form={form} name="sustainedLoadFactors" err={err} />
        <PointsTable form={form} name="cyclicFactors" err={err} />
      </div>
    </Fieldset>
  );
}
