/**
 * Load cases of the Harrow Sound scenario shared by the engine's tests (not used by the engine
 * itself); the materials are in test-materials.ts.
 */
import type { Component, LoadCaseInput } from '../schemas/evaluate';

export const chamberViewport: LoadCaseInput = {
  pressure: { value: 5e5 }, // 5 bar hyperbaric treatment chamber
  temperature: { min: 15, max: 40 },
  sustainedHours: 2000,
  cycles: 3000,
  component: { type: 'flat-disc', diameter: 0.25, thickness: 0.03, edge: 'simply-supported' },
};
export const cameraCone: LoadCaseInput = {
  pressure: { depth: 4000, latitude: 42, water: 'sea' }, // 4,000 m survey vehicle camera housing
  temperature: { min: 1, max: 25 },
  sustainedHours: 500,
  cycles: 400,
  component: { type: 'conical-frustum', minorDiameter: 0.05, thickness: 0.06, includedAngle: 90 },
};
export const hullSphere: LoadCaseInput = {
  pressure: { depth: 1200, latitude: 56, water: 'sea' }, // two-person submersible rated to 1,200 m
  temperature: { min: 0, max: 30 },
  sustainedHours: 1000,
  cycles: 1000,
  targetSafetyFactor: 1.5,
  component: { type: 'sphere', innerRadius: 0.8, thickness: 0.03 },
};
export const hullBay: LoadCaseInput = {
  ...hullSphere,
  component: { type: 'cylinder', innerRadius: 0.8, thickness: 0.025, length: 0.7 },
};
/** The submersible's 1,200 m dive as the hull component tests take it: pressure at depth, water at 2–25 °C. */
export const dive1200 = {
  pressure: { depth: 1200, latitude: 56, water: 'sea' },
  temperature: { min: 2, max: 25 },
} as const satisfies Pick<LoadCaseInput, 'pressure' | 'temperature'>;
export const loadCases = { chamberViewport, cameraCone, hullSphere, hullBay };

export const withThickness = (lc: LoadCaseInput, thickness: number): LoadCaseInput => ({
  ...lc,
  component: { ...lc.component, thickness } as Component,
});

/**
 * A short-term load case: a given pressure (Pa) at one temperature (°C), no sustained load and no
 * cycles, as the component tests use to compare with short-term tests and worked examples.
 */
export const shortTerm = (pressure: number, component: Component, temperature = 21, extra: Partial<LoadCaseInput> = {}): LoadCaseInput => ({
  pressure: { value: pressure },
  temperature: { min: temperature, max: temperature },
  sustainedHours: 0,
  cycles: 0,
  ...extra,
  component,
});
