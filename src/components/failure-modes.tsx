import type { CandidateResult, FailureMode } from '@shared/engine';
import tokens from '../../tailwind.config';

export const MODE_LABELS: Record<FailureMode, string> = {
  tension: 'Tension',
  compression: 'Compression',
  shear: 'Shear',
  buckling: 'Buckling',
};

/** One colour per failure mode, used in tables, charts and the design record. */
export const MODE_COLOURS: Record<FailureMode, string> = tokens.theme.extend.colors.mode;

export function ModeTag({ mode }: { mode: CandidateResult['governingMode'] }) {
  return (
    <span className="inline-flex items-center gap-1.5 text-sm font-bold" style={{ color: MODE_COLOURS[mode] }}>
      <span aria-hidden className="inline-block h-2.5 w-2.5 rounded-full" style={{ background: MODE_COLOURS[mode] }} />
      {MODE_LABELS[mode]}
    </span>
  );
}

/** Margin = safety factor / target − 1, as a signed percentage. */
export function formatMargin(margin: number): string {
  return `${margin >= 0 ? '+' : ''}${(margin * 100).toFixed(0)} %`;
}

export function MarginCell({ margin }: { margin: number }) {
  return <span className={`font-bold ${margin >= 0 ? 'text-verdict-pass' : 'text-verdict-fail'}`}>{formatMargin(margin)}</span>;
}
