import type { ButtonHTMLAttributes, ReactNode } from 'react';

type Tone = 'primary' | 'quiet' | 'danger';
const TONES: Record<Tone, string> = {
  primary: 'bg-sounding text-white hover:bg-sounding-dark disabled:bg-ink-faint',
  quiet: 'bg-chart-raised text-ink border border-chart-line hover:bg-chart-deep disabled:text-ink-faint',
  danger: 'bg-verdict-fail text-white hover:brightness-95 disabled:bg-ink-faint',
};

type ButtonProps = ButtonHTMLAttributes<HTMLButtonElement> & { tone?: Tone };

export function Button({ tone = 'primary', className = '', type = 'button', ...props }: ButtonProps) {
  return (
    <button
      type={type}
      className={`inline-flex items-center justify-center gap-2 rounded-plate px-3 py-1.5 text-sm font-bold transition-colors disabled:cursor-not-allowed ${TONES[tone]} ${className}`}
      {...props}
    />
  );
}

/** A form's submit button: while `busy` it is disabled and says what it is doing (`busyLabel`). */
export function SubmitButton({ busy, busyLabel, disabled = false, children, ...props }: Omit<ButtonProps, 'type'> & { busy: boolean; busyLabel: string; children: ReactNode }) {
  return (
    <Button type="submit" disabled={busy || disabled} {...props}>
      {busy ? busyLabel : children}
    </Button>
  );
}
