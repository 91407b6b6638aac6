// Step 2 of the property-set import: one row's cells → a draft. Each cell is read by its column's
// cell type (text, choice, yes/no, number in the column's unit → SI, whole number, list of
// points) and placed at the column's draft paths: first every cell that fills its paths outright,
// then the row-wide defaults (`onlyWith`, `unless`), judged on what the first pass filled. Then
// the draft schema, the same one as a draft saved on the desk, judges the whole row. Its issues,
// cross-field ones included, come back named by the CSV column a person fixes, in the same round
// as the cells that could not be read. No rule on values lives here.
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

interface Target {
  path: string;
  keys: string[];
  onlyWith?: string[];
  unless?: string[][];
}
interface Reader {
  targets: Target[];
  toSI: (v: number) => number;
  /** The parents of the column's paths: columns with the same parents fill fields of the same values. */
  parents: string;
}
const readers = new WeakMap<ImportColumn, Reader>();
/** A column's targets and SI conversion, worked out once per column. */
function readerOf(column: ImportColumn): Reader {
  let r = readers.get(column);
  if (!r) {
    const unit = unitOfColumn(column);
    const targets = targetsOf(column).map((t) => ({ path: t.path, keys: t.path.split('.'), onlyWith: t.onlyWith?.split('.'), unless: t.unless?.map((u) => u.split('.')) }));
    const parents = [...new Set(targets.map((t) => t.keys.slice(0, -1).join('.')))].sort().join(' ');
    r = { targets, toSI: unit ? unit.toSI : (v) => v, parents };
    readers.set(column, r);
  }
  return r;
}

const NUMBER_TEXT = String.raw`[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?`;
const NUMBER = new RegExp(`^${NUMBER_TEXT}$`);
const POINT = new RegExp(`^(${NUMBER_TEXT})\\s*:\\s*(${NUMBER_TEXT})$`);
const YES = new Set(['yes', 'y', 'true', '1']);
const NO = new Set(['no', 'n', 'false', '0']);

type Read = { value: unknown } | { problem: string };

/** "x:factor; x:factor" → points { <axis>: x in SI, factor }; the first part that is not a point is named. */
function readPoints(column: ImportColumn, text: string): Read {
  const axis = column.points ?? 'x';
  const parts = text
    .split(';')
    .map((p) => p.trim())
    .filter(Boolean);
  if (!parts.length) return { problem: `has no points; write ${axis}:factor points separated by semicolons, or leave the cell blank` };
  const points: Record<string, number>[] = [];
  for (const part of parts) {
    const m = POINT.exec(part);
    if (!m) return { problem: `'${part}' is not ${axis}:factor (write the points as ${axis}:factor, separated by semicolons)` };
    const [x, factor] = [Number(m[1]), Number(m[2])];
    if (!Number.isFinite(x) || !Number.isFinite(factor)) return { problem: `'${part}' has a number that is not finite` };
    points.push({ [axis]: readerOf(column).toSI(x), factor });
  }
  return { value: points };
}

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
    case 'points':
      return readPoints(column, text);
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
function inColumnUnit(column: ImportColumn | undefined, si: number | bigint, withUnit = true): string {
  const unit = column && withUnit ? unitOfColumn(column) : undefined;
  const shown = unit ? unit.fromSI(Number(si)) : Number(si);
  return `${Number(shown.toPrecision(12))}${unit ? ` ${unit.label}` : ''}`;
}

/** Where an issue is fixed: the column, and for a missing field the column that gave its neighbour. */
interface Blame {
  column: ImportColumn | undefined;
  /** A column of the row that filled a field next to the missing one (e.g. status_location beside a missing status). */
  beside?: ImportColumn;
}

/** A schema issue in the words of a CSV cell (the schema's own message where it has one). */
function wordIssue(issue: z.core.$ZodIssue, { column, beside }: Blame, input: unknown): string {
  const missing = valueAt(input, issue.path) === undefined;
  // In a list of points: which point, and whether the bound is on x (in the column's unit) or on the factor.
  const index = column?.cell === 'points' ? issue.path.findIndex((k) => typeof k === 'number') : -1;
  const point = index >= 0 ? `point ${Number(issue.path[index]) + 1}: ${String(issue.path[index + 1] ?? '')} ` : '';
  const onAxis = index < 0 || issue.path[index + 1] === column?.points;
  const message = (() => {
    switch (issue.code) {
      case 'invalid_type':
      case 'invalid_value':
        if (missing) return beside ? `is required when ${beside.name} is given` : 'is required';
        if (issue.code === 'invalid_value') return `must be one of: ${issue.values.map(String).join(', ')}`;
        return issue.expected === 'int' ? 'must be a whole number' : `must be a ${issue.expected}`;
      case 'too_big':
        if (issue.origin === 'array') return `has more than ${issue.maximum} points`;
        return issue.origin === 'string' ? `is longer than ${issue.maximum} characters` : `must be at most ${inColumnUnit(column, issue.maximum, onAxis)}`;
      case 'too_small':
        if (issue.origin === 'string') return Number(issue.minimum) <= 1 ? 'is required' : `must have at least ${issue.minimum} characters`;
        if (issue.origin === 'array') return `must have at least ${issue.minimum} points`;
        return `must be at least ${inColumnUnit(column, issue.minimum, onAxis)}`;
      default:
        return issue.message;
    }
  })();
  return point + message;
}

/**
 * The mapping for a file with these columns (in the file's order): one row's cells → the draft
 * it describes, or its issues named by column.
 */
export function rowMapper(header: readonly ImportColumn[]): (cells: string[]) => MappedRow {
  // Draft path → the CSV columns that can fill it (a column may fill several paths, and a path
  // may be filled by a row-wide column or by a value's own).
  const columnsOfPath = new Map<string, ImportColumn[]>();
  for (const c of new Set([...PROPERTY_SET_COLUMNS, ...header])) {
    for (const t of readerOf(c).targets) columnsOfPath.set(t.path, [...(columnsOfPath.get(t.path) ?? []), c]);
  }

  /** The column to fix for an issue at `path`: the one whose cell filled it, else one that can fill it, beside the column that filled its neighbour. */
  const blame = (path: string[], placedBy: Map<string, ImportColumn>): Blame => {
    for (let n = path.length; n > 0; n--) {
      const column = placedBy.get(path.slice(0, n).join('.'));
      if (column) return { column };
    }
    for (let n = path.length; n > 0; n--) {
      const candidates = columnsOfPath.get(path.slice(0, n).join('.'));
      if (!candidates) continue;
      const parent = path.slice(0, n - 1).join('.');
      const neighbours = [...placedBy].filter(([p]) => p.startsWith(`${parent}.`)).map(([, c]) => c);
      for (const beside of neighbours) {
        const column = candidates.find((c) => readerOf(c).parents === readerOf(beside).parents);
        if (column) return { column, beside };
      }
      return { column: candidates[0] };
    }
    return { column: undefined };
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

    const placedBy = new Map<string, ImportColumn>();
    // Unconditional targets first; then the conditional ones, each judged on what the first pass
    // filled (so a row-wide default sees the value's own cells, not another default).
    for (const [column, value] of read) {
      for (const t of readerOf(column).targets) {
        if (t.onlyWith || t.unless) continue;
        place(input, t.keys, value);
        placedBy.set(t.path, column);
      }
    }
    const defaults: [Target, ImportColumn, unknown][] = [];
    for (const [column, value] of read) {
      for (const t of readerOf(column).targets) {
        if (!t.onlyWith && !t.unless) continue;
        if (t.onlyWith && valueAt(input, t.onlyWith) === undefined) continue;
        if (t.unless?.some((u) => valueAt(input, u) !== undefined)) continue;
        defaults.push([t, column, value]);
      }
    }
    for (const [t, column, value] of defaults) {
      place(input, t.keys, value);
      placedBy.set(t.path, column);
    }

    const parsed = draftInputSchema.safeParse(input);
    if (parsed.success) return { input, draft: issues.length ? null : parsed.data, issues };
    for (const issue of parsed.error.issues) {
      const who = blame(issue.path.map(String), placedBy);
      flag(who.column?.name ?? '_', wordIssue(issue, who, input));
    }
    return { input, draft: null, issues };
  };
}
