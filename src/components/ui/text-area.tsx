import { forwardRef, type ReactNode, type TextareaHTMLAttributes } from 'react';
import { FieldShell } from './field';

type TextAreaProps = TextareaHTMLAttributes<HTMLTextAreaElement> & { label: ReactNode; error?: string; hint?: ReactNode; wrapperClassName?: string };

/** A multi-line text field with its label, hint and own error, like TextField. */
export const TextAreaField = forwardRef<HTMLTextAreaElement, TextAreaProps>(function TextAreaField(
  { label, error, hint, wrapperClassName, rows = 3, ...props },
  ref,
) {
  return (
    <FieldShell label={label} error={error} hint={hint} className={wrapperClassName}>
      {({ id, describedBy }) => (
        <textarea
          ref={ref}
          id={id}
          rows={rows}
          aria-invalid={!!error}
          aria-describedby={describedBy}
          className={`w-full rounded-plate border bg-white px-2 py-1.5 text-sm text-ink ${error ? 'border-verdict-fail' : 'border-chart-line'} focus:border-sounding`}
          {...props}
        />
      )}
    </FieldShell>
  );
});
