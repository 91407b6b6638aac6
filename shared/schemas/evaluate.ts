/**
 * Request schemas of the calculation: the load case and `POST /api/evaluate` (see PRODUCT.md).
 * All values SI: Pa, m, °C, hours. Objects are strict (unknown fields are refused) and every
 * number must be finite. Messages are whole sentences naming the field, for `{ error: { fields } }`.
 */
import { z } from 'zod';
import { familySchema } from './catalogue';

// ---------------------------------------------------------------------------------------------
// Small builders for fields with human messages
// ---------------------------------------------------------------------------------------------

interface NumberRule {
  /** Inclusive lower bound. */
  min?: number;
  /** Exclusive lower bound. */
  gt?: number;
  /** Inclusive upper bound. */
  max?: number;
  /** Exclusive upper bound. */
  lt?: number;
  int?: boolean;
  /** Unit appended to bounds in messages, e.g. "m" or "Pa". */
  unit?: string;
}

const withUnit = (v: number, unit?: string) => (unit ? `${v} ${unit}` : `${v}`);

/** A finite number field named `label` in messages, with bounds. */
function num(label: string, rule: NumberRule = {}) {
  const kind = rule.int ? 'a whole number' : 'a number';
  let s = z.number({
    error: (iss) => (iss.input === undefined ? `${label} is required.` : `${label} must be ${kind}.`),
  });
  if (rule.int) s = s.int({ error: `${label} must be a whole number.` });
  if (rule.gt !== undefined) s = s.gt(rule.gt, { error: `${label} must be greater than ${withUnit(rule.gt, rule.unit)}.` });
  if (rule.min !== undefined)
    s = s.min(rule.min, {
      error: rule.min === 0 ? `${label} must be zero or more.` : `${label} must be at least ${withUnit(rule.min, rule.unit)}.`,
    });
  if (rule.lt !== undefined) s = s.lt(rule.lt, { error: `${label} must be less than ${withUnit(rule.lt, rule.unit)}.` });
  if (rule.max !== undefined) s = s.max(rule.max, { error: `${label} must be at most ${withUnit(rule.max, rule.unit)}.` });
  return s;
}

/** A strict object whose unknown fields are refused with a sentence naming them. */
function strict<T extends z.core.$ZodLooseShape>(label: string, shape: T) {
  return z.strictObject(shape, {
    error: (iss) => {
      if (iss.code === 'unrecognized_keys') {
        const keys = iss.keys.map((k) => `"${k}"`).join(', ');
        const allowed = Object.keys(shape).join(', ');
        return `${label} has unknown field${iss.keys.length > 1 ? 's' : ''} ${keys}; allowed: ${allowed}.`;
      }
      if (iss.code === 'invalid_type') return iss.input === undefined ? `${label} is required.` : `${label} must be an object.`;
      return undefined;
    },
  });
}

/**
 * A union of strict objects told apart by which fields are present. Zod reports a failed union
 * as one issue; this picks the option whose distinguishing field is present and repeats that
 * option's own messages, so the user learns what is wrong rather than "invalid input".
 */
function keyedUnionMessage(label: string, expected: string, options: { key: string; index: number }[]) {
  return (iss: z.core.$ZodRawIssue): string => {
    if (iss.code !== 'invalid_union') return `${label} must be ${expected}.`;
    const input = iss.input;
    if (input === undefined) return `${label} is required.`;
    if (typeof input !== 'object' || input === null || Array.isArray(input)) return `${label} must be ${expected}.`;
    const chosen = options.find((o) => Object.prototype.hasOwnProperty.call(input, o.key));
    const errors = (iss as unknown as { errors?: { message: string }[][] }).errors;
    if (!chosen || !errors || !errors[chosen.index]) return `${label} must be ${expected}.`;
    const messages = errors[chosen.index].map((e) => e.message);
    return `${label}: ${[...new Set(messages)].join(' ')}`;
  };
}

// ---------------------------------------------------------------------------------------------
// Load case
// ---------------------------------------------------------------------------------------------

/** Largest size accepted for any length (m). */
export const MAX_SIZE_M = 100;
/** Smallest size accepted for any length (m): keeps every result finite. */
export const MIN_SIZE_M = 1e-6;
export const MAX_PRESSURE_PA = 2e9;
export const MAX_DEPTH_M = 12_000;

const size = (label: string) => num(label, { min: MIN_SIZE_M, max: MAX_SIZE_M, unit: 'm' });

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

export const flatDiscSchema = strict('Flat disc', {
  type: z.literal('flat-disc'),
  diameter: size('Unsupported diameter'),
  thickness: size('Thickness'),
  edge: z.enum(['simply-supported', 'clamped'], { error: 'Edge must be "simply-supported" or "clamped".' }),
});

export const conicalFrustumSchema = strict('Conical frustum', {
  type: z.literal('conical-frustum'),
  minorDiameter: size('Minor diameter'),
  thickness: size('Thickness'),
  includedAngle: num('Included angle', { min: 30, max: 180, unit: '°' }),
  /** Outer diameter of the seat's bearing annulus; needed for a 180° (flat) seat, which has no major diameter. */
  seatOuterDiameter: size('Seat outer diameter').optional(),
}).refine((c) => c.seatOuterDiameter === undefined || c.seatOuterDiameter > c.minorDiameter, {
  error: 'Seat outer diameter must be larger than the minor diameter.',
  path: ['seatOuterDiameter'],
});

/** Spherical sector window in a conical seat: concave face of inner spherical radius Ri, pressure on the convex face. */
export const sphericalSectorSchema = strict('Spherical sector', {
  type: z.literal('spherical-sector'),
  innerRadius: size('Inner spherical radius'),
  thickness: size('Thickness'),
  includedAngle: num('Included angle', { min: 30, max: 180, unit: '°' }),
});

/** How a sphere was made: it decides its collapse more than any other input. */
export const SPHERE_FABRICATIONS = ['fabricated', 'machined'] as const;

export const sphereSchema = strict('Sphere', {
  type: z.literal('sphere'),
  innerRadius: size('Inner radius'),
  thickness: size('Thickness'),
  /** Default "fabricated" (welded or formed within ordinary tolerances): the cautious class. */
  fabrication: z.enum(SPHERE_FABRICATIONS, { error: 'Fabrication must be "fabricated" or "machined".' }).optional(),
  /** Measured out-of-roundness: the largest local radius over an arc of 2.2·√(R·t), as a multiple of the nominal radius (≥ 1). */
  localRadiusRatio: num('Local radius ratio', { min: 1, max: 3 }).optional(),
});

/** Out-of-roundness of ring frames assumed when none is given: 0.5 % of the radius (common practice tolerance). */
export const DEFAULT_OUT_OF_ROUNDNESS = 0.005;
const outOfRoundness = () => num('Out-of-roundness', { min: 0, max: 0.05 }).optional();

export const cylinderSchema = strict('Cylinder', {
  type: z.literal('cylinder'),
  innerRadius: size('Inner radius'),
  thickness: size('Thickness'),
  length: size('Unsupported length'),
  /** Measured oval deviation from the mean radius as a fraction of it (none: the knock-down alone covers imperfections). */
  outOfRoundness: outOfRoundness(),
});

/** A tee frame by its dimensions (the web stands on the shell). */
export const teeFrameSchema = strict('Frame', {
  shape: z.literal('tee'),
  webHeight: size('Web height'),
  webThickness: size('Web thickness'),
  flangeWidth: size('Flange width'),
  flangeThickness: size('Flange thickness'),
}).refine((f) => f.flangeWidth >= f.webThickness, { error: 'The flange cannot be narrower than the web.', path: ['flangeWidth'] });

/** A frame by its section properties. */
export const sectionFrameSchema = strict('Frame', {
  shape: z.literal('section'),
  area: num('Frame area', { gt: 0, max: 10, unit: 'm²' }),
  /** Second moment of area about the frame's own centroid, for bending in the plane of the ring. */
  secondMoment: num('Frame second moment of area', { gt: 0, max: 10, unit: 'm⁴' }),
  /** Height of the frame from the shell surface to its outermost fibre. */
  depth: size('Frame depth'),
  /** Distance from the shell surface to the frame's centroid. */
  centroidHeight: size('Frame centroid height'),
  /** Width of the frame where it meets the shell. */
  contactWidth: size('Frame contact width'),
})
  .refine((f) => f.centroidHeight < f.depth, { error: 'The centroid must lie inside the frame depth.', path: ['centroidHeight'] })
  .refine((f) => f.secondMoment <= f.area * f.depth * f.depth, {
    error: 'No section of this area and depth has so large a second moment of area.',
    path: ['secondMoment'],
  });

export const frameSchema = z.discriminatedUnion('shape', [teeFrameSchema, sectionFrameSchema], {
  error: 'Frame shape must be "tee" or "section".',
});
export type Frame = z.infer<typeof frameSchema>;

/** A cylinder stiffened by equally spaced ring frames between bulkheads. */
export const ringStiffenedCylinderSchema = strict('Ring-stiffened cylinder', {
  type: z.literal('ring-stiffened-cylinder'),
  innerRadius: size('Inner radius'),
  thickness: size('Shell thickness'),
  frameSpacing: size('Frame spacing'),
  frame: frameSchema,
  framePosition: z.enum(['internal', 'external'], { error: 'Frame position must be "internal" or "external".' }),
  /** Between bulkheads (or deep frames): the length of the overall mode. */
  length: size('Length between bulkheads'),
  outOfRoundness: outOfRoundness(),
})
  .superRefine((c, ctx) => {
    const depth = c.frame.shape === 'tee' ? c.frame.webHeight + c.frame.flangeThickness : c.frame.depth;
    const width = c.frame.shape === 'tee' ? Math.max(c.frame.webThickness, c.frame.flangeWidth) : c.frame.contactWidth;
    if (width >= c.frameSpacing) ctx.addIssue({ code: 'custom', path: ['frame', c.frame.shape === 'tee' ? 'flangeWidth' : 'contactWidth'], message: 'The frame is as wide as the bay: frames larger than the frame spacing cannot be.' });
    if (c.frameSpacing > c.length) ctx.addIssue({ code: 'custom', path: ['frameSpacing'], message: 'Frame spacing must not exceed the length between bulkheads.' });
    if (c.framePosition === 'internal' && depth >= 0.8 * c.innerRadius) ctx.addIssue({ code: 'custom', path: ['frame'], message: 'An internal frame this deep would fill the hull (depth at most 0.8 × the inner radius).' });
  });

export const COMPONENT_TYPES = ['flat-disc', 'conical-frustum', 'spherical-sector', 'sphere', 'cylinder', 'ring-stiffened-cylinder'] as const;
export type ComponentType = (typeof COMPONENT_TYPES)[number];

export const componentSchema = z.discriminatedUnion('type', [flatDiscSchema, conicalFrustumSchema, sphericalSectorSchema, sphereSchema, cylinderSchema, ringStiffenedCylinderSchema], {
  error: (iss) =>
    iss.input === undefined
      ? 'Component is required.'
      : `Component type must be one of ${COMPONENT_TYPES.map((t) => `"${t}"`).join(', ')}.`,
});
export type Component = z.infer<typeof componentSchema>;
export type FlatDisc = z.infer<typeof flatDiscSchema>;
export type ConicalFrustum = z.infer<typeof conicalFrustumSchema>;
export type SphericalSector = z.infer<typeof sphericalSectorSchema>;
export type Sphere = z.infer<typeof sphereSchema>;
export type Cylinder = z.infer<typeof cylinderSchema>;
export type RingStiffenedCylinder = z.infer<typeof ringStiffenedCylinderSchema>;

/** Common practice for the proof (hydrostatic test) factor is 1.25–1.5 × design pressure. */
export const DEFAULT_PROOF_FACTOR = 1.25;

export const loadCaseSchema = strict('Load case', {
  pressure: pressureInputSchema,
  temperature: temperatureRangeSchema,
  sustainedHours: num('Sustained-load hours', { min: 0, max: 1e6, unit: 'h' }),
  cycles: num('Pressure cycles', { min: 0, max: 1e9, int: true }),
  targetSafetyFactor: num('Target safety factor', { gt: 0, max: 100 }).optional(),
  proofFactor: num('Proof factor', { min: 1, max: 3 }).default(DEFAULT_PROOF_FACTOR),
  /** For human occupancy: window candidates no window rule covers carry a warning and rank below covered ones. */
  humanOccupancy: z.boolean({ error: 'Human occupancy must be true or false.' }).optional(),
  component: componentSchema,
});
/** A validated load case (defaults applied). */
export type LoadCase = z.output<typeof loadCaseSchema>;
/** A load case as sent (proofFactor may be absent). The engine accepts this. */
export type LoadCaseInput = z.input<typeof loadCaseSchema>;

// ---------------------------------------------------------------------------------------------
// Candidates
// ---------------------------------------------------------------------------------------------

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

// ---------------------------------------------------------------------------------------------
// Request
// ---------------------------------------------------------------------------------------------

export const SORT_KEYS = ['margin', 'requiredThickness', 'massPerArea', 'weightToDisplacement'] as const;
export const sortBySchema = z.enum(SORT_KEYS, {
  error: `Sort must be one of ${SORT_KEYS.map((k) => `"${k}"`).join(', ')}.`,
});
export const MAX_CANDIDATES = 5000;
export const DEFAULT_LIMIT = 100;

/** Narrows the published catalogue when no candidates are given. */
export const evaluateFiltersSchema = strict('Filters', {
  family: familySchema.optional(),
  transparent: z.boolean({ error: 'Transparent must be true or false.' }).optional(),
  /** Only property sets whose service temperature range covers the load case's design range. */
  coversTemperature: z.boolean({ error: 'Covers temperature must be true or false.' }).optional(),
});

export const evaluateRequestSchema = strict('Request', {
  loadCase: loadCaseSchema,
  /** Omit to evaluate the published catalogue (narrowed by `filters`). */
  candidates: z
    .array(candidateInputSchema, { error: 'Candidates must be a list.' })
    .min(1, { error: 'Candidates, when given, must list at least one candidate; omit the field to evaluate the published catalogue.' })
    .max(MAX_CANDIDATES, { error: `At most ${MAX_CANDIDATES} candidates can be evaluated at once.` })
    .optional(),
  limit: num('Limit', { min: 1, max: MAX_CANDIDATES, int: true }).default(DEFAULT_LIMIT),
  sortBy: sortBySchema.default('margin'),
  /**
   * For a window under human occupancy: rank the candidates a window rule covers above those it
   * does not (default). False ranks them all together, still with their warnings.
   */
  coveredFirst: z.boolean({ error: 'Covered first must be true or false.' }).default(true),
  filters: evaluateFiltersSchema.optional(),
});
export type EvaluateRequest = z.output<typeof evaluateRequestSchema>;
export type EvaluateRequestInput = z.input<typeof evaluateRequestSchema>;

// ---------------------------------------------------------------------------------------------
// GET /api/pressure query (strings from the URL)
// ---------------------------------------------------------------------------------------------

const queryNumber = (label: string, min: number, max: number, unit: string) =>
  z
    .string({ error: (iss) => (iss.input === undefined ? `${label} is required.` : `${label} must be a number.`) })
    .trim()
    .min(1, { error: `${label} is required.` })
    .transform(Number)
    .pipe(num(label, { min, max, unit }));

/** Query of `GET /api/pressure?depth=&latitude=&water=`; depth may be 0 here (the surface). */
export const pressureQuerySchema = strict('Query', {
  depth: queryNumber('Depth', 0, MAX_DEPTH_M, 'm'),
  latitude: queryNumber('Latitude', -90, 90, '°'),
  water: waterSchema,
});
export type PressureQuery = z.output<typeof pressureQuerySchema>;
