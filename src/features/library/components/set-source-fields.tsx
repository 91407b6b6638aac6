import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { FAMILIES, FAMILY_LABELS, REFERENCE_KINDS, type MaterialDto } from '@shared/schemas/catalogue';
import { SelectField, TextField, LabelledOptions } from '@/components/ui/field';
import { Spinner } from '@/components/ui/states';
import { useMaterials } from '../api/library-sets';
import { useReferences } from '../api/references';
import { REFERENCE_KIND_LABELS } from '../labels';
import { Fieldset, type SetEditorSectionProps } from './set-editor-fieldset';

/**
 * The property-set editor's material and source: an existing material or a new one, and an
 * existing reference, a new one or none yet.
 */

/** A row of radio buttons, one per choice, naming the group for assistive tech. */
function Choices<T extends string>({ label, name, current, onChange, options }: { label: string; name: string; current: T; onChange: (v: T) => void; options: [T, ReactNode][] }) {
  return (
    <div role="radiogroup" aria-label={label} className="flex flex-wrap gap-4">
      {options.map(([value, text]) => (
        <label key={value} className="flex items-center gap-1.5 text-sm">
          <input type="radio" name={name} value={value} checked={current === value} onChange={() => onChange(value)} />
          {text}
        </label>
      ))}
    </div>
  );
}

function materialOptions(materials: MaterialDto[]) {
  return FAMILIES.map((f) => ({ family: f, items: materials.filter((m) => m.family === f) })).filter((g) => g.items.length);
}

export function MaterialSection({ form, err }: SetEditorSectionProps) {
  const materials = useMaterials();
  const mode = form.watch('materialMode');
  return (
    <Fieldset legend="Material and condition">
      <Choices
        label="Material: existing or new"
        name="materialMode"
        current={mode}
        onChange={(v) => form.setValue('materialMode', v)}
        options={[['existing', 'Existing material'], ['new', 'New material']]}
      />
      {mode === 'existing' ? (
        materials.isPending ? (
          <Spinner label="Loading materials…" />
        ) : (
          <SelectField
            label="Material"
            error={err('materialId') ?? (materials.isError ? 'Could not load the materials; describe a new one or try again later' : undefined)}
            hint="Not in the list? Choose “New material”."
            {...form.register('materialId')}
          >
            <option value="">Choose a material…</option>
            {materialOptions(materials.data?.items ?? []).map((g) => (
              <optgroup key={g.family} label={FAMILY_LABELS[g.family]}>
                {g.items.map((m) => (
                  <option key={m.id} value={String(m.id)}>
                    {m.name}
                  </option>
                ))}
              </optgroup>
            ))}
          </SelectField>
        )
      ) : (
        <div className="grid gap-3 md:grid-cols-2">
          <TextField label="Material name" error={err('material.name')} hint="Generic name, no trade names (e.g. “cast acrylic”)" {...form.register('material.name')} />
          <SelectField label="Family" error={err('material.family')} {...form.register('material.family')}>
            <option value="">Choose a family…</option>
            <LabelledOptions values={FAMILIES} labels={FAMILY_LABELS} />
          </SelectField>
          <label className="flex items-center gap-2 text-sm">
            <input type="checkbox" {...form.register('material.transparent')} /> Transparent (a window material)
          </label>
          <TextField label="Description" error={err('material.description')} wrapperClassName="md:col-span-2" {...form.register('material.description')} />
        </div>
      )}
      <TextField label="Condition" error={err('condition')} hint="Form, temper, grade or test state, e.g. “cast sheet, annealed”" {...form.register('condition')} />
    </Fieldset>
  );
}

export function ReferenceSection({ form, err }: SetEditorSectionProps) {
  const references = useReferences('');
  const mode = form.watch('referenceMode');
  return (
    <Fieldset legend="Source">
      <Choices
        label="Reference: existing, new or none yet"
        name="referenceMode"
        current={mode}
        onChange={(v) => form.setValue('referenceMode', v)}
        options={[['existing', 'Existing reference'], ['new', 'New reference'], ['none', 'None yet']]}
      />
      {mode === 'existing' ? (
        references.isPending ? (
          <Spinner label="Loading references…" />
        ) : (
          <SelectField
            label="Reference"
            error={err('referenceId') ?? (references.isError ? 'Could not load the references; describe a new one or try again later' : undefined)}
            hint={
              <>
                Manage references and their documents under <Link to="/library/references" className="text-sounding underline">References</Link>.
              </>
            }
            {...form.register('referenceId')}
          >
            <option value="">Choose a reference…</option>
            {(references.data?.items ?? []).map((r) => (
              <option key={r.id} value={String(r.id)}>
                {r.title}
                {r.identifier ? ` — ${r.identifier}` : ''}
                {r.year ? ` (${r.year})` : ''}
              </option>
            ))}
          </SelectField>
        )
      ) : mode === 'new' ? (
        <div className="grid gap-3 md:grid-cols-2">
          <SelectField label="Kind" error={err('reference.kind')} {...form.register('reference.kind')}>
            <option value="">Choose a kind…</option>
            <LabelledOptions values={REFERENCE_KINDS} labels={REFERENCE_KIND_LABELS} />
          </SelectField>
          <TextField label="Title" error={err('reference.title')} {...form.register('reference.title')} />
          <TextField label="Authors or issuer" error={err('reference.authors')} {...form.register('reference.authors')} />
          <TextField label="Year" inputMode="numeric" error={err('reference.year')} {...form.register('reference.year')} />
          <TextField label="Identifier" error={err('reference.identifier')} hint="Standard number, DOI or report number" {...form.register('reference.identifier')} />
          <TextField label="Table or page" error={err('reference.location')} {...form.register('reference.location')} />
          <TextField label="Note" error={err('reference.note')} wrapperClassName="md:col-span-2" {...form.register('reference.note')} />
        </div>
      ) : (
        <p className="rounded-plate bg-brass-light px-3 py-2 text-sm text-brass">
          A draft may be saved without a reference, but nobody can approve it until it has one.
        </p>
      )}
    </Fieldset>
  );
}
