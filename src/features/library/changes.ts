import { QUANTITIES, QUANTITY_LABELS, type PropertySetDto, type Quantity, type ValueDetail } from '@shared/schemas/catalogue';
import type { ValueChangeDto } from '@shared/schemas/library';
import { formatQuantity, type UnitSystem } from '@/lib/units';
import { QUANTITY_KIND } from './draft-form';

/**
 * How a change between two versions of a property set reads on the review screen. Field names
 * are DTO paths ("tensileStrength", "serviceTemperature.max", "reference.title",
 * "valueDetails.shearStrength.basis", "temperatureFactors"); values are SI.
 */

const isQuantity = (s: string): s is Quantity => (QUANTITIES as readonly string[]).includes(s);

const DETAIL_LABELS: Record<string, string> = { basis: 'basis', testMethod: 'test method', temperature: 'test temperature' };

const FIELD_LABELS: Record<string, string> = {
  condition: 'Condition',
  material: 'Material',
  'material.name': 'Material',
  'material.id': 'Material',
  'material.family': 'Material family',
  'material.transparent': 'Material transparency',
  reference: 'Reference',
  'reference.id': 'Reference',
  'reference.kind': 'Reference kind',
  'reference.title': 'Reference title',
  'reference.authors': 'Reference authors',
  'reference.year': 'Reference year',
  'reference.identifier': 'Reference identifier',
  'reference.location': 'Reference table / page',
  'reference.note': 'Reference note',
  serviceTemperature: 'Service temperature',
  'serviceTemperature.min': 'Service temperature, lowest',
  'serviceTemperature.max': 'Service temperature, highest',
  valueDetails: 'Basis, method and test temperature',
  temperatureFactors: 'Strength vs temperature',
  sustainedLoadFactors: 'Strength vs sustained load',
  cyclicFactors: 'Strength vs pressure cycles',
};

export function fieldLabel(field: string): string {
  if (isQuantity(field)) return QUANTITY_LABELS[field];
  if (FIELD_LABELS[field]) return FIELD_LABELS[field];
  const detail = /^valueDetails\.([a-zA-Z]+)(?:\.([a-zA-Z]+))?$/.exec(field);
  if (detail && isQuantity(detail[1])) {
    const what = detail[2] ? (DETAIL_LABELS[detail[2]] ?? detail[2]) : 'basis, method and test temperature';
    return `${QUANTITY_LABELS[detail[1]]}: ${what}`;
  }
  return field;
}

const num = (v: number, digits = 2) => v.toLocaleString('en-GB', { maximumFractionDigits: digits });

function formatDetail(d: Partial<ValueDetail>, system: UnitSystem): string {
  return [d.basis, d.testMethod, d.temperature !== undefined ? `at ${formatQuantity('temperature', system, d.temperature)}` : undefined]
    .filter(Boolean)
    .join(', ');
}

function formatPoints(field: string, points: unknown[], system: UnitSystem): string {
  if (points.length === 0) return 'none';
  return points
    .map((p) => {
      const point = p as { temperature?: number; hours?: number; cycles?: number; factor?: number };
      const at =
        field === 'temperatureFactors'
          ? formatQuantity('temperature', system, point.temperature)
          : field === 'sustainedLoadFactors'
            ? `${num(point.hours ?? Number.NaN, 0)} h`
            : `${num(point.cycles ?? Number.NaN, 0)} cycles`;
      return `${at} ×${num(point.factor ?? Number.NaN, 3)}`;
    })
    .join('; ');
}

/** One side of a change, in the chosen unit system. */
export function formatChangeValue(field: string, value: unknown, system: UnitSystem): string {
  if (value === null || value === undefined || value === '') return '—';
  if (isQuantity(field) && typeof value === 'number') {
    const kind = QUANTITY_KIND[field];
    return kind ? formatQuantity(kind, system, value, { exact: true }) : num(value, 12);
  }
  if (/^serviceTemperature\.(min|max)$/.test(field) && typeof value === 'number') return formatQuantity('temperature', system, value);
  if (/^valueDetails\.[a-zA-Z]+\.temperature$/.test(field) && typeof value === 'number') return formatQuantity('temperature', system, value);
  if (field === 'serviceTemperature' && typeof value === 'object') {
    const r = value as { min: number; max: number };
    return `${formatQuantity('temperature', system, r.min)} to ${formatQuantity('temperature', system, r.max)}`;
  }
  if (/^(temperatureFactors|sustainedLoadFactors|cyclicFactors)$/.test(field) && Array.isArray(value)) return formatPoints(field, value, system);
  if (/^valueDetails\.[a-zA-Z]+$/.test(field) && typeof value === 'object') return formatDetail(value as ValueDetail, system) || '—';
  if (field === 'valueDetails' && typeof value === 'object') {
    const entries = Object.entries(value as Record<string, ValueDetail>);
    return entries.length ? entries.map(([q, d]) => `${isQuantity(q) ? QUANTITY_LABELS[q] : q}: ${formatDetail(d, system)}`).join('; ') : 'none';
  }
  if ((field === 'material' || field === 'reference') && typeof value === 'object') {
    const named = value as { name?: string; title?: string };
    return named.name ?? named.title ?? JSON.stringify(value);
  }
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  if (typeof value === 'number') return num(value, 6);
  if (typeof value === 'string') return value;
  return JSON.stringify(value);
}

export interface ChangeRow {
  field: string;
  label: string;
  before: string;
  after: string;
}

export function describeChanges(changes: ValueChangeDto[], system: UnitSystem): ChangeRow[] {
  return changes.map((c) => ({
    field: c.field,
    label: fieldLabel(c.field),
    before: formatChangeValue(c.field, c.before, system),
    after: formatChangeValue(c.field, c.after, system),
  }));
}

/** Cells of the values table: the value and its basis, test method and test temperature. */
export type ValueCell = 'value' | 'basis' | 'testMethod' | 'temperature';

const same = (a: unknown, b: unknown) => (a ?? null) === (b ?? null);

/**
 * Which cells of the values table differ between a set and the version it supersedes, found by
 * comparing the two sets themselves (so the highlight never depends on how the server names a path).
 */
export function changedCells(current: PropertySetDto, previous: PropertySetDto | null): Map<Quantity | 'serviceTemperature.min' | 'serviceTemperature.max', Set<ValueCell>> {
  const out = new Map<Quantity | 'serviceTemperature.min' | 'serviceTemperature.max', Set<ValueCell>>();
  if (!previous) return out;
  for (const q of QUANTITIES) {
    const cells = new Set<ValueCell>();
    if (!same(current[q], previous[q])) cells.add('value');
    const a = current.valueDetails[q];
    const b = previous.valueDetails[q];
    if (!same(a?.basis, b?.basis)) cells.add('basis');
    if (!same(a?.testMethod, b?.testMethod)) cells.add('testMethod');
    if (!same(a?.temperature, b?.temperature)) cells.add('temperature');
    if (cells.size) out.set(q, cells);
  }
  if (current.serviceTemperature.min !== previous.serviceTemperature.min) out.set('serviceTemperature.min', new Set(['value']));
  if (current.serviceTemperature.max !== previous.serviceTemperature.max) out.set('serviceTemperature.max', new Set(['value']));
  return out;
}
