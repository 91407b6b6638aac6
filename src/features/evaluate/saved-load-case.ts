/**
 * A saved load case and the Evaluate form: the form a saved case opens as, the request it stands
 * for, and whether two requests or load cases ask the same (unit round trips allowed for).
 */
import { DEFAULT_PROOF_FACTOR, evaluateRequestSchema, type EvaluateRequest, type EvaluateRequestInput, type LoadCaseInput } from '@shared/schemas/evaluate';
import { DEFAULT_TARGET_SAFETY_FACTORS } from '@shared/engine/defaults';
import { checkForm, convertForm, DEMO_LOAD_CASE_SI, type LoadCaseForm } from './form-model';

type SavedFilters = EvaluateRequestInput['filters'] | null | undefined;

/**
 * The form (in SI, like DEMO_LOAD_CASE_SI) for a load case saved in a project. Fields the saved
 * case does not use (another geometry's sizes) keep the demo values, so switching stays sensible.
 */
export function formFromLoadCase(lc: LoadCaseInput, filters?: SavedFilters): LoadCaseForm {
  const p = lc.pressure;
  const pressure: Partial<LoadCaseForm> =
    'value' in p ? { pressureMode: 'pressure', pressureValue: p.value } : { pressureMode: 'depth', depth: p.depth, latitude: p.latitude, water: p.water };
  const c = lc.component;
  const geometry: Partial<LoadCaseForm> =
    c.type === 'flat-disc'
      ? { diameter: c.diameter, edge: c.edge }
      : c.type === 'conical-frustum'
        ? { minorDiameter: c.minorDiameter, includedAngle: c.includedAngle, seatOuterDiameter: c.seatOuterDiameter ?? Number.NaN }
        : c.type === 'spherical-sector'
          ? { innerRadius: c.innerRadius, includedAngle: c.includedAngle }
        : c.type === 'sphere'
          ? { innerRadius: c.innerRadius, fabrication: c.fabrication ?? 'fabricated', localRadiusRatio: c.localRadiusRatio ?? Number.NaN }
          : c.type === 'cylinder'
            ? { innerRadius: c.innerRadius, length: c.length, outOfRoundness: c.outOfRoundness ?? Number.NaN }
            : {
                innerRadius: c.innerRadius,
                length: c.length,
                outOfRoundness: c.outOfRoundness ?? Number.NaN,
                frameSpacing: c.frameSpacing,
                framePosition: c.framePosition,
                frameShape: c.frame.shape,
                ...(c.frame.shape === 'tee'
                  ? { webHeight: c.frame.webHeight, webThickness: c.frame.webThickness, flangeWidth: c.frame.flangeWidth, flangeThickness: c.frame.flangeThickness }
                  : {
                      frameArea: c.frame.area,
                      frameSecondMoment: c.frame.secondMoment,
                      frameDepth: c.frame.depth,
                      frameCentroidHeight: c.frame.centroidHeight,
                      frameContactWidth: c.frame.contactWidth,
                    }),
              };
  return {
    ...DEMO_LOAD_CASE_SI,
    ...pressure,
    tmin: lc.temperature.min,
    tmax: lc.temperature.max,
    sustainedHours: lc.sustainedHours,
    cycles: lc.cycles,
    useFamilyTargets: lc.targetSafetyFactor === undefined,
    familyTargets: { ...DEFAULT_TARGET_SAFETY_FACTORS, ...(lc.familyTargets ?? {}) },
    targetSafetyFactor: lc.targetSafetyFactor ?? DEMO_LOAD_CASE_SI.targetSafetyFactor,
    proofFactor: lc.proofFactor ?? DEFAULT_PROOF_FACTOR,
    componentType: c.type,
    thickness: c.thickness,
    humanOccupancy: lc.humanOccupancy === true,
    ...geometry,
    family: filters?.family ?? '',
    transparent: filters?.transparent === undefined ? '' : filters.transparent ? 'true' : 'false',
    coversTemperature: filters?.coversTemperature === true,
    confirmedOnly: filters?.confirmedOnly === true,
    excludeDemo: filters?.excludeDemo === true,
  };
}

/** The evaluation request for a saved load case, exactly as saved (SI). */
export function requestFromLoadCase(lc: LoadCaseInput, filters?: SavedFilters): EvaluateRequest {
  return evaluateRequestSchema.parse({ loadCase: lc, ...(filters ? { filters } : {}) });
}

// Fields left as shown keep their exact SI value (ExactValues); the tolerance covers the float
// round trips of conversions.
const RELATIVE_TOLERANCE = 1e-5;

function nearlyEqual(a: unknown, b: unknown): boolean {
  if (typeof a === 'number' && typeof b === 'number') {
    return a === b || Math.abs(a - b) <= RELATIVE_TOLERANCE * Math.max(Math.abs(a), Math.abs(b));
  }
  if (a && b && typeof a === 'object' && typeof b === 'object') {
    const ka = Object.keys(a).filter((k) => (a as Record<string, unknown>)[k] !== undefined);
    const kb = Object.keys(b).filter((k) => (b as Record<string, unknown>)[k] !== undefined);
    if (ka.length !== kb.length) return false;
    return ka.every((k) => nearlyEqual((a as Record<string, unknown>)[k], (b as Record<string, unknown>)[k]));
  }
  return a === b;
}

/** True when the form, checked, asks for what was evaluated (the rank order aside). */
export function sameRequest(a: EvaluateRequest, b: EvaluateRequest): boolean {
  const strip = ({ sortBy: _sortBy, limit: _limit, ...rest }: EvaluateRequest) => rest;
  return nearlyEqual(strip(a), strip(b));
}

/** True when two load cases describe the same design case (unit round trips allowed for). */
export function sameLoadCase(a: LoadCaseInput, b: LoadCaseInput): boolean {
  const norm = (lc: LoadCaseInput) => ({ ...lc, proofFactor: lc.proofFactor ?? DEFAULT_PROOF_FACTOR });
  return nearlyEqual(norm(a), norm(b));
}

/** The request for the example load case the page opens with (SI). */
export function exampleRequest(): EvaluateRequest {
  const check = checkForm(convertForm(DEMO_LOAD_CASE_SI, 'SI-raw', 'SI'), 'SI');
  if (!check.ok) throw new Error('The example load case does not validate');
  return check.request;
}
