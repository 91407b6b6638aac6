/**
 * The rating-table editor holds text as typed (pressures in the unit chosen for entry); the draft
 * is built in SI and checked by the shared schema, whose issues are mapped back onto the fields
 * and grid cells they name.
 */
import { ratingTableDraftSchema, type RatingTableDraftInput, type RatingTableDto } from '@shared/schemas/rating-tables';
import { checkedFormSchema } from '@/lib/form-schema';

export const ENTRY_UNITS = { bar: 1e5, MPa: 1e6, psi: 6894.757293168 } as const;
export type EntryUnit = keyof typeof ENTRY_UNITS;

export interface EditorState {
  name: string;
  geometry: 'flat-disc' | 'conical-frustum' | 'spherical-sector';
  angleMin: string;
  angleMax: string;
  limitHours: string;
  limitCycles: string;
  grade: string;
  note: string;
  referenceId: string;
  coversLineageIds: number[];
  form: 'minimum-ratio' | 'critical-pressure';
  unit: EntryUnit;
  /** minimum-ratio: row pressures, column temperatures (°C), cells; critical-pressure: rows are ratios and STCPs. */
  pressures: string[];
  temperatures: string[];
  cells: string[][];
  ratios: string[];
  criticalPressures: string[];
  factorTemperatures: string[];
  factors: string[];
}

export const EMPTY_EDITOR: EditorState = {
  name: '',
  geometry: 'flat-disc',
  angleMin: '',
  angleMax: '',
  limitHours: '',
  limitCycles: '',
  grade: '',
  note: '',
  referenceId: '',
  coversLineageIds: [],
  form: 'minimum-ratio',
  unit: 'bar',
  pressures: ['', ''],
  temperatures: ['10', '24'],
  cells: [
    ['', ''],
    ['', ''],
  ],
  ratios: ['', ''],
  criticalPressures: ['', ''],
  factorTemperatures: ['24'],
  factors: [''],
};

const str = (n: number | null | undefined) => (n === null || n === undefined ? '' : String(Number(n.toPrecision(10))));

/** The editor for a stored table (pressures shown in bar). */
export function editorFrom(t: RatingTableDto): EditorState {
  const c = t.content;
  const d = c.data;
  const base: EditorState = {
    ...EMPTY_EDITOR,
    name: c.name,
    geometry: c.geometry,
    angleMin: str(c.includedAngle?.min),
    angleMax: str(c.includedAngle?.max),
    limitHours: str(c.limits?.sustainedHours),
    limitCycles: str(c.limits?.cycles),
    grade: c.grade,
    note: c.note ?? '',
    referenceId: t.reference ? String(t.reference.id) : '',
    coversLineageIds: t.covers.map((x) => x.lineageId),
    form: d.form,
    unit: 'bar',
  };
  if (d.form === 'minimum-ratio') {
    return { ...base, pressures: d.pressures.map((p) => str(p / 1e5)), temperatures: d.temperatures.map(str), cells: d.ratios.map((row) => row.map(str)) };
  }
  return {
    ...base,
    ratios: d.ratios.map(str),
    criticalPressures: d.criticalPressures.map((p) => str(p / 1e5)),
    factorTemperatures: d.conversionFactors.map((x) => str(x.temperature)),
    factors: d.conversionFactors.map((x) => str(x.factor)),
  };
}

/** A typed number, NaN when not a number (so the schema reports it where it is). */
const num = (s: string) => (s.trim() === '' ? Number.NaN : Number(s.trim()));
const optional = (s: string) => (s.trim() === '' ? undefined : Number(s.trim()));

export function toDraft(s: EditorState, materialId: number): RatingTableDraftInput {
  const k = ENTRY_UNITS[s.unit];
  const angled = s.geometry !== 'flat-disc';
  const hours = optional(s.limitHours);
  const cycles = optional(s.limitCycles);
  const data =
    s.form === 'minimum-ratio'
      ? {
          form: 'minimum-ratio' as const,
          pressures: s.pressures.map((p) => num(p) * k),
          temperatures: s.temperatures.map(num),
          ratios: s.cells.map((row) => row.map((c) => (c.trim() === '' ? null : num(c)))),
        }
      : {
          form: 'critical-pressure' as const,
          ratios: s.ratios.map(num),
          criticalPressures: s.criticalPressures.map((p) => num(p) * k),
          conversionFactors: s.factorTemperatures.map((t, i) => ({ temperature: num(t), factor: num(s.factors[i] ?? '') })),
        };
  return {
    materialId,
    referenceId: s.referenceId ? Number(s.referenceId) : null,
    coversLineageIds: s.coversLineageIds,
    content: {
      name: s.name,
      geometry: s.geometry,
      includedAngle: angled ? { min: num(s.angleMin), max: num(s.angleMax) } : null,
      limits: hours === undefined && cycles === undefined ? null : { sustainedHours: hours ?? null, cycles: cycles ?? null },
      grade: s.grade,
      note: s.note.trim() ? s.note : null,
      data,
    },
  };
}

export type EditorErrors = Record<string, string>;

/** Checks the draft with the shared schema; errors keyed by the draft's dotted paths (content.data.ratios.1.2 …). */
export function checkDraft(s: EditorState, materialId: number): { ok: true; draft: RatingTableDraftInput } | { ok: false; errors: EditorErrors } {
  const draft = toDraft(s, materialId);
  const parsed = ratingTableDraftSchema.safeParse(draft);
  if (parsed.success) return { ok: true, draft };
  const errors: EditorErrors = {};
  for (const issue of parsed.error.issues) errors[issue.path.map(String).join('.')] ??= issue.message;
  return { ok: false, errors };
}

/** The editor's zod schema for zodResolver: the typed editor in, the draft in SI out; errors at the draft's paths. */
export const ratingDraftFormSchema = (materialId: number) =>
  checkedFormSchema((s: EditorState) => {
    const check = checkDraft(s, materialId);
    return check.ok ? { ok: true, value: check.draft } : check;
  });

/** Labels of the server's field paths the editor shows at a field; grid paths are listed under the grid. */
const FIELD_LABELS: Record<string, string> = {
  'content.name': 'Name',
  'content.geometry': 'Geometry',
  'content.includedAngle': 'Included angles',
  'content.includedAngle.min': 'Smallest included angle',
  'content.includedAngle.max': 'Largest included angle',
  'content.grade': 'Material grade',
  'content.limits.sustainedHours': 'Sustained load limit',
  'content.limits.cycles': 'Cycle limit',
  referenceId: 'Reference',
  coversLineageIds: 'Property sets it covers',
};
export const editorFieldLabel = (path: string): string | undefined => FIELD_LABELS[path] ?? (path.startsWith('content.data.') ? path.slice('content.data.'.length) : undefined);
/** A PUT nests the draft under "draft."; the editor's paths are the draft's own. */
export const editorPathFor = (serverPath: string) => serverPath.replace(/^draft\./, '');

/** Adds or removes a row or column of the minimum-ratio grid, keeping the cells aligned. */
export function resizeGrid(s: EditorState, change: 'add-row' | 'remove-row' | 'add-column' | 'remove-column'): EditorState {
  if (change === 'add-row') return { ...s, pressures: [...s.pressures, ''], cells: [...s.cells, s.temperatures.map(() => '')] };
  if (change === 'remove-row') return s.pressures.length > 1 ? { ...s, pressures: s.pressures.slice(0, -1), cells: s.cells.slice(0, -1) } : s;
  if (change === 'add-column') return { ...s, temperatures: [...s.temperatures, ''], cells: s.cells.map((row) => [...row, '']) };
  return s.temperatures.length > 1 ? { ...s, temperatures: s.temperatures.slice(0, -1), cells: s.cells.map((row) => row.slice(0, -1)) } : s;
}
