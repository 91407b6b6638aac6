/**
 * The columns of the property-set CSV import, each declared once: its CSV name, the draft path(s)
 * it fills (dotted, as in `draftInputSchema`), how its cells are read, its quantity kind and the
 * unit the CSV gives it in, whether the header must have it, and its help text. The template, the
 * header check, the row mapping, the unit conversion, the insert and the import page's column
 * list all read this one list. Rules on the values are the draft schema's, not this file's.
 */
import { familySchema, referenceKindSchema, valueBasisSchema } from '../schemas/catalogue';
import { unitByLabel, type QuantityKind, type UnitDef } from '../units';

/**
 * How a cell is read before the draft schema sees it: as text; as a choice (lower case, spaces
 * and underscores become hyphens); as yes/no; as a number in the column's unit (converted to
 * SI); or as a whole number.
 */
export type CellType = 'text' | 'choice' | 'yes-no' | 'number' | 'integer';

/** A draft path a cell fills; `onlyWith`: only when that other path has a value in the row. */
export type ColumnTarget = string | { readonly path: string; readonly onlyWith: string };

export interface ImportColumn {
  /** The header cell, lower case. */
  readonly name: string;
  /** The draft path (or paths) the cell's value is placed at. */
  readonly fills: ColumnTarget | readonly ColumnTarget[];
  readonly cell: CellType;
  /** For numbers with a unit: the quantity kind and the unit's label in `shared/units.ts`. */
  readonly quantity?: QuantityKind;
  readonly unit?: string;
  /** The header must have it and its cells must not be blank. */
  readonly required: boolean;
  readonly help: string;
}

const STRENGTH_BASIS: readonly ColumnTarget[] = [
  'valueDetails.tensileStrength.basis',
  'valueDetails.compressiveStrength.basis',
  'valueDetails.shearStrength.basis',
  { path: 'valueDetails.tensileYield.basis', onlyWith: 'tensileYield' },
  { path: 'valueDetails.compressiveYield.basis', onlyWith: 'compressiveYield' },
];

export const PROPERTY_SET_COLUMNS = [
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
  { name: 'basis', fills: STRENGTH_BASIS, cell: 'choice', required: true, help: `${valueBasisSchema.options.join(', ')} (applies to the strengths and yields)` },
  { name: 'density_kg_m3', fills: 'density', cell: 'number', quantity: 'density', unit: 'kg/m³', required: true, help: 'Density' },
  { name: 'youngs_modulus_gpa', fills: 'youngsModulus', cell: 'number', quantity: 'modulus', unit: 'GPa', required: true, help: "Young's modulus" },
  { name: 'poissons_ratio', fills: 'poissonsRatio', cell: 'number', required: true, help: "Poisson's ratio, dimensionless" },
  { name: 'tensile_strength_mpa', fills: 'tensileStrength', cell: 'number', quantity: 'stress', unit: 'MPa', required: true, help: 'Tensile strength' },
  { name: 'tensile_yield_mpa', fills: 'tensileYield', cell: 'number', quantity: 'stress', unit: 'MPa', required: false, help: 'Tensile yield (metals)' },
  { name: 'compressive_strength_mpa', fills: 'compressiveStrength', cell: 'number', quantity: 'stress', unit: 'MPa', required: true, help: 'Compressive strength' },
  { name: 'compressive_yield_mpa', fills: 'compressiveYield', cell: 'number', quantity: 'stress', unit: 'MPa', required: false, help: 'Compressive yield' },
  { name: 'shear_strength_mpa', fills: 'shearStrength', cell: 'number', quantity: 'stress', unit: 'MPa', required: true, help: 'Shear strength' },
  { name: 'elongation_pct', fills: 'elongation', cell: 'number', quantity: 'fraction', unit: '%', required: false, help: 'Elongation at break' },
  { name: 'luminous_transmittance_pct', fills: 'luminousTransmittance', cell: 'number', quantity: 'fraction', unit: '%', required: false, help: 'Luminous transmittance' },
  { name: 'service_temp_min_c', fills: 'serviceTemperature.min', cell: 'number', quantity: 'temperature', unit: '°C', required: true, help: 'Lowest service temperature' },
  { name: 'service_temp_max_c', fills: 'serviceTemperature.max', cell: 'number', quantity: 'temperature', unit: '°C', required: true, help: 'Highest service temperature' },
] as const satisfies readonly ImportColumn[];

export type ImportColumnName = (typeof PROPERTY_SET_COLUMNS)[number]['name'];

/** Every target of a column, as { path, onlyWith? }. */
export function targetsOf(column: ImportColumn): { path: string; onlyWith?: string }[] {
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

