/**
 * Turning catalogue property sets and inline materials into engine candidates.
 */
import type { PropertySetDto } from '../schemas/catalogue';
import type { InlineMaterial } from '../schemas/evaluate';
import type { CandidateMaterial, RatingTable } from './types';
import { engineInputKeys, inputStatus } from '../schemas/provenance';

/** The mechanical values of a set, wherever they are copied (the catalogue DTO, an engine candidate). */
export type MechanicalValues = Pick<
  PropertySetDto,
  'density' | 'youngsModulus' | 'poissonsRatio' | 'tensileStrength' | 'tensileYield' | 'compressiveStrength' | 'compressiveYield' | 'shearStrength'
> & { shearYield: number | null };

export function mechanicalValues(s: Omit<MechanicalValues, 'shearYield'> & { shearYield?: number | null }): MechanicalValues {
  return {
    density: s.density,
    youngsModulus: s.youngsModulus,
    poissonsRatio: s.poissonsRatio,
    tensileStrength: s.tensileStrength,
    tensileYield: s.tensileYield,
    compressiveStrength: s.compressiveStrength,
    compressiveYield: s.compressiveYield,
    shearStrength: s.shearStrength,
    shearYield: s.shearYield ?? null,
  };
}

/** A catalogue property set as a candidate; the name is the material's, with the condition when given. */
export function candidateFromPropertySet(ps: PropertySetDto, ratingTables?: readonly RatingTable[]): CandidateMaterial {
  const condition = ps.condition?.trim();
  return {
    ...(ratingTables && ratingTables.length ? { ratingTables } : {}),
    inputs: inputStatus(ps.provenance, engineInputKeys(ps)),
    name: condition ? `${ps.material.name} (${condition})` : ps.material.name,
    propertySetId: ps.id,
    family: ps.material.family,
    ...mechanicalValues(ps),
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
