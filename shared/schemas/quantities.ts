// The scalar quantities of a property set, apart from the schemas so every module can name them.

import type { QuantityKind } from '../units';

/**
 * Scalar quantities a property set may carry, all SI:
 * density kg/m³; moduli and strengths Pa; Poisson's ratio, elongation and
 * luminous transmittance as fractions (0.02 = 2 %).
 */
export const QUANTITIES = [
  'density',
  'youngsModulus',
  'poissonsRatio',
  'tensileStrength',
  'tensileYield',
  'compressiveStrength',
  'compressiveYield',
  'shearStrength',
  'shearYield',
  'elongation',
  'luminousTransmittance',
] as const;
export type Quantity = (typeof QUANTITIES)[number];

export const QUANTITY_LABELS: Record<Quantity, string> = {
  density: 'Density',
  youngsModulus: "Young's modulus",
  poissonsRatio: "Poisson's ratio",
  tensileStrength: 'Tensile strength',
  tensileYield: 'Tensile yield',
  compressiveStrength: 'Compressive strength',
  compressiveYield: 'Compressive yield',
  shearStrength: 'Shear strength',
  shearYield: 'Shear yield',
  elongation: 'Elongation at break',
  luminousTransmittance: 'Luminous transmittance',
};

/** Unit of each quantity on screen and in files (null: dimensionless). */
export const QUANTITY_KIND: Record<Quantity, QuantityKind | null> = {
  density: 'density',
  youngsModulus: 'modulus',
  poissonsRatio: null,
  tensileStrength: 'stress',
  tensileYield: 'stress',
  compressiveStrength: 'stress',
  compressiveYield: 'stress',
  shearStrength: 'stress',
  shearYield: 'stress',
  elongation: 'fraction',
  luminousTransmittance: 'fraction',
};
