import type { z } from 'zod';
import { PROVENANCE_KEYS, type ProvenanceKey, type ValueStatus, type ValueStatusRecord } from '@shared/schemas/provenance';
import { draftInputSchema, type DraftData, type DraftInput } from '@shared/schemas/library';
import {
  QUANTITIES,
  type Family,
  type PropertySetDto,
  type Quantity,
  type ReferenceKind,
  type ValueBasis,
  type ValueDetail,
} from '@shared/schemas/catalogue';
import { QUANTITY_KIND } from '@shared/schemas/quantities';
import { checkedFormSchema } from '@/lib/form-schema';
import { fromDisplay, toDisplay, type QuantityKind, type UnitSystem } from '@/lib/units';

/**
 * The property-set editor holds every number as the text typed, in the units shown on screen.
 * The draft is built in SI and checked by the shared `draftInputSchema`; its field errors come
 * back under the same dotted paths the form uses (e.g. "valueDetails.tensileStrength.basis").
 */

export { QUANTITY_KIND } from '@shared/schemas/quantities';

/** Quantities every property set must carry (the rest are optional). */
export const REQUIRED_QUANTITIES: readonly Quantity[] = [
  'density',
  'youngsModulus',
  'poissonsRatio',
  'tensileStrength',
  'compressiveStrength',
  'shearStrength',
];

export interface ValueDetailForm {
  basis: ValueBasis | '';
  testMethod: string;
  /** Test temperature as typed, in the shown unit; '' when not recorded. */
  temperature: string;
}

export interface DraftForm extends Record<Quantity, string> {
  condition: string;
  materialMode: 'existing' | 'new';
  materialId: string;
  material: { name: string; family: Family | ''; transparent: boolean; description: string };
  referenceMode: 'existing' | 'new' | 'none';
  referenceId: string;
  reference: { kind: ReferenceKind | ''; title: string; authors: string; year: string; identifier: string; location: string; note: string };
  serviceTemperature: { min: string; max: string };
  valueDetails: Record<Quantity, ValueDetailForm>;
  temperatureFactors: { temperature: string; factor: string }[];
  sustainedLoadFactors: { hours: string; factor: string }[];
  cyclicFactors: { cycles: string; factor: string }[];
  /** Each value's status as claimed ('' = not said: recalled), with the location, other source or rule. */
  provenance: Record<ProvenanceKey, StatusForm>;
}

export interface StatusForm {
  status: ValueStatus | '';
  location: string;
  source: string;
  rule: string;
}

const emptyStatuses = (): Record<ProvenanceKey, StatusForm> =>
  Object.fromEntries(PROVENANCE_KEYS.map((k) => [k, { status: '', location: '', source: '', rule: '' }])) as Record<ProvenanceKey, StatusForm>;

const emptyDetails = (): Record<Quantity, ValueDetailForm> =>
  Object.fromEntries(QUANTITIES.map((q) => [q, { basis: '', testMethod: '', temperature: '' }])) as Record<Quantity, ValueDetailForm>;

export function emptyDraftForm(): DraftForm {
  return {
    condition: '',
    materialMode: 'existing',
    materialId: '',
    material: { name: '', family: '', transparent: false, description: '' },
    referenceMode: 'existing',
    referenceId: '',
    reference: { kind: '', title: '', authors: '', year: '', identifier: '', location: '', note: '' },
    ...(Object.fromEntries(QUANTITIES.map((q) => [q, ''])) as Record<Quantity, string>),
    serviceTemperature: { min: '', max: '' },
    valueDetails: emptyDetails(),
    temperatureFactors: [],
    sustainedLoadFactors: [],
    cyclicFactors: [],
    provenance: emptyStatuses(),
  };
}

/** Six significant figures: enough to round-trip a typed value through another unit system. */
const tidy = (v: number) => String(Number(v.toPrecision(6)));

/** An SI value as text in the shown unit ('' when unknown). */
export function showNumber(kind: QuantityKind | null, system: UnitSystem, si: number | null | undefined): string {
  if (si === null || si === undefined || !Number.isFinite(si)) return '';
  return tidy(kind ? toDisplay(kind, system, si) : si);
}

/** Text typed into a number field: undefined when blank, NaN when not a number. */
export function parseNumber(text: string): number | undefined {
  const t = text.trim().replace(/\u2212/g, '-').replace(/\s/g, '');
  if (t === '') return undefined;
  if (!/^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i.test(t)) return Number.NaN;
  return Number(t);
}

/** The form for an existing set, shown in `system`. */
export function formFromSet(set: PropertySetDto, system: UnitSystem): DraftForm {
  const form = emptyDraftForm();
  form.condition = set.condition;
  form.materialMode = 'existing';
  form.materialId = String(set.material.id);
  form.referenceMode = set.reference ? 'existing' : 'none';
  form.referenceId = set.reference ? String(set.reference.id) : '';
  for (const q of QUANTITIES) {
    form[q] = showNumber(QUANTITY_KIND[q], system, set[q]);
    const d = set.valueDetails[q];
    if (d) form.valueDetails[q] = { basis: d.basis, testMethod: d.testMethod ?? '', temperature: showNumber('temperature', system, d.temperature) };
  }
  form.serviceTemperature = {
    min: showNumber('temperature', system, set.serviceTemperature.min),
    max: showNumber('temperature', system, set.serviceTemperature.max),
  };
  form.temperatureFactors = set.temperatureFactors.map((p) => ({ temperature: showNumber('temperature', system, p.temperature), factor: tidy(p.factor) }));
  form.sustainedLoadFactors = set.sustainedLoadFactors.map((p) => ({ hours: tidy(p.hours), factor: tidy(p.factor) }));
  form.cyclicFactors = set.cyclicFactors.map((p) => ({ cycles: tidy(p.cycles), factor: tidy(p.factor) }));
  for (const [k, e] of Object.entries(set.provenance ?? {}) as [ProvenanceKey, ValueStatusRecord][]) {
    form.provenance[k] = { status: e.status, location: e.location ?? '', source: e.source ?? '', rule: e.rule ?? '' };
  }
  return form;
}

/** Re-expresses every number typed in `from` units in `to` units; text that is not a number stays as typed. */
export function convertDraftForm(form: DraftForm, from: UnitSystem, to: UnitSystem): DraftForm {
  if (from === to) return form;
  const conv = (kind: QuantityKind | null, text: string) => {
    const v = parseNumber(text);
    if (!kind || v === undefined || !Number.isFinite(v)) return text;
    return tidy(toDisplay(kind, to, fromDisplay(kind, from, v)));
  };
  const out: DraftForm = structuredClone(form);
  for (const q of QUANTITIES) {
    out[q] = conv(QUANTITY_KIND[q], form[q]);
    out.valueDetails[q].temperature = conv('temperature', form.valueDetails[q].temperature);
  }
  out.serviceTemperature = { min: conv('temperature', form.serviceTemperature.min), max: conv('temperature', form.serviceTemperature.max) };
  out.temperatureFactors = form.temperatureFactors.map((p) => ({ ...p, temperature: conv('temperature', p.temperature) }));
  return out;
}

export type DraftErrors = Record<string, string>;

/** Every number of a stored set by form path, in SI. */
function storedValues(set: PropertySetDto): Map<string, number> {
  const out = new Map<string, number>();
  const put = (path: string, v: number | null | undefined) => {
    if (v !== null && v !== undefined) out.set(path, v);
  };
  for (const q of QUANTITIES) {
    put(q, set[q]);
    put(`valueDetails.${q}.temperature`, set.valueDetails[q]?.temperature);
  }
  put('serviceTemperature.min', set.serviceTemperature.min);
  put('serviceTemperature.max', set.serviceTemperature.max);
  set.temperatureFactors.forEach((p, i) => {
    put(`temperatureFactors.${i}.temperature`, p.temperature);
    put(`temperatureFactors.${i}.factor`, p.factor);
  });
  set.sustainedLoadFactors.forEach((p, i) => {
    put(`sustainedLoadFactors.${i}.hours`, p.hours);
    put(`sustainedLoadFactors.${i}.factor`, p.factor);
  });
  set.cyclicFactors.forEach((p, i) => {
    put(`cyclicFactors.${i}.cycles`, p.cycles);
    put(`cyclicFactors.${i}.factor`, p.factor);
  });
  return out;
}

const optionalText = (s: string) => (s.trim() === '' ? undefined : s.trim());

/**
 * The draft in SI from the form as shown, and the errors found before the schema runs (text that
 * is not a number, choices not made). Blank required numbers are left undefined for the schema.
 */
export function toDraftInput(form: DraftForm, system: UnitSystem, baseline?: PropertySetDto): { input: DraftInput; errors: DraftErrors } {
  const errors: DraftErrors = {};
  const stored = baseline ? storedValues(baseline) : new Map<string, number>();
  const num = (path: string, text: string, kind: QuantityKind | null = null): number | undefined => {
    const v = parseNumber(text);
    if (v === undefined) return undefined;
    if (!Number.isFinite(v)) {
      errors[path] = 'Enter a number';
      return Number.NaN;
    }
    // A value left as shown keeps its stored SI value exactly, so a save in other units adds no rounding.
    const before = stored.get(path);
    if (before !== undefined && showNumber(kind, system, before) === text.trim()) return before;
    return kind ? fromDisplay(kind, system, v) : v;
  };

  const input: Record<string, unknown> = { condition: form.condition };

  if (form.materialMode === 'existing') {
    if (form.materialId === '') errors.materialId = 'Choose a material, or describe a new one';
    input.materialId = form.materialId === '' ? undefined : Number(form.materialId);
  } else {
    input.material = {
      name: form.material.name,
      family: form.material.family === '' ? undefined : form.material.family,
      transparent: form.material.transparent,
      description: optionalText(form.material.description),
    };
  }

  if (form.referenceMode === 'existing') {
    if (form.referenceId === '') errors.referenceId = 'Choose a reference, describe a new one, or choose “none yet”';
    input.referenceId = form.referenceId === '' ? undefined : Number(form.referenceId);
  } else if (form.referenceMode === 'new') {
    const r = form.reference;
    const year = num('reference.year', r.year);
    input.reference = {
      kind: r.kind === '' ? undefined : r.kind,
      title: r.title,
      authors: optionalText(r.authors),
      year,
      identifier: optionalText(r.identifier),
      location: optionalText(r.location),
      note: optionalText(r.note),
    };
  } else {
    // A draft may lack a reference; it cannot be approved until it has one.
    input.referenceId = null;
  }

  for (const q of QUANTITIES) {
    const v = num(q, form[q], QUANTITY_KIND[q]);
    input[q] = v === undefined && !REQUIRED_QUANTITIES.includes(q) ? null : v;
  }

  input.serviceTemperature = {
    min: num('serviceTemperature.min', form.serviceTemperature.min, 'temperature'),
    max: num('serviceTemperature.max', form.serviceTemperature.max, 'temperature'),
  };

  const details: Partial<Record<Quantity, ValueDetail>> = {};
  for (const q of QUANTITIES) {
    const d = form.valueDetails[q];
    const temperature = num(`valueDetails.${q}.temperature`, d.temperature, 'temperature');
    const testMethod = optionalText(d.testMethod);
    if (d.basis === '') {
      if (testMethod !== undefined || temperature !== undefined) errors[`valueDetails.${q}.basis`] = 'Choose the basis to keep the method and temperature';
      continue;
    }
    details[q] = { basis: d.basis, ...(testMethod !== undefined ? { testMethod } : {}), ...(temperature !== undefined ? { temperature } : {}) };
  }
  input.valueDetails = details;

  input.temperatureFactors = form.temperatureFactors.map((p, i) => ({
    temperature: num(`temperatureFactors.${i}.temperature`, p.temperature, 'temperature'),
    factor: num(`temperatureFactors.${i}.factor`, p.factor),
  }));
  input.sustainedLoadFactors = form.sustainedLoadFactors.map((p, i) => ({
    hours: num(`sustainedLoadFactors.${i}.hours`, p.hours),
    factor: num(`sustainedLoadFactors.${i}.factor`, p.factor),
  }));
  input.cyclicFactors = form.cyclicFactors.map((p, i) => ({
    cycles: num(`cyclicFactors.${i}.cycles`, p.cycles),
    factor: num(`cyclicFactors.${i}.factor`, p.factor),
  }));

  // The claims only: who confirmed and approved a value is the server's to keep (it keeps them for an unchanged value).
  const provenance: Record<string, unknown> = {};
  for (const k of PROVENANCE_KEYS) {
    const p = form.provenance[k];
    if (p.status === '') continue;
    provenance[k] = { status: p.status, location: optionalText(p.location ?? ''), source: optionalText(p.source ?? ''), rule: optionalText(p.rule ?? '') };
  }
  input.provenance = provenance;

  return { input: input as DraftInput, errors };
}

const capitalise = (s: string) => (s ? s[0].toUpperCase() + s.slice(1) : s);

/** A schema issue in the words of the form (the schema's own messages where it has them). */
export function issueMessage(issue: z.core.$ZodIssue): string {
  const last = String(issue.path[issue.path.length - 1] ?? '');
  switch (issue.code) {
    case 'invalid_type':
      return issue.expected === 'number' ? 'Enter a number' : 'Required';
    case 'invalid_value':
      return 'Choose one of the options';
    case 'too_small':
      if (issue.origin === 'string') return Number(issue.minimum) <= 1 ? 'Required' : `At least ${issue.minimum} characters`;
      if (issue.origin === 'array') return `At least ${issue.minimum} points`;
      return last === 'temperature' ? 'Below absolute zero' : `Must be at least ${issue.minimum}`;
    case 'too_big':
      if (issue.origin === 'string') return `At most ${issue.maximum} characters`;
      if (issue.origin === 'array') return `At most ${issue.maximum} points`;
      return last === 'temperature' ? 'Too hot for a test temperature' : `Must be at most ${issue.maximum}`;
    case 'invalid_format':
      return 'Not in the expected format';
    case 'unrecognized_keys':
      return 'The form sent a field the server does not know';
    default:
      return capitalise(issue.message);
  }
}

/**
 * Where an error path of the draft (from the schema, or from the server's 400 `fields`, where a
 * PUT nests it under "draft.") is shown on the form. Paths the form has no field for go to "root".
 */
export function formPathFor(path: string): string {
  const p = path.replace(/^draft\./, '');
  if (p === '') return 'root';
  if (p === 'material' || p === 'reference') return p === 'material' ? 'materialId' : 'referenceId';
  if (/^(material|reference)\.[a-z]+$/i.test(p)) return p;
  if (p === 'materialId' || p === 'referenceId' || p === 'condition') return p;
  if ((QUANTITIES as readonly string[]).includes(p)) return p;
  if (/^serviceTemperature(\.(min|max))?$/.test(p)) return p === 'serviceTemperature' ? 'serviceTemperature.min' : p;
  if (/^valueDetails\.[a-zA-Z]+\.(basis|testMethod|temperature)$/.test(p)) return p;
  if (/^valueDetails\.[a-zA-Z]+$/.test(p)) return `${p}.basis`;
  if (/^provenance\.[a-zA-Z]+\.(status|location|source|rule)$/.test(p)) return p;
  if (/^provenance\.[a-zA-Z]+$/.test(p)) return `${p}.status`;
  if (/^(temperatureFactors|sustainedLoadFactors|cyclicFactors)\.\d+\.[a-z]+$/i.test(p)) return p;
  if (/^(temperatureFactors|sustainedLoadFactors|cyclicFactors)(\.\d+)?$/.test(p)) return p.split('.')[0];
  return 'root';
}

export type DraftCheck = { ok: true; draft: DraftData; input: DraftInput } | { ok: false; errors: DraftErrors };

/**
 * Checks the form through the shared draft schema; errors keyed by form path (first per field).
 * `baseline` is the set as last saved: numbers left as shown keep their stored values.
 */
export function checkDraftForm(form: DraftForm, system: UnitSystem, baseline?: PropertySetDto): DraftCheck {
  const { input, errors } = toDraftInput(form, system, baseline);
  const parsed = draftInputSchema.safeParse(input);
  if (parsed.success && Object.keys(errors).length === 0) return { ok: true, draft: parsed.data, input };
  const all: DraftErrors = { ...errors };
  if (!parsed.success) {
    for (const issue of parsed.error.issues) {
      const field = formPathFor(issue.path.map(String).join('.'));
      all[field] ??= issueMessage(issue);
    }
  }
  return { ok: false, errors: all };
}

/**
 * The editor's zod schema for zodResolver: the typed form in, the draft in SI out, checked by the
 * shared draft schema with its issues on the form's fields. `system` gives the units of the moment.
 */
export const draftFormSchema = (system: () => UnitSystem, baseline?: PropertySetDto) =>
  checkedFormSchema((form: DraftForm) => {
    const check = checkDraftForm(form, system(), baseline);
    return check.ok ? { ok: true, value: check.input } : check;
  });

/** The server's 400 field errors, keyed by form path (several on one field: the first wins). */
export function serverErrorsToForm(fields: Record<string, string>): DraftErrors {
  const out: DraftErrors = {};
  for (const [path, message] of Object.entries(fields)) out[formPathFor(path)] ??= message;
  return out;
}
