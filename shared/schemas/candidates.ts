/**
 * Candidates of an evaluation: a published property set by id, or a material given inline with
 * its values (SI: Pa, kg/m³, °C) and its strength-factor curves.
 */
import { z } from 'zod';
import { familySchema } from './catalogue';
import { keyedUnionMessage, num, strict } from './fields';

const strength = (label: string) => num(label, { gt: 0, max: 1e12, unit: 'Pa' });

const temperatureFactorPoint = strict('Temperature factor point', {
  temperature: num('Temperature of a factor point', { min: -273.15, max: 2000, unit: '°C' }),
  factor: num('Temperature factor', { gt: 0, max: 10 }),
});
const hoursFactorPoint = strict('Sustained-load factor point', {
  hours: num('Hours of a sustained-load factor point', { min: 0, max: 1e9, unit: 'h' }),
  factor: num('Sustained-load factor', { gt: 0, max: 10 }),
});
const cyclesFactorPoint = strict('Cyclic factor point', {
  cycles: num('Cycles of a cyclic factor point', { min: 0, max: 1e12 }),
  factor: num('Cyclic factor', { gt: 0, max: 10 }),
});

export const inlineMaterialSchema = strict('Inline material', {
  name: z
    .string({ error: (iss) => (iss.input === undefined ? 'Name is required.' : 'Name must be text.') })
    .trim()
    .min(1, { error: 'Name must not be empty.' })
    .max(200, { error: 'Name must be at most 200 characters.' }),
  family: familySchema.optional(),
  density: num('Density', { gt: 0, max: 1e5, unit: 'kg/m³' }),
  youngsModulus: num("Young's modulus", { gt: 0, max: 1e13, unit: 'Pa' }),
  poissonsRatio: num("Poisson's ratio", { gt: -1, lt: 0.5 }),
  tensileStrength: strength('Tensile strength'),
  tensileYield: strength('Tensile yield').optional(),
  compressiveStrength: strength('Compressive strength'),
  compressiveYield: strength('Compressive yield').optional(),
  shearStrength: strength('Shear strength'),
  shearYield: strength('Shear yield').optional(),
  serviceTemperature: strict('Service temperature', {
    min: num('Minimum service temperature', { min: -273.15, max: 2000, unit: '°C' }),
    max: num('Maximum service temperature', { min: -273.15, max: 2000, unit: '°C' }),
  })
    .refine((r) => r.min <= r.max, { error: 'Maximum service temperature must not be below the minimum.', path: ['max'] })
    .optional(),
  temperatureFactors: z.array(temperatureFactorPoint).max(50, { error: 'At most 50 temperature factor points.' }).optional(),
  sustainedLoadFactors: z.array(hoursFactorPoint).max(50, { error: 'At most 50 sustained-load factor points.' }).optional(),
  cyclicFactors: z.array(cyclesFactorPoint).max(50, { error: 'At most 50 cyclic factor points.' }).optional(),
});
export type InlineMaterial = z.infer<typeof inlineMaterialSchema>;

export const candidateRefSchema = strict('Candidate', {
  propertySetId: num('Property set id', { min: 1, int: true }),
});
export const candidateInlineSchema = strict('Candidate', { inline: inlineMaterialSchema });

export const candidateInputSchema = z.union([candidateRefSchema, candidateInlineSchema], {
  error: keyedUnionMessage('Candidate', 'either {"propertySetId"} or {"inline": {…}}', [
    { key: 'propertySetId', index: 0 },
    { key: 'inline', index: 1 },
  ]),
});
export type CandidateInput = z.infer<typeof candidateInputSchema>;
