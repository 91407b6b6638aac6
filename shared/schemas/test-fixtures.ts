/**
 * The one builder of catalogue property-set DTOs for unit tests (shared, engine and client tests; not
 * used by the app). Invented entries of the Harrow Sound scenario; values SI. A test gives what it
 * needs as overrides.
 */
import type { PropertySetDto } from './catalogue';

/** A published cast acrylic sheet (values shaped like a cast acrylic sheet's; not catalogue data). */
export function propertySetDto(overrides: Partial<PropertySetDto> = {}): PropertySetDto {
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
