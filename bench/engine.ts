/**
 * Engine throughput on one core: candidate × mode evaluations per second over a mix of all four
 * component types, ranking included (evaluate() evaluates, sorts and cuts to the limit).
 */
import { evaluate, modeMap, type CandidateMaterial } from '../shared/engine';
import type { LoadCaseInput } from '../shared/schemas/evaluate';
import { readSeedCatalogue } from '../server/db/seeders/catalogue';

const base = { temperature: { min: 2, max: 25 }, sustainedHours: 1000, cycles: 2000 } as const;
export const ENGINE_LOAD_CASES: LoadCaseInput[] = [
  { ...base, pressure: { depth: 1200, latitude: 57, water: 'sea' }, component: { type: 'flat-disc', diameter: 0.2, thickness: 0.05, edge: 'clamped' } },
  { ...base, pressure: { depth: 1200, latitude: 57, water: 'sea' }, component: { type: 'conical-frustum', minorDiameter: 0.15, thickness: 0.1, includedAngle: 90 } },
  { ...base, pressure: { depth: 4000, latitude: 57, water: 'sea' }, component: { type: 'sphere', innerRadius: 0.8, thickness: 0.06 } },
  { ...base, pressure: { depth: 4000, latitude: 57, water: 'sea' }, component: { type: 'cylinder', innerRadius: 0.07, thickness: 0.012, length: 0.35 } },
];

export function syntheticCandidates(n: number): CandidateMaterial[] {
  const seed = readSeedCatalogue();
  return Array.from({ length: n }, (_, i) => {
    const s = seed.propertySets[i % seed.propertySets.length];
    const k = 0.9 + ((i * 7919) % 200) / 1000;
    const family = seed.materials.find((m) => m.key === s.material)!.family;
    return {
      name: `${s.material} ${i}`,
      family,
      density: s.density,
      youngsModulus: s.youngsModulus * (2 - k),
      poissonsRatio: s.poissonsRatio,
      tensileStrength: s.tensileStrength * k,
      tensileYield: s.tensileYield ?? null,
      compressiveStrength: s.compressiveStrength * k,
      compressiveYield: s.compressiveYield ?? null,
      shearStrength: s.shearStrength * k,
      serviceTemperature: s.serviceTemperature,
      temperatureFactors: s.temperatureFactors,
      sustainedLoadFactors: s.sustainedLoadFactors,
      cyclicFactors: s.cyclicFactors,
    };
  });
}

export interface EngineBench {
  /** Median over timed rounds; each round evaluates every load case once. */
  modeEvaluationsPerSecond: number;
  /** Fastest round, for reference. */
  bestRoundModeEvaluationsPerSecond: number;
  /** Median rate per component type. */
  perComponent: Record<string, number>;
  /**
   * The same mix ranked by required thickness, which needs every candidate's full result
   * (required thickness of every mode, warnings, model texts), for comparison.
   */
  fullResultsModeEvaluationsPerSecond: number;
  candidates: number;
  rounds: number;
  /** Median ms for one 64 × 64 mode map (the Evaluate page's grid): cone over t/D × angle, sphere over t × depth. */
  modeMapMs: { cone: number; sphere: number };
}

/** Median time of the mode map the Evaluate page draws (budget: 100 ms in the browser). */
function benchModeMap(cand: CandidateMaterial): { cone: number; sphere: number } {
  const [, cone, sphere] = ENGINE_LOAD_CASES;
  const time = (f: () => void) => {
    const xs: number[] = [];
    for (let k = 0; k < 25; k++) {
      const t0 = performance.now();
      f();
      xs.push(performance.now() - t0);
    }
    return Number(median(xs).toFixed(2));
  };
  return {
    cone: time(() => modeMap(cone, cand, { kind: 'thicknessRatio', from: 0.05, to: 1.5, cells: 64 }, { kind: 'includedAngle', from: 30, to: 180, cells: 64 })),
    sphere: time(() => modeMap(sphere, cand, { kind: 'thickness', from: 0.005, to: 0.2, cells: 64 }, { kind: 'depth', from: 100, to: 11000, cells: 64 })),
  };
}

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)];
};

/** Rates of timed rounds, each evaluating every load case once, for `seconds`. */
function roundRates(cands: CandidateMaterial[], seconds: number, sortBy: 'margin' | 'requiredThickness', componentRates?: Record<string, number[]>): number[] {
  const rates: number[] = [];
  const until = performance.now() + seconds * 1000;
  while (performance.now() < until) {
    let modes = 0;
    let time = 0;
    for (const lc of ENGINE_LOAD_CASES) {
      const t0 = performance.now();
      const out = evaluate({ loadCase: lc, candidates: cands, limit: 100, sortBy });
      const dt = performance.now() - t0;
      const m = out.results[0].modes.length * out.total;
      modes += m;
      time += dt;
      if (componentRates) (componentRates[lc.component.type] ??= []).push(m / (dt / 1000));
    }
    rates.push(modes / (time / 1000));
  }
  return rates;
}

export function benchEngine(seconds = 4, candidates = 2000): EngineBench {
  const cands = syntheticCandidates(candidates);
  // Warm-up: let the JIT settle on every path.
  for (let i = 0; i < 20; i++) for (const lc of ENGINE_LOAD_CASES) evaluate({ loadCase: lc, candidates: cands, limit: 100 });
  for (let i = 0; i < 20; i++) for (const lc of ENGINE_LOAD_CASES) evaluate({ loadCase: lc, candidates: cands, limit: 100, sortBy: 'requiredThickness' });
  const componentRates: Record<string, number[]> = {};
  const marginRates = roundRates(cands, seconds, 'margin', componentRates);
  const fullRates = roundRates(cands, Math.max(1, seconds / 3), 'requiredThickness');
  return {
    modeEvaluationsPerSecond: Math.round(median(marginRates)),
    bestRoundModeEvaluationsPerSecond: Math.round(Math.max(...marginRates)),
    perComponent: Object.fromEntries(Object.entries(componentRates).map(([k, v]) => [k, Math.round(median(v))])),
    fullResultsModeEvaluationsPerSecond: Math.round(median(fullRates)),
    candidates,
    rounds: marginRates.length,
    modeMapMs: benchModeMap(cands[0]),
  };
}
