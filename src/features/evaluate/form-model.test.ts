import { describe, expect, it } from 'vitest';
import { DEMO_CHAMBER_PORT } from '@shared/demo-load-cases';
import type { LoadCaseInput } from '@shared/schemas/evaluate';
import { checkForm, convertForm, DEMO_LOAD_CASE_SI, exactValues, toRequest } from './form-model';
import { formFromLoadCase, requestFromLoadCase, sameLoadCase } from './saved-load-case';

describe('Evaluate form model', () => {
  it('builds the SI request from the demo load case shown in SI units (mm, m, °C)', () => {
    const req = toRequest(convertForm(DEMO_LOAD_CASE_SI, 'SI-raw', 'SI'), 'SI');
    expect(req.loadCase.pressure).toEqual({ depth: 1200, latitude: 57, water: 'sea' });
    expect(req.loadCase.component).toEqual({ type: 'conical-frustum', minorDiameter: 0.15, thickness: 0.1, includedAngle: 90 });
    expect(req.loadCase.targetSafetyFactor).toBeUndefined();
  });

  it('shows lengths in mm for SI and in inches for US, and builds the same request from either', () => {
    const si = convertForm(DEMO_LOAD_CASE_SI, 'SI-raw', 'SI');
    expect(si.thickness).toBe(100);
    const us = convertForm(DEMO_LOAD_CASE_SI, 'SI-raw', 'US');
    // 100 mm = 3.93701 in; 1200 m = 3937.01 ft; 25 °C = 77 °F (NIST SP 811 factors).
    expect(us.thickness).toBeCloseTo(3.93701, 4);
    expect(us.depth).toBeCloseTo(3937.01, 1);
    expect(us.tmax).toBeCloseTo(77, 6);
    const a = toRequest(si, 'SI').loadCase.component as { thickness: number };
    const b = toRequest(us, 'US').loadCase.component as { thickness: number };
    expect(b.thickness).toBeCloseTo(a.thickness, 6);
  });

  it('maps schema errors back to the form fields', () => {
    const shown = convertForm({ ...DEMO_LOAD_CASE_SI, thickness: -1, includedAngle: 10, tmin: 30, tmax: 5 }, 'SI-raw', 'SI');
    const check = checkForm(shown, 'SI');
    expect(check.ok).toBe(false);
    if (!check.ok) {
      expect(Object.keys(check.errors).sort()).toEqual(['includedAngle', 'thickness', 'tmax']);
    }
  });

  it('reports an empty number field (NaN) as an error on that field', () => {
    const shown = convertForm({ ...DEMO_LOAD_CASE_SI, depth: Number.NaN }, 'SI-raw', 'SI');
    const check = checkForm(shown, 'SI');
    expect(check.ok).toBe(false);
    if (!check.ok) expect(check.errors.depth).toBeTruthy();
  });
});

describe('saved load cases in the Evaluate form', () => {
  // Harrow Sound's 5 bar treatment chamber: a flat side viewport (invented scenario,
  // shared/demo-load-cases.ts), here clamped and with a set target.
  const chamberPort: LoadCaseInput = {
    ...DEMO_CHAMBER_PORT,
    targetSafetyFactor: 6,
    component: { ...DEMO_CHAMBER_PORT.component, edge: 'clamped' },
  };

  it('fills the form from a saved case and builds the same request again, in SI and in US units', () => {
    const form = formFromLoadCase(chamberPort, { transparent: true });
    expect(form).toMatchObject({ pressureMode: 'pressure', pressureValue: 0.5e6, componentType: 'flat-disc', edge: 'clamped', useFamilyTargets: false, transparent: 'true', coversTemperature: false });
    for (const system of ['SI', 'US'] as const) {
      const shown = convertForm(form, 'SI-raw', system);
      const check = checkForm(shown, system, exactValues(shown, form));
      expect(check.ok).toBe(true);
      if (check.ok) {
        expect(sameLoadCase(check.request.loadCase, chamberPort)).toBe(true);
        expect(check.request.filters).toEqual({ transparent: true });
      }
    }
    // 250 mm shows rounded as 9.843 in (NIST SP 811: 1 in = 25.4 mm exactly) and still stands for 250 mm exactly.
    const us = convertForm(form, 'SI-raw', 'US');
    expect(us.diameter).toBe(9.843);
    expect(convertForm(us, 'US', 'SI-raw', exactValues(us, form)).diameter).toBe(form.diameter);
    // A value typed anew is taken as typed.
    expect(convertForm({ ...us, diameter: 10 }, 'US', 'SI-raw', exactValues(us, form)).diameter).toBeCloseTo(0.254, 12);
  });

  it('keeps the family defaults when the saved case has no target, and reads depth cases', () => {
    const form = formFromLoadCase({ ...chamberPort, targetSafetyFactor: undefined, pressure: { depth: 4000, latitude: 57, water: 'sea' } }, null);
    expect(form).toMatchObject({ useFamilyTargets: true, pressureMode: 'depth', depth: 4000, latitude: 57, water: 'sea', transparent: '' });
  });

  it('tells a changed load case from the saved one', () => {
    expect(sameLoadCase(chamberPort, { ...chamberPort, component: { ...chamberPort.component, thickness: 0.041 } })).toBe(false);
    expect(sameLoadCase(chamberPort, { ...chamberPort, targetSafetyFactor: undefined })).toBe(false);
    expect(sameLoadCase(chamberPort, { ...chamberPort, pressure: { value: 0.5e6 * (1 + 2e-6) } })).toBe(true);
  });

  it('builds the request for a saved case exactly as saved', () => {
    const req = requestFromLoadCase(chamberPort, { transparent: true });
    expect(req.loadCase).toEqual(chamberPort);
    expect(req.sortBy).toBe('margin');
  });
});
