import type { ButtonHTMLAttributes } from 'react';

type Tone = 'primary' | 'quiet' | 'danger';
const TONES: Record<Tone, string> = {
  primary: 'bg-sounding text-white hover:bg-sounding-dark disabled:bg-ink-faint',
  quiet: 'bg-chart-raised text-ink border border-chart-line hover:bg-chart-deep disabled:text-ink-faint',
  danger: 'bg-verdict-fail text-white hover:brightness-95 disabled:bg-ink-faint',
};

export function Button({ tone = 'primary', className = '', type = 'button', ...props }: ButtonHTMLAttributes<HTMLButtonElement> & { tone?: Tone }) {
  return (
    <button
      type={type}
      className={`inline-flex items-center justify-center gap-2 rounded-plate px-3 py-1.5 text-sm font-bold transition-colors disabled:cursor-not-allowed ${TONES[tone]} ${className}`}
      {...props}
    />
  );
}
