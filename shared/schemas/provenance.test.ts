import { describe, expect, it } from 'vitest';
import { describeInputs, engineInputKeys, inputStatus, inputStatusText, presentKeys, provenanceInputSchema, valueStatusInputSchema } from './provenance';

const set = {
  density: 1190,
  youngsModulus: 2.76e9,
  poissonsRatio: 0.37,
  tensileStrength: 62e6,
  tensileYield: null,
  compressiveStrength: 103e6,
  compressiveYield: 103e6,
  shearStrength: 55e6,
  shearYield: null,
  elongation: 0.02,
  luminousTransmittance: null,
  temperatureFactors: [{ temperature: 21, factor: 1 }],
  sustainedLoadFactors: [],
  cyclicFactors: [],
};

describe('value status', () => {
  it('asks a confirmed value for its location and a derived one for its rule', () => {
    expect(valueStatusInputSchema.safeParse({ status: 'confirmed' }).error?.issues[0].path).toEqual(['location']);
    expect(valueStatusInputSchema.safeParse({ status: 'derived' }).error?.issues[0].path).toEqual(['rule']);
    expect(valueStatusInputSchema.safeParse({ status: 'confirmed', location: 'Table 3-1' }).success).toBe(true);
    expect(valueStatusInputSchema.safeParse({ status: 'recalled' }).success).toBe(true);
  });

  it('refuses the fields only the server writes (who confirmed and approved) in what a librarian sends', () => {
    expect(valueStatusInputSchema.safeParse({ status: 'confirmed', location: 'Table 3-1', approvedBy: { id: 1, name: 'x' } }).success).toBe(false);
    expect(provenanceInputSchema.safeParse({ notAValue: { status: 'recalled' } }).success).toBe(false);
  });

  it('counts the values a set has: optional ones only when given, curves only when not empty', () => {
    expect(presentKeys(set)).toEqual(['density', 'youngsModulus', 'poissonsRatio', 'tensileStrength', 'compressiveStrength', 'compressiveYield', 'shearStrength', 'elongation', 'serviceTemperature', 'temperatureFactors']);
    // elongation is shown, not used by the calculation
    expect(engineInputKeys(set)).not.toContain('elongation');
  });

  it('says how many inputs are confirmed and which are not; a value with no entry is recalled', () => {
    const s = inputStatus({ density: { status: 'confirmed', location: 'Table 3-1' }, poissonsRatio: { status: 'demo' }, compressiveStrength: { status: 'derived', rule: 'taken as the yield minimum' } }, engineInputKeys(set));
    expect([s.confirmed, s.total, s.demo]).toEqual([1, 9, true]);
    expect(s.unconfirmed.find((u) => u.key === 'youngsModulus')?.status).toBe('recalled');
    expect(inputStatusText(s)).toBe('1 of 9 inputs confirmed · demo data');
  });

  it('describes each input for a record, with where it was confirmed and by whom', () => {
    const lines = describeInputs({ ...set, provenance: { density: { status: 'confirmed', location: 'Table 3-1', confirmedBy: { id: 3, name: 'Tamsin' }, approvedBy: { id: 4, name: 'Ailsa' } } } });
    expect(lines[0]).toEqual({ key: 'density', label: 'Density', status: 'confirmed', detail: 'Table 3-1; confirmed by Tamsin, approved by Ailsa' });
    expect(lines[1].status).toBe('recalled');
  });
});
