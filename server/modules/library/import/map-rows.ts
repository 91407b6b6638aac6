// Step 2 of the property-set import: one row's cells → a draft. Each cell is read by its column's
// cell type (text, choice, yes/no, number in the column's unit → SI, whole number) and placed at
// the column's draft path; then the draft schema, the same one as a draft saved on the desk,
// judges the whole row. Its issues, cross-field ones included, come back named by CSV column,
// in the same round as the cells that could not be read. No rule on values lives here.
import type { z } from 'zod';
import { draftInputSchema, type DraftData, type ImportIssueDto } from '../../../../shared/schemas/library';
import { PROPERTY_SET_COLUMNS, targetsOf, unitOfColumn, type ImportColumn } from '../../../../shared/import/property-set-columns';

type Issue = Omit<ImportIssueDto, 'row'>;

export interface MappedRow {
  /** What the cells placed at their draft paths, before the schema (for checks across rows). */
  input: Record<string, unknown>;
  /** The schema's output when the row has no issue. */
  draft: DraftData | null;
  issues: Issue[];
}

interface Reader {
  targets: { path: string; keys: string[]; onlyWith?: string[] }[];
  toSI: (v: number) => number;
}
const readers = new WeakMap<ImportColumn, Reader>();
/** A column's targets and SI conversion, worked out once per column. */
function readerOf(column: ImportColumn): Reader {
  let r = readers.get(column);
  if (!r) {
    const unit = unitOfColumn(column);
    const targets = targetsOf(column).map((t) => ({ path: t.path, keys: t.path.split('.'), onlyWith: t.onlyWith?.split('.') }));
    r = { targets, toSI: unit ? unit.toSI : (v) => v };
    readers.set(column, r);
  }
  return r;
}

const NUMBER = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;
const YES = new Set(['yes', 'y', 'true', '1']);
const NO = new Set(['no', 'n', 'false', '0']);

type Read = { value: unknown } | { problem: string };

/** A non-blank cell's value as its column reads it (numbers in SI), or why it cannot be read. */
export function readCell(column: ImportColumn, text: string): Read {
  switch (column.cell) {
    case 'text':
      return { value: text };
    case 'choice':
      return { value: text.toLowerCase().replace(/[\s_]+/g, '-') };
    case 'yes-no': {
      const t = text.toLowerCase();
      return YES.has(t) ? { value: true } : NO.has(t) ? { value: false } : { problem: 'must be yes or no' };
    }
    case 'number':
    case 'integer': {
      if (!NUMBER.test(text)) return { problem: 'must be a number (use a point for decimals, no thousands separators)' };
      const v = Number(text);
      if (!Number.isFinite(v)) return { problem: 'must be a finite number' };
      if (column.cell === 'integer' && !Number.isInteger(v)) return { problem: 'must be a whole number' };
      return { value: readerOf(column).toSI(v) };
    }
  }
}

function place(target: Record<string, unknown>, keys: readonly string[], value: unknown): void {
  let node = target;
  for (let i = 0; i < keys.length - 1; i++) node = (node[keys[i]] ??= {}) as Record<string, unknown>;
  node[keys[keys.length - 1]] = value;
}

function valueAt(source: unknown, path: readonly PropertyKey[]): unknown {
  let node = source;
  for (const key of path) node = node && typeof node === 'object' ? (node as Record<PropertyKey, unknown>)[key] : undefined;
  return node;
}

/** A schema bound (SI) in the column's unit, e.g. 1800 for a year, "-273.15 °C" for a temperature. */
function inColumnUnit(column: ImportColumn | undefined, si: number | bigint): string {
  const unit = column ? unitOfColumn(column) : undefined;
  const shown = unit ? unit.fromSI(Number(si)) : Number(si);
  return `${Number(shown.toPrecision(12))}${unit ? ` ${unit.label}` : ''}`;
}

/** A schema issue in the words of a CSV cell (the schema's own message where it has one). */
function wordIssue(issue: z.core.$ZodIssue, column: ImportColumn | undefined, input: unknown): string {
  switch (issue.code) {
    case 'invalid_type':
      if (valueAt(input, issue.path) === undefined) return 'is required';
      return issue.expected === 'int' ? 'must be a whole number' : `must be a ${issue.expected}`;
    case 'invalid_value':
      return `must be one of: ${issue.values.map(String).join(', ')}`;
    case 'too_big':
      return issue.origin === 'string' ? `is longer than ${issue.maximum} characters` : `must be at most ${inColumnUnit(column, issue.maximum)}`;
    case 'too_small':
      if (issue.origin === 'string') return Number(issue.minimum) <= 1 ? 'is required' : `must have at least ${issue.minimum} characters`;
      return `must be at least ${inColumnUnit(column, issue.minimum)}`;
    default:
      return issue.message;
  }
}

/**
 * The mapping for a file with these columns (in the file's order): one row's cells → the draft
 * it describes, or its issues named by column.
 */
export function rowMapper(header: readonly ImportColumn[]): (cells: string[]) => MappedRow {
  // Draft path → the CSV column a person fixes (a column may fill several paths).
  const columnOfPath = new Map<string, ImportColumn>();
  for (const c of [...PROPERTY_SET_COLUMNS, ...header]) for (const t of readerOf(c).targets) columnOfPath.set(t.path, c);
  const columnAt = (path: string[]) => {
    for (let n = path.length; n > 0; n--) {
      const column = columnOfPath.get(path.slice(0, n).join('.'));
      if (column) return column;
    }
    return undefined;
  };

  return (cells) => {
    const input: Record<string, unknown> = {};
    if (cells.length !== header.length) {
      return { input, draft: null, issues: [{ field: '_', message: `has ${cells.length} field${cells.length === 1 ? '' : 's'}; the header has ${header.length}` }] };
    }
    const issues: Issue[] = [];
    const flagged = new Set<string>();
    const flag = (field: string, message: string) => {
      if (flagged.has(field)) return;
      flagged.add(field);
      issues.push({ field, message });
    };

    const read = new Map<ImportColumn, unknown>();
    header.forEach((column, i) => {
      const text = cells[i].trim();
      if (!text) return void (column.required && flag(column.name, 'is required'));
      const r = readCell(column, text);
      if ('problem' in r) flag(column.name, r.problem);
      else read.set(column, r.value);
    });
    // Unconditional targets first, so `onlyWith` sees every value of the row.
    for (const [column, value] of read) for (const t of readerOf(column).targets) if (!t.onlyWith) place(input, t.keys, value);
    for (const [column, value] of read) {
      for (const t of readerOf(column).targets) if (t.onlyWith && valueAt(input, t.onlyWith) !== undefined) place(input, t.keys, value);
    }

    const parsed = draftInputSchema.safeParse(input);
    if (parsed.success) return { input, draft: issues.length ? null : parsed.data, issues };
    for (const issue of parsed.error.issues) {
      const column = columnAt(issue.path.map(String));
      flag(column?.name ?? '_', wordIssue(issue, column, input));
    }
    return { input, draft: null, issues };
  };
}
