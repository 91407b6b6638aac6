/**
 * The components a load case sizes: windows (flat disc, conical frustum, spherical sector) and
 * hull shells (sphere, cylinder between stiffeners, ring-stiffened cylinder). All sizes in m.
 */
import { z } from 'zod';
import { num, strict } from './fields';

/** Largest size accepted for any length (m). */
export const MAX_SIZE_M = 100;
/** Smallest size accepted for any length (m): keeps every result finite. */
export const MIN_SIZE_M = 1e-6;

const size = (label: string) => num(label, { min: MIN_SIZE_M, max: MAX_SIZE_M, unit: 'm' });

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
