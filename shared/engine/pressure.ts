/**
 * Hydrostatic pressure from depth (and back), with compressibility and gravity's variation.
 *
 * Seawater: the UNESCO 1983 depth formula (Fofonoff, N. P. & Millard, R. C., "Algorithms for
 * computation of fundamental properties of seawater", Unesco Technical Papers in Marine Science 44,
 * 1983; the formula is that of Saunders, P. M. & Fofonoff, N. P., Deep-Sea Research 23, 1976),
 * for the standard ocean (salinity 35, 0 °C), inverted numerically (safeguarded Newton).
 * Check: Saunders, P. M., "Practical conversion of pressure to depth", J. Phys. Oceanogr. 11,
 * 573–574, 1981 (closed form, also exported).
 *
 * Fresh water: dp/dz = ρ(p)·g(lat, z) integrated in closed form, with a Murnaghan density law
 * ρ = ρ0 (1 + K′p/K0)^(1/K′) whose constants were evaluated from TEOS-10 (IOC, SCOR & IAPSO 2010,
 * via the reference library gsw 3.6) for pure water (SA = 0) at 4 °C, the temperature of deep
 * lake water, and the same gravity model as the UNESCO formula.
 *
 * Pressures are gauge (sea pressure: 0 at the surface), in Pa. 1 dbar = 1e4 Pa.
 */
import type { Water } from './types';

export const PA_PER_DBAR = 1e4;

/** sin²(latitude), with the degree conversion of the published UNESCO code (lat/57.29578). */
function sin2lat(latitudeDeg: number): number {
  const s = Math.sin(latitudeDeg / 57.29578);
  return s * s;
}

/** Surface gravity, m/s², International Gravity Formula 1967 as used by UNESCO 1983. */
export function surfaceGravity(latitudeDeg: number): number {
  const x = sin2lat(latitudeDeg);
  return 9.780318 * (1.0 + (5.2788e-3 + 2.36e-5 * x) * x);
}

/**
 * Mean vertical gradient of gravity in the ocean, s⁻² (m/s² per m of depth), used by
 * Saunders & Fofonoff 1976 (UNESCO 1983 carries it as 1.092e-6 per dbar in the mean gravity).
 */
export const GRAVITY_GRADIENT = 2.226e-6;

/**
 * UNESCO 1983 depth (m) of the standard ocean at sea pressure `dbar` and latitude.
 * Published check value: 10000 dbar, 30° → 9712.653 m.
 */
export function unesco1983Depth(dbar: number, latitudeDeg: number): number {
  const gr = surfaceGravity(latitudeDeg) + 1.092e-6 * dbar;
  const depthTimesG = (((-1.82e-15 * dbar + 2.279e-10) * dbar - 2.2512e-5) * dbar + 9.72659) * dbar;
  return depthTimesG / gr;
}

/** d(depth)/d(pressure) of `unesco1983Depth`, m per dbar. */
function unesco1983DepthDerivative(dbar: number, latitudeDeg: number): number {
  const gr = surfaceGravity(latitudeDeg) + 1.092e-6 * dbar;
  const n = (((-1.82e-15 * dbar + 2.279e-10) * dbar - 2.2512e-5) * dbar + 9.72659) * dbar;
  const dn = ((-4 * 1.82e-15 * dbar + 3 * 2.279e-10) * dbar - 2 * 2.2512e-5) * dbar + 9.72659;
  return (dn * gr - n * 1.092e-6) / (gr * gr);
}

/**
 * Inverse of the UNESCO 1983 depth formula: sea pressure (dbar) at `depthM`.
 * Safeguarded Newton iteration inside a bracket that always holds the root; converges to
 * round-off in a few steps because the formula is smooth and nearly linear.
 */
export function unesco1983PressureDbar(depthM: number, latitudeDeg: number): number {
  if (!(depthM > 0)) return 0;
  let lo = 0;
  let hi = depthM * 1.2 + 10; // depth < pressure(dbar) × 1.0 everywhere in the ocean; generous bracket
  let p = depthM * 1.01; // first guess: about 1 dbar per 0.99 m
  for (let i = 0; i < 60; i++) {
    const f = unesco1983Depth(p, latitudeDeg) - depthM;
    if (f > 0) hi = p;
    else lo = p;
    const next = p - f / unesco1983DepthDerivative(p, latitudeDeg);
    const stepOk = next > lo && next < hi;
    const candidate = stepOk ? next : 0.5 * (lo + hi);
    if (Math.abs(candidate - p) <= 1e-12 * Math.max(1, p)) return candidate;
    p = candidate;
  }
  return p;
}

/**
 * Saunders 1981 closed-form sea pressure (dbar) at depth z (m), J. Phys. Oceanogr. 11, 573–574:
 * p = ((1 − c1) − √((1 − c1)² − 8.84e-6·z)) / 4.42e-6, c1 = 5.92e-3 + 5.25e-3·sin²(lat).
 */
export function saunders1981PressureDbar(depthM: number, latitudeDeg: number): number {
  const s = Math.sin((latitudeDeg * Math.PI) / 180);
  const c1 = 5.92e-3 + 5.25e-3 * s * s;
  const a = 1 - c1;
  return (a - Math.sqrt(a * a - 8.84e-6 * depthM)) / 4.42e-6;
}

/**
 * Pure water at 4 °C (deep lake water), Murnaghan law K = K0 + K′·p. Values evaluated [calc] from
 * TEOS-10 (gsw 3.6.16: gsw.rho(0, 4, 0) = 999.976 kg/m³; 1/gsw.kappa(0, 4, p) = 2.018 GPa at 0 dbar
 * rising to 2.133 GPa at 2000 dbar, slope ≈ 5.7). At 4 °C the thermal expansion of water is
 * near zero, so isentropic and isothermal compressibility agree.
 */
export const FRESH_WATER = { density: 999.976, bulkModulus: 2.018e9, bulkModulusSlope: 5.7, temperature: 4 } as const;

/** Geopotential from the surface to depth z (m): ∫ g dz with g = g0(lat) + GRAVITY_GRADIENT·z. */
function geopotential(depthM: number, latitudeDeg: number): number {
  return surfaceGravity(latitudeDeg) * depthM + 0.5 * GRAVITY_GRADIENT * depthM * depthM;
}

/**
 * Fresh-water gauge pressure (Pa) at depth, from ∫dp/ρ(p) = ∫g dz in closed form:
 * p = (K0/K′)·[(1 + (K′−1)·ρ0·Φ/K0)^(K′/(K′−1)) − 1], Φ = g0·z + γ·z²/2.
 */
export function freshWaterPressurePa(depthM: number, latitudeDeg: number): number {
  if (!(depthM > 0)) return 0;
  const { density: rho0, bulkModulus: k0, bulkModulusSlope: kp } = FRESH_WATER;
  const phi = geopotential(depthM, latitudeDeg);
  return (k0 / kp) * Math.expm1((kp / (kp - 1)) * Math.log1p(((kp - 1) * rho0 * phi) / k0));
}

/** Inverse of `freshWaterPressurePa`: depth (m) at gauge pressure (Pa). */
export function freshWaterDepthM(pressurePa: number, latitudeDeg: number): number {
  if (!(pressurePa > 0)) return 0;
  const { density: rho0, bulkModulus: k0, bulkModulusSlope: kp } = FRESH_WATER;
  const u = Math.log1p((kp * pressurePa) / k0); // ln(1 + K′p/K0)
  const phi = (k0 / (rho0 * (kp - 1))) * Math.expm1(((kp - 1) / kp) * u);
  const g0 = surfaceGravity(latitudeDeg);
  // γz²/2 + g0·z − Φ = 0, stable root
  return (2 * phi) / (g0 + Math.sqrt(g0 * g0 + 2 * GRAVITY_GRADIENT * phi));
}

export const SEAWATER_METHOD =
  'Seawater, standard ocean (salinity 35, 0 °C): UNESCO 1983 depth–pressure formula (Fofonoff & Millard, ' +
  'Unesco Tech. Pap. Mar. Sci. 44, 1983; Saunders & Fofonoff 1976) inverted numerically; includes ' +
  "seawater's compressibility and gravity's variation with latitude and depth.";

export const FRESH_WATER_METHOD =
  'Fresh water at 4 °C: dp/dz = ρ(p)·g(latitude, depth) integrated in closed form; compressibility by a ' +
  'Murnaghan law (ρ0 = 999.976 kg/m³, K0 = 2.018 GPa, dK/dp = 5.7) fitted to TEOS-10 pure water ' +
  '(IOC, SCOR & IAPSO 2010); gravity by the International Gravity Formula 1967 with the ' +
  'Saunders & Fofonoff (1976) vertical gradient.';

export interface PressureFromDepth {
  /** Pa gauge */
  pressure: number;
  /** Model and source. */
  method: string;
}

/**
 * Gauge pressure (Pa) at `depthM` metres below the surface of sea or fresh water at a latitude.
 * @throws RangeError for a negative or non-finite depth or a latitude outside −90..90.
 */
export function pressureFromDepth(depthM: number, latitudeDeg: number, water: Water): PressureFromDepth {
  if (!Number.isFinite(depthM) || depthM < 0) throw new RangeError('depth must be a finite number of metres, zero or more');
  if (!Number.isFinite(latitudeDeg) || Math.abs(latitudeDeg) > 90) throw new RangeError('latitude must be between −90 and 90 degrees');
  if (water === 'fresh') return { pressure: freshWaterPressurePa(depthM, latitudeDeg), method: FRESH_WATER_METHOD };
  return { pressure: unesco1983PressureDbar(depthM, latitudeDeg) * PA_PER_DBAR, method: SEAWATER_METHOD };
}

/** Depth (m) at a gauge pressure (Pa): the inverse of `pressureFromDepth`. */
export function depthFromPressure(pressurePa: number, latitudeDeg: number, water: Water): number {
  if (!Number.isFinite(pressurePa) || pressurePa < 0) throw new RangeError('pressure must be a finite number of pascals, zero or more');
  if (!Number.isFinite(latitudeDeg) || Math.abs(latitudeDeg) > 90) throw new RangeError('latitude must be between −90 and 90 degrees');
  if (water === 'fresh') return freshWaterDepthM(pressurePa, latitudeDeg);
  return unesco1983Depth(pressurePa / PA_PER_DBAR, latitudeDeg);
}
