import { useMemo, useState } from 'react';
import { Bar } from 'react-chartjs-2';
import { FAILURE_MODES, modeMargin, type CandidateResult } from '@shared/engine';
import { FAILURE_MODE_LABELS, MARGIN_CHART_RANGE, formatMargin } from '@shared/labels';
import { shortCandidateLabels } from '@shared/candidate-name';
import { MODE_COLOURS } from '@/components/failure-modes';
import { palette } from './setup';

/**
 * Each candidate's margin in every mode it has (tension, compression, shear, buckling), against
 * the target at zero: bars left of zero miss the target. Long rankings are shown a page at a
 * time, and the caption says how many of how many are drawn; labels are the designation and a
 * short name of the condition, distinct within the ranking.
 */
export function MarginChart({ results, pageSize = 12 }: { results: CandidateResult[]; pageSize?: number }) {
  const [page, setPage] = useState(0);
  const labels = useMemo(() => shortCandidateLabels(results), [results]);
  const pages = Math.max(1, Math.ceil(results.length / pageSize));
  const current = Math.min(page, pages - 1);
  const from = current * pageSize;
  const shown = results.slice(from, from + pageSize);
  const modes = FAILURE_MODES.filter((m) => shown.some((r) => r.modes.some((x) => x.mode === m)));
  const { min, max } = MARGIN_CHART_RANGE;
  // Margins run from −1 upwards without bound; the axis is clipped so one strong mode does not flatten the rest.
  const data = {
    // Two lines each: the designation, then the condition's short name.
    labels: labels.slice(from, from + pageSize).map((l) => l.split(' · ')),
    datasets: modes.map((mode) => ({
      label: FAILURE_MODE_LABELS[mode],
      backgroundColor: MODE_COLOURS[mode],
      data: shown.map((r) => {
        const margin = modeMargin(r, mode);
        return margin === undefined ? null : Math.min(margin, max);
      }),
    })),
  };
  const count =
    results.length > shown.length ? `Showing ${from + 1}–${from + shown.length} of ${results.length} candidates` : `All ${results.length} candidate${results.length === 1 ? '' : 's'} shown`;
  return (
    <figure className="flex flex-col gap-1">
      <figcaption className="text-xs font-bold uppercase tracking-wide text-ink-soft">
        Margin by mode against the target (0 = exactly on target; bars clipped at {formatMargin(max)})
      </figcaption>
      <div className="flex flex-wrap items-center justify-between gap-2 text-xs">
        <span className="text-ink-soft" data-testid="margin-chart-count" aria-live="polite">
          {count}
        </span>
        {pages > 1 ? (
          <span className="no-print flex gap-1">
            <button
              type="button"
              className="rounded-plate border border-chart-line px-2 py-0.5 font-bold text-sounding disabled:text-ink-faint"
              disabled={current === 0}
              onClick={() => setPage(current - 1)}
            >
              Previous {pageSize}
            </button>
            <button
              type="button"
              className="rounded-plate border border-chart-line px-2 py-0.5 font-bold text-sounding disabled:text-ink-faint"
              disabled={current >= pages - 1}
              onClick={() => setPage(current + 1)}
            >
              Next {Math.min(pageSize, results.length - from - shown.length)}
            </button>
          </span>
        ) : null}
      </div>
      <div style={{ height: `${Math.max(160, shown.length * 40 + 60)}px` }}>
        <Bar
          role="img"
          aria-label={`Margins by failure mode per candidate: ${labels.slice(from, from + pageSize).join('; ')}`}
          data={data}
          options={{
            indexAxis: 'y',
            maintainAspectRatio: false,
            plugins: {
              legend: { position: 'bottom' },
              tooltip: {
                callbacks: {
                  title: (items) => shown[items[0]?.dataIndex ?? 0]?.name ?? '',
                  label: (ctx) => {
                    const exact = modeMargin(shown[ctx.dataIndex], modes[ctx.datasetIndex]);
                    return `${ctx.dataset.label}: ${formatMargin(exact ?? ctx.parsed.x ?? 0)}`;
                  },
                },
              },
            },
            scales: {
              x: { min, max, title: { display: true, text: 'margin (safety factor / target − 1)' }, grid: { color: (c) => (c.tick.value === 0 ? palette.ink.DEFAULT : palette.chart.deep) } },
              y: { ticks: { autoSkip: false, font: { size: 11 } } },
            },
          }}
        />
      </div>
    </figure>
  );
}
