/**
 * Where each failure mode governs for one candidate: its component checked over a grid of two
 * inputs, thickness ratio (t/D at the minor diameter) against included angle for conical windows,
 * or thickness against design depth (or pressure) for any component. Each cell records the
 * governing mode and the lowest safety factor over the target, so the chart can draw where the
 * target is met. Analytical modes only: a rating table's sizing is not drawn. Pure; allocates
 * the grid once and the component models' fill() allocates nothing per cell.
 */
import type { Component, LoadCaseInput } from '../schemas/evaluate';
import { modeMaterial, prepareLoadCase, targetFor } from './evaluate';
import { pressureFromDepth } from './pressure';
import type { CandidateMaterial, FailureMode } from './types';

export type ModeMapAxisKind = 'thicknessRatio' | 'includedAngle' | 'thickness' | 'depth' | 'pressure';

export interface ModeMapAxis {
  kind: ModeMapAxisKind;
  from: number;
  to: number;
  /** Number of cells along the axis (values at cell centres). */
  cells: number;
}

export interface ModeMapResult {
  /** Cell-centre values of each axis (SI: m, °, Pa; t/D dimensionless). */
  x: Float64Array;
  y: Float64Array;
  xKind: ModeMapAxisKind;
  yKind: ModeMapAxisKind;
  /** The component model's modes; `governing` indexes into them. */
  modes: readonly FailureMode[];
  /** Governing mode of cell (i, j) at [j * x.length + i]. */
  governing: Uint8Array;
  /** Lowest safety factor / target at each cell: 1 is the target contour. */
  ratio: Float64Array;
  target: number;
}

export const MAX_MODE_MAP_CELLS = 200;

const AXIS_PAIRS: Record<string, true> = { 'thicknessRatio:includedAngle': true, 'thickness:depth': true, 'thickness:pressure': true };

const centres = (a: ModeMapAxis) => {
  const v = new Float64Array(a.cells);
  for (let k = 0; k < a.cells; k++) v[k] = a.from + ((a.to - a.from) * (k + 0.5)) / a.cells;
  return v;
};

/** Throws RangeError for an axis pair the map does not draw, a bad range or too many cells. */
export function modeMap(loadCase: LoadCaseInput, candidate: CandidateMaterial, xAxis: ModeMapAxis, yAxis: ModeMapAxis): ModeMapResult {
  if (!AXIS_PAIRS[`${xAxis.kind}:${yAxis.kind}`]) throw new RangeError(`a mode map over ${xAxis.kind} and ${yAxis.kind} is not drawn`);
  for (const a of [xAxis, yAxis]) {
    if (!(Number.isFinite(a.from) && Number.isFinite(a.to) && a.from > 0 && a.to > a.from)) throw new RangeError(`${a.kind}: from and to must be finite, above zero, from below to`);
    if (!(Number.isInteger(a.cells) && a.cells >= 2 && a.cells <= MAX_MODE_MAP_CELLS)) throw new RangeError(`${a.kind}: cells must be a whole number from 2 to ${MAX_MODE_MAP_CELLS}`);
  }
  const cone = loadCase.component.type === 'conical-frustum';
  if (xAxis.kind === 'thicknessRatio' && !cone) throw new RangeError('thickness ratio against included angle is drawn for conical frustum windows');
  if (yAxis.kind === 'includedAngle' && yAxis.to > 180) throw new RangeError('includedAngle: at most 180°');

  const prepared = prepareLoadCase(loadCase);
  const { model } = prepared;
  const mm = modeMaterial(candidate, prepared, []);
  const target = targetFor(prepared, candidate);
  const x = centres(xAxis);
  const y = centres(yAxis);
  const nx = x.length;
  const governing = new Uint8Array(nx * y.length);
  const ratio = new Float64Array(nx * y.length);
  const stress = new Float64Array(8);
  const allowable = new Float64Array(8);
  const n = model.modes.length;
  const base = prepared.component;
  const minor = base.type === 'conical-frustum' ? base.minorDiameter : 0;
  const latitude = 'depth' in loadCase.pressure ? loadCase.pressure.latitude : 45;
  const water = 'depth' in loadCase.pressure ? loadCase.pressure.water : 'sea';

  for (let j = 0; j < y.length; j++) {
    let component: Component = base;
    let p = prepared.pressure;
    if (yAxis.kind === 'includedAngle') component = { ...(base as Extract<Component, { type: 'conical-frustum' }>), includedAngle: y[j] };
    else if (yAxis.kind === 'depth') p = pressureFromDepth(y[j], latitude, water).pressure;
    else p = y[j];
    for (let i = 0; i < nx; i++) {
      const t = xAxis.kind === 'thicknessRatio' ? x[i] * minor : x[i];
      model.fill(component, t, p, mm, stress, allowable);
      let g = 0;
      let best = Infinity;
      for (let k = 0; k < n; k++) {
        const sf = allowable[k] / stress[k];
        if (sf < best) {
          best = sf;
          g = k;
        }
      }
      governing[j * nx + i] = g;
      ratio[j * nx + i] = best / target;
    }
  }
  return { x, y, xKind: xAxis.kind, yKind: yAxis.kind, modes: model.modes, governing, ratio, target };
}

/**
 * The target contour (ratio = 1) as line segments in cell-centre coordinates (i, j as fractions),
 * by marching squares with linear interpolation along each cell edge.
 */
export function targetContour(map: Pick<ModeMapResult, 'x' | 'y' | 'ratio'>): [number, number, number, number][] {
  const nx = map.x.length;
  const ny = map.y.length;
  const v = (i: number, j: number) => map.ratio[j * nx + i] - 1;
  const segments: [number, number, number, number][] = [];
  const cross = (a: number, b: number) => a / (a - b);
  for (let j = 0; j < ny - 1; j++) {
    for (let i = 0; i < nx - 1; i++) {
      const a = v(i, j);
      const b = v(i + 1, j);
      const c = v(i + 1, j + 1);
      const d = v(i, j + 1);
      const points: [number, number][] = [];
      if (a < 0 !== b < 0) points.push([i + cross(a, b), j]);
      if (b < 0 !== c < 0) points.push([i + 1, j + cross(b, c)]);
      if (c < 0 !== d < 0) points.push([i + 1 - cross(c, d), j + 1]);
      if (d < 0 !== a < 0) points.push([i, j + 1 - cross(d, a)]);
      if (points.length >= 2) segments.push([points[0][0], points[0][1], points[1][0], points[1][1]]);
      if (points.length === 4) segments.push([points[2][0], points[2][1], points[3][0], points[3][1]]);
    }
  }
  return segments;
}
