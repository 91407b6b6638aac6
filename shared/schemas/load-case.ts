/**
 * The load case: design pressure (given, or from depth), temperatures, sustained load, cycles,
 * target and proof factors, and the component. All values SI: Pa, m, °C, hours.
 */
import { z } from 'zod';
import { componentSchema } from './components';
import { keyedUnionMessage, num, strict } from './fields';
import { familySchema } from './catalogue';

export const MAX_PRESSURE_PA = 2e9;
export const MAX_DEPTH_M = 12_000;

export const waterSchema = z.enum(['sea', 'fresh'], { error: 'Water must be "sea" or "fresh".' });

export const pressureValueSchema = strict('Pressure', {
  value: num('Pressure value', { min: 1, max: MAX_PRESSURE_PA, unit: 'Pa' }),
});

/** Depth for a load case: must be below the surface (0.01 m or more) so there is a load to design for. */
export const pressureDepthSchema = strict('Pressure', {
  depth: num('Depth', { min: 0.01, max: MAX_DEPTH_M, unit: 'm' }),
  latitude: num('Latitude', { min: -90, max: 90, unit: '°' }),
  water: waterSchema,
});

export const pressureInputSchema = z.union([pressureValueSchema, pressureDepthSchema], {
  error: keyedUnionMessage('Pressure', 'either {"value"} in Pa or {"depth", "latitude", "water"}', [
    { key: 'value', index: 0 },
    { key: 'depth', index: 1 },
    { key: 'latitude', index: 1 },
    { key: 'water', index: 1 },
  ]),
});
export type PressureInput = z.infer<typeof pressureInputSchema>;

export const temperatureRangeSchema = strict('Temperature', {
  min: num('Minimum temperature', { min: -273.15, max: 1000, unit: '°C' }),
  max: num('Maximum temperature', { min: -273.15, max: 1000, unit: '°C' }),
}).refine((r) => r.min <= r.max, {
  error: 'Maximum temperature must not be below the minimum temperature.',
  path: ['max'],
});
/** Common practice for the proof (hydrostatic test) factor is 1.25–1.5 × design pressure. */
export const DEFAULT_PROOF_FACTOR = 1.25;

export const loadCaseSchema = strict('Load case', {
  pressure: pressureInputSchema,
  temperature: temperatureRangeSchema,
  sustainedHours: num('Sustained-load hours', { min: 0, max: 1e6, unit: 'h' }),
  cycles: num('Pressure cycles', { min: 0, max: 1e9, int: true }),
  targetSafetyFactor: num('Target safety factor', { gt: 0, max: 100 }).optional(),
  /** Targets by family, for families whose common-practice default is not wanted; the one targetSafetyFactor, when given, wins. */
  familyTargets: z.partialRecord(familySchema, num('Target safety factor', { gt: 0, max: 100 })).optional(),
  proofFactor: num('Proof factor', { min: 1, max: 3 }).default(DEFAULT_PROOF_FACTOR),
  /** For human occupancy: window candidates no window rule covers carry a warning and rank below covered ones. */
  humanOccupancy: z.boolean({ error: 'Human occupancy must be true or false.' }).optional(),
  component: componentSchema,
});
/** A validated load case (defaults applied). */
export type LoadCase = z.output<typeof loadCaseSchema>;
/** A load case as sent (proofFactor may be absent). The engine accepts this. */
export type LoadCaseInput = z.input<typeof loadCaseSchema>;
