/**
 * Spherical sector window in a conical seat (inner spherical radius Ri of the concave face,
 * thickness t, included angle α of the sector and its seat), pressure p on the convex face
 * (Ro = Ri + t). A window geometry common at depth.
 *
 * Compression: the membrane state of a sphere, the seat carrying the membrane force. The force
 * balance on the sector, p·π(Ro·sin(α/2))² = σn·π(Ro² − Ri²)·sin²(α/2), gives the seat normal stress
 * σn = p·Ro²/(Ro² − Ri²), the mean membrane stress whatever the angle; the largest stress is the
 * Lamé thick-sphere hoop stress at the inner (concave) face, 1.5·p·Ro³/(Ro³ − Ri³) ≥ σn, which is
 * the one checked (it reduces to the thin p·R/(2t) as t/R → 0).
 * Buckling: elastic buckling as for a sphere of the same radius and thickness (the sphere model's
 * buckling pressure, with its knock-down), a cautious stand-in for a restrained cap.
 * Acrylic sectors are rated from the standard's tables where a rating table covers them.
 */
import type { SphericalSector } from '../../schemas/evaluate';
import type { FailureMode } from '../types';
import { compressionText, type ComponentModel } from './common';
import { sphereModel } from './sphere';

const MODES: readonly FailureMode[] = ['compression', 'buckling'];

/** Mean membrane stress = seat normal stress of a sector, p·Ro²/(Ro² − Ri²) (Pa). */
export function sectorSeatStress(p: number, innerRadius: number, t: number): number {
  const ro = innerRadius + t;
  return (p * ro * ro) / (t * (ro + innerRadius));
}

const COMPRESSION = compressionText(
  'Membrane compression of the sector, Lamé thick-wall sphere at the concave face: σ = 1.5·p·Ro³/(Ro³ − Ri³); the conical seat carries the ' +
    'membrane force, at the mean stress p·Ro²/(Ro² − Ri²), from the force balance on the sector at its included angle.',
);

export const SPHERICAL_SECTOR_WARNING =
  'The spherical sector model checks membrane compression and elastic buckling only; seat fit, edge restraint and bearing-surface fatigue ' +
  "decide real windows: acrylic sectors are rated from the applicable standard's tables (e.g. ASME PVHO-1), entered here as rating tables.";

/** The sector viewed as a sphere of the same radii, so the sphere model's buckling can be reused. */
const asSphere = (g: SphericalSector) => ({ type: 'sphere' as const, innerRadius: g.innerRadius, thickness: g.thickness });

export const sphericalSectorModel: ComponentModel<SphericalSector> = {
  modes: MODES,
  usesModulus: true,
  thickness: (g) => g.thickness,

  fill(g, t, p, m, stress, allowable) {
    sphereModel.fill(asSphere(g), t, p, m, stress, allowable);
  },

  required(g, p, m, target, i, t, stress, allowable) {
    return sphereModel.required(asSphere(g), p, m, target, i, t, stress, allowable);
  },

  model(g, i, m) {
    return i === 0 ? COMPRESSION[m.compressionOnYield ? 'yield' : 'strength'] : sphereModel.model(asSphere(g), i, m);
  },

  validity: (g, t, i) => sphereModel.validity!(asSphere(g), t, i),

  check(g, p, m, stress, allowable, warnings) {
    warnings.push(SPHERICAL_SECTOR_WARNING);
    return sphereModel.check(asSphere(g), p, m, stress, allowable, warnings);
  },
};
