import { useEffect, useMemo, useRef } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { FAMILIES, FAMILY_LABELS } from '@shared/schemas/catalogue';
import { COMPONENT_TYPES, type EvaluateRequest } from '@shared/schemas/evaluate';
import { COMPONENT_LABELS, WINDOW_COMPONENTS } from '@shared/labels';
import { pressureFromDepth, DEFAULT_TARGET_SAFETY_FACTORS } from '@shared/engine';
import { SelectField, TextField, LabelledOptions } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { FormError } from '@/components/ui/form-error';
import { useUnits } from '@/lib/unit-system';
import { fromDisplay } from '@/lib/units';
import { convertForm, loadCaseFormSchema, type LoadCaseForm } from '../form-model';
import { ComponentSketch } from './component-sketch';

function Fieldset({ legend, children }: { legend: string; children: React.ReactNode }) {
  return (
    <fieldset className="flex flex-col gap-3 border-t border-chart-line pt-3">
      <legend className="pr-2 text-xs font-bold uppercase tracking-wide text-sounding-dark">{legend}</legend>
      {children}
    </fieldset>
  );
}

export function LoadCaseFormPanel({
  initial,
  onSubmit,
  onSave,
  busy,
}: {
  /** Initial values in SI. */
  initial: LoadCaseForm;
  onSubmit: (request: EvaluateRequest, shownSI: LoadCaseForm) => void;
  /** When given, a "Save to a project" action hands over the checked form (as for onSubmit). */
  onSave?: (request: EvaluateRequest, shownSI: LoadCaseForm) => void;
  busy: boolean;
}) {
  const { system, label, format } = useUnits();
  const systemRef = useRef(system);
  // The schema reads the units of the moment: the form converts what is typed when they switch.
  const resolver = useMemo(() => zodResolver(loadCaseFormSchema(() => systemRef.current)), []);
  const form = useForm<LoadCaseForm, unknown, EvaluateRequest>({ resolver, defaultValues: convertForm(initial, 'SI-raw', system), mode: 'onSubmit', reValidateMode: 'onChange' });
  const { register, handleSubmit, watch, formState, reset, getValues } = form;
  const errors = formState.errors;

  // Switching units converts what is typed, so the load case stays the same.
  useEffect(() => {
    if (systemRef.current !== system) {
      reset(convertForm(getValues(), systemRef.current, system));
      systemRef.current = system;
    }
  }, [system, reset, getValues]);

  const v = watch();
  const num = { valueAsNumber: true } as const;
  const err = (k: keyof LoadCaseForm) => errors[k]?.message as string | undefined;

  // Live design pressure from depth, by the same engine the server uses.
  let pressureReadout = '';
  if (v.pressureMode === 'depth' && Number.isFinite(v.depth) && Number.isFinite(v.latitude) && v.depth > 0 && Math.abs(v.latitude) <= 90) {
    const depthM = fromDisplay('depth', system, v.depth);
    if (depthM <= 12_000) pressureReadout = `≈ ${format('pressure', pressureFromDepth(depthM, v.latitude, v.water).pressure)} gauge`;
  }

  const submit = handleSubmit((request) => onSubmit(request, convertForm(getValues(), system, 'SI-raw')));
  // Saving checks the form the same way, so what is saved is what would be evaluated.
  const save = handleSubmit((request) => onSave?.(request, convertForm(getValues(), system, 'SI-raw')));

  const len = label('length');
  const sketchLabels = {
    diameter: `${v.diameter} ${len}`,
    minorDiameter: `${v.minorDiameter} ${len}`,
    thickness: `${v.thickness} ${len}`,
    includedAngle: `${v.includedAngle}°`,
    innerRadius: `${v.innerRadius} ${len}`,
    length: `${v.length} ${len}`,
    frameSpacing: `${v.frameSpacing} ${len}`,
  };
  const isWindow = WINDOW_COMPONENTS.includes(v.componentType);

  return (
    <form onSubmit={submit} noValidate aria-label="Load case" className="flex flex-col gap-4">
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
          <TextField label="Design pressure" unit={label('pressure')} inputMode="decimal" error={err('pressureValue')} {...register('pressureValue', num)} />
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
          <span>
            Each family's default safety factor <span className="text-ink-faint">(common practice: acrylic {DEFAULT_TARGET_SAFETY_FACTORS.acrylic}, glass {DEFAULT_TARGET_SAFETY_FACTORS.glass}, titanium {DEFAULT_TARGET_SAFETY_FACTORS['titanium-alloy']} …)</span>
          </span>
        </label>
        <div className="grid grid-cols-2 gap-2">
          {!v.useFamilyTargets ? (
            <TextField label="Target safety factor" inputMode="decimal" error={err('targetSafetyFactor')} {...register('targetSafetyFactor', num)} />
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
                {...register('seatOuterDiameter', num)}
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
              <TextField label="Local radius ÷ R" inputMode="decimal" error={err('localRadiusRatio')} hint="Measured over an arc of 2.2√(R·t); empty: not measured" {...register('localRadiusRatio', num)} />
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
              {...register('outOfRoundness', num)}
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
      <Button type="submit" disabled={busy}>
        {busy ? 'Evaluating…' : 'Evaluate candidates'}
      </Button>
      {onSave ? (
        <Button tone="quiet" onClick={() => void save()}>
          Save to a project…
        </Button>
      ) : null}
    </form>
  );
}
