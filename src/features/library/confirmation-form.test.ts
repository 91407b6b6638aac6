import { describe, expect, it } from 'vitest';
import { propertySetDto } from '@shared/schemas/test-fixtures';
import { formErrors } from '@/lib/form-test-support';
import { checkConfirmationForm, confirmableValues, confirmationFormSchema, emptyConfirmationForm } from './confirmation-form';

describe('confirmation proposal form', () => {
  it('builds the proposal with the text trimmed and blank optional fields left out', () => {
    const check = checkConfirmationForm({ ...emptyConfirmationForm(), key: 'poissonsRatio', location: '  Table 2, row 4 ' });
    expect(check).toEqual({ ok: true, value: { key: 'poissonsRatio', location: 'Table 2, row 4', source: undefined, documentPage: undefined } });
  });

  it('sends another source and the stored document’s page as a number', () => {
    const check = checkConfirmationForm({ key: 'density', location: 'Table 1', source: 'Harrow Sound sheet acceptance tests, lot 12', documentPage: '41' });
    expect(check).toEqual({ ok: true, value: { key: 'density', location: 'Table 1', source: 'Harrow Sound sheet acceptance tests, lot 12', documentPage: 41 } });
  });

  it('names the missing value and location in the form’s words', async () => {
    expect(await formErrors(confirmationFormSchema, emptyConfirmationForm())).toEqual({
      key: 'Choose one of the set’s values.',
      location: 'Say where the source shows the value: table, page, figure or clause.',
    });
  });

  it('refuses a page that is not a whole positive number, and a location too short or too long', async () => {
    const base = { ...emptyConfirmationForm(), key: 'density' as const, location: 'Table 1' };
    expect(await formErrors(confirmationFormSchema, { ...base, documentPage: 'forty' })).toEqual({ documentPage: 'Enter a page number, e.g. 41' });
    expect(await formErrors(confirmationFormSchema, { ...base, documentPage: '2.5' })).toEqual({ documentPage: 'Enter a whole page number, 1 to 100,000' });
    expect(await formErrors(confirmationFormSchema, { ...base, documentPage: '0' })).toEqual({ documentPage: 'Enter a whole page number, 1 to 100,000' });
    expect(await formErrors(confirmationFormSchema, { ...base, location: 'T' })).toEqual({ location: 'At least 2 characters' });
    expect(await formErrors(confirmationFormSchema, { ...base, location: 'T'.repeat(301) })).toEqual({ location: 'At most 300 characters' });
  });
});

describe('values a set offers for confirmation', () => {
  it('lists the set’s values not yet confirmed, in table order, with their status and any proposal waiting', () => {
    const set = propertySetDto({
      tensileYield: null,
      luminousTransmittance: 0.92,
      temperatureFactors: [{ temperature: 23, factor: 1 }],
      provenance: {
        density: { status: 'confirmed', location: 'Table 1' },
        shearStrength: { status: 'derived', rule: 'shear yield = tensile yield/√3 (von Mises)' },
      },
    });
    const values = confirmableValues(set, [
      { key: 'poissonsRatio', status: 'proposed' },
      { key: 'youngsModulus', status: 'rejected' },
    ]);
    expect(values.map((v) => v.key)).toEqual([
      'youngsModulus',
      'poissonsRatio',
      'tensileStrength',
      'compressiveStrength',
      'shearStrength',
      'luminousTransmittance',
      'serviceTemperature',
      'temperatureFactors',
    ]);
    expect(values.find((v) => v.key === 'poissonsRatio')).toEqual({ key: 'poissonsRatio', status: 'recalled', waiting: true });
    // A rejected proposal leaves the value open to a new one.
    expect(values.find((v) => v.key === 'youngsModulus')?.waiting).toBe(false);
    expect(values.find((v) => v.key === 'shearStrength')?.status).toBe('derived');
  });

  it('offers nothing when every value is confirmed', () => {
    const set = propertySetDto({ elongation: null, luminousTransmittance: null });
    const keys = ['density', 'youngsModulus', 'poissonsRatio', 'tensileStrength', 'compressiveStrength', 'shearStrength', 'serviceTemperature'] as const;
    const provenance = Object.fromEntries(keys.map((k) => [k, { status: 'confirmed' as const, location: 'Table 1' }]));
    expect(confirmableValues({ ...set, provenance }, [])).toEqual([]);
  });
});
