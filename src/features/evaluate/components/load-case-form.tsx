import { useEffect, useMemo, useRef, useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { FAMILIES, FAMILY_LABELS } from '@shared/schemas/catalogue';
import { COMPONENT_TYPES, type EvaluateRequest } from '@shared/schemas/evaluate';
import { COMPONENT_LABELS, WINDOW_COMPONENTS } from '@shared/labels';
import { pressureFromDepth } from '@shared/engine';
import { SelectField, TextField, LabelledOptions } from '@/components/ui/field';
import { Button, SubmitButton } from '@/components/ui/button';
import { FormError } from '@/components/ui/form-error';
import { useUnits } from '@/lib/unit-system';
import { defaultPressureUnit, formatPressureAll, fromDisplay, PRESSURE_UNITS, roundForInput, toDisplay, unitOf, type PressureUnit } from '@/lib/units';
import { checkForm, convertForm, exactValues, loadCaseFormSchema, withPressureUnit, type ExactValues, type LoadCaseForm } from '../form-model';
import { ComponentSketch } from './component-sketch';
import { FamilyTargetsFields } from './family-targets';

function Fieldset({ legend, children }: { legend: string; children: React.ReactNode }) {
  return (
    <fieldset className="flex flex-col gap-3 border-t border-chart-line pt-3">
      <legend className="pr-2 text-xs font-bold uppercase tracking-wide text-sounding-dark">{legend}</legend>
      {children}
    </fieldset>
  );
}

/** A point chosen elsewhere (the mode map) to load into the form, in SI; `key` makes each choice new. */
export interface FormPoint {
  key: number;
  thickness?: number;
  includedAngle?: number;
  depth?: number;
  pressure?: number;
}

/** Fields the sketch labels, and their kind (null: degrees). */
const SKETCH_FIELDS = {
  diameter: 'length',
  minorDiameter: 'length',
  thickness: 'length',
  includedAngle: null,
  innerRadius: 'length',
  length: 'length',
  frameSpacing: 'length',
} as const;

const HULLS: readonly LoadCaseForm['componentType'][] = ['sphere', 'cylinder', 'ring-stiffened-cylinder'];

export function LoadCaseFormPanel({
  initial,
  onSubmit,
  onSave,
  onDraft,
  point,
  busy,
}: {
  /** Initial values in SI. */
  initial: LoadCaseForm;
  onSubmit: (request: EvaluateRequest, shownSI: LoadCaseForm) => void;
  /** When given, a "Save to a project" action hands over the checked form (as for onSubmit). */
  onSave?: (request: EvaluateRequest, shownSI: LoadCaseForm) => void;
  /** Told on every change what the form now asks for: the checked request, or null while it does not check. */
  onDraft?: (request: EvaluateRequest | null) => void;
  /** A point to load into the form (its thickness, angle, depth or pressure). */
  point?: FormPoint | null;
  busy: boolean;
}) {
  const { system, label, format } = useUnits();
  const systemRef = useRef(system);
  const exactRef = useRef<ExactValues>({});
  // The schema reads the units of the moment: the form converts what is typed when they switch.
  const resolver = useMemo(() => zodResolver(loadCaseFormSchema(() => systemRef.current, () => exactRef.current)), []);
  const [defaults] = useState(() => {
    const si = { ...initial, pressureUnit: initial.pressureUnit === 'bar' ? 'bar' : defaultPressureUnit(system) } as LoadCaseForm;
    const shown = convertForm(si, 'SI-raw', system);
    exactRef.current = exactValues(shown, si);
    return shown;
  });
  const form = useForm<LoadCaseForm, unknown, EvaluateRequest>({ resolver, defaultValues: defaults, mode: 'onSubmit', reValidateMode: 'onChange' });
  const { register, handleSubmit, watch, formState, reset, getValues, setValue } = form;
  const errors = formState.errors;

  // Switching units converts what is typed, so the load case stays the same; fields left as shown keep their exact value.
  useEffect(() => {
    if (systemRef.current !== system) {
      const before = getValues();
      const si = convertForm(before, systemRef.current, 'SI-raw', exactRef.current);
      const unit = system === 'US' ? 'psi' : before.pressureUnit === 'psi' ? 'MPa' : before.pressureUnit;
      const shown = convertForm({ ...si, pressureUnit: unit }, 'SI-raw', system);
      exactRef.current = exactValues(shown, { ...si, pressureUnit: unit });
      reset(shown, { keepDefaultValues: true });
      systemRef.current = system;
    }
  }, [system, reset, getValues]);

  // A point chosen on the mode map: its values go into the form in the shown units.
  useEffect(() => {
    if (!point) return;
    const shownLength = (m: number) => roundForInput(unitOf('length', systemRef.current), toDisplay('length', systemRef.current, m));
    const opts = { shouldDirty: true } as const;
    if (point.thickness !== undefined) setValue('thickness', shownLength(point.thickness), opts);
    if (point.includedAngle !== undefined) setValue('includedAngle', Number(point.includedAngle.toFixed(1)), opts);
    if (point.depth !== undefined) {
      setValue('pressureMode', 'depth', opts);
      setValue('depth', roundForInput(unitOf('depth', systemRef.current), toDisplay('depth', systemRef.current, point.depth)), opts);
    }
    if (point.pressure !== undefined) {
      setValue('pressureMode', 'pressure', opts);
      const unit = PRESSURE_UNITS[getValues('pressureUnit')];
      setValue('pressureValue', roundForInput(unit, unit.fromSI(point.pressure)), opts);
    }
  }, [point, setValue, getValues]);

  const v = watch();
  const num = { valueAsNumber: true } as const;
  const err = (k: keyof LoadCaseForm) => errors[k]?.message as string | undefined;
  // Optional fields hold NaN while empty: the input shows nothing rather than "NaN".
  const optional = (name: 'seatOuterDiameter' | 'localRadiusRatio' | 'outOfRoundness') => {
    const r = register(name, num);
    return {
      ...r,
      ref: (el: HTMLInputElement | null) => {
        r.ref(el);
        if (el && el.value === 'NaN') el.value = '';
      },
    };
  };

  // What the form asks for now, checked by the same schema as on submit: the page marks the
  // ranking stale when it differs, and the sketch shows only values that check.
  const draft = checkForm(v, system, exactRef.current);
  useEffect(() => {
    onDraft?.(draft.ok ? draft.request : null);
  }, [draft, onDraft]);

  // A hull shell is seldom transparent: the transparency filter follows the component, unless set by hand.
  const componentType = v.componentType;
  const lastType = useRef(componentType);
  useEffect(() => {
    const was = lastType.current;
    lastType.current = componentType;
    if (was === componentType) return;
    const transparent = getValues('transparent');
    if (HULLS.includes(componentType) && !HULLS.includes(was) && transparent === 'true') setValue('transparent', '');
    if (!HULLS.includes(componentType) && HULLS.includes(was) && transparent === '') setValue('transparent', 'true');
  }, [componentType, getValues, setValue]);

  // Live design pressure from depth, by the same engine the server uses.
  let pressureReadout = '';
  if (v.pressureMode === 'depth' && Number.isFinite(v.depth) && Number.isFinite(v.latitude) && v.depth > 0 && Math.abs(v.latitude) <= 90) {
    const depthM = fromDisplay('depth', system, v.depth);
    if (depthM <= 12_000) pressureReadout = `≈ ${formatPressureAll(pressureFromDepth(depthM, v.latitude, v.water).pressure, system === 'US' ? 'psi' : 'MPa')} gauge`;
  }

  const submit = handleSubmit((request) => onSubmit(request, convertForm(getValues(), system, 'SI-raw', exactRef.current)));
  // Saving checks the form the same way, so what is saved is what would be evaluated.
  const save = handleSubmit((request) => onSave?.(request, convertForm(getValues(), system, 'SI-raw', exactRef.current)));

  const len = label('length');
  // Only values that pass the form's check reach the sketch, rounded as the tables round them.
  const sketchLabels = Object.fromEntries(
    (Object.entries(SKETCH_FIELDS) as [keyof typeof SKETCH_FIELDS, 'length' | null][]).map(([field, kind]) => {
      const value = v[field];
      const bad = !Number.isFinite(value) || (!draft.ok && draft.errors[field] !== undefined);
      if (bad) return [field, '—'];
      return [field, kind ? format('length', fromDisplay('length', system, value)) : `${Number(value.toFixed(1))}°`];
    }),
  ) as Record<keyof typeof SKETCH_FIELDS, string>;
  const isWindow = WINDOW_COMPONENTS.includes(v.componentType);

  return (
    <form id="load-case-form" onSubmit={submit} noValidate aria-label="Load case" className="relative flex flex-col gap-4">
      <a
        href="#evaluate-submit"
        className="sr-only focus:not-sr-only focus:rounded-plate focus:bg-white focus:p-2 focus:text-sm focus:font-bold focus:text-sounding"
        onClick={(e) => {
          e.preventDefault();
          document.getElementById('evaluate-submit')?.focus();
        }}
      >
        Skip to “Evaluate candidates”
      </a>
      <Fieldset legend="Load">
        <div role="radiogroup" aria-label="Pressure from" className="flex gap-4 text-sm">
          <label className="flex items-center gap-1.5">
            <input type="radio" value="depth" {...register('pressureMode')} /> Depth
          </label>
          <label className="flex items-center gap-1.5">
            <input type="radio" value="pressure" {...register('pressureMode')} /> Pressure
          </label>
        </div>
        {v.pressureMode === 'depth' ? (
          <div className="grid grid-cols-3 gap-2">
            <TextField label="Design depth" unit={label('depth')} inputMode="decimal" error={err('depth')} {...register('depth', num)} />
            <SelectField label="Water" error={err('water')} {...register('water')}>
              <option value="sea">Seawater</option>
              <option value="fresh">Fresh water</option>
            </SelectField>
            <TextField label="Latitude" unit="°" inputMode="decimal" error={err('latitude')} {...register('latitude', num)} />
          </div>
        ) : (
          <div className="grid grid-cols-[1fr_7rem] gap-2">
            <TextField label="Design pressure" unit={`${v.pressureUnit}, gauge`} inputMode="decimal" error={err('pressureValue')} {...register('pressureValue', num)} />
            <SelectField
              label="Pressure unit"
              value={v.pressureUnit}
              onChange={(e) => {
                const before = getValues();
                const kept = exactRef.current.pressureValue;
                const pa = kept && Object.is(kept.shown, before.pressureValue) ? kept.si : PRESSURE_UNITS[before.pressureUnit].toSI(before.pressureValue);
                const next = withPressureUnit(before, e.target.value as PressureUnit, exactRef.current);
                exactRef.current = { ...exactRef.current, pressureValue: { shown: next.pressureValue, si: pa } };
                setValue('pressureUnit', next.pressureUnit);
                setValue('pressureValue', next.pressureValue);
              }}
            >
              {(Object.keys(PRESSURE_UNITS) as PressureUnit[]).map((u) => (
                <option key={u} value={u}>
                  {u}
                </option>
              ))}
            </SelectField>
          </div>
        )}
        {pressureReadout ? <p className="text-xs text-ink-soft" data-testid="pressure-readout">Design pressure {pressureReadout}</p> : null}
      </Fieldset>

      <Fieldset legend="Service">
        <div className="grid grid-cols-2 gap-2">
          <TextField label="Coldest" unit={label('temperature')} inputMode="decimal" error={err('tmin')} {...register('tmin', num)} />
          <TextField label="Warmest" unit={label('temperature')} inputMode="decimal" error={err('tmax')} {...register('tmax', num)} />
          <TextField label="Sustained load" unit="h" inputMode="decimal" error={err('sustainedHours')} hint="Longest time held at pressure" {...register('sustainedHours', num)} />
          <TextField label="Pressure cycles" inputMode="numeric" error={err('cycles')} hint="Dives over the service life" {...register('cycles', num)} />
        </div>
      </Fieldset>

      <Fieldset legend="Targets">
        <label className="flex items-start gap-2 text-sm">
          <input type="checkbox" className="mt-1" {...register('useFamilyTargets')} />
          <span>Target safety factor by family</span>
        </label>
        {v.useFamilyTargets ? <FamilyTargetsFields register={register} values={v} error={err('familyTargets')} /> : null}
        <div className="grid grid-cols-2 gap-2">
          {!v.useFamilyTargets ? (
            <TextField label="Target safety factor" inputMode="decimal" error={err('targetSafetyFactor')} hint="One target for every candidate" {...register('targetSafetyFactor', num)} />
          ) : null}
          <TextField label="Proof-test factor" inputMode="decimal" error={err('proofFactor')} hint="Common practice 1.25–1.5" {...register('proofFactor', num)} />
        </div>
      </Fieldset>

      <Fieldset legend="Component">
        <SelectField label="Geometry" error={err('componentType')} {...register('componentType')}>
          <LabelledOptions values={COMPONENT_TYPES} labels={COMPONENT_LABELS} />
        </SelectField>
        <ComponentSketch type={v.componentType} labels={sketchLabels} />
        <div className="grid grid-cols-2 gap-2">
          {v.componentType === 'flat-disc' ? (
            <>
              <TextField label="Unsupported diameter" unit={len} inputMode="decimal" error={err('diameter')} {...register('diameter', num)} />
              <SelectField label="Edge" error={err('edge')} {...register('edge')}>
                <option value="simply-supported">Simply supported</option>
                <option value="clamped">Clamped</option>
              </SelectField>
            </>
          ) : null}
          {v.componentType === 'conical-frustum' ? (
            <>
              <TextField label="Minor diameter" unit={len} inputMode="decimal" error={err('minorDiameter')} {...register('minorDiameter', num)} />
              <TextField label="Included angle" unit="°" inputMode="decimal" error={err('includedAngle')} hint="30° to 180°" {...register('includedAngle', num)} />
              <TextField
                label="Seat outer diameter"
                unit={len}
                inputMode="decimal"
                error={err('seatOuterDiameter')}
                hint={`Optional; a 180° (flat) seat without it bears to 1.25 × the minor diameter`}
                {...optional('seatOuterDiameter')}
              />
            </>
          ) : null}
          {v.componentType === 'spherical-sector' ? (
            <>
              <TextField label="Inner spherical radius" unit={len} inputMode="decimal" error={err('innerRadius')} hint="Of the concave (low-pressure) face" {...register('innerRadius', num)} />
              <TextField label="Included angle" unit="°" inputMode="decimal" error={err('includedAngle')} hint="Of the sector and its conical seat, 30° to 180°" {...register('includedAngle', num)} />
            </>
          ) : null}
          {v.componentType === 'sphere' || v.componentType === 'cylinder' || v.componentType === 'ring-stiffened-cylinder' ? (
            <TextField label="Inner radius" unit={len} inputMode="decimal" error={err('innerRadius')} {...register('innerRadius', num)} />
          ) : null}
          {v.componentType === 'sphere' ? (
            <>
              <SelectField label="Fabrication" error={err('fabrication')} hint="How it was made decides its collapse" {...register('fabrication')}>
                <option value="fabricated">Fabricated (welded or formed)</option>
                <option value="machined">Machined, stress-relieved</option>
              </SelectField>
              <TextField label="Local radius ÷ R" inputMode="decimal" error={err('localRadiusRatio')} hint="Measured over an arc of 2.2√(R·t); empty: not measured" {...optional('localRadiusRatio')} />
            </>
          ) : null}
          {v.componentType === 'cylinder' ? (
            <TextField label="Unsupported length" unit={len} inputMode="decimal" error={err('length')} hint="Between stiffeners or bulkheads" {...register('length', num)} />
          ) : null}
          {v.componentType === 'ring-stiffened-cylinder' ? (
            <>
              <TextField label="Length between bulkheads" unit={len} inputMode="decimal" error={err('length')} {...register('length', num)} />
              <TextField label="Frame spacing" unit={len} inputMode="decimal" error={err('frameSpacing')} {...register('frameSpacing', num)} />
              <SelectField label="Frames" error={err('framePosition')} {...register('framePosition')}>
                <option value="internal">Inside the shell</option>
                <option value="external">Outside the shell</option>
              </SelectField>
              <SelectField label="Frame given by" {...register('frameShape')}>
                <option value="tee">Tee dimensions</option>
                <option value="section">Section properties</option>
              </SelectField>
              {v.frameShape === 'tee' ? (
                <>
                  <TextField label="Web height" unit={len} inputMode="decimal" error={err('webHeight')} {...register('webHeight', num)} />
                  <TextField label="Web thickness" unit={len} inputMode="decimal" error={err('webThickness')} {...register('webThickness', num)} />
                  <TextField label="Flange width" unit={len} inputMode="decimal" error={err('flangeWidth')} {...register('flangeWidth', num)} />
                  <TextField label="Flange thickness" unit={len} inputMode="decimal" error={err('flangeThickness')} {...register('flangeThickness', num)} />
                </>
              ) : (
                <>
                  <TextField label="Frame area" unit={label('area')} inputMode="decimal" error={err('frameArea')} {...register('frameArea', num)} />
                  <TextField label="Second moment" unit={label('secondMoment')} inputMode="decimal" error={err('frameSecondMoment')} hint="About the frame's own centroid" {...register('frameSecondMoment', num)} />
                  <TextField label="Frame depth" unit={len} inputMode="decimal" error={err('frameDepth')} hint="Shell surface to outer fibre" {...register('frameDepth', num)} />
                  <TextField label="Centroid height" unit={len} inputMode="decimal" error={err('frameCentroidHeight')} hint="Shell surface to centroid" {...register('frameCentroidHeight', num)} />
                  <TextField label="Contact width" unit={len} inputMode="decimal" error={err('frameContactWidth')} {...register('frameContactWidth', num)} />
                </>
              )}
            </>
          ) : null}
          {v.componentType === 'cylinder' || v.componentType === 'ring-stiffened-cylinder' ? (
            <TextField
              label="Out-of-roundness"
              unit="% of R"
              inputMode="decimal"
              error={err('outOfRoundness')}
              hint={v.componentType === 'cylinder' ? 'Measured oval deviation; empty: none entered' : 'Empty: 0.5 % of R (a common tolerance)'}
              {...optional('outOfRoundness')}
            />
          ) : null}
          <TextField label="Thickness" unit={len} inputMode="decimal" error={err('thickness')} {...register('thickness', num)} />
        </div>
      </Fieldset>

      {isWindow ? (
        <Fieldset legend="Occupancy">
          <label className="flex items-start gap-2 text-sm">
            <input type="checkbox" className="mt-1" {...register('humanOccupancy')} />
            <span>
              For human occupancy <span className="text-ink-faint">(windows no rule covers are warned and ranked below the covered ones)</span>
            </span>
          </label>
          {v.humanOccupancy ? (
            <label className="flex items-center gap-2 text-sm">
              <input type="checkbox" {...register('coveredFirst')} /> Rank covered windows first
            </label>
          ) : null}
        </Fieldset>
      ) : null}

      <Fieldset legend="Candidates from the catalogue">
        <div className="grid grid-cols-2 gap-2">
          <SelectField label="Family" {...register('family')}>
            <option value="">All families</option>
            <LabelledOptions values={FAMILIES} labels={FAMILY_LABELS} />
          </SelectField>
          <SelectField label="Transparency" {...register('transparent')}>
            <option value="">Any</option>
            <option value="true">Transparent</option>
            <option value="false">Opaque</option>
          </SelectField>
        </div>
        <label className="flex items-center gap-2 text-sm">
          <input type="checkbox" {...register('coversTemperature')} /> Service range must cover the design temperatures
        </label>
        <label className="flex items-center gap-2 text-sm">
          <input type="checkbox" {...register('confirmedOnly')} /> Confirmed inputs only (every value the calculation uses checked against its source)
        </label>
        <label className="flex items-center gap-2 text-sm">
          <input type="checkbox" {...register('excludeDemo')} /> Exclude demo data
        </label>
      </Fieldset>

      <FormError message={errors.root?.message} />
      <SubmitButton busy={busy} busyLabel="Evaluating…" id="evaluate-submit">
        Evaluate candidates
      </SubmitButton>
      {onSave ? (
        <Button tone="quiet" onClick={() => void save()}>
          Save to a project…
        </Button>
      ) : null}
    </form>
  );
}
