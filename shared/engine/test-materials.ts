/**
 * Candidate materials shared by the engine's tests (not used by the engine itself), each written
 * once with the source of its numbers. A test that needs other numbers spreads one of these and
 * overrides them beside the test. Demo data of the invented Harrow Sound scenario.
 */
import type { CandidateMaterial } from './types';

// ---------------------------------------------------------------------------------------------
// Cast acrylic
// ---------------------------------------------------------------------------------------------

/**
 * Acrylic at the pressure-window standard's lot minimums: ASME PVHO-1 minimum properties as
 * transcribed in UFC 4-159-01 Tables 3-1, 3-2: tensile 62 MPa, compressive yield 103 MPa, shear
 * 55 MPa, modulus 2,760 MPa, specific gravity 1.19 [pub]. Poisson's ratio 0.37 is a typical value
 * [memory]. No curves of its own.
 */
export const acrylicLotMinimums: CandidateMaterial = {
  name: 'Cast acrylic, lot minimums',
  family: 'acrylic',
  density: 1190,
  youngsModulus: 2.76e9,
  poissonsRatio: 0.37,
  tensileStrength: 62e6,
  compressiveStrength: 103e6,
  compressiveYield: 103e6,
  shearStrength: 55e6,
};

/** The lot minimums with a flat temperature curve at 21 °C, which keeps comparisons with tests at 65–75 °F. */
export const acrylicAt21C: CandidateMaterial = { ...acrylicLotMinimums, temperatureFactors: [{ temperature: 21, factor: 1 }] };

/**
 * PVHO-style cast acrylic: the lot minimums above with demo curves for temperature, sustained
 * load and pressure cycles (values as in REFERENCES.md "Typical properties"; demo only).
 */
export const pvhoAcrylic: CandidateMaterial = {
  ...acrylicLotMinimums,
  name: 'Cast acrylic, PVHO-1 minimum properties',
  serviceTemperature: { min: -18, max: 66 },
  temperatureFactors: [
    { temperature: 0, factor: 1.15 },
    { temperature: 21, factor: 1 },
    { temperature: 32, factor: 0.85 },
    { temperature: 66, factor: 0.5 },
  ],
  sustainedLoadFactors: [
    { hours: 0.1, factor: 1 },
    { hours: 1000, factor: 0.6 },
    { hours: 100000, factor: 0.45 },
  ],
  cyclicFactors: [
    { cycles: 1, factor: 1 },
    { cycles: 10000, factor: 0.75 },
  ],
};

// ---------------------------------------------------------------------------------------------
// Metals (values as in REFERENCES.md "Typical properties"; demo only, except where said)
// ---------------------------------------------------------------------------------------------

export const titanium: CandidateMaterial = {
  name: 'Titanium alloy, annealed plate',
  propertySetId: 7,
  family: 'titanium-alloy',
  density: 4430,
  youngsModulus: 114e9,
  poissonsRatio: 0.31,
  tensileStrength: 896e6,
  tensileYield: 827e6,
  compressiveStrength: 896e6,
  compressiveYield: 827e6,
  shearStrength: 550e6,
};

export const aluminium: CandidateMaterial = {
  name: 'Aluminium alloy 7075-T6, typical',
  propertySetId: 3,
  family: 'aluminium-alloy',
  density: 2810,
  youngsModulus: 71.7e9,
  poissonsRatio: 0.33,
  tensileStrength: 572e6,
  tensileYield: 503e6,
  compressiveStrength: 572e6,
  compressiveYield: 503e6,
  shearStrength: 331e6,
};

/** HY-80 at its MIL-S-16216 minimum yield of 552 MPa [pub]; E, ν typical [memory]. */
export const hy80: CandidateMaterial = {
  name: 'HY-80 plate (demo)',
  family: 'steel',
  density: 7850,
  youngsModulus: 207e9,
  poissonsRatio: 0.3,
  tensileStrength: 690e6,
  tensileYield: 552e6,
  compressiveStrength: 552e6,
  compressiveYield: 552e6,
  shearStrength: 414e6,
};

// ---------------------------------------------------------------------------------------------
// Brittle windows (values as in REFERENCES.md "Typical properties"; demo only)
// ---------------------------------------------------------------------------------------------

export const sapphire: CandidateMaterial = {
  name: 'Sapphire, c-plane window grade',
  family: 'sapphire-alumina',
  density: 3980,
  youngsModulus: 345e9,
  poissonsRatio: 0.29,
  tensileStrength: 400e6,
  compressiveStrength: 2000e6,
  shearStrength: 300e6,
};

export const glass: CandidateMaterial = {
  name: 'Borosilicate glass',
  family: 'glass',
  density: 2230,
  youngsModulus: 64e9,
  poissonsRatio: 0.2,
  tensileStrength: 40e6,
  compressiveStrength: 1000e6,
  shearStrength: 40e6,
};

/** One of each family above, as the evaluation tests rank them. */
export const demo = [pvhoAcrylic, titanium, aluminium, sapphire, glass];
