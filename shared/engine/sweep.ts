/**
 * Safety factor of every mode against thickness, for the chart that shows where the governing
 * mode changes; transitions are located by root finding between sweep points.
 */
import type { LoadCaseInput } from '../schemas/evaluate';
import { prepareLoadCase, targetFor } from './load-case';
import { modeMaterial } from './evaluate-candidate';
import { brent } from './solve';
import type { CandidateMaterial, FailureMode } from './types';

export interface SweepOptions {
  /** Smallest thickness, m (> 0). */
  from: number;
  /** Largest thickness, m (> from). */
  to: number;
  /** Number of intervals (1..2000); the sweep has steps + 1 points. */
  steps: number;
  /** Spacing of the points (default 'linear'). */
  spacing?: 'linear' | 'log';
}

export interface SweepSeries {
  mode: FailureMode;
  /** Which check, when a component has several of one mode. */
  check?: string;
  model: string;
  /** Safety factor at each thickness of `thickness`. */
  safetyFactor: number[];
  /** Whether the mode's formula is inside its range at each thickness; charts grey or stop the curve where it is not. */
  valid: boolean[];
  /** Why it is outside its range, when it is anywhere in the sweep. */
  invalidReason?: string;
}

export interface GoverningTransition {
  /** m */
  thickness: number;
  /** Mode governing just below this thickness. */
  from: FailureMode;
  /** Mode governing just above it. */
  to: FailureMode;
}

export interface SweepResult {
  /** Design pressure, Pa. */
  pressure: number;
  targetSafetyFactor: number;
  /** m, ascending. */
  thickness: number[];
  /** One series per mode, in the component's mode order. */
  series: SweepSeries[];
  /** Governing mode (lowest safety factor) at each thickness. */
  governing: FailureMode[];
  /** Thicknesses where the governing mode changes, ascending. */
  governingTransitions: GoverningTransition[];
}

export const MAX_SWEEP_STEPS = 2000;

/**
 * Sweeps the load case's component over thickness for one candidate (the component's own
 * thickness is ignored). Throws RangeError on a bad range.
 */
export function sweepThickness(loadCase: LoadCaseInput, candidate: CandidateMaterial, options: SweepOptions): SweepResult {
  const { from, to } = options;
  const steps = Math.floor(options.steps);
  if (!(Number.isFinite(from) && from > 0)) throw new RangeError('from must be a finite thickness greater than zero');
  if (!(Number.isFinite(to) && to > from)) throw new RangeError('to must be a finite thickness greater than from');
  if (!(steps >= 1 && steps <= MAX_SWEEP_STEPS)) throw new RangeError(`steps must be between 1 and ${MAX_SWEEP_STEPS}`);

  const prepared = prepareLoadCase(loadCase);
  const { model, component, pressure: p } = prepared;
  const mm = modeMaterial(candidate, prepared, []);
  const target = targetFor(prepared, candidate);
  const n = model.modes.length;
  const stress = new Float64Array(4);
  const allowable = new Float64Array(4);

  const thickness: number[] = new Array(steps + 1);
  const log = options.spacing === 'log';
  const lf = Math.log(from);
  const lt = Math.log(to);
  for (let k = 0; k <= steps; k++) {
    const w = k / steps;
    thickness[k] = k === steps ? to : log ? Math.exp(lf + (lt - lf) * w) : from + (to - from) * w;
  }

  const series: SweepSeries[] = model.modes.map((mode, i) => ({
    mode,
    ...(model.checkName ? { check: model.checkName(component, i) } : {}),
    model: model.model(component, i, mm),
    safetyFactor: new Array(steps + 1),
    valid: new Array(steps + 1).fill(true),
  }));
  const govIndex: number[] = new Array(steps + 1);
  for (let k = 0; k <= steps; k++) {
    model.fill(component, thickness[k], p, mm, stress, allowable);
    let g = 0;
    let best = Infinity;
    for (let i = 0; i < n; i++) {
      const sf = allowable[i] / stress[i];
      series[i].safetyFactor[k] = sf;
      const reason = model.validity?.(component, thickness[k], i) ?? null;
      if (reason !== null) {
        series[i].valid[k] = false;
        series[i].invalidReason ??= reason;
      }
      if (sf < best) {
        best = sf;
        g = i;
      }
    }
    govIndex[k] = g;
  }

  const sfOf = (t: number, i: number) => {
    model.fill(component, t, p, mm, stress, allowable);
    return allowable[i] / stress[i];
  };
  const pair = { a: 0, b: 0 };
  const f = (t: number, q: { a: number; b: number }) => sfOf(t, q.a) - sfOf(t, q.b);
  const governingTransitions: GoverningTransition[] = [];
  for (let k = 0; k < steps; k++) {
    const a = govIndex[k];
    const b = govIndex[k + 1];
    if (a === b) continue;
    // f = SF_a − SF_b: ≤ 0 at the left point (a governs), > 0 at the right point (b governs)
    pair.a = a;
    pair.b = b;
    const t0 = thickness[k];
    const t1 = thickness[k + 1];
    const f0 = series[a].safetyFactor[k] - series[b].safetyFactor[k];
    const f1 = series[a].safetyFactor[k + 1] - series[b].safetyFactor[k + 1];
    const at = f0 * f1 <= 0 ? brent(f, pair, t0, t1, f0, f1, 1e-12 * t1) : 0.5 * (t0 + t1);
    governingTransitions.push({ thickness: at, from: model.modes[a], to: model.modes[b] });
  }

  return {
    pressure: p,
    targetSafetyFactor: target,
    thickness,
    series,
    governing: govIndex.map((i) => model.modes[i]),
    governingTransitions,
  };
}
