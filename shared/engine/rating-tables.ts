/**
 * Rating tables: the trade's empirical window data (minimum t/Di against design pressure and
 * temperature, or short-term critical pressure against t/Di with conversion factors), read the
 * way a window designer reads them.
 *
 * Rules, stated in every result's `interpolation` text:
 *  - linear interpolation between rows (pressure, or thickness ratio) and between temperature
 *    columns; never extrapolation: a design pressure or temperature beyond the table's last row
 *    or column, a cell the source leaves empty, or a service life beyond the table's stated
 *    limits gives no number and says why;
 *  - below the first row or column the first is used, which is the conservative side because
 *    the tables' requirements never fall with pressure or temperature (the schema refuses a table
 *    whose do); the result says when this happened;
 *  - the design temperature is the highest of the load case's range (the tables' columns are
 *    chosen by the highest sustained temperature).
 * The thickness ratio is t/Di for flat discs (Di = unsupported diameter of the seat) and conical
 * frustums (Di = minor diameter), t/Ri for spherical sectors (Ri = inner spherical radius).
 */
import type { Component } from '../schemas/evaluate';
import { fmt } from './allowables';
import type { CriticalPressureData, MinimumRatioData, RatingGeometry, RatingResult, RatingTable } from './types';

/** The window geometries rating tables are written for. */
export const RATING_GEOMETRIES: readonly RatingGeometry[] = ['flat-disc', 'conical-frustum', 'spherical-sector'];

export function isWindowComponent(c: Component): c is Extract<Component, { type: RatingGeometry }> {
  return c.type === 'flat-disc' || c.type === 'conical-frustum' || c.type === 'spherical-sector';
}

/** The dimension the thickness ratio is taken over (m), and its name. */
export function ratioBase(c: Extract<Component, { type: RatingGeometry }>): { base: number; label: 't/Di' | 't/Ri' } {
  if (c.type === 'flat-disc') return { base: c.diameter, label: 't/Di' };
  if (c.type === 'conical-frustum') return { base: c.minorDiameter, label: 't/Di' };
  return { base: c.innerRadius, label: 't/Ri' };
}

/** True when the table is written for this component's geometry (and its included angle). */
export function tableCovers(table: RatingTable, c: Component): boolean {
  if (table.geometry !== c.type) return false;
  if (c.type === 'conical-frustum' || c.type === 'spherical-sector') {
    const range = table.includedAngle;
    if (!range) return false;
    return c.includedAngle >= range.min && c.includedAngle <= range.max;
  }
  return true;
}

const PSI = 6894.757293168;
const pressureText = (p: number) => `${fmt(p / 1e6)} MPa (${fmt(p / 1e5)} bar, ${fmt(p / PSI)} psi)`;

/** Index i with xs[i] ≤ x ≤ xs[i + 1] for x inside [xs[0], xs[n−1]]; xs ascending, n ≥ 2. */
function bracket(xs: readonly number[], x: number): number {
  let i = 0;
  while (i < xs.length - 2 && xs[i + 1] < x) i++;
  return i;
}

const lerp = (x0: number, x1: number, y0: number, y1: number, x: number) => (x1 === x0 ? y0 : y0 + ((y1 - y0) * (x - x0)) / (x1 - x0));

interface Reading {
  /** The value, or null with `outside` saying why. */
  value: number | null;
  outside?: string;
  /** Conservative clampings that were applied. */
  notes: string[];
}

/**
 * A column curve of a minimum-ratio table at design temperature T: for each row, the ratio
 * interpolated between the two temperature columns around T (the first column below it). Rows
 * stop at the first that lacks a needed cell. Null with a reason when T is beyond the last column.
 */
function columnAt(d: MinimumRatioData, T: number): { pressures: number[]; ratios: number[]; notes: string[] } | { outside: string } {
  const temps = d.temperatures;
  const last = temps[temps.length - 1];
  if (T > last) return { outside: `the design temperature ${fmt(T)} °C is above the table's last column (${fmt(last)} °C)` };
  const notes: string[] = [];
  let j0 = 0;
  let j1 = 0;
  let w = 0;
  if (T <= temps[0]) {
    if (T < temps[0]) notes.push(`design temperature ${fmt(T)} °C is below the first column: the ${fmt(temps[0])} °C column is used (conservative)`);
  } else if (temps.length > 1) {
    j0 = bracket(temps, T);
    j1 = j0 + 1;
    w = (T - temps[j0]) / (temps[j1] - temps[j0]);
  }
  const pressures: number[] = [];
  const ratios: number[] = [];
  for (let i = 0; i < d.pressures.length; i++) {
    const a = d.ratios[i][j0];
    const b = d.ratios[i][j1];
    if (a === null || a === undefined || b === null || b === undefined) break;
    pressures.push(d.pressures[i]);
    ratios.push(a + (b - a) * w);
  }
  if (pressures.length === 0) return { outside: `the table gives no value at ${fmt(T)} °C` };
  return { pressures, ratios, notes };
}

/** Minimum thickness ratio at design pressure P and temperature T. */
export function minimumRatioAt(d: MinimumRatioData | CriticalPressureData, P: number, T: number): Reading {
  if (d.form === 'critical-pressure') return criticalRatioAt(d, P, T);
  const col = columnAt(d, T);
  if ('outside' in col) return { value: null, outside: col.outside, notes: [] };
  const { pressures, ratios, notes } = col;
  const lastP = pressures[pressures.length - 1];
  if (P > lastP) {
    const tableLast = d.pressures[d.pressures.length - 1];
    return {
      value: null,
      outside:
        lastP < tableLast
          ? `the table gives no value above ${pressureText(lastP)} at ${fmt(T)} °C`
          : `the design pressure ${pressureText(P)} is above the table's last row (${pressureText(lastP)})`,
      notes,
    };
  }
  if (P <= pressures[0]) {
    if (P < pressures[0]) notes.push(`design pressure is below the first row: the ${pressureText(pressures[0])} row is used (conservative)`);
    return { value: ratios[0], notes };
  }
  const i = bracket(pressures, P);
  return { value: lerp(pressures[i], pressures[i + 1], ratios[i], ratios[i + 1], P), notes };
}

/** Conversion factor at design temperature T (linear between points; first point below them). */
function conversionFactorAt(d: CriticalPressureData, T: number): Reading {
  const pts = d.conversionFactors;
  const last = pts[pts.length - 1];
  if (T > last.temperature) {
    return { value: null, outside: `the design temperature ${fmt(T)} °C is above the table's last conversion-factor column (${fmt(last.temperature)} °C)`, notes: [] };
  }
  if (T <= pts[0].temperature) {
    const notes = T < pts[0].temperature ? [`design temperature ${fmt(T)} °C is below the first conversion-factor column: the ${fmt(pts[0].temperature)} °C factor is used (conservative)`] : [];
    return { value: pts[0].factor, notes };
  }
  const temps = pts.map((p) => p.temperature);
  const i = bracket(temps, T);
  return { value: lerp(temps[i], temps[i + 1], pts[i].factor, pts[i + 1].factor, T), notes: [] };
}

function criticalRatioAt(d: CriticalPressureData, P: number, T: number): Reading {
  const cf = conversionFactorAt(d, T);
  if (cf.value === null) return cf;
  const needed = cf.value * P;
  const notes = [...cf.notes, `conversion factor ${fmt(cf.value)}: short-term critical pressure needed ${pressureText(needed)}`];
  const stcp = d.criticalPressures;
  const last = stcp[stcp.length - 1];
  if (needed > last) {
    return { value: null, outside: `the short-term critical pressure needed, ${pressureText(needed)}, is above the table's last row (${pressureText(last)})`, notes };
  }
  if (needed <= stcp[0]) {
    if (needed < stcp[0]) notes.push('the pressure needed is below the first row: its thickness ratio is used (conservative)');
    return { value: d.ratios[0], notes };
  }
  const i = bracket(stcp, needed);
  return { value: lerp(stcp[i], stcp[i + 1], d.ratios[i], d.ratios[i + 1], needed), notes };
}

/**
 * The pressure the table rates a thickness ratio r for at design temperature T: the inverse of
 * `minimumRatioAt`. Null when r is below the table's first row (the table cannot say how much
 * less it carries); a lower bound when r exceeds the last row.
 */
export function ratedPressureAt(d: MinimumRatioData | CriticalPressureData, r: number, T: number): { value: number | null; lowerBound: boolean } {
  let xs: readonly number[];
  let ps: readonly number[];
  let scale = 1;
  if (d.form === 'critical-pressure') {
    const cf = conversionFactorAt(d, T);
    if (cf.value === null) return { value: null, lowerBound: false };
    xs = d.ratios;
    ps = d.criticalPressures;
    scale = 1 / cf.value;
  } else {
    const col = columnAt(d, T);
    if ('outside' in col) return { value: null, lowerBound: false };
    xs = col.ratios;
    ps = col.pressures;
  }
  if (r < xs[0]) return { value: null, lowerBound: false };
  const n = xs.length;
  if (r >= xs[n - 1]) return { value: ps[n - 1] * scale, lowerBound: true };
  // the largest pressure whose requirement r meets (ratios non-decreasing; flat steps take the far end)
  let i = 0;
  while (i < n - 2 && xs[i + 1] <= r) i++;
  const p = xs[i + 1] === xs[i] ? ps[i + 1] : lerp(xs[i], xs[i + 1], ps[i], ps[i + 1], r);
  return { value: p * scale, lowerBound: false };
}

/** Service beyond the table's stated limits, or null. */
function beyondLimits(table: RatingTable, hours: number, cycles: number): string | null {
  const l = table.limits;
  if (!l) return null;
  if (l.sustainedHours != null && hours > l.sustainedHours) {
    return `the load case's ${fmt(hours)} h of sustained load exceed the ${fmt(l.sustainedHours)} h the table's data support`;
  }
  if (l.cycles != null && cycles > l.cycles) return `the load case's ${fmt(cycles)} pressure cycles exceed the ${fmt(l.cycles)} the table's data support`;
  return null;
}

export const INTERPOLATION_RULE =
  'Linear between rows and between temperature columns at the highest design temperature; never extrapolated; below the first row or column the first is used (conservative).';

/**
 * The rating-table route for one table and one window: minimum ratio and required thickness at
 * the design pressure, rated pressure at the entered thickness. `crossCheckSafetyFactor` is left
 * null for the caller to fill.
 */
export function rateWithTable(
  table: RatingTable,
  component: Extract<Component, { type: RatingGeometry }>,
  pressure: number,
  conditions: { temperature: { max: number }; sustainedHours: number; cycles: number },
): RatingResult {
  const { base, label } = ratioBase(component);
  const T = conditions.temperature.max;
  const result: RatingResult = {
    name: table.name,
    source: table.source,
    minimumRatio: null,
    requiredThickness: null,
    ratedPressure: null,
    ratedPressureIsLowerBound: false,
    interpolation: INTERPOLATION_RULE,
    crossCheckSafetyFactor: null,
  };
  if (table.id !== undefined) result.ratingTableId = table.id;
  if (table.version !== undefined) result.version = table.version;
  const limit = beyondLimits(table, conditions.sustainedHours, conditions.cycles);
  if (limit) {
    result.outside = `Outside the rating table: ${limit}.`;
    return result;
  }
  const need = minimumRatioAt(table.data, pressure, T);
  if (need.value === null) {
    result.outside = `Outside the rating table: ${need.outside}.`;
    return result;
  }
  result.minimumRatio = need.value;
  result.requiredThickness = need.value * base;
  const rated = ratedPressureAt(table.data, component.thickness / base, T);
  result.ratedPressure = rated.value;
  result.ratedPressureIsLowerBound = rated.lowerBound;
  const notes = need.notes.length ? ` Here: ${need.notes.join('; ')}.` : '';
  result.interpolation = `${INTERPOLATION_RULE} Minimum ${label} ${fmt(need.value)} at ${pressureText(pressure)} and ${fmt(T)} °C.${notes}`;
  return result;
}

/**
 * The margin the table gives the entered thickness: rated pressure / design pressure − 1 (a lower
 * bound when the rating is), or, when the entered thickness is below the table's first row, the
 * thickness shortfall entered/required − 1 (negative). Null outside the table.
 */
export function ratingMargin(r: RatingResult, pressure: number, thickness: number): number | null {
  if (r.requiredThickness === null) return null;
  if (r.ratedPressure !== null) return r.ratedPressure / pressure - 1;
  return thickness / r.requiredThickness - 1;
}
