import { useId } from 'react';

/** A determinate bar (fraction 0–1) or, without a fraction, an indeterminate one. */
export function ProgressBar({ label, fraction, detail }: { label: string; fraction?: number; detail?: string }) {
  const id = useId();
  const percent = fraction === undefined ? undefined : Math.max(0, Math.min(100, Math.round(fraction * 100)));
  return (
    <div className="flex flex-col gap-1" data-testid="progress">
      <div className="flex justify-between text-sm">
        <span id={id}>{label}</span>
        <span className="font-bold tabular-nums" aria-hidden>
          {percent === undefined ? '' : `${percent} %`}
        </span>
      </div>
      <div
        role="progressbar"
        aria-labelledby={id}
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={percent}
        aria-valuetext={percent === undefined ? detail ?? label : `${percent} %`}
        className="h-2 overflow-hidden rounded-plate bg-chart-deep"
      >
        {percent === undefined ? (
          <div className="h-full w-1/3 animate-pulse bg-sounding" />
        ) : (
          <div className="h-full bg-sounding transition-[width]" style={{ width: `${percent}%` }} />
        )}
      </div>
      {detail ? <p className="text-xs text-ink-soft">{detail}</p> : null}
    </div>
  );
}
