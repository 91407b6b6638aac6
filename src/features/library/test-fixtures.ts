import type { LibrarySetDto } from '@shared/schemas/library';

/**
 * An invented draft in the Harrow Sound scenario (values shaped like a cast acrylic sheet's, for
 * exercising the form; not catalogue data).
 */
export function harrowDraft(overrides: Partial<LibrarySetDto> = {}): LibrarySetDto {
  return {
    id: 41,
    status: 'draft',
    version: 2,
    condition: 'Cast sheet, annealed, 100 mm',
    material: { id: 7, name: 'Cast acrylic', family: 'acrylic', transparent: true, description: null },
    reference: { id: 3, kind: 'test-report', title: 'Harrow Sound viewport blank tests', authors: 'Harrow Sound Marine Works', year: 2025, identifier: 'HSMW-TR-014', location: 'Table 2', note: null },
    density: 1190,
    youngsModulus: 3.1e9,
    poissonsRatio: 0.37,
    tensileStrength: 68.9476e6,
    tensileYield: null,
    compressiveStrength: 124e6,
    compressiveYield: null,
    shearStrength: 62e6,
    elongation: 0.045,
    luminousTransmittance: 0.92,
    serviceTemperature: { min: -20, max: 60 },
    valueDetails: { tensileStrength: { basis: 'minimum', testMethod: 'ASTM D638', temperature: 23 } },
    temperatureFactors: [
      { temperature: 0, factor: 1.12 },
      { temperature: 23, factor: 1 },
      { temperature: 50, factor: 0.8 },
    ],
    sustainedLoadFactors: [{ hours: 1000, factor: 0.6 }],
    cyclicFactors: [{ cycles: 10000, factor: 0.7 }],
    draftedBy: { id: 4, name: 'Tamsin Oyelaran' },
    approvedBy: null,
    publishedAt: null,
    updatedAt: '2026-03-02T10:00:00.000Z',
    lockVersion: 5,
    lineageId: 40,
    supersedesId: 40,
    supersededById: null,
    returnedComment: null,
    lastEditedBy: { id: 4, name: 'Tamsin Oyelaran' },
    submittedAt: null,
    ...overrides,
  };
}
