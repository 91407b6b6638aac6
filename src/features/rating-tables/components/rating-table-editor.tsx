import { useRef, useState } from 'react';
import type { RatingTableDraftInput } from '@shared/schemas/rating-tables';
import { RATING_GEOMETRIES, RATING_GEOMETRY_LABELS, RATIO_LABEL } from '@shared/schemas/rating-tables';
import { SelectField, TextField } from '@/components/ui/field';
import { TextAreaField } from '@/components/ui/text-area';
import { Button } from '@/components/ui/button';
import { ApiError } from '@/lib/api-client';
import { checkDraft, ENTRY_UNITS, resizeGrid, type EditorErrors, type EditorState, type EntryUnit } from '../editor-model';
import { ratingCsvTemplateUrl, readRatingCsv } from '../api/rating-tables';

interface Option {
  id: number;
  label: string;
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
  busy,
  serverErrors,
  onSave,
}: {
  materialId: number;
  initial: EditorState;
  references: Option[];
  /** The material's property-set lineages (id = lineage id). */
  sets: Option[];
  busy: boolean;
  serverErrors: EditorErrors;
  onSave: (draft: RatingTableDraftInput) => void;
}) {
  const [s, setS] = useState<EditorState>(initial);
  const [errors, setErrors] = useState<EditorErrors>({});
  const [csvNote, setCsvNote] = useState<string | null>(null);
  const fileRef = useRef<HTMLInputElement>(null);
  const all = { ...serverErrors, ...errors };
  const err = (path: string) => all[path];
  const set = <K extends keyof EditorState>(k: K, v: EditorState[K]) => setS((prev) => ({ ...prev, [k]: v }));
  const cell = (i: number, j: number, v: string) => setS((prev) => ({ ...prev, cells: prev.cells.map((row, r) => (r === i ? row.map((c, k) => (k === j ? v : c)) : row)) }));
  const ratio = RATIO_LABEL[s.geometry];
  const unitFactor = ENTRY_UNITS[s.unit];

  const save = () => {
    const check = checkDraft(s, materialId);
    if (!check.ok) {
      setErrors(check.errors);
      return;
    }
    setErrors({});
    onSave(check.draft);
  };

  const loadCsv = async (file: File) => {
    setCsvNote('Reading the file…');
    try {
      const { data } = await readRatingCsv(file, s.form);
      const fmt = (pa: number) => String(Number((pa / unitFactor).toPrecision(8)));
      if (data.form === 'minimum-ratio') {
        setS((prev) => ({ ...prev, pressures: data.pressures.map(fmt), temperatures: data.temperatures.map(String), cells: data.ratios.map((row) => row.map((r) => (r === null ? '' : String(r)))) }));
      } else {
        setS((prev) => ({ ...prev, ratios: data.ratios.map(String), criticalPressures: data.criticalPressures.map(fmt) }));
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
      onSubmit={(e) => {
        e.preventDefault();
        save();
      }}
      className="flex flex-col gap-4"
    >
      <div className="grid gap-3 md:grid-cols-2">
        <TextField label="Name" value={s.name} onChange={(e) => set('name', e.target.value)} error={err('content.name')} />
        <SelectField label="Geometry" value={s.geometry} onChange={(e) => set('geometry', e.target.value as EditorState['geometry'])} error={err('content.geometry')}>
          {RATING_GEOMETRIES.map((g) => (
            <option key={g} value={g}>
              {RATING_GEOMETRY_LABELS[g]}
            </option>
          ))}
        </SelectField>
        {s.geometry !== 'flat-disc' ? (
          <div className="grid grid-cols-2 gap-2">
            <TextField label="Smallest included angle" unit="°" inputMode="decimal" value={s.angleMin} onChange={(e) => set('angleMin', e.target.value)} error={err('content.includedAngle.min') ?? err('content.includedAngle')} />
            <TextField label="Largest included angle" unit="°" inputMode="decimal" value={s.angleMax} onChange={(e) => set('angleMax', e.target.value)} error={err('content.includedAngle.max')} />
          </div>
        ) : null}
        <TextField label="Material grade" value={s.grade} onChange={(e) => set('grade', e.target.value)} error={err('content.grade')} hint="In words: which material the table holds for" />
        <div className="grid grid-cols-2 gap-2">
          <TextField label="Data support up to" unit="h" inputMode="decimal" value={s.limitHours} onChange={(e) => set('limitHours', e.target.value)} error={err('content.limits.sustainedHours')} hint="Sustained load; empty: no limit stated" />
          <TextField label="… and up to" unit="cycles" inputMode="decimal" value={s.limitCycles} onChange={(e) => set('limitCycles', e.target.value)} error={err('content.limits.cycles')} />
        </div>
        <SelectField label="Reference" value={s.referenceId} onChange={(e) => set('referenceId', e.target.value)} error={err('referenceId')} hint="Needed before it can be published">
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
              onChange={(e) => set('coversLineageIds', e.target.checked ? [...s.coversLineageIds, o.id] : s.coversLineageIds.filter((x) => x !== o.id))}
            />
            {o.label}
          </label>
        ))}
        {err('coversLineageIds') ? <p className="text-xs font-bold text-verdict-fail">{err('coversLineageIds')}</p> : null}
      </fieldset>

      <TextAreaField label="Note" value={s.note} onChange={(e) => set('note', e.target.value)} hint="How each value was taken from the source: [pub], [memory], interpolated or inferred" rows={3} />

      <fieldset className="flex flex-col gap-2">
        <legend className="text-xs font-bold uppercase tracking-wide text-ink-soft">Grid</legend>
        <div className="flex flex-wrap items-end gap-3">
          <SelectField label="Form" value={s.form} onChange={(e) => set('form', e.target.value as EditorState['form'])}>
            <option value="minimum-ratio">Minimum {ratio} against pressure and temperature</option>
            <option value="critical-pressure">Short-term critical pressure against {ratio}, with conversion factors</option>
          </SelectField>
          <SelectField label="Pressures entered in" value={s.unit} onChange={(e) => set('unit', e.target.value as EntryUnit)}>
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
                  {s.temperatures.map((t, j) => (
                    <th key={j} className="pr-1">
                      <input
                        aria-label={`Temperature of column ${j + 1} (°C)`}
                        className={`w-20 rounded-plate border px-1 py-0.5 text-right ${err(`content.data.temperatures.${j}`) || err('content.data.temperatures') ? 'border-verdict-fail' : 'border-chart-line'}`}
                        value={t}
                        onChange={(e) => set('temperatures', s.temperatures.map((x, k) => (k === j ? e.target.value : x)))}
                      />
                    </th>
                  ))}
                </tr>
              </thead>
              <tbody>
                {s.pressures.map((p, i) => (
                  <tr key={i}>
                    <td className="pr-2">
                      <input
                        aria-label={`Pressure of row ${i + 1} (${s.unit})`}
                        className={`w-24 rounded-plate border px-1 py-0.5 text-right ${err(`content.data.pressures.${i}`) || err('content.data.pressures') ? 'border-verdict-fail' : 'border-chart-line'}`}
                        value={p}
                        onChange={(e) => set('pressures', s.pressures.map((x, k) => (k === i ? e.target.value : x)))}
                      />
                    </td>
                    {s.cells[i].map((c, j) => (
                      <td key={j} className="pr-1">
                        <input
                          aria-label={`${ratio} at row ${i + 1}, column ${j + 1}`}
                          title={err(`content.data.ratios.${i}.${j}`)}
                          className={`w-20 rounded-plate border px-1 py-0.5 text-right ${err(`content.data.ratios.${i}.${j}`) ? 'border-verdict-fail' : 'border-chart-line'}`}
                          value={c}
                          onChange={(e) => cell(i, j, e.target.value)}
                        />
                      </td>
                    ))}
                  </tr>
                ))}
              </tbody>
            </table>
            <div className="mt-1 flex flex-wrap gap-2">
              {(['add-row', 'remove-row', 'add-column', 'remove-column'] as const).map((c) => (
                <Button key={c} tone="quiet" onClick={() => setS((prev) => resizeGrid(prev, c))}>
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
                {s.ratios.map((r, i) => (
                  <tr key={i}>
                    <td className="pr-2">
                      <input aria-label={`${ratio} of row ${i + 1}`} className="w-20 rounded-plate border border-chart-line px-1 py-0.5 text-right" value={r} onChange={(e) => set('ratios', s.ratios.map((x, k) => (k === i ? e.target.value : x)))} />
                    </td>
                    <td>
                      <input aria-label={`Critical pressure of row ${i + 1}`} className="w-24 rounded-plate border border-chart-line px-1 py-0.5 text-right" value={s.criticalPressures[i] ?? ''} onChange={(e) => set('criticalPressures', s.ratios.map((_, k) => (k === i ? e.target.value : (s.criticalPressures[k] ?? ''))))} />
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
                {s.factorTemperatures.map((t, i) => (
                  <tr key={i}>
                    <td className="pr-2">
                      <input aria-label={`Temperature of factor ${i + 1}`} className="w-20 rounded-plate border border-chart-line px-1 py-0.5 text-right" value={t} onChange={(e) => set('factorTemperatures', s.factorTemperatures.map((x, k) => (k === i ? e.target.value : x)))} />
                    </td>
                    <td>
                      <input aria-label={`Conversion factor ${i + 1}`} className="w-20 rounded-plate border border-chart-line px-1 py-0.5 text-right" value={s.factors[i] ?? ''} onChange={(e) => set('factors', s.factorTemperatures.map((_, k) => (k === i ? e.target.value : (s.factors[k] ?? ''))))} />
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
            <div className="flex gap-2">
              <Button tone="quiet" onClick={() => setS((p) => ({ ...p, ratios: [...p.ratios, ''], criticalPressures: [...p.criticalPressures, ''] }))}>
                add a point
              </Button>
              <Button tone="quiet" onClick={() => setS((p) => ({ ...p, factorTemperatures: [...p.factorTemperatures, ''], factors: [...p.factors, ''] }))}>
                add a factor
              </Button>
            </div>
          </div>
        )}
        {Object.keys(all).some((k) => k.startsWith('content.data')) ? (
          <ul role="alert" className="list-disc pl-5 text-xs font-bold text-verdict-fail">
            {Object.entries(all)
              .filter(([k]) => k.startsWith('content.data'))
              .slice(0, 12)
              .map(([k, v]) => (
                <li key={k}>
                  {k.replace('content.data.', '')}: {v}
                </li>
              ))}
          </ul>
        ) : null}
      </fieldset>

      <div className="flex gap-2">
        <Button type="submit" disabled={busy}>
          {busy ? 'Saving…' : 'Save draft'}
        </Button>
      </div>
    </form>
  );
}
