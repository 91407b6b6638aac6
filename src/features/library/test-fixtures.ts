import type { LibrarySetDto } from '@shared/schemas/library';
import { propertySetDto } from '@shared/schemas/test-fixtures';

/**
 * An invented draft in the Harrow Sound scenario (values shaped like a cast acrylic sheet's, for
 * exercising the form; not catalogue data), built on the shared property-set builder.
 */
export function harrowDraft(overrides: Partial<LibrarySetDto> = {}): LibrarySetDto {
  return {
    ...propertySetDto({
      id: 41,
      status: 'draft',
      condition: 'Cast sheet, annealed, 100 mm',
      material: { id: 7, name: 'Cast acrylic', family: 'acrylic', transparent: true, description: null },
      reference: { id: 3, kind: 'test-report', title: 'Harrow Sound viewport blank tests', authors: 'Harrow Sound Marine Works', year: 2025, identifier: 'HSMW-TR-014', location: 'Table 2', note: null },
      tensileStrength: 68.9476e6,
      compressiveStrength: 124e6,
      shearStrength: 62e6,
      elongation: 0.045,
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
      updatedAt: '2026-03-02T10:00:00.000Z',
    }),
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
