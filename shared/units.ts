import { convert, type Unit } from 'convert';

/**
 * SI inside, always; these convert only at the edges (forms, tables, charts, the CSV import's
 * columns). Shared by the client and the server so both convert through the same table.
 */
export type UnitSystem = 'SI' | 'US';
export type QuantityKind =
  | 'stress'
  | 'modulus'
  | 'pressure'
  | 'density'
  | 'temperature'
  | 'length'
  | 'depth'
  | 'massPerArea'
  | 'fraction'
  | 'area'
  | 'secondMoment';

export interface UnitDef {
  label: string;
  /** Converts the SI value to display units. */
  fromSI: (si: number) => number;
  /** Converts a display value back to SI. */
  toSI: (shown: number) => number;
  digits: number;
}

// Factors come from the `convert` library; `scale` covers prefixes it lacks (ksi = 1000 psi).
const via = (from: Unit, to: Unit, scale = 1): Pick<UnitDef, 'fromSI' | 'toSI'> => {
  const factor = (convert(1, from as never).to(to as never) as unknown as number) * scale;
  return from === 'C' ? { fromSI: (v) => convert(v, 'C').to('F'), toSI: (v) => convert(v, 'F').to('C') } : { fromSI: (v) => v * factor, toSI: (v) => v / factor };
};

// kg/m³ → lb/in³ and kg/m² → lb/ft², built from the library's mass, volume and area units.
const lbPerKg = convert(1, 'kg').to('lb');
const densityUS = lbPerKg / convert(1, 'm3').to('in3');
const arealUS = lbPerKg / convert(1, 'm2').to('ft2');
const inPerM = convert(1, 'm').to('in');

const UNITS: Record<QuantityKind, Record<UnitSystem, UnitDef>> = {
  stress: {
    SI: { label: 'MPa', ...via('Pa', 'MPa'), digits: 1 },
    US: { label: 'ksi', ...via('Pa', 'psi', 1e-3), digits: 2 },
  },
  modulus: {
    SI: { label: 'GPa', fromSI: (v) => v / 1e9, toSI: (v) => v * 1e9, digits: 1 },
    US: { label: 'Msi', ...via('Pa', 'psi', 1e-6), digits: 2 },
  },
  pressure: {
    SI: { label: 'MPa', ...via('Pa', 'MPa'), digits: 2 },
    US: { label: 'psi', ...via('Pa', 'psi'), digits: 0 },
  },
  density: {
    SI: { label: 'kg/m³', fromSI: (v) => v, toSI: (v) => v, digits: 0 },
    US: { label: 'lb/in³', fromSI: (v) => v * densityUS, toSI: (v) => v / densityUS, digits: 4 },
  },
  temperature: {
    SI: { label: '°C', fromSI: (v) => v, toSI: (v) => v, digits: 0 },
    US: { label: '°F', ...via('C', 'F'), digits: 0 },
  },
  length: {
    SI: { label: 'mm', ...via('m', 'mm'), digits: 1 },
    US: { label: 'in', ...via('m', 'in'), digits: 3 },
  },
  depth: {
    SI: { label: 'm', fromSI: (v) => v, toSI: (v) => v, digits: 0 },
    US: { label: 'ft', ...via('m', 'ft'), digits: 0 },
  },
  massPerArea: {
    SI: { label: 'kg/m²', fromSI: (v) => v, toSI: (v) => v, digits: 1 },
    US: { label: 'lb/ft²', fromSI: (v) => v * arealUS, toSI: (v) => v / arealUS, digits: 2 },
  },
  fraction: {
    SI: { label: '%', fromSI: (v) => v * 100, toSI: (v) => v / 100, digits: 1 },
    US: { label: '%', fromSI: (v) => v * 100, toSI: (v) => v / 100, digits: 1 },
  },
  area: {
    SI: { label: 'mm²', fromSI: (v) => v * 1e6, toSI: (v) => v / 1e6, digits: 0 },
    US: { label: 'in²', fromSI: (v) => v * inPerM ** 2, toSI: (v) => v / inPerM ** 2, digits: 3 },
  },
  secondMoment: {
    SI: { label: 'mm⁴', fromSI: (v) => v * 1e12, toSI: (v) => v / 1e12, digits: 0 },
    US: { label: 'in⁴', fromSI: (v) => v * inPerM ** 4, toSI: (v) => v / inPerM ** 4, digits: 2 },
  },
};

/** The unit of `kind` whose label is `label` (e.g. stress "MPa", modulus "GPa"), in either system. */
export function unitByLabel(kind: QuantityKind, label: string): UnitDef | undefined {
  const { SI, US } = UNITS[kind];
  return SI.label === label ? SI : US.label === label ? US : undefined;
}

export const unitOf = (kind: QuantityKind, system: UnitSystem): UnitDef => UNITS[kind][system];
export const toDisplay = (kind: QuantityKind, system: UnitSystem, si: number): number => UNITS[kind][system].fromSI(si);
export const fromDisplay = (kind: QuantityKind, system: UnitSystem, shown: number): number => UNITS[kind][system].toSI(shown);

/** A value formatted in the chosen system, e.g. "62.0 MPa"; an em dash when unknown. */
export function formatQuantity(
  kind: QuantityKind,
  system: UnitSystem,
  si: number | null | undefined,
  options: { unit?: boolean; digits?: number; exact?: boolean } = {},
): string {
  if (si === null || si === undefined || !Number.isFinite(si)) return '—';
  const def = UNITS[kind][system];
  const shown = def.fromSI(si);
  const digits = options.digits ?? def.digits;
  // exact: every digit the stored value has (to 12 significant figures, dropping conversion noise), for reviewers.
  const text = options.exact
    ? Number(shown.toPrecision(12)).toLocaleString('en-GB', { minimumFractionDigits: digits === 0 ? 0 : Math.min(digits, 1), maximumFractionDigits: 12 })
    : shown.toLocaleString('en-GB', { minimumFractionDigits: digits, maximumFractionDigits: digits });
  return options.unit === false ? text : `${text} ${def.label}`;
}

/** Pressure can be typed and read in MPa, bar or psi whatever the system; always gauge. */
export type PressureUnit = 'MPa' | 'bar' | 'psi';
export const PRESSURE_UNITS: Record<PressureUnit, UnitDef> = {
  MPa: UNITS.pressure.SI,
  bar: { label: 'bar', ...via('Pa', 'bar'), digits: 1 },
  psi: UNITS.pressure.US,
};
/** The pressure unit a system starts with. */
export const defaultPressureUnit = (system: UnitSystem): PressureUnit => (system === 'US' ? 'psi' : 'MPa');

/** A gauge pressure in all three units, the system's first: "12.15 MPa (121.5 bar, 1,762 psi)". */
export function formatPressureAll(pa: number | null | undefined, first: PressureUnit = 'MPa'): string {
  if (pa === null || pa === undefined || !Number.isFinite(pa)) return '—';
  const one = (u: PressureUnit) => {
    const def = PRESSURE_UNITS[u];
    return `${def.fromSI(pa).toLocaleString('en-GB', { minimumFractionDigits: def.digits, maximumFractionDigits: def.digits })} ${def.label}`;
  };
  const rest = (Object.keys(PRESSURE_UNITS) as PressureUnit[]).filter((u) => u !== first).map(one);
  return `${one(first)} (${rest.join(', ')})`;
}

/**
 * A converted value rounded for a form field to meaningful digits: the decimals the unit shows in
 * tables, and never fewer than four significant figures (5.906 in, not 5.90551 in).
 */
export function roundForInput(def: Pick<UnitDef, 'digits'>, value: number): number {
  if (!Number.isFinite(value) || value === 0) return value;
  const decimals = def.digits;
  const bySignificant = 4 - Math.floor(Math.log10(Math.abs(value))) - 1;
  const places = Math.min(12, Math.max(decimals, bySignificant));
  return Number(value.toFixed(places));
}
