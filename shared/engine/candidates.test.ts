import { describe, expect, it } from 'vitest';
import type { PropertySetDto } from '../schemas/catalogue';
import { candidateFromInline, candidateFromPropertySet } from './candidates';

describe('candidates', () => {
  const dto: PropertySetDto = {
    id: 41,
    status: 'published',
    version: 2,
    condition: 'annealed plate',
    material: { id: 5, name: 'Titanium alloy Ti-6Al-4V', family: 'titanium-alloy', transparent: false, description: null },
    reference: null,
    density: 4430,
    youngsModulus: 114e9,
    poissonsRatio: 0.31,
    tensileStrength: 896e6,
    tensileYield: 827e6,
    compressiveStrength: 896e6,
    compressiveYield: null,
    shearStrength: 550e6,
    elongation: 0.1,
    luminousTransmittance: null,
    serviceTemperature: { min: -50, max: 300 },
    valueDetails: {},
    temperatureFactors: [{ temperature: 20, factor: 1 }],
    sustainedLoadFactors: [],
    cyclicFactors: [],
    draftedBy: null,
    approvedBy: null,
    publishedAt: null,
    updatedAt: '2026-01-01T00:00:00Z',
  };

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
