/**
 * The columns of the property-set CSV import, each declared once: its CSV name, the draft path(s)
 * it fills (dotted, as in `draftInputSchema`), how its cells are read, its quantity kind and the
 * unit the CSV gives it in, whether the header must have it, and its help text. The template, the
 * header check, the row mapping, the unit conversion, the insert and the import page's column
 * list all read this one list. Rules on the values are the draft schema's, not this file's.
 */
import { familySchema, referenceKindSchema, valueBasisSchema, type ValueDetail } from '../schemas/catalogue';
import { PROVENANCE_KEYS, valueStatusSchema, type ProvenanceKey } from '../schemas/provenance';
import { QUANTITIES, type Quantity } from '../schemas/quantities';
import { unitByLabel, type QuantityKind, type UnitDef } from '../units';

/**
 * How a cell is read before the draft schema sees it: as text; as a choice (lower case, spaces
 * and underscores become hyphens); as yes/no; as a number in the column's unit (converted to
 * SI); as a whole number; or as a list of points "x:factor; x:factor" (x in the column's unit).
 */
export type CellType = 'text' | 'choice' | 'yes-no' | 'number' | 'integer' | 'points';

/** What the first number of each point of a `points` cell is (the draft's key for it). */
export type PointAxis = 'temperature' | 'hours' | 'cycles';

/**
 * A draft path a cell fills. `onlyWith`: only when that other path has a value in the row.
 * `unless`: only when the row's own cells leave these paths empty, so a row-wide default gives
 * way to a value's own cell. Both are judged on what the row's unconditional cells filled.
 */
export type ColumnTarget = string | { readonly path: string; readonly onlyWith?: string; readonly unless?: readonly string[] };

export interface ImportColumn {
  /** The header cell, lower case. */
  readonly name: string;
  /** The draft path (or paths) the cell's value is placed at. */
  readonly fills: ColumnTarget | readonly ColumnTarget[];
  readonly cell: CellType;
  /** For numbers with a unit (for point lists: the unit of x): the quantity kind and the unit's label in `shared/units.ts`. */
  readonly quantity?: QuantityKind;
  readonly unit?: string;
  /** For point lists: the key of x in each point (the factor is always `factor`). */
  readonly points?: PointAxis;
  /** The header must have it and its cells must not be blank. */
  readonly required: boolean;
  readonly help: string;
  /** Set on the columns of one value (generated from PER_VALUE_PARTS): which value and which part. */
  readonly perValue?: { readonly key: ProvenanceKey; readonly suffix: PerValueSuffix };
}

/** camelCase → snake_case, in the types too: 'youngsModulus' → 'youngs_modulus'. */
type Snake<S extends string> = S extends `${infer H}${infer T}` ? `${H extends Lowercase<H> ? H : `_${Lowercase<H>}`}${Snake<T>}` : S;
const snake = <S extends string>(s: S) => s.replace(/[A-Z]/g, (c) => `_${c.toLowerCase()}`) as Snake<S>;

/** The strengths and yields: what the row's basis, test method and test temperature apply to. */
const STRENGTHS = ['tensileStrength', 'tensileYield', 'compressiveStrength', 'compressiveYield', 'shearStrength', 'shearYield'] as const satisfies readonly Quantity[];

/** A row-wide default for one field of each given value: it fills the value's field when the row has that value and the value's own cell is blank. */
const rowDefault = (keys: readonly string[], field: (key: string) => string, unless: (key: string) => string[] = (k) => [field(k)]): ColumnTarget[] =>
  keys.map((k) => ({ path: field(k), onlyWith: k, unless: unless(k) }));

const detail = (part: keyof ValueDetail) => (k: string) => `valueDetails.${k}.${part}`;
const status = (part: 'status' | 'location' | 'source' | 'rule') => (k: string) => `provenance.${k}.${part}`;
/** The row's location, source and rule go with the row's status: a value with its own status takes none of them. */
const withRowStatus = (part: 'location' | 'source' | 'rule') => rowDefault(PROVENANCE_KEYS, status(part), (k) => [status('status')(k), status(part)(k)]);

const STATUSES = valueStatusSchema.options.join(', ');

/**
 * The columns of one value, each generated for every value it applies to (`<value>_<suffix>`,
 * e.g. `tensile_strength_test_method`, `shear_yield_status`): the value's own basis, test method
 * and test temperature (the quantities), and its own status (every value that carries one). A
 * value's own cell wins over the row's column of the same kind.
 */
export const PER_VALUE_PARTS = [
  { suffix: 'basis', keys: QUANTITIES, fills: detail('basis'), cell: 'choice', help: `Basis of this value alone: ${valueBasisSchema.options.join(', ')} (instead of the row's basis)` },
  { suffix: 'test_method', keys: QUANTITIES, fills: detail('testMethod'), cell: 'text', help: "Test method of this value alone, e.g. ASTM D638 (instead of the row's test_method)" },
  { suffix: 'test_temperature_c', keys: QUANTITIES, fills: detail('temperature'), cell: 'number', quantity: 'temperature', unit: '°C', help: "Test temperature of this value alone (instead of the row's test_temperature_c)" },
  { suffix: 'status', keys: PROVENANCE_KEYS, fills: status('status'), cell: 'choice', help: `Status of this value alone: ${STATUSES}. It then takes none of the row's status columns` },
  { suffix: 'location', keys: PROVENANCE_KEYS, fills: status('location'), cell: 'text', help: 'Where the source shows this value: table, page, figure or clause' },
  { suffix: 'source', keys: PROVENANCE_KEYS, fills: status('source'), cell: 'text', help: 'Another public source that shows this value, when it is not the row’s reference' },
  { suffix: 'rule', keys: PROVENANCE_KEYS, fills: status('rule'), cell: 'text', help: 'For a derived value: the rule it comes from, e.g. tensile yield/√3 (von Mises)' },
] as const satisfies readonly {
  suffix: string;
  keys: readonly ProvenanceKey[];
  fills: (key: string) => string;
  cell: CellType;
  quantity?: QuantityKind;
  unit?: string;
  help: string;
}[];

export type PerValueSuffix = (typeof PER_VALUE_PARTS)[number]['suffix'];
type PerValueName = { [P in (typeof PER_VALUE_PARTS)[number] as P['suffix']]: `${Snake<P['keys'][number]>}_${P['suffix']}` }[PerValueSuffix];

/** Every value's own columns, value by value (all of density's, then Young's modulus's, …). */
const PER_VALUE_COLUMNS: readonly (ImportColumn & { name: PerValueName })[] = PROVENANCE_KEYS.flatMap((key) =>
  PER_VALUE_PARTS.filter((part) => (part.keys as readonly ProvenanceKey[]).includes(key)).map((part) => {
    const { suffix, cell, help } = part;
    const unit = 'unit' in part ? { quantity: part.quantity, unit: part.unit } : {};
    return { name: `${snake(key)}_${suffix}` as PerValueName, fills: part.fills(key), cell, ...unit, required: false, help, perValue: { key, suffix } };
  }),
);

const BASE_COLUMNS = [
  { name: 'material', fills: 'material.name', cell: 'text', required: true, help: 'Material name; an existing one is matched case-insensitively, otherwise it is created' },
  { name: 'family', fills: 'material.family', cell: 'choice', required: true, help: `One of: ${familySchema.options.join(', ')}` },
  { name: 'transparent', fills: 'material.transparent', cell: 'yes-no', required: true, help: 'yes or no' },
  { name: 'condition', fills: 'condition', cell: 'text', required: true, help: 'Form, temper, grade or test state' },
  { name: 'reference_title', fills: 'reference.title', cell: 'text', required: true, help: 'Title of the source; matched with the identifier, otherwise created' },
  { name: 'reference_kind', fills: 'reference.kind', cell: 'choice', required: true, help: `One of: ${referenceKindSchema.options.join(', ')}` },
  { name: 'reference_authors', fills: 'reference.authors', cell: 'text', required: false, help: 'Authors or issuing body' },
  { name: 'reference_year', fills: 'reference.year', cell: 'integer', required: false, help: 'Year of publication' },
  { name: 'reference_identifier', fills: 'reference.identifier', cell: 'text', required: false, help: 'Standard number, DOI or report number' },
  { name: 'reference_location', fills: 'reference.location', cell: 'text', required: false, help: 'Table or page' },
  { name: 'basis', fills: rowDefault(STRENGTHS, detail('basis')), cell: 'choice', required: true, help: `${valueBasisSchema.options.join(', ')}: the basis of the strengths and yields (a value's own <value>_basis wins)` },
  { name: 'test_method', fills: rowDefault(STRENGTHS, detail('testMethod')), cell: 'text', required: false, help: "Test method of the strengths and yields, e.g. ASTM D638 (a value's own <value>_test_method wins)" },
  { name: 'test_temperature_c', fills: rowDefault(STRENGTHS, detail('temperature')), cell: 'number', quantity: 'temperature', unit: '°C', required: false, help: "Temperature the strengths and yields were tested at (a value's own <value>_test_temperature_c wins)" },
  { name: 'status', fills: rowDefault(PROVENANCE_KEYS, status('status')), cell: 'choice', required: false, help: `${STATUSES}: the status of every value in the row, unless the value has its own <value>_status. Blank: recalled (not confirmed)` },
  { name: 'status_location', fills: withRowStatus('location'), cell: 'text', required: false, help: 'Where the source shows the values: table, page, figure or clause (required when the status is confirmed)' },
  { name: 'status_source', fills: withRowStatus('source'), cell: 'text', required: false, help: 'Another public source that shows the values, when it is not the row’s reference' },
  { name: 'status_rule', fills: withRowStatus('rule'), cell: 'text', required: false, help: 'For derived values: the rule they come from (required when the status is derived)' },
  { name: 'density_kg_m3', fills: 'density', cell: 'number', quantity: 'density', unit: 'kg/m³', required: true, help: 'Density' },
  { name: 'youngs_modulus_gpa', fills: 'youngsModulus', cell: 'number', quantity: 'modulus', unit: 'GPa', required: true, help: "Young's modulus" },
  { name: 'poissons_ratio', fills: 'poissonsRatio', cell: 'number', required: true, help: "Poisson's ratio, dimensionless" },
  { name: 'tensile_strength_mpa', fills: 'tensileStrength', cell: 'number', quantity: 'stress', unit: 'MPa', required: true, help: 'Tensile strength' },
  { name: 'tensile_yield_mpa', fills: 'tensileYield', cell: 'number', quantity: 'stress', unit: 'MPa', required: false, help: 'Tensile yield (metals)' },
  { name: 'compressive_strength_mpa', fills: 'compressiveStrength', cell: 'number', quantity: 'stress', unit: 'MPa', required: true, help: 'Compressive strength' },
  { name: 'compressive_yield_mpa', fills: 'compressiveYield', cell: 'number', quantity: 'stress', unit: 'MPa', required: false, help: 'Compressive yield' },
  { name: 'shear_strength_mpa', fills: 'shearStrength', cell: 'number', quantity: 'stress', unit: 'MPa', required: true, help: 'Shear strength' },
  { name: 'shear_yield_mpa', fills: 'shearYield', cell: 'number', quantity: 'stress', unit: 'MPa', required: false, help: 'Shear yield (metals; without it the calculation takes tensile yield/√3)' },
  { name: 'elongation_pct', fills: 'elongation', cell: 'number', quantity: 'fraction', unit: '%', required: false, help: 'Elongation at break' },
  { name: 'luminous_transmittance_pct', fills: 'luminousTransmittance', cell: 'number', quantity: 'fraction', unit: '%', required: false, help: 'Luminous transmittance' },
  { name: 'service_temp_min_c', fills: 'serviceTemperature.min', cell: 'number', quantity: 'temperature', unit: '°C', required: true, help: 'Lowest service temperature' },
  { name: 'service_temp_max_c', fills: 'serviceTemperature.max', cell: 'number', quantity: 'temperature', unit: '°C', required: true, help: 'Highest service temperature' },
  { name: 'temperature_factors', fills: 'temperatureFactors', cell: 'points', points: 'temperature', quantity: 'temperature', unit: '°C', required: false, help: 'Strength factor against temperature, as °C:factor points separated by semicolons, e.g. -20:1.15; 23:1; 50:0.8' },
  { name: 'sustained_load_factors', fills: 'sustainedLoadFactors', cell: 'points', points: 'hours', required: false, help: 'Strength factor against hours at load, as hours:factor points, e.g. 0:1; 1000:0.75; 100000:0.6' },
  { name: 'cyclic_factors', fills: 'cyclicFactors', cell: 'points', points: 'cycles', required: false, help: 'Strength factor against pressure cycles, as cycles:factor points, e.g. 1:1; 1000:0.85; 10000:0.7' },
] as const satisfies readonly ImportColumn[];

/**
 * Every column, in the template's order: the row's own (material, reference, the row-wide basis,
 * test and status columns, the values and the point lists), then each value's own columns.
 */
export const PROPERTY_SET_COLUMNS: readonly ImportColumn[] = [...BASE_COLUMNS, ...PER_VALUE_COLUMNS];

export type ImportColumnName = (typeof BASE_COLUMNS)[number]['name'] | PerValueName;

/** Every target of a column, as { path, onlyWith?, unless? }. */
export function targetsOf(column: ImportColumn): { path: string; onlyWith?: string; unless?: readonly string[] }[] {
  const fills: readonly ColumnTarget[] = typeof column.fills === 'string' || !Array.isArray(column.fills) ? [column.fills as ColumnTarget] : column.fills;
  return fills.map((t) => (typeof t === 'string' ? { path: t } : t));
}

/** The unit a column's numbers are given in, from the shared units table; none for plain numbers. */
export function unitOfColumn(column: ImportColumn): UnitDef | undefined {
  if (!column.quantity && !column.unit) return undefined;
  const unit = column.quantity && column.unit !== undefined ? unitByLabel(column.quantity, column.unit) : undefined;
  if (!unit) throw new Error(`CSV column ${column.name}: the units table has no ${column.quantity ?? '(no kind)'} unit "${column.unit ?? ''}"`);
  return unit;
}

