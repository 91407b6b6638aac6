import { describe, expect, it } from 'vitest';
import { formatPressureAll, formatQuantity, fromDisplay, PRESSURE_UNITS, roundForInput, toDisplay, unitByLabel, unitOf, type QuantityKind } from './units';

describe('units', () => {
  // Conversion factors: NIST SP 811 (2008), Appendix B: 1 psi = 6894.757 Pa, 1 in = 25.4 mm,
  // 1 lb = 0.45359237 kg, °F = °C × 9/5 + 32.
  it.each([
    ['pressure', 6894.757, 1],
    ['stress', 6894757, 1],
    ['modulus', 6894757000, 1],
    ['length', 0.0254, 1],
    ['temperature', 100, 212],
    ['density', 27679.9047, 1],
    ['massPerArea', 4.88242764, 1],
  ] as [QuantityKind, number, number][])('converts %s from SI to US customary (NIST SP 811)', (kind, si, us) => {
    expect(toDisplay(kind, 'US', si)).toBeCloseTo(us, 4);
  });

  it.each(['stress', 'modulus', 'pressure', 'density', 'temperature', 'length', 'depth', 'massPerArea'] as QuantityKind[])(
    'round-trips %s through both systems',
    (kind) => {
      for (const system of ['SI', 'US'] as const) {
        expect(fromDisplay(kind, system, toDisplay(kind, system, 123.456))).toBeCloseTo(123.456, 6);
      }
    },
  );

  it('formats with unit labels and a dash for missing values', () => {
    expect(formatQuantity('stress', 'SI', 62e6)).toBe('62.0 MPa');
    expect(formatQuantity('stress', 'US', 62e6)).toBe('8.99 ksi');
    expect(formatQuantity('temperature', 'US', 10)).toBe('50 °F');
    expect(formatQuantity('stress', 'SI', null)).toBe('—');
    expect(formatQuantity('stress', 'SI', Number.NaN)).toBe('—');
  });
});

describe('units by label', () => {
  it('finds a unit of a kind by its label in either system and converts to SI', () => {
    expect(unitByLabel('modulus', 'GPa')!.toSI(3.1)).toBe(3.1e9);
    expect(unitByLabel('stress', 'MPa')!.toSI(85.5)).toBe(85.5e6);
    expect(unitByLabel('fraction', '%')!.toSI(3)).toBeCloseTo(0.03, 15);
    // 1 ksi = 6.894757 MPa (NIST SP 811 (2008), Appendix B).
    expect(unitByLabel('stress', 'ksi')!.toSI(1)).toBeCloseTo(6894757, 0);
  });

  it('knows no unit by a label of another kind', () => {
    expect(unitByLabel('stress', 'GPa')).toBeUndefined();
    expect(unitByLabel('temperature', 'K')).toBeUndefined();
  });
});

describe('pressure in MPa, bar and psi, and values rounded for the form', () => {
  it('writes a gauge pressure in all three units, the chosen one first', () => {
    // 1 bar = 0.1 MPa (definition); 1 psi = 6894.757 Pa (NIST SP 811, B.8).
    expect(formatPressureAll(12.15e6)).toBe('12.15 MPa (121.5 bar, 1,762 psi)');
    expect(formatPressureAll(5e5, 'bar')).toBe('5.0 bar (0.50 MPa, 73 psi)');
  });

  it('rounds to the unit digits, keeping four significant figures', () => {
    expect(roundForInput(unitOf('length', 'US'), 5.905511811)).toBe(5.906);
    expect(roundForInput(unitOf('temperature', 'US'), 35.6)).toBe(35.6);
    expect(roundForInput(unitOf('depth', 'US'), 3937.007874)).toBe(3937);
    expect(roundForInput(unitOf('length', 'SI'), 99.99998)).toBe(100);
    expect(roundForInput(unitOf('area', 'SI'), 0.0123456)).toBe(0.01235);
    expect(PRESSURE_UNITS.bar.toSI(1)).toBeCloseTo(1e5, 6);
  });
});

describe('exact values for reviewers', () => {
  it('shows every digit entered, not the table rounding', () => {
    expect(formatQuantity('modulus', 'SI', 2.35e9)).toBe('2.4 GPa');
    expect(formatQuantity('modulus', 'SI', 2.35e9, { exact: true })).toBe('2.35 GPa');
    expect(formatQuantity('stress', 'SI', 62e6, { exact: true })).toBe('62.0 MPa');
    expect(formatQuantity('density', 'SI', 1190, { exact: true })).toBe('1,190 kg/m³');
  });
});
