import { describe, expect, it } from 'vitest';
import { draftInputSchema } from './library';

/** A complete draft in SI (invented Harrow Sound acceptance-test values). */
const draft = (changes: Record<string, unknown> = {}) => ({
  condition: 'Harrow Sound viewport blank, 120 mm cast sheet',
  material: { name: 'Cast acrylic (PMMA)', family: 'acrylic', transparent: true },
  density: 1190,
  youngsModulus: 3.1e9,
  poissonsRatio: 0.37,
  tensileStrength: 70e6,
  compressiveStrength: 110e6,
  shearStrength: 60e6,
  serviceTemperature: { min: 10, max: 66 },
  ...changes,
});

const issuesOf = (input: unknown) => {
  const r = draftInputSchema.safeParse(input);
  return r.success ? [] : r.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`).sort();
};

describe('the draft schema', () => {
  it('accepts a complete draft', () => {
    expect(issuesOf(draft())).toEqual([]);
  });

  it('reports rules across fields together with unrelated invalid values', () => {
    expect(issuesOf(draft({ density: undefined, tensileYield: 90e6, serviceTemperature: { min: 80, max: 10 } }))).toEqual([
      'density: Invalid input: expected number, received undefined',
      'serviceTemperature.max: min must not exceed max',
      'tensileYield: Tensile yield cannot exceed tensile strength',
    ]);
  });

  it('refuses a service temperature below absolute zero, and still compares the range', () => {
    expect(issuesOf(draft({ serviceTemperature: { min: -300, max: 10 } }))).toEqual(['serviceTemperature.min: must not be below absolute zero (-273.15 °C)']);
    expect(issuesOf(draft({ serviceTemperature: { min: 20, max: -300 } }))).toEqual([
      'serviceTemperature.max: min must not exceed max',
      'serviceTemperature.max: must not be below absolute zero (-273.15 °C)',
    ]);
    expect(issuesOf(draft({ serviceTemperature: { min: -273.15, max: -273.15 } }))).toEqual([]);
  });
});
