import type { UseFormRegister } from 'react-hook-form';
import { FAMILIES, FAMILY_LABELS } from '@shared/schemas/catalogue';
import { DEFAULT_TARGET_SAFETY_FACTORS } from '@shared/engine/defaults';
import { FormError } from '@/components/ui/form-error';
import type { LoadCaseForm } from '../form-model';

/** A target safety factor per family, each beside its common-practice default (changed ones stand out). */
export function FamilyTargetsFields({ register, values: v, error }: { register: UseFormRegister<LoadCaseForm>; values: LoadCaseForm; error?: string }) {
  const num = { valueAsNumber: true } as const;
  return (
    <div data-testid="family-targets">
      <p className="mb-1 text-xs text-ink-faint">Common-practice defaults, shown beside each; change any for this load case.</p>
      <div className="grid grid-cols-2 gap-x-2 gap-y-1">
        {FAMILIES.map((family) => (
          <label key={family} className="flex items-center justify-between gap-1 text-xs">
            <span className="min-w-0 truncate" title={FAMILY_LABELS[family]}>
              {FAMILY_LABELS[family]}
            </span>
            <span className="flex items-center gap-1">
              <input
                inputMode="decimal"
                aria-label={`Target safety factor for ${FAMILY_LABELS[family]}`}
                className={`w-12 rounded-plate border bg-white px-1 py-0.5 text-right text-xs ${Object.is(v.familyTargets?.[family], DEFAULT_TARGET_SAFETY_FACTORS[family]) ? 'border-chart-line' : 'border-brass font-bold'}`}
                {...register(`familyTargets.${family}`, num)}
              />
              <span className="w-7 text-ink-faint" title="Common practice">
                {DEFAULT_TARGET_SAFETY_FACTORS[family]}
              </span>
            </span>
          </label>
        ))}
      </div>
      <FormError message={error} />
    </div>
  );
}
