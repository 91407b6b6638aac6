import { forwardRef, useId, type InputHTMLAttributes, type SelectHTMLAttributes } from 'react';

/** Compact inputs for table cells: the label is for assistive tech; the error shows below. */
const cellClass = (error?: string) =>
  `w-full rounded-plate border bg-white px-2 py-1 text-sm text-ink ${error ? 'border-verdict-fail' : 'border-chart-line'} focus:border-sounding`;

function CellError({ id, error }: { id: string; error?: string }) {
  return error ? (
    <p id={id} role="alert" className="mt-0.5 text-xs font-bold text-verdict-fail">
      {error}
    </p>
  ) : null;
}

export const CellInput = forwardRef<HTMLInputElement, InputHTMLAttributes<HTMLInputElement> & { label: string; error?: string }>(function CellInput(
  { label, error, className = '', ...props },
  ref,
) {
  const id = useId();
  return (
    <div className={className}>
      <input ref={ref} aria-label={label} aria-invalid={!!error} aria-describedby={error ? id : undefined} className={cellClass(error)} {...props} />
      <CellError id={id} error={error} />
    </div>
  );
});

export const CellSelect = forwardRef<HTMLSelectElement, SelectHTMLAttributes<HTMLSelectElement> & { label: string; error?: string }>(function CellSelect(
  { label, error, className = '', children, ...props },
  ref,
) {
  const id = useId();
  return (
    <div className={className}>
      <select ref={ref} aria-label={label} aria-invalid={!!error} aria-describedby={error ? id : undefined} className={cellClass(error)} {...props}>
        {children}
      </select>
      <CellError id={id} error={error} />
    </div>
  );
});
