/**
 * Turning catalogue property sets and inline materials into engine candidates.
 */
import type { PropertySetDto } from '../schemas/catalogue';
import type { InlineMaterial } from '../schemas/evaluate';
import type { CandidateMaterial, RatingTable } from './types';

/** A catalogue property set as a candidate; the name is the material's, with the condition when given. */
export function candidateFromPropertySet(ps: PropertySetDto, ratingTables?: readonly RatingTable[]): CandidateMaterial {
  const condition = ps.condition?.trim();
  return {
    ...(ratingTables && ratingTables.length ? { ratingTables } : {}),
    name: condition ? `${ps.material.name} (${condition})` : ps.material.name,
    propertySetId: ps.id,
    family: ps.material.family,
    density: ps.density,
    youngsModulus: ps.youngsModulus,
    poissonsRatio: ps.poissonsRatio,
    tensileStrength: ps.tensileStrength,
    tensileYield: ps.tensileYield,
    compressiveStrength: ps.compressiveStrength,
    compressiveYield: ps.compressiveYield,
    shearStrength: ps.shearStrength,
    shearYield: ps.shearYield ?? null,
    serviceTemperature: ps.serviceTemperature,
    temperatureFactors: ps.temperatureFactors,
    sustainedLoadFactors: ps.sustainedLoadFactors,
    cyclicFactors: ps.cyclicFactors,
  };
}

/** An inline material (validated by `inlineMaterialSchema`) as a candidate. */
export function candidateFromInline(m: InlineMaterial): CandidateMaterial {
  return { ...m };
}
