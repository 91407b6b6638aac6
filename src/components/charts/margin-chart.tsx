import { Bar } from 'react-chartjs-2';
import { FAILURE_MODES, modeMargin, type CandidateResult } from '@shared/engine';
import { FAILURE_MODE_LABELS, formatMargin } from '@shared/labels';
import { MODE_COLOURS } from '@/components/failure-modes';
import { palette } from './setup';

/**
 * Each candidate's margin in every mode it has (tension, compression, shear, buckling), against
 * the target at zero: bars left of zero miss the target.
 */
export function MarginChart({ results }: { results: CandidateResult[] }) {
  const shown = results.slice(0, 12);
  const modes = FAILURE_MODES.filter((m) => shown.some((r) => r.modes.some((x) => x.mode === m)));
  // Margins run from −1 upwards without bound; clip the axis so one strong mode does not flatten the rest.
  const data = {
    labels: shown.map((r) => (r.name.length > 42 ? `${r.name.slice(0, 40)}…` : r.name)),
    datasets: modes.map((mode) => ({
      label: FAILURE_MODE_LABELS[mode],
      backgroundColor: MODE_COLOURS[mode],
      data: shown.map((r) => {
        const margin = modeMargin(r, mode);
        return margin === undefined ? null : Math.min(margin, 5);
      }),
    })),
  };
  return (
    <figure className="flex flex-col gap-1">
      <figcaption className="text-xs font-bold uppercase tracking-wide text-ink-soft">
        Margin by mode against the target (0 = exactly on target; bars clipped at +500 %)
      </figcaption>
      <div style={{ height: `${Math.max(160, shown.length * 34 + 60)}px` }}>
        <Bar
          role="img"
          aria-label="Margins by failure mode per candidate"
          data={data}
          options={{
            indexAxis: 'y',
            maintainAspectRatio: false,
            plugins: {
              legend: { position: 'bottom' },
              tooltip: { callbacks: { label: (ctx) => `${ctx.dataset.label}: ${formatMargin(ctx.parsed.x ?? 0)}` } },
            },
            scales: {
              x: { min: -1, suggestedMax: 2, title: { display: true, text: 'margin (safety factor / target − 1)' }, grid: { color: (c) => (c.tick.value === 0 ? palette.ink.DEFAULT : palette.chart.deep) } },
              y: { ticks: { autoSkip: false, font: { size: 11 } } },
            },
          }}
        />
      </div>
    </figure>
  );
}
