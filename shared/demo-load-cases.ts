/**
 * The load cases of the Harrow Sound demo (invented): Harrow Sound Marine Works' two-person
 * research submersible rated to 1,200 m, its 4,000 m survey camera housing and its 5 bar treatment
 * chamber. Seeded into the demo projects (server/db/seeders/demo-project.ts); the client's tests
 * read the same cases.
 */
import type { LoadCase } from './schemas/evaluate';

/** The HS-2 submersible's service at 1,200 m, shared by its forward viewport and its crew sphere. */
const SUBMERSIBLE_SERVICE = {
  pressure: { depth: 1200, latitude: 57, water: 'sea' },
  temperature: { min: 2, max: 25 },
  sustainedHours: 1000,
  cycles: 2000,
  proofFactor: 1.25,
} as const satisfies Omit<LoadCase, 'component'>;

/** Forward viewport: a 90° cone, minor diameter 150 mm, 100 mm thick. */
export const DEMO_VIEWPORT = {
  ...SUBMERSIBLE_SERVICE,
  component: { type: 'conical-frustum', minorDiameter: 0.15, thickness: 0.1, includedAngle: 90 },
} as const satisfies LoadCase;

/** Crew sphere: 1.6 m inside diameter, 45 mm thick. */
export const DEMO_HULL = {
  ...SUBMERSIBLE_SERVICE,
  component: { type: 'sphere', innerRadius: 0.8, thickness: 0.045 },
} as const satisfies LoadCase;

/** Survey camera housing at 4,000 m: the tube between its end caps. */
export const DEMO_CAMERA = {
  pressure: { depth: 4000, latitude: 57, water: 'sea' },
  temperature: { min: 1, max: 20 },
  sustainedHours: 200,
  cycles: 500,
  proofFactor: 1.25,
  component: { type: 'cylinder', innerRadius: 0.07, thickness: 0.012, length: 0.35 },
} as const satisfies LoadCase;

/** Treatment chamber TC-5 at 5 bar: a flat side viewport, 250 mm clear. */
export const DEMO_CHAMBER_PORT = {
  pressure: { value: 0.5e6 },
  temperature: { min: 15, max: 40 },
  sustainedHours: 5000,
  cycles: 10000,
  proofFactor: 1.5,
  component: { type: 'flat-disc', diameter: 0.25, thickness: 0.04, edge: 'simply-supported' },
} as const satisfies LoadCase;
