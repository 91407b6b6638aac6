import type { CandidateResult } from '@shared/engine';
import type { PropertySetDto } from '@shared/schemas/catalogue';

/** Invented catalogue entries for unit tests (Harrow Sound scenario); values SI. */
export function fixtureSet(overrides: Partial<PropertySetDto> = {}): PropertySetDto {
  return {
    id: 11,
    status: 'published',
    version: 2,
    condition: 'Cast sheet, as supplied',
    material: { id: 3, name: 'Cast acrylic (PMMA)', family: 'acrylic', transparent: true, description: null },
    reference: null,
    density: 1190,
    youngsModulus: 3.1e9,
    poissonsRatio: 0.37,
    tensileStrength: 62e6,
    tensileYield: null,
    compressiveStrength: 103e6,
    compressiveYield: null,
    shearStrength: 55e6,
    elongation: null,
    luminousTransmittance: 0.92,
    serviceTemperature: { min: -10, max: 50 },
    valueDetails: {},
    temperatureFactors: [],
    sustainedLoadFactors: [],
    cyclicFactors: [],
    draftedBy: null,
    approvedBy: null,
    publishedAt: null,
    updatedAt: '2026-01-05T10:00:00.000Z',
    ...overrides,
  };
}

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
