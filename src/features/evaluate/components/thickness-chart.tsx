import { useMemo } from 'react';
import { Line } from 'react-chartjs-2';
import { palette } from '@/components/charts/setup';
import { sweepThickness, type CandidateMaterial } from '@shared/engine';
import type { LoadCaseInput } from '@shared/schemas/evaluate';
import { useUnits } from '@/lib/unit-system';
import { toDisplay } from '@/lib/units';
import { FAILURE_MODE_LABELS } from '@shared/labels';
import { MODE_COLOURS } from '../modes';

/** Safety factor of every mode against thickness for one candidate, computed here by the shared engine. */
export function ThicknessChart({ loadCase, candidate, thickness, requiredThickness }: { loadCase: LoadCaseInput; candidate: CandidateMaterial; thickness: number; requiredThickness: number | null }) {
  const { system, label, format } = useUnits();
  const sweep = useMemo(() => {
    const upper = Math.max(thickness * 3, (requiredThickness ?? 0) * 1.5);
    return sweepThickness(loadCase, candidate, { from: upper / 60, to: upper, steps: 120 });
  }, [loadCase, candidate, thickness, requiredThickness]);

  const x = (t: number) => toDisplay('length', system, t);
  const cap = sweep.targetSafetyFactor * 6;
  const data = {
    datasets: [
      ...sweep.series.map((s) => ({
        label: s.check ? `${FAILURE_MODE_LABELS[s.mode]} (${s.check})` : FAILURE_MODE_LABELS[s.mode],
        borderColor: MODE_COLOURS[s.mode],
        backgroundColor: MODE_COLOURS[s.mode],
        pointRadius: 0,
        borderWidth: 2,
        data: sweep.thickness.map((t, i) => ({ x: x(t), y: Math.min(s.safetyFactor[i], cap) })),
        // Beyond a formula's range the curve goes on dashed and grey: indicative, not a result.
        segment: {
          borderColor: (ctx: { p1DataIndex: number }) => (s.valid[ctx.p1DataIndex] ? MODE_COLOURS[s.mode] : '#9aa7ad'),
          borderDash: (ctx: { p1DataIndex: number }) => (s.valid[ctx.p1DataIndex] ? undefined : [3, 3]),
        },
      })),
      {
        label: `Target ${sweep.targetSafetyFactor}`,
        borderColor: palette.ink.DEFAULT,
        borderDash: [6, 4],
        borderWidth: 1,
        pointRadius: 0,
        data: [
          { x: x(sweep.thickness[0]), y: sweep.targetSafetyFactor },
          { x: x(sweep.thickness[sweep.thickness.length - 1]), y: sweep.targetSafetyFactor },
        ],
      },
      {
        label: 'Evaluated thickness',
        borderColor: palette.brass.DEFAULT,
        borderWidth: 1.5,
        pointRadius: 0,
        data: [
          { x: x(thickness), y: 0 },
          { x: x(thickness), y: cap },
        ],
      },
    ],
  };
  return (
    <figure className="flex flex-col gap-1">
      <figcaption className="text-xs font-bold uppercase tracking-wide text-ink-soft">Safety factor against thickness — {candidate.name}</figcaption>
      <div className="h-72">
        <Line
          role="img"
          aria-label={`Safety factor against thickness for ${candidate.name}`}
          data={data}
          options={{
            maintainAspectRatio: false,
            parsing: false,
            plugins: { legend: { position: 'bottom' } },
            scales: {
              x: { type: 'linear', title: { display: true, text: `thickness (${label('length')})` } },
              y: { min: 0, max: cap, title: { display: true, text: 'safety factor' } },
            },
          }}
        />
      </div>
      {sweep.series.some((s) => s.invalidReason) ? (
        <p className="text-xs text-ink-soft" data-testid="validity-note">
          Dashed grey:{' '}
          {sweep.series
            .filter((s) => s.invalidReason)
            .map((s) => `${FAILURE_MODE_LABELS[s.mode]}${s.check ? ` (${s.check})` : ''} — ${s.invalidReason}`)
            .join('; ')}
          .
        </p>
      ) : null}
      <p className="text-xs text-ink-soft" data-testid="mode-transitions">
        {sweep.governingTransitions.length
          ? sweep.governingTransitions.map((t) => `${FAILURE_MODE_LABELS[t.from]} gives way to ${FAILURE_MODE_LABELS[t.to].toLowerCase()} at ${format('length', t.thickness)}`).join('; ') + '.'
          : `${FAILURE_MODE_LABELS[sweep.governing[0]]} governs across this range.`}
      </p>
    </figure>
  );
}
