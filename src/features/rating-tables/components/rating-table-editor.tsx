import { useRef, useState } from 'react';
import { get, useForm, type FieldErrors } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { RatingTableDraftInput } from '@shared/schemas/rating-tables';
import { RATING_GEOMETRIES, RATING_GEOMETRY_LABELS, RATIO_LABEL } from '@shared/schemas/rating-tables';
import { StaleBanner } from '@/components/stale-banner';
import { SelectField, TextField, LabelledOptions } from '@/components/ui/field';
import { FormError } from '@/components/ui/form-error';
import { TextAreaField } from '@/components/ui/text-area';
import { Button, SubmitButton } from '@/components/ui/button';
import { ApiError, isStale } from '@/lib/api-client';
import { setServerErrors } from '@/lib/field-errors';
import { editorFieldLabel, editorPathFor, ENTRY_UNITS, ratingDraftFormSchema, resizeGrid, type EditorState } from '../editor-model';
import { ratingCsvTemplateUrl, readRatingCsv } from '../api/rating-tables';

interface Option {
  id: number;
  label: string;
}

/** Every message at or below `path` in react-hook-form's nested errors, by dotted path (an array's own error sits on "root"). */
function messagesUnder(errors: FieldErrors, path: string): [string, string][] {
  const out: [string, string][] = [];
  const walk = (node: unknown, at: string) => {
    if (!node || typeof node !== 'object') return;
    const { message, type: _type, ref: _ref, types: _types, ...children } = node as Record<string, unknown>;
    if (typeof message === 'string') out.push([at, message]);
    for (const [key, child] of Object.entries(children)) walk(child, key === 'root' ? at : `${at}.${key}`);
  };
  walk(get(errors, path), path);
  return out;
}

/**
 * The draft editor: what the table is for (material grade, sets covered, geometry, angles,
 * service limits), its citation, and its grid, typed or read from a CSV file.
 */
export function RatingTableEditor({
  materialId,
  initial,
  references,
  sets,
  onSave,
  onReload,
}: {
  materialId: number;
  initial: EditorState;
  references: Option[];
  /** The material's property-set lineages (id = lineage id). */
  sets: Option[];
  /** Sends the checked draft; a refusal comes back onto the form. */
  onSave: (draft: RatingTableDraftInput) => Promise<unknown>;
  /** Loads the table as saved now (after someone else saved it). */
  onReload?: () => void;
}) {
  const form = useForm<EditorState, unknown, RatingTableDraftInput>({ resolver: zodResolver(ratingDraftFormSchema(materialId)), defaultValues: initial });
  const { register, formState } = form;
  const s = form.watch();
  const [stale, setStale] = useState<ApiError | null>(null);
  const [csvNote, setCsvNote] = useState<string | null>(null);
  const fileRef = useRef<HTMLInputElement>(null);
  const err = (path: string) => (get(formState.errors, path) as { message?: string } | undefined)?.message;
  const dataErrors = messagesUnder(formState.errors, 'content.data');
  /** Replaces whole parts of the editor (rows and columns added, a grid read from a file). */
  const change = (patch: Partial<EditorState>) => {
    for (const [key, value] of Object.entries(patch)) form.setValue(key as keyof EditorState, value as never, { shouldDirty: true });
  };
  const ratio = RATIO_LABEL[s.geometry];
  const unitFactor = ENTRY_UNITS[s.unit];

  const save = form.handleSubmit(async (draft) => {
    setStale(null);
    try {
      await onSave(draft);
    } catch (e) {
      if (isStale(e) && onReload) setStale(e);
      else setServerErrors(form.setError, e, editorFieldLabel, editorPathFor);
    }
  });

  const loadCsv = async (file: File) => {
    setCsvNote('Reading the file…');
    try {
      const { data } = await readRatingCsv(file, s.form);
      const fmt = (pa: number) => String(Number((pa / unitFactor).toPrecision(8)));
      if (data.form === 'minimum-ratio') {
        change({ pressures: data.pressures.map(fmt), temperatures: data.temperatures.map(String), cells: data.ratios.map((row) => row.map((r) => (r === null ? '' : String(r)))) });
      } else {
        change({ ratios: data.ratios.map(String), criticalPressures: data.criticalPressures.map(fmt) });
      }
      setCsvNote(`Read ${data.form === 'minimum-ratio' ? data.pressures.length : data.ratios.length} rows from ${file.name}. Check them, then save the draft.`);
    } catch (e) {
      const fields = e instanceof ApiError ? Object.entries(e.fields).map(([k, v]) => `${k}: ${v}`) : [];
      setCsvNote(`${e instanceof Error ? e.message : 'The file could not be read.'} ${fields.slice(0, 20).join(' · ')}`);
    }
  };

  return (
    <form
      aria-label="Rating table draft"
      noValidate
      onSubmit={save}
      className="flex flex-col gap-4"
    >
      <div className="grid gap-3 md:grid-cols-2">
        <TextField label="Name" {...register('name')} error={err('content.name')} />
        <SelectField label="Geometry" {...register('geometry')} error={err('content.geometry')}>
          <LabelledOptions values={RATING_GEOMETRIES} labels={RATING_GEOMETRY_LABELS} />
        </SelectField>
        {s.geometry !== 'flat-disc' ? (
          <div className="grid grid-cols-2 gap-2">
            <TextField label="Smallest included angle" unit="°" inputMode="decimal" {...register('angleMin')} error={err('content.includedAngle.min') ?? err('content.includedAngle')} />
            <TextField label="Largest included angle" unit="°" inputMode="decimal" {...register('angleMax')} error={err('content.includedAngle.max')} />
          </div>
        ) : null}
        <TextField label="Material grade" {...register('grade')} error={err('content.grade')} hint="In words: which material the table holds for" />
        <div className="grid grid-cols-2 gap-2">
          <TextField label="Data support up to" unit="h" inputMode="decimal" {...register('limitHours')} error={err('content.limits.sustainedHours')} hint="Sustained load; empty: no limit stated" />
          <TextField label="… and up to" unit="cycles" inputMode="decimal" {...register('limitCycles')} error={err('content.limits.cycles')} />
        </div>
        <SelectField label="Reference" {...register('referenceId')} error={err('referenceId')} hint="Needed before it can be published">
          <option value="">None yet</option>
          {references.map((r) => (
            <option key={r.id} value={r.id}>
              {r.label}
            </option>
          ))}
        </SelectField>
      </div>

      <fieldset className="flex flex-col gap-1">
        <legend className="text-xs font-bold uppercase tracking-wide text-ink-soft">Property sets it covers</legend>
        <p className="text-xs text-ink-faint">None ticked: every set of the material.</p>
        {sets.map((o) => (
          <label key={o.id} className="flex items-center gap-2 text-sm">
            <input
              type="checkbox"
              checked={s.coversLineageIds.includes(o.id)}
              onChange={(e) => change({ coversLineageIds: e.target.checked ? [...s.coversLineageIds, o.id] : s.coversLineageIds.filter((x) => x !== o.id) })}
            />
            {o.label}
          </label>
        ))}
        {err('coversLineageIds') ? <p className="text-xs font-bold text-verdict-fail">{err('coversLineageIds')}</p> : null}
      </fieldset>

      <TextAreaField label="Note" {...register('note')} hint="How each value was taken from the source: [pub], [memory], interpolated or inferred" rows={3} />

      <fieldset className="flex flex-col gap-2">
        <legend className="text-xs font-bold uppercase tracking-wide text-ink-soft">Grid</legend>
        <div className="flex flex-wrap items-end gap-3">
          <SelectField label="Form" {...register('form')}>
            <option value="minimum-ratio">Minimum {ratio} against pressure and temperature</option>
            <option value="critical-pressure">Short-term critical pressure against {ratio}, with conversion factors</option>
          </SelectField>
          <SelectField label="Pressures entered in" {...register('unit')}>
            {Object.keys(ENTRY_UNITS).map((u) => (
              <option key={u}>{u}</option>
            ))}
          </SelectField>
          <input ref={fileRef} type="file" accept=".csv,text/csv" className="hidden" onChange={(e) => e.target.files?.[0] && void loadCsv(e.target.files[0])} aria-label="CSV file with the grid" />
          <Button tone="quiet" onClick={() => fileRef.current?.click()}>
            Fill from CSV…
          </Button>
          <a className="text-xs text-sounding underline" href={ratingCsvTemplateUrl(s.form)}>
            CSV header
          </a>
        </div>
        {csvNote ? (
          <p role="status" className="text-xs text-ink-soft">
            {csvNote}
          </p>
        ) : null}
        {s.form === 'minimum-ratio' ? (
          <div className="overflow-x-auto">
            <table className="text-sm" aria-label="Grid: minimum thickness ratio">
              <thead>
                <tr>
                  <th className="pr-2 text-left text-xs text-ink-soft">Pressure ({s.unit}) ↓ · temperature (°C) →</th>
                  {s.temperatures.map((_, j) => (
                    <th key={j} className="pr-1">
                      <input
                        aria-label={`Temperature of column ${j + 1} (°C)`}
                        className={`w-20 rounded-plate border px-1 py-0.5 text-right ${err(`content.data.temperatures.${j}`) || err('content.data.temperatures') ? 'border-verdict-fail' : 'border-chart-line'}`}
                        {...register(`temperatures.${j}`)}
                      />
                    </th>
                  ))}
                </tr>
              </thead>
              <tbody>
                {s.pressures.map((_, i) => (
                  <tr key={i}>
                    <td className="pr-2">
                      <input
                        aria-label={`Pressure of row ${i + 1} (${s.unit})`}
                        className={`w-24 rounded-plate border px-1 py-0.5 text-right ${err(`content.data.pressures.${i}`) || err('content.data.pressures') ? 'border-verdict-fail' : 'border-chart-line'}`}
                        {...register(`pressures.${i}`)}
                      />
                    </td>
                    {s.cells[i].map((_, j) => (
                      <td key={j} className="pr-1">
                        <input
                          aria-label={`${ratio} at row ${i + 1}, column ${j + 1}`}
                          title={err(`content.data.ratios.${i}.${j}`)}
                          className={`w-20 rounded-plate border px-1 py-0.5 text-right ${err(`content.data.ratios.${i}.${j}`) ? 'border-verdict-fail' : 'border-chart-line'}`}
                          {...register(`cells.${i}.${j}`)}
                        />
                      </td>
                    ))}
                  </tr>
                ))}
              </tbody>
            </table>
            <div className="mt-1 flex flex-wrap gap-2">
              {(['add-row', 'remove-row', 'add-column', 'remove-column'] as const).map((c) => (
                <Button key={c} tone="quiet" onClick={() => change(resizeGrid(form.getValues(), c))}>
                  {c.replace('-', ' a ')}
                </Button>
              ))}
            </div>
          </div>
        ) : (
          <div className="grid gap-3 md:grid-cols-2">
            <table className="text-sm" aria-label="Grid: short-term critical pressure">
              <thead className="text-xs text-ink-soft">
                <tr>
                  <th className="pr-2 text-left">{ratio}</th>
                  <th className="text-left">STCP ({s.unit})</th>
                </tr>
              </thead>
              <tbody>
                {s.ratios.map((_, i) => (
                  <tr key={i}>
                    <td className="pr-2">
                      <input aria-label={`${ratio} of row ${i + 1}`} className="w-20 rounded-plate border border-chart-line px-1 py-0.5 text-right" {...register(`ratios.${i}`)} />
                    </td>
                    <td>
                      <input aria-label={`Critical pressure of row ${i + 1}`} className="w-24 rounded-plate border border-chart-line px-1 py-0.5 text-right" {...register(`criticalPressures.${i}`)} />
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
            <table className="text-sm" aria-label="Conversion factors by temperature">
              <thead className="text-xs text-ink-soft">
                <tr>
                  <th className="pr-2 text-left">Temperature (°C)</th>
                  <th className="text-left">Conversion factor</th>
                </tr>
              </thead>
              <tbody>
                {s.factorTemperatures.map((_, i) => (
                  <tr key={i}>
                    <td className="pr-2">
                      <input aria-label={`Temperature of factor ${i + 1}`} className="w-20 rounded-plate border border-chart-line px-1 py-0.5 text-right" {...register(`factorTemperatures.${i}`)} />
                    </td>
                    <td>
                      <input aria-label={`Conversion factor ${i + 1}`} className="w-20 rounded-plate border border-chart-line px-1 py-0.5 text-right" {...register(`factors.${i}`)} />
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
            <div className="flex gap-2">
              <Button tone="quiet" onClick={() => change({ ratios: [...s.ratios, ''], criticalPressures: [...s.criticalPressures, ''] })}>
                add a point
              </Button>
              <Button tone="quiet" onClick={() => change({ factorTemperatures: [...s.factorTemperatures, ''], factors: [...s.factors, ''] })}>
                add a factor
              </Button>
            </div>
          </div>
        )}
        {dataErrors.length ? (
          <ul role="alert" className="list-disc pl-5 text-xs font-bold text-verdict-fail">
            {dataErrors.slice(0, 12).map(([k, v]) => (
              <li key={k}>
                {k.replace('content.data.', '')}: {v}
              </li>
            ))}
          </ul>
        ) : null}
      </fieldset>

      {stale && onReload ? <StaleBanner message={stale.message} onReload={onReload} /> : null}
      <FormError message={formState.errors.root?.message} />
      <div className="flex gap-2">
        <SubmitButton busy={formState.isSubmitting} busyLabel="Saving…">
          Save draft
        </SubmitButton>
      </div>
    </form>
  );
}
