import type { CandidateResult } from '@shared/engine';

/** Invented catalogue entries for unit tests (Harrow Sound scenario); values SI: the shared builder. */
export { propertySetDto as fixtureSet } from '@shared/schemas/test-fixtures';

export function fixtureResult(overrides: Partial<CandidateResult> = {}): CandidateResult {
  return {
    name: 'Cast acrylic (PMMA) (Cast sheet, as supplied)',
    propertySetId: 11,
    family: 'acrylic',
    governingMode: 'compression',
    safetyFactor: 4.6,
    margin: 0.15,
    requiredThickness: 0.087,
    sizedBy: { kind: 'mode', mode: 'compression' },
    proofSafetyFactor: 4.2,
    massPerArea: 103.53,
    weightToDisplacement: null,
    targetSafetyFactor: 4,
    factors: { temperature: 0.9, worstTemperature: 25, temperatureSource: 'set', sustainedLoad: 0.8, cyclic: 0.95, life: 0.8, lifeBasis: 'sustained-load' },
    modes: [],
    warnings: [],
    ...overrides,
  };
}
