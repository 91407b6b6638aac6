import type { CandidateResult } from '@shared/engine';
import { MODE_COLOURS } from '@shared/design-tokens';
import { useUnits } from '@/lib/unit-system';
import { FAILURE_MODE_LABELS, formatMargin, sizedByText } from '@shared/labels';

/** One colour per failure mode, used in tables, charts and the design record. */
export { MODE_COLOURS };

export function ModeTag({ mode, small = false }: { mode: CandidateResult['governingMode']; small?: boolean }) {
  return (
    <span className={`inline-flex items-center gap-1.5 font-bold ${small ? 'text-xs' : 'text-sm'}`} style={{ color: MODE_COLOURS[mode] }}>
      <span aria-hidden className="inline-block h-2.5 w-2.5 rounded-full" style={{ background: MODE_COLOURS[mode] }} />
      {FAILURE_MODE_LABELS[mode]}
    </span>
  );
}

export function MarginCell({ margin }: { margin: number }) {
  return <span className={`font-bold ${margin >= 0 ? 'text-verdict-pass' : 'text-verdict-fail'}`}>{formatMargin(margin)}</span>;
}

/** Every mode of one result: stress, allowable, safety factor, thickness needed, model and source. */
export function ModesTable({ result, className = '' }: { result: CandidateResult; className?: string }) {
  const { format } = useUnits();
  return (
    <table className={`w-full text-sm ${className}`} aria-label={`Modes of ${result.name}`}>
      <thead className="text-left text-xs uppercase tracking-wide text-ink-soft">
        <tr>
          <th scope="col" className="pr-2">Mode</th>
          <th scope="col" className="pr-2 text-right">Stress</th>
          <th scope="col" className="pr-2 text-right">Allowable</th>
          <th scope="col" className="whitespace-nowrap pr-2 text-right">Safety factor</th>
          <th scope="col" className="whitespace-nowrap pr-2 text-right">Needs t</th>
          <th scope="col" className="whitespace-nowrap pr-2 text-right" title="Safety factor at the proof-test pressure against short-term strength">
            At proof
          </th>
          <th scope="col">Model and source</th>
        </tr>
      </thead>
      <tbody>
        {result.modes.map((m, i) => (
          <tr key={`${i}:${m.mode}`} className="border-t border-chart-line/60 align-top">
            <td className="py-1 pr-2">
              <ModeTag mode={m.mode} />
              {m.check ? <span className="block text-xs text-ink-soft">{m.check}</span> : null}
            </td>
            <td className="whitespace-nowrap py-1 pr-2 text-right">{format('stress', m.stress)}</td>
            <td className="whitespace-nowrap py-1 pr-2 text-right">{format('stress', m.allowable)}</td>
            <td className="whitespace-nowrap py-1 pr-2 text-right">{m.safetyFactor.toFixed(2)}</td>
            <td className="whitespace-nowrap py-1 pr-2 text-right">{m.requiredThickness === null ? 'none suffices' : format('length', m.requiredThickness)}</td>
            <td className={`whitespace-nowrap py-1 pr-2 text-right ${m.proof && m.proof.safetyFactor < 1 ? 'font-bold text-verdict-fail' : ''}`}>
              {m.proof ? m.proof.safetyFactor.toFixed(2) : '—'}
            </td>
            <td className="py-1 text-xs text-ink-soft">
              {m.collapse ? (
                <span className="mb-0.5 block font-bold text-ink">
                  Elastic {Number.isFinite(m.collapse.elastic) ? format('pressure', m.collapse.elastic) : '—'} · yield {format('pressure', m.collapse.yield)} → collapse {format('pressure', m.collapse.collapse)}
                </span>
              ) : null}
              {m.model}
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

/**
 * What sizes a result: a rating table (with its source, how it was read and the analytical
 * cross-check) or an analytical mode; the human-occupancy coverage when it applies.
 * Records frozen before rating tables and proof checks lack those fields: they are skipped.
 */
export function SizingSummary({ result }: { result: CandidateResult }) {
  const { format } = useUnits();
  const rating = result.rating;
  return (
    <div className="flex flex-col gap-1 text-xs" data-testid="sizing-summary">
      {result.coverage ? (
        <p className={`font-bold ${result.coverage === 'covered' ? 'text-verdict-pass' : 'text-verdict-fail'}`}>
          {result.coverage === 'covered' ? 'Human occupancy: covered by a window rule' : 'Human occupancy: NOT covered by any window rule in the catalogue'}
        </p>
      ) : null}
      {'sizedBy' in result ? (
        <p>
          <span className="text-ink-soft">Thickness set by: </span>
          <span className="font-bold">{sizedByText(result.sizedBy)}</span>
        </p>
      ) : null}
      {rating ? (
        <div className="rounded-plate border border-chart-line bg-chart-raised px-2 py-1.5" aria-label="Rating table route">
          <p className="font-bold">{rating.name}</p>
          <p className="text-ink-soft">{rating.source}</p>
          {rating.requiredThickness === null ? (
            <p className="font-bold text-verdict-fail">{rating.outside}</p>
          ) : (
            <p>
              Minimum ratio {rating.minimumRatio?.toFixed(3)} → {format('length', rating.requiredThickness)}; rated{' '}
              {rating.ratedPressure === null ? 'below the table at the entered thickness' : `${rating.ratedPressureIsLowerBound ? 'at least ' : ''}${format('pressure', rating.ratedPressure)}`}
              {rating.crossCheckSafetyFactor !== null ? `; analytical cross-check safety factor ${rating.crossCheckSafetyFactor.toFixed(2)} at that thickness` : ''}.
            </p>
          )}
          <p className="text-ink-soft">{rating.interpolation}</p>
        </div>
      ) : null}
      {result.proofSafetyFactor !== undefined ? (
        <p>
          <span className="text-ink-soft">Proof test: </span>
          <span className={result.proofSafetyFactor < 1 ? 'font-bold text-verdict-fail' : ''}>lowest safety factor {result.proofSafetyFactor.toFixed(2)}</span>{' '}
          <span className="text-ink-soft">against short-term strength</span>
        </p>
      ) : null}
    </div>
  );
}
