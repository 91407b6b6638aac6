import { describe, expect, it } from 'vitest';
import { changedCells, describeChanges, fieldLabel, formatChangeValue } from './changes';
import { harrowDraft } from './test-fixtures';

describe('review diff formatting', () => {
  it('names fields in the words of the catalogue', () => {
    expect(fieldLabel('tensileStrength')).toBe('Tensile strength');
    expect(fieldLabel('serviceTemperature.max')).toBe('Service temperature, highest');
    expect(fieldLabel('valueDetails.shearStrength.basis')).toBe('Shear strength: basis');
    expect(fieldLabel('valueDetails.shearStrength')).toBe('Shear strength: basis, method and test temperature');
    expect(fieldLabel('reference.title')).toBe('Reference title');
    expect(fieldLabel('somethingNew')).toBe('somethingNew');
  });

  it('shows SI values exactly, in the chosen units: 68.9476 MPa is 10 ksi', () => {
    // Exact, not rounded to the table's digits: a reviewer checks the value as entered.
    expect(formatChangeValue('tensileStrength', 68.9476e6, 'SI')).toBe('68.9476 MPa');
    // 1 ksi = 6.894757 MPa (NIST SP 811, appendix B).
    expect(formatChangeValue('tensileStrength', 68.9476e6, 'US')).toBe('10.0000043511 ksi');
    expect(formatChangeValue('tensileStrength', 6.894757e7, 'US')).toBe('10.0 ksi');
    expect(formatChangeValue('serviceTemperature.min', -20, 'US')).toBe('-4 °F');
    expect(formatChangeValue('elongation', 0.045, 'SI')).toBe('4.5 %');
    expect(formatChangeValue('poissonsRatio', 0.37, 'SI')).toBe('0.37');
    expect(formatChangeValue('tensileYield', null, 'SI')).toBe('—');
  });

  it('spells out dependence points and value details', () => {
    expect(
      formatChangeValue(
        'temperatureFactors',
        [
          { temperature: 0, factor: 1.12 },
          { temperature: 50, factor: 0.8 },
        ],
        'SI',
      ),
    ).toBe('0 °C ×1.12; 50 °C ×0.8');
    expect(formatChangeValue('sustainedLoadFactors', [{ hours: 1000, factor: 0.6 }], 'SI')).toBe('1,000 h ×0.6');
    expect(formatChangeValue('cyclicFactors', [], 'SI')).toBe('none');
    expect(formatChangeValue('valueDetails.tensileStrength', { basis: 'minimum', testMethod: 'ASTM D638', temperature: 23 }, 'SI')).toBe('minimum, ASTM D638, at 23 °C');
    expect(formatChangeValue('reference', { id: 3, title: 'Harrow Sound viewport blank tests' }, 'SI')).toBe('Harrow Sound viewport blank tests');
  });

  it('describes each change with both sides', () => {
    const rows = describeChanges(
      [
        { field: 'shearStrength', before: 60e6, after: 62e6 },
        { field: 'condition', before: 'Cast sheet', after: 'Cast sheet, annealed' },
      ],
      'SI',
    );
    expect(rows).toEqual([
      { field: 'shearStrength', label: 'Shear strength', before: '60.0 MPa', after: '62.0 MPa' },
      { field: 'condition', label: 'Condition', before: 'Cast sheet', after: 'Cast sheet, annealed' },
    ]);
  });

  it('highlights exactly the cells that differ from the previous version', () => {
    const previous = harrowDraft({ id: 40, version: 1, status: 'published' });
    const current = harrowDraft({
      shearStrength: 64e6,
      valueDetails: { tensileStrength: { basis: 'typical', testMethod: 'ASTM D638', temperature: 23 } },
      serviceTemperature: { min: -20, max: 65 },
    });
    const cells = changedCells(current, previous);
    expect([...cells.keys()].sort()).toEqual(['serviceTemperature.max', 'shearStrength', 'tensileStrength']);
    expect([...cells.get('shearStrength')!]).toEqual(['value']);
    expect([...cells.get('tensileStrength')!]).toEqual(['basis']);
    expect(changedCells(current, null).size).toBe(0);
  });
});
