import { Link, type LinkProps } from 'react-router-dom';

const TONES = {
  primary: 'bg-sounding text-white hover:bg-sounding-dark',
  quiet: 'bg-chart-raised text-ink border border-chart-line hover:bg-chart-deep',
};

/** A navigation link that looks like a button (navigation stays a link for the keyboard and the browser). */
export function LinkButton({ tone = 'primary', className = '', ...props }: LinkProps & { tone?: keyof typeof TONES }) {
  return <Link className={`inline-flex items-center justify-center gap-2 rounded-plate px-3 py-1.5 text-sm font-bold ${TONES[tone]} ${className}`} {...props} />;
}
