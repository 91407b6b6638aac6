import { describe, expect, it } from 'vitest';
import type { LoadCaseInput } from '@shared/schemas/evaluate';
import { describeLoadCase, summarizeLoadCase } from './load-case-text';

// Harrow Sound's 1,200 m submersible viewport and its 5 bar chamber port (invented scenario).
const VIEWPORT: LoadCaseInput = {
  pressure: { depth: 1200, latitude: 57, water: 'sea' },
  temperature: { min: 2, max: 25 },
  sustainedHours: 1000,
  cycles: 2000,
  proofFactor: 1.25,
  component: { type: 'conical-frustum', minorDiameter: 0.15, thickness: 0.1, includedAngle: 90 },
};
const CHAMBER_PORT: LoadCaseInput = {
  pressure: { value: 0.5e6 },
  temperature: { min: 15, max: 40 },
  sustainedHours: 5000,
  cycles: 10000,
  targetSafetyFactor: 6,
  component: { type: 'flat-disc', diameter: 0.25, thickness: 0.04, edge: 'clamped' },
};

const value = (rows: { label: string; value: string }[], label: string) => rows.find((r) => r.label === label)?.value;

describe('load case in words', () => {
  it('describes a depth load case in SI, with the family defaults named as common practice', () => {
    const rows = describeLoadCase(VIEWPORT, 'SI');
    expect(value(rows, 'Pressure from')).toBe('1,200 m in seawater at 57° latitude');
    expect(value(rows, 'Design temperatures')).toBe('2 °C to 25 °C');
    expect(value(rows, 'Minor diameter')).toBe('150.0 mm');
    expect(value(rows, 'Thickness')).toBe('100.0 mm');
    expect(value(rows, 'Included angle')).toBe('90°');
    expect(value(rows, 'Target safety factor')).toMatch(/common practice/);
  });

  it('shows the same load case in US customary units', () => {
    const rows = describeLoadCase(VIEWPORT, 'US');
    // 1,200 m = 3,937 ft; 100 mm = 3.937 in; 25 °C = 77 °F (NIST SP 811 factors).
    expect(value(rows, 'Pressure from')).toBe('3,937 ft in seawater at 57° latitude');
    expect(value(rows, 'Thickness')).toBe('3.937 in');
    expect(value(rows, 'Design temperatures')).toBe('36 °F to 77 °F');
  });

  it('describes a given pressure, a set target and a clamped disc', () => {
    const rows = describeLoadCase(CHAMBER_PORT, 'SI');
    expect(value(rows, 'Pressure from')).toBe('0.50 MPa given');
    expect(value(rows, 'Target safety factor')).toBe('6.00');
    expect(value(rows, 'Edge')).toBe('Clamped');
    expect(value(rows, 'Proof-test factor')).toBe('1.25');
    expect(summarizeLoadCase(CHAMBER_PORT, 'SI')).toBe('Flat disc window · 0.50 MPa given');
  });
});
