import { useId, type InputHTMLAttributes, type ReactNode, type SelectHTMLAttributes, forwardRef } from 'react';

interface FieldShellProps {
  label: ReactNode;
  error?: string;
  hint?: ReactNode;
  unit?: string;
  children: (ids: { id: string; describedBy?: string }) => ReactNode;
  className?: string;
}

/** Label, control, unit, hint and the field's own error message, wired for screen readers. */
export function FieldShell({ label, error, hint, unit, children, className = '' }: FieldShellProps) {
  const id = useId();
  const errorId = `${id}-error`;
  const hintId = `${id}-hint`;
  const describedBy = [error ? errorId : null, hint ? hintId : null].filter(Boolean).join(' ') || undefined;
  return (
    <div className={`flex flex-col gap-1 ${className}`}>
      <label htmlFor={id} className="text-xs font-bold uppercase tracking-wide text-ink-soft">
        {label}
        {unit ? <span className="ml-1 font-normal normal-case text-ink-faint">({unit})</span> : null}
      </label>
      {children({ id, describedBy })}
      {hint && !error ? (
        <p id={hintId} className="text-xs text-ink-faint">
          {hint}
        </p>
      ) : null}
      {error ? (
        <p id={errorId} role="alert" className="text-xs font-bold text-verdict-fail">
          {error}
        </p>
      ) : null}
    </div>
  );
}

const controlClass = (error?: string) =>
  `w-full rounded-plate border bg-white px-2 py-1.5 text-sm text-ink ${error ? 'border-verdict-fail' : 'border-chart-line'} focus:border-sounding`;

type InputProps = InputHTMLAttributes<HTMLInputElement> & { label: ReactNode; error?: string; hint?: ReactNode; unit?: string; wrapperClassName?: string };

export const TextField = forwardRef<HTMLInputElement, InputProps>(function TextField(
  { label, error, hint, unit, wrapperClassName, ...props },
  ref,
) {
  return (
    <FieldShell label={label} error={error} hint={hint} unit={unit} className={wrapperClassName}>
      {({ id, describedBy }) => (
        <input ref={ref} id={id} aria-invalid={!!error} aria-describedby={describedBy} className={controlClass(error)} {...props} />
      )}
    </FieldShell>
  );
});

type SelectProps = SelectHTMLAttributes<HTMLSelectElement> & { label: ReactNode; error?: string; hint?: ReactNode; wrapperClassName?: string };

export const SelectField = forwardRef<HTMLSelectElement, SelectProps>(function SelectField(
  { label, error, hint, wrapperClassName, children, ...props },
  ref,
) {
  return (
    <FieldShell label={label} error={error} hint={hint} className={wrapperClassName}>
      {({ id, describedBy }) => (
        <select ref={ref} id={id} aria-invalid={!!error} aria-describedby={describedBy} className={controlClass(error)} {...props}>
          {children}
        </select>
      )}
    </FieldShell>
  );
});

/** One option per value, shown by its label (for a SelectField over a shared list). */
export function LabelledOptions<T extends string>({ values, labels }: { values: readonly T[]; labels: Record<T, string> }) {
  return (
    <>
      {values.map((v) => (
        <option key={v} value={v}>
          {labels[v]}
        </option>
      ))}
    </>
  );
}
