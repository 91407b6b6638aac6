import { useEffect, useMemo, useRef, useState, type ReactNode } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { Link, useLocation, useNavigate } from 'react-router-dom';
import { get, set as setPath, useFieldArray, useForm, type FieldErrors, type Resolver, type UseFormReturn } from 'react-hook-form';
import { FAMILIES, FAMILY_LABELS, QUANTITIES, QUANTITY_LABELS, REFERENCE_KINDS, VALUE_BASES, type MaterialDto, type Quantity } from '@shared/schemas/catalogue';
import type { LibrarySetDto } from '@shared/schemas/library';
import { Button } from '@/components/ui/button';
import { SelectField, TextField } from '@/components/ui/field';
import { Panel, Spinner } from '@/components/ui/states';
import { ApiError } from '@/lib/api-client';
import { useUnits } from '@/lib/unit-system';
import { unitOf } from '@/lib/units';
import { librarySetQueryOptions, useCreateDraft, useMaterials, useSaveDraft, useSetStep } from '../api/library-sets';
import { useReferences } from '../api/references';
import {
  checkDraftForm,
  convertDraftForm,
  emptyDraftForm,
  formFromSet,
  QUANTITY_KIND,
  REQUIRED_QUANTITIES,
  serverErrorsToForm,
  type DraftErrors,
  type DraftForm,
} from '../draft-form';
import { REFERENCE_KIND_LABELS, VALUE_BASIS_LABELS } from '../labels';
import { CellInput, CellSelect } from './cells';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { SetHistory } from './set-history';

function nest(errors: DraftErrors): FieldErrors<DraftForm> {
  const out: FieldErrors<DraftForm> = {};
  for (const [path, message] of Object.entries(errors)) setPath(out, path, { type: 'validate', message });
  return out;
}

function Fieldset({ legend, children, hint }: { legend: string; children: ReactNode; hint?: ReactNode }) {
  return (
    <fieldset className="flex flex-col gap-3">
      <legend className="mb-2 text-xs font-bold uppercase tracking-wide text-sounding-dark">{legend}</legend>
      {hint ? <p className="-mt-2 text-xs text-ink-soft">{hint}</p> : null}
      {children}
    </fieldset>
  );
}

function Choice<T extends string>({ name, value, current, onChange, children }: { name: string; value: T; current: T; onChange: (v: T) => void; children: ReactNode }) {
  return (
    <label className="flex items-center gap-1.5 text-sm">
      <input type="radio" name={name} value={value} checked={current === value} onChange={() => onChange(value)} />
      {children}
    </label>
  );
}

type Banner = { tone: 'error' | 'info'; message: string; stale?: boolean } | null;

function materialOptions(materials: MaterialDto[]) {
  return FAMILIES.map((f) => ({ family: f, items: materials.filter((m) => m.family === f) })).filter((g) => g.items.length);
}

function MaterialSection({ form, err }: { form: UseFormReturn<DraftForm>; err: (p: string) => string | undefined }) {
  const materials = useMaterials();
  const mode = form.watch('materialMode');
  return (
    <Fieldset legend="Material and condition">
      <div role="radiogroup" aria-label="Material: existing or new" className="flex flex-wrap gap-4">
        <Choice name="materialMode" value="existing" current={mode} onChange={(v) => form.setValue('materialMode', v)}>
          Existing material
        </Choice>
        <Choice name="materialMode" value="new" current={mode} onChange={(v) => form.setValue('materialMode', v)}>
          New material
        </Choice>
      </div>
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
            {FAMILIES.map((f) => (
              <option key={f} value={f}>
                {FAMILY_LABELS[f]}
              </option>
            ))}
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

function ReferenceSection({ form, err }: { form: UseFormReturn<DraftForm>; err: (p: string) => string | undefined }) {
  const references = useReferences('');
  const mode = form.watch('referenceMode');
  return (
    <Fieldset legend="Source">
      <div role="radiogroup" aria-label="Reference: existing, new or none yet" className="flex flex-wrap gap-4">
        <Choice name="referenceMode" value="existing" current={mode} onChange={(v) => form.setValue('referenceMode', v)}>
          Existing reference
        </Choice>
        <Choice name="referenceMode" value="new" current={mode} onChange={(v) => form.setValue('referenceMode', v)}>
          New reference
        </Choice>
        <Choice name="referenceMode" value="none" current={mode} onChange={(v) => form.setValue('referenceMode', v)}>
          None yet
        </Choice>
      </div>
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
            {REFERENCE_KINDS.map((k) => (
              <option key={k} value={k}>
                {REFERENCE_KIND_LABELS[k]}
              </option>
            ))}
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

function ValuesSection({ form, err }: { form: UseFormReturn<DraftForm>; err: (p: string) => string | undefined }) {
  const { system, label } = useUnits();
  const transparent = form.watch('material.transparent');
  return (
    <Fieldset legend="Values" hint={`Enter values in ${system === 'SI' ? 'SI' : 'US customary'} units (switch at the top right); they are saved in SI.`}>
      <div className="overflow-x-auto">
        <table className="w-full text-sm" aria-label="Values to enter">
          <thead className="text-left text-xs uppercase tracking-wide text-ink-soft">
            <tr>
              <th scope="col" className="py-1 pr-3">Quantity</th>
              <th scope="col" className="w-32 py-1 pr-3">Value</th>
              <th scope="col" className="w-44 py-1 pr-3">Basis</th>
              <th scope="col" className="py-1 pr-3">Test method</th>
              <th scope="col" className="w-28 py-1">Tested at ({label('temperature')})</th>
            </tr>
          </thead>
          <tbody>
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
                      {VALUE_BASES.map((b) => (
                        <option key={b} value={b}>
                          {VALUE_BASIS_LABELS[b]}
                        </option>
                      ))}
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
          </tbody>
        </table>
      </div>
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

function PointsTable({ form, name, err }: { form: UseFormReturn<DraftForm>; name: PointsName; err: (p: string) => string | undefined }) {
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

function DependenceSection({ form, err }: { form: UseFormReturn<DraftForm>; err: (p: string) => string | undefined }) {
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

/**
 * Draft a new property set or edit a draft. The form holds the numbers in the units on screen;
 * the draft is sent in SI. A stale save (someone else saved first) keeps the user's edits.
 */
export function SetEditor({ set }: { set?: LibrarySetDto }) {
  const { system } = useUnits();
  const systemRef = useRef(system);
  const navigate = useNavigate();
  const location = useLocation();
  const qc = useQueryClient();
  const [lockVersion, setLockVersion] = useState(set?.lockVersion ?? 0);
  const [banner, setBanner] = useState<Banner>(() => {
    const notice = (location.state as { notice?: string } | null)?.notice;
    return notice ? { tone: 'error', message: notice } : null;
  });
  useEffect(() => {
    // The notice is for this arrival only; a reload should not show it again.
    if ((location.state as { notice?: string } | null)?.notice) navigate(location.pathname, { replace: true, state: null });
  }, [location, navigate]);
  const [confirmSubmit, setConfirmSubmit] = useState(false);
  const [submitError, setSubmitError] = useState<string | null>(null);

  const resolver: Resolver<DraftForm> = useMemo(
    () => async (values) => {
      const check = checkDraftForm(values, systemRef.current);
      return check.ok ? { values, errors: {} } : { values: {}, errors: nest(check.errors) };
    },
    [],
  );
  const form = useForm<DraftForm>({
    resolver,
    defaultValues: set ? formFromSet(set, system) : emptyDraftForm(),
    mode: 'onSubmit',
    reValidateMode: 'onChange',
  });
  const { formState, getValues, reset } = form;
  const dirty = formState.isDirty;

  // Switching units converts what is typed, so the set stays the same.
  useEffect(() => {
    if (systemRef.current !== system) {
      reset(convertDraftForm(getValues(), systemRef.current, system), { keepDirty: true });
      systemRef.current = system;
    }
  }, [system, reset, getValues]);

  const create = useCreateDraft();
  const save = useSaveDraft();
  const step = useSetStep();
  const saving = create.isPending || save.isPending;
  const busy = saving || step.isPending;

  const err = (path: string) => (get(formState.errors, path) as { message?: string } | undefined)?.message;

  function showServerError(e: unknown) {
    if (e instanceof ApiError) {
      const fields = serverErrorsToForm(e.fields);
      for (const [path, message] of Object.entries(fields)) if (path !== 'root') form.setError(path as never, { type: 'server', message });
      setBanner({ tone: 'error', message: e.message, stale: e.status === 409 && e.code === 'stale' });
    } else {
      setBanner({ tone: 'error', message: 'The draft could not be saved.' });
    }
  }

  /** Saves what is in the form; the saved set, or null when the form or the server refused it. */
  async function persist(): Promise<LibrarySetDto | null> {
    const check = checkDraftForm(getValues(), system, set);
    if (!check.ok) {
      for (const [path, message] of Object.entries(check.errors)) form.setError(path as never, { type: 'validate', message });
      return null;
    }
    try {
      const saved = set ? await save.mutateAsync({ id: set.id, lockVersion, draft: check.input }) : await create.mutateAsync(check.input);
      setLockVersion(saved.lockVersion);
      // New materials and references now exist: from here on the form points at them.
      reset(formFromSet(saved, system));
      return saved;
    } catch (e) {
      showServerError(e);
      return null;
    }
  }

  const onSave = form.handleSubmit(async () => {
    setBanner(null);
    const saved = await persist();
    if (!saved) return;
    if (!set) navigate(`/library/sets/${saved.id}`, { replace: true });
    else setBanner({ tone: 'info', message: `Draft saved at ${new Date().toLocaleTimeString('en-GB', { hour: '2-digit', minute: '2-digit' })}.` });
  });

  const askSubmit = form.handleSubmit(() => {
    setSubmitError(null);
    setConfirmSubmit(true);
  });

  async function saveAndSubmit() {
    setSubmitError(null);
    setBanner(null);
    // Nothing typed since the last save: submit that version as it is.
    const saved = set && !dirty ? { ...set, lockVersion } : await persist();
    if (!saved) {
      setConfirmSubmit(false);
      return;
    }
    try {
      await step.mutateAsync({ step: 'submit', id: saved.id, lockVersion: saved.lockVersion });
    } catch (e) {
      const message = e instanceof ApiError ? e.message : 'The set could not be submitted.';
      // Saved, not submitted: a new set goes to its own page, which says so.
      if (!set) navigate(`/library/sets/${saved.id}`, { replace: true, state: { notice: `Saved as a draft, not submitted: ${message}` } });
      else setSubmitError(message);
      return;
    }
    setConfirmSubmit(false);
    await qc.invalidateQueries({ queryKey: librarySetQueryOptions(saved.id).queryKey });
    navigate(`/library/sets/${saved.id}`, { replace: true });
  }

  async function reloadSaved() {
    if (!set) return;
    const fresh = await qc.fetchQuery({ ...librarySetQueryOptions(set.id), staleTime: 0 });
    setLockVersion(fresh.lockVersion);
    reset(formFromSet(fresh, system));
    setBanner(fresh.status === 'draft' ? { tone: 'info', message: 'Loaded the saved version.' } : null);
  }

  return (
    <>
      <form onSubmit={onSave} noValidate aria-label="Property set" className="grid gap-5 lg:grid-cols-[1fr_18rem]">
        <div className="flex min-w-0 flex-col gap-4">
          {set?.returnedComment ? (
            <div role="note" className="rounded-plate border border-brass/40 bg-brass-light px-4 py-3 text-sm" data-testid="returned-comment">
              <p className="font-bold text-brass">Returned by the reviewer</p>
              <p className="mt-1 whitespace-pre-line">{set.returnedComment}</p>
            </div>
          ) : null}
          <Panel>
            <MaterialSection form={form} err={err} />
          </Panel>
          <Panel>
            <ReferenceSection form={form} err={err} />
          </Panel>
          <Panel>
            <ValuesSection form={form} err={err} />
          </Panel>
          <Panel>
            <DependenceSection form={form} err={err} />
          </Panel>
        </div>

        <aside className="flex flex-col gap-4 lg:sticky lg:top-4 lg:self-start" aria-label="Draft actions">
          <Panel title="Draft" className="no-print">
            <div className="flex flex-col gap-3">
              {banner ? (
                <div
                  role={banner.tone === 'error' ? 'alert' : 'status'}
                  data-testid="editor-banner"
                  className={`rounded-plate border px-3 py-2 text-sm ${banner.tone === 'error' ? 'border-verdict-fail/40 bg-white text-verdict-fail' : 'border-verdict-pass/30 bg-white text-verdict-pass'}`}
                >
                  <p>{banner.message}</p>
                  {banner.stale ? (
                    <>
                      <p className="mt-1 text-ink-soft">Your edits are still in the form: copy what you need, or load the saved version.</p>
                      <button type="button" className="mt-2 font-bold text-sounding underline" onClick={() => void reloadSaved()}>
                        Load the saved version (discards your edits)
                      </button>
                    </>
                  ) : null}
                </div>
              ) : null}
              {Object.keys(formState.errors).length ? (
                <p role="alert" className="text-sm font-bold text-verdict-fail">
                  {err('root') ?? 'Some fields need attention; each says what is wrong.'}
                </p>
              ) : null}
              <Button type="submit" disabled={busy}>
                {saving && !confirmSubmit ? 'Saving…' : 'Save draft'}
              </Button>
              <Button tone="quiet" onClick={() => void askSubmit()} disabled={busy}>
                Submit for review…
              </Button>
              <p className="text-xs text-ink-soft">A second librarian must approve the set before it reaches the catalogue.</p>
            </div>
          </Panel>
          {set ? <SetHistory set={set} /> : null}
        </aside>
      </form>

      <ConfirmDialog
        open={confirmSubmit}
        title="Submit for review?"
        confirmLabel="Save and submit"
        busy={busy}
        busyLabel="Submitting…"
        error={submitError}
        onClose={() => setConfirmSubmit(false)}
        onConfirm={() => void saveAndSubmit()}
      >
        <p>
          The draft is saved and sent to the other librarians, who get an e-mail. You cannot edit it while it is in review; a reviewer approves it
          or returns it to you with a comment.
        </p>
        {form.watch('referenceMode') === 'none' ? <p className="font-bold text-brass">It has no reference yet, so it cannot be approved.</p> : null}
      </ConfirmDialog>
    </>
  );
}
