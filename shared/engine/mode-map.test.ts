import { describe, expect, it } from 'vitest';
import { modeMap, targetContour } from './mode-map';
import { evaluate } from './evaluate';
import { cameraCone, chamberViewport, hullSphere } from './evaluate-fixtures';
import { pvhoAcrylic as acrylic, titanium } from './test-materials';
import { pressureFromDepth } from './pressure';

describe('modeMap', () => {
  it('agrees cell by cell with evaluate() at the same thickness and angle (cone)', () => {
    const map = modeMap(cameraCone, acrylic, { kind: 'thicknessRatio', from: 0.2, to: 1.2, cells: 6 }, { kind: 'includedAngle', from: 60, to: 120, cells: 4 });
    expect(map.governing).toHaveLength(24);
    const minor = cameraCone.component.type === 'conical-frustum' ? cameraCone.component.minorDiameter : 0;
    for (const [i, j] of [[0, 0], [5, 3], [2, 1]]) {
      const component = { ...cameraCone.component, thickness: map.x[i] * minor, includedAngle: map.y[j] } as typeof cameraCone.component;
      const r = evaluate({ loadCase: { ...cameraCone, component }, candidates: [acrylic] }).results[0];
      // The map is analytical: compare with the lowest analytical mode, not a rating table's margin.
      const lowest = r.modes.reduce((a, b) => (b.safetyFactor < a.safetyFactor ? b : a));
      expect(map.modes[map.governing[j * 6 + i]]).toBe(lowest.mode);
      expect(map.ratio[j * 6 + i]).toBeCloseTo(lowest.safetyFactor / r.targetSafetyFactor, 9);
    }
  });

  it('follows depth: deeper is never safer, and thicker never less safe (sphere)', () => {
    const map = modeMap(hullSphere, titanium, { kind: 'thickness', from: 0.01, to: 0.1, cells: 10 }, { kind: 'depth', from: 100, to: 6000, cells: 8 });
    for (let j = 0; j < 8; j++) for (let i = 1; i < 10; i++) expect(map.ratio[j * 10 + i]).toBeGreaterThanOrEqual(map.ratio[j * 10 + i - 1] - 1e-12);
    for (let i = 0; i < 10; i++) for (let j = 1; j < 8; j++) expect(map.ratio[j * 10 + i]).toBeLessThanOrEqual(map.ratio[(j - 1) * 10 + i] + 1e-12);
    expect(pressureFromDepth(map.y[0], 57, 'sea').pressure).toBeGreaterThan(0);
  });

  it('shows shear taking over from bending as a flat window thickens (plate bending ∝ 1/t², shear ∝ 1/t)', () => {
    const map = modeMap(chamberViewport, acrylic, { kind: 'thickness', from: 0.005, to: 0.5, cells: 60 }, { kind: 'pressure', from: 1e5, to: 1e6, cells: 2 });
    const row = Array.from({ length: 60 }, (_, i) => map.modes[map.governing[i]]);
    expect(row[0]).toBe('tension');
    expect(row[59]).toBe('shear');
  });

  it('draws the target contour where the ratio crosses 1', () => {
    const map = modeMap(hullSphere, titanium, { kind: 'thickness', from: 0.005, to: 0.2, cells: 30 }, { kind: 'depth', from: 100, to: 8000, cells: 30 });
    const segments = targetContour(map);
    expect(segments.length).toBeGreaterThan(0);
    for (const [x1, y1] of segments) {
      const i = Math.min(28, Math.floor(x1));
      const j = Math.min(28, Math.floor(y1));
      const around = [map.ratio[j * 30 + i], map.ratio[j * 30 + i + 1], map.ratio[(j + 1) * 30 + i], map.ratio[(j + 1) * 30 + i + 1]];
      expect(Math.min(...around)).toBeLessThanOrEqual(1);
      expect(Math.max(...around)).toBeGreaterThanOrEqual(1);
    }
  });

  it('refuses axes it does not draw', () => {
    expect(() => modeMap(hullSphere, titanium, { kind: 'thicknessRatio', from: 0.1, to: 1, cells: 4 }, { kind: 'includedAngle', from: 60, to: 120, cells: 4 })).toThrow(RangeError);
    expect(() => modeMap(hullSphere, titanium, { kind: 'thickness', from: 0.1, to: 0.05, cells: 4 }, { kind: 'depth', from: 10, to: 100, cells: 4 })).toThrow(RangeError);
    expect(() => modeMap(hullSphere, titanium, { kind: 'thickness', from: 0.01, to: 0.05, cells: 500 }, { kind: 'depth', from: 10, to: 100, cells: 4 })).toThrow(RangeError);
  });
});
