import {
  evaluateRequestSchema,
  type ComponentType,
  type EvaluateRequest,
  type EvaluateRequestInput,
} from '@shared/schemas/evaluate';
import { FAMILIES, FAMILY_LABELS, type Family } from '@shared/schemas/catalogue';
import { DEFAULT_TARGET_SAFETY_FACTORS } from '@shared/engine/defaults';
import { checkedFormSchema } from '@/lib/form-schema';
import { PRESSURE_UNITS, roundForInput, unitOf, type PressureUnit, type QuantityKind, type UnitSystem } from '@/lib/units';

/**
 * The Evaluate form holds numbers in the units shown on screen; the request is built in SI and
 * validated by the shared schema, whose field errors are mapped back onto these fields.
 */
export interface LoadCaseForm {
  pressureMode: 'depth' | 'pressure';
  depth: number;
  latitude: number;
  water: 'sea' | 'fresh';
  pressureValue: number;
  /** The unit the design pressure is typed in (MPa, bar or psi, gauge), whatever the system. */
  pressureUnit: PressureUnit;
  tmin: number;
  tmax: number;
  sustainedHours: number;
  cycles: number;
  useFamilyTargets: boolean;
  /** Each family's target while useFamilyTargets: the common-practice default unless changed. */
  familyTargets: Record<Family, number>;
  targetSafetyFactor: number;
  proofFactor: number;
  componentType: ComponentType;
  diameter: number;
  minorDiameter: number;
  includedAngle: number;
  innerRadius: number;
  length: number;
  thickness: number;
  /** Cones: outer diameter of the seat's bearing annulus; NaN (left empty) = not given. */
  seatOuterDiameter: number;
  /** Spheres. */
  fabrication: 'fabricated' | 'machined';
  /** Measured local radius ÷ nominal; NaN = not measured. */
  localRadiusRatio: number;
  /** Cylinders (measured, fraction; NaN = none) and ring-stiffened cylinders (NaN = the 0.5 % default). */
  outOfRoundness: number;
  /** Ring-stiffened cylinders. */
  frameSpacing: number;
  framePosition: 'internal' | 'external';
  frameShape: 'tee' | 'section';
  webHeight: number;
  webThickness: number;
  flangeWidth: number;
  flangeThickness: number;
  frameArea: number;
  frameSecondMoment: number;
  frameDepth: number;
  frameCentroidHeight: number;
  frameContactWidth: number;
  edge: 'simply-supported' | 'clamped';
  humanOccupancy: boolean;
  coveredFirst: boolean;
  family: Family | '';
  transparent: '' | 'true' | 'false';
  coversTemperature: boolean;
  confirmedOnly: boolean;
  excludeDemo: boolean;
}

export type NumericField = {
  [K in keyof LoadCaseForm]: LoadCaseForm[K] extends number ? K : never;
}[keyof LoadCaseForm];

/** Unit of each numeric field (null: dimensionless or already in its only unit). */
export const FIELD_KIND: Record<NumericField, QuantityKind | null> = {
  depth: 'depth',
  latitude: null,
  pressureValue: 'pressure',
  tmin: 'temperature',
  tmax: 'temperature',
  sustainedHours: null,
  cycles: null,
  targetSafetyFactor: null,
  proofFactor: null,
  diameter: 'length',
  minorDiameter: 'length',
  includedAngle: null,
  innerRadius: 'length',
  length: 'length',
  thickness: 'length',
  seatOuterDiameter: 'length',
  localRadiusRatio: null,
  outOfRoundness: 'fraction',
  frameSpacing: 'length',
  webHeight: 'length',
  webThickness: 'length',
  flangeWidth: 'length',
  flangeThickness: 'length',
  frameArea: 'area',
  frameSecondMoment: 'secondMoment',
  frameDepth: 'length',
  frameCentroidHeight: 'length',
  frameContactWidth: 'length',
};

/** Harrow Sound's two-person submersible, rated to 1,200 m: its 90° conical viewport (SI). */
export const DEMO_LOAD_CASE_SI: LoadCaseForm = {
  pressureMode: 'depth',
  depth: 1200,
  latitude: 57,
  water: 'sea',
  pressureValue: 12e6,
  pressureUnit: 'MPa',
  tmin: 2,
  tmax: 25,
  sustainedHours: 1000,
  cycles: 2000,
  useFamilyTargets: true,
  familyTargets: { ...DEFAULT_TARGET_SAFETY_FACTORS },
  targetSafetyFactor: 4,
  proofFactor: 1.25,
  componentType: 'conical-frustum',
  diameter: 0.2,
  minorDiameter: 0.15,
  includedAngle: 90,
  innerRadius: 0.8,
  length: 1.2,
  thickness: 0.1,
  seatOuterDiameter: Number.NaN,
  fabrication: 'fabricated',
  localRadiusRatio: Number.NaN,
  outOfRoundness: Number.NaN,
  // Harrow Sound's hull section: tee frames 100 × 10 mm web, 80 × 15 mm flange every 500 mm
  frameSpacing: 0.5,
  framePosition: 'internal',
  frameShape: 'tee',
  webHeight: 0.1,
  webThickness: 0.01,
  flangeWidth: 0.08,
  flangeThickness: 0.015,
  frameArea: 0.0022,
  frameSecondMoment: 2.8e-6,
  frameDepth: 0.115,
  frameCentroidHeight: 0.08,
  frameContactWidth: 0.01,
  edge: 'simply-supported',
  humanOccupancy: true,
  coveredFirst: true,
  family: '',
  transparent: 'true',
  coversTemperature: true,
  confirmedOnly: false,
  excludeDemo: false,
};

/**
 * The exact SI value behind each converted field, with the rounded number shown for it: a field
 * still showing that number stands for the exact value, so rounding on screen never changes
 * what is evaluated or saved.
 */
export type ExactValues = Partial<Record<NumericField, { shown: number; si: number }>>;

/** The unit definition a field is shown in: the system's, or the chosen pressure unit. */
function unitFor(field: NumericField, kind: QuantityKind, system: UnitSystem, form: LoadCaseForm) {
  return field === 'pressureValue' ? PRESSURE_UNITS[form.pressureUnit] : unitOf(kind, system);
}

/**
 * Converts every numeric field between unit systems (SI form ⇄ display form). Shown values are
 * rounded to meaningful digits (roundForInput); `exact` gives back the SI value of fields left as shown.
 */
export function convertForm(form: LoadCaseForm, from: UnitSystem | 'SI-raw', to: UnitSystem | 'SI-raw', exact: ExactValues = {}): LoadCaseForm {
  const out = { ...form };
  for (const [field, kind] of Object.entries(FIELD_KIND) as [NumericField, QuantityKind | null][]) {
    if (!kind) continue;
    const kept = exact[field];
    const si = from === 'SI-raw' ? form[field] : kept && Object.is(kept.shown, form[field]) ? kept.si : unitFor(field, kind, from, form).toSI(form[field]);
    if (to === 'SI-raw') out[field] = si;
    else {
      const def = unitFor(field, kind, to, form);
      out[field] = roundForInput(def, def.fromSI(si));
    }
  }
  return out;
}

/** What each shown field stands for exactly (see ExactValues). */
export function exactValues(shown: LoadCaseForm, si: LoadCaseForm): ExactValues {
  const exact: ExactValues = {};
  for (const [field, kind] of Object.entries(FIELD_KIND) as [NumericField, QuantityKind | null][]) {
    if (kind && Number.isFinite(si[field])) exact[field] = { shown: shown[field], si: si[field] };
  }
  return exact;
}

/** The pressure typed in another unit: the number converts, the pressure stays the same. */
export function withPressureUnit(shown: LoadCaseForm, unit: PressureUnit, exact: ExactValues = {}): LoadCaseForm {
  if (unit === shown.pressureUnit) return shown;
  const kept = exact.pressureValue;
  const pa = kept && Object.is(kept.shown, shown.pressureValue) ? kept.si : PRESSURE_UNITS[shown.pressureUnit].toSI(shown.pressureValue);
  return { ...shown, pressureUnit: unit, pressureValue: roundForInput(PRESSURE_UNITS[unit], PRESSURE_UNITS[unit].fromSI(pa)) };
}

const optionalOutOfRoundness = (f: LoadCaseForm) => (Number.isNaN(f.outOfRoundness) ? {} : { outOfRoundness: f.outOfRoundness });

/** The families whose target differs from the common-practice default (only those are sent). */
function familyTargetsOf(f: LoadCaseForm): { familyTargets?: Partial<Record<Family, number>> } {
  const changed = FAMILIES.filter((family) => !Object.is(f.familyTargets[family], DEFAULT_TARGET_SAFETY_FACTORS[family]));
  return changed.length ? { familyTargets: Object.fromEntries(changed.map((family) => [family, f.familyTargets[family]])) } : {};
}

/** The request in SI from the form as shown. */
export function toRequest(shown: LoadCaseForm, system: UnitSystem, exact: ExactValues = {}): EvaluateRequestInput {
  const f = convertForm(shown, system, 'SI-raw', exact);
  const component =
    f.componentType === 'flat-disc'
      ? { type: 'flat-disc' as const, diameter: f.diameter, thickness: f.thickness, edge: f.edge }
      : f.componentType === 'conical-frustum'
        ? {
            type: 'conical-frustum' as const,
            minorDiameter: f.minorDiameter,
            thickness: f.thickness,
            includedAngle: f.includedAngle,
            ...(Number.isNaN(f.seatOuterDiameter) ? {} : { seatOuterDiameter: f.seatOuterDiameter }),
          }
        : f.componentType === 'spherical-sector'
          ? { type: 'spherical-sector' as const, innerRadius: f.innerRadius, thickness: f.thickness, includedAngle: f.includedAngle }
        : f.componentType === 'sphere'
          ? {
              type: 'sphere' as const,
              innerRadius: f.innerRadius,
              thickness: f.thickness,
              fabrication: f.fabrication,
              ...(Number.isNaN(f.localRadiusRatio) ? {} : { localRadiusRatio: f.localRadiusRatio }),
            }
          : f.componentType === 'cylinder'
            ? { type: 'cylinder' as const, innerRadius: f.innerRadius, thickness: f.thickness, length: f.length, ...optionalOutOfRoundness(f) }
            : {
                type: 'ring-stiffened-cylinder' as const,
                innerRadius: f.innerRadius,
                thickness: f.thickness,
                frameSpacing: f.frameSpacing,
                framePosition: f.framePosition,
                frame:
                  f.frameShape === 'tee'
                    ? { shape: 'tee' as const, webHeight: f.webHeight, webThickness: f.webThickness, flangeWidth: f.flangeWidth, flangeThickness: f.flangeThickness }
                    : { shape: 'section' as const, area: f.frameArea, secondMoment: f.frameSecondMoment, depth: f.frameDepth, centroidHeight: f.frameCentroidHeight, contactWidth: f.frameContactWidth },
                length: f.length,
                ...optionalOutOfRoundness(f),
              };
  return {
    loadCase: {
      pressure: f.pressureMode === 'depth' ? { depth: f.depth, latitude: f.latitude, water: f.water } : { value: f.pressureValue },
      temperature: { min: f.tmin, max: f.tmax },
      sustainedHours: f.sustainedHours,
      cycles: f.cycles,
      ...(f.useFamilyTargets ? familyTargetsOf(f) : { targetSafetyFactor: f.targetSafetyFactor }),
      proofFactor: f.proofFactor,
      ...(f.humanOccupancy ? { humanOccupancy: true } : {}),
      component,
    },
    ...(f.humanOccupancy && !f.coveredFirst ? { coveredFirst: false } : {}),
    filters: {
      ...(f.family ? { family: f.family } : {}),
      ...(f.transparent ? { transparent: f.transparent === 'true' } : {}),
      ...(f.coversTemperature ? { coversTemperature: true } : {}),
      ...(f.confirmedOnly ? { confirmedOnly: true } : {}),
      ...(f.excludeDemo ? { excludeDemo: true } : {}),
    },
  };
}

/** Request error path → form field. */
const PATHS: Record<string, keyof LoadCaseForm> = {
  'loadCase.pressure': 'depth',
  'loadCase.pressure.depth': 'depth',
  'loadCase.pressure.latitude': 'latitude',
  'loadCase.pressure.water': 'water',
  'loadCase.pressure.value': 'pressureValue',
  'loadCase.temperature.min': 'tmin',
  'loadCase.temperature.max': 'tmax',
  'loadCase.sustainedHours': 'sustainedHours',
  'loadCase.cycles': 'cycles',
  'loadCase.targetSafetyFactor': 'targetSafetyFactor',
  'loadCase.proofFactor': 'proofFactor',
  'loadCase.component.diameter': 'diameter',
  'loadCase.component.minorDiameter': 'minorDiameter',
  'loadCase.component.includedAngle': 'includedAngle',
  'loadCase.component.innerRadius': 'innerRadius',
  'loadCase.component.length': 'length',
  'loadCase.component.thickness': 'thickness',
  'loadCase.component.edge': 'edge',
  'loadCase.component.seatOuterDiameter': 'seatOuterDiameter',
  'loadCase.component.fabrication': 'fabrication',
  'loadCase.component.localRadiusRatio': 'localRadiusRatio',
  'loadCase.component.outOfRoundness': 'outOfRoundness',
  'loadCase.component.frameSpacing': 'frameSpacing',
  'loadCase.component.framePosition': 'framePosition',
  'loadCase.component.frame': 'webHeight',
  'loadCase.component.frame.webHeight': 'webHeight',
  'loadCase.component.frame.webThickness': 'webThickness',
  'loadCase.component.frame.flangeWidth': 'flangeWidth',
  'loadCase.component.frame.flangeThickness': 'flangeThickness',
  'loadCase.component.frame.area': 'frameArea',
  'loadCase.component.frame.secondMoment': 'frameSecondMoment',
  'loadCase.component.frame.depth': 'frameDepth',
  'loadCase.component.frame.centroidHeight': 'frameCentroidHeight',
  'loadCase.component.frame.contactWidth': 'frameContactWidth',
  'loadCase.humanOccupancy': 'humanOccupancy',
  'loadCase.component': 'componentType',
  'loadCase.component.type': 'componentType',
};

export function formFieldFor(path: string, mode: LoadCaseForm['pressureMode']): keyof LoadCaseForm | 'root' {
  if (path === 'loadCase.pressure') return mode === 'depth' ? 'depth' : 'pressureValue';
  if (path.startsWith('loadCase.familyTargets')) return 'familyTargets';
  return PATHS[path] ?? 'root';
}

export type FormCheck =
  | { ok: true; request: EvaluateRequest }
  | { ok: false; errors: Partial<Record<keyof LoadCaseForm | 'root', string>> };

/** Validates the form through the shared request schema. */
export function checkForm(shown: LoadCaseForm, system: UnitSystem, exact: ExactValues = {}): FormCheck {
  const parsed = evaluateRequestSchema.safeParse(toRequest(shown, system, exact));
  if (parsed.success) return { ok: true, request: parsed.data };
  const errors: Partial<Record<keyof LoadCaseForm | 'root', string>> = {};
  for (const issue of parsed.error.issues) {
    const field = formFieldFor(issue.path.map(String).join('.'), shown.pressureMode);
    errors[field] ??= field === 'familyTargets' ? `${FAMILY_LABELS[issue.path[2] as Family] ?? 'A family'}: ${issue.message}` : issue.message;
  }
  return { ok: false, errors };
}

/** The form's zod schema for zodResolver: the typed form in, the checked request in SI out. */
export const loadCaseFormSchema = (system: () => UnitSystem, exact: () => ExactValues = () => ({})) =>
  checkedFormSchema((shown: LoadCaseForm) => {
    const check = checkForm(shown, system(), exact());
    return check.ok ? { ok: true, value: check.request } : check;
  });

// ---- Saved load cases ------------------------------------------------------------------------
