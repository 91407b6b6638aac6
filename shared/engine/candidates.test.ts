import { describe, expect, it } from 'vitest';
import { propertySetDto } from '../schemas/test-fixtures';
import { candidateFromInline, candidateFromPropertySet } from './candidates';
import { titanium } from './test-materials';

describe('candidates', () => {
  // The demo titanium plate of test-materials.ts as a published catalogue set, with no compressive
  // yield of its own.
  const { density, youngsModulus, poissonsRatio, tensileStrength, tensileYield, compressiveStrength, shearStrength } = titanium;
  const dto = propertySetDto({
    id: 41,
    condition: 'annealed plate',
    material: { id: 5, name: 'Titanium alloy Ti-6Al-4V', family: 'titanium-alloy', transparent: false, description: null },
    ...{ density, youngsModulus, poissonsRatio, tensileStrength, tensileYield, compressiveStrength, shearStrength },
    elongation: 0.1,
    luminousTransmittance: null,
    serviceTemperature: { min: -50, max: 300 },
    temperatureFactors: [{ temperature: 20, factor: 1 }],
    updatedAt: '2026-01-01T00:00:00Z',
  });

  it('a property set keeps its id, family and values; the name carries the condition', () => {
    const c = candidateFromPropertySet(dto);
    expect(c).toMatchObject({
      name: 'Titanium alloy Ti-6Al-4V (annealed plate)',
      propertySetId: 41,
      family: 'titanium-alloy',
      tensileYield: 827e6,
      compressiveYield: null,
      serviceTemperature: { min: -50, max: 300 },
    });
    expect(candidateFromPropertySet({ ...dto, condition: '' }).name).toBe('Titanium alloy Ti-6Al-4V');
  });

  it('an inline material becomes a candidate without an id', () => {
    const c = candidateFromInline({
      name: 'Trial sample',
      density: 1000,
      youngsModulus: 1e9,
      poissonsRatio: 0.3,
      tensileStrength: 1e7,
      compressiveStrength: 1e7,
      shearStrength: 1e7,
    });
    expect(c.name).toBe('Trial sample');
    expect(c.propertySetId).toBeUndefined();
  });
});
