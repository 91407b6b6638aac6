import { describe, expect, it } from 'vitest';
import { checkForm, convertForm, DEMO_LOAD_CASE_SI, toRequest } from './form-model';

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
