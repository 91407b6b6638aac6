import { describe, expect, it } from 'vitest';
import { DEMO_CHAMBER_PORT, DEMO_VIEWPORT } from '@shared/demo-load-cases';
import type { LoadCaseInput } from '@shared/schemas/evaluate';
import { describeLoadCase, summarizeLoadCase } from './load-case-text';

// Harrow Sound's 1,200 m submersible viewport and its 5 bar chamber port (invented scenario,
// shared/demo-load-cases.ts); here the port is clamped, with a set target and no proof factor.
const VIEWPORT: LoadCaseInput = DEMO_VIEWPORT;
const CHAMBER_PORT: LoadCaseInput = {
  ...DEMO_CHAMBER_PORT,
  targetSafetyFactor: 6,
  proofFactor: undefined,
  component: { ...DEMO_CHAMBER_PORT.component, edge: 'clamped' },
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
