import type { RatingTableContent } from '@shared/schemas/rating-tables';
import { RATIO_LABEL } from '@shared/schemas/rating-tables';
import { useUnits } from '@/lib/unit-system';

const bar = (pa: number) => `${Number((pa / 1e5).toPrecision(4))} bar`;

/** A rating table's grid as published: rows of pressure (or thickness ratio), columns of temperature. */
export function RatingGrid({ content }: { content: RatingTableContent }) {
  const { format, system } = useUnits();
  const ratio = RATIO_LABEL[content.geometry];
  const d = content.data;
  if (d.form === 'critical-pressure') {
    return (
      <div className="flex flex-col gap-2">
        <table className="text-sm" aria-label={`Short-term critical pressure against ${ratio}`}>
          <thead className="text-left text-xs uppercase tracking-wide text-ink-soft">
            <tr>
              <th scope="col" className="pr-4">{ratio}</th>
              <th scope="col" className="pr-4 text-right">Short-term critical pressure</th>
            </tr>
          </thead>
          <tbody>
            {d.ratios.map((r, i) => (
              <tr key={r} className="border-t border-chart-line/60">
                <td className="pr-4">{r}</td>
                <td className="pr-4 text-right">{format('pressure', d.criticalPressures[i])}</td>
              </tr>
            ))}
          </tbody>
        </table>
        <p className="text-xs text-ink-soft">
          Conversion factors: {d.conversionFactors.map((c) => `${format('temperature', c.temperature)} → ${c.factor}`).join(' · ')}
        </p>
      </div>
    );
  }
  return (
    <div className="overflow-x-auto">
      <table className="text-sm" aria-label={`Minimum ${ratio} against design pressure and temperature`}>
        <thead className="text-left text-xs uppercase tracking-wide text-ink-soft">
          <tr>
            <th scope="col" className="pr-4">Design pressure</th>
            {d.temperatures.map((t) => (
              <th key={t} scope="col" className="pr-4 text-right">
                {format('temperature', t)}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {d.pressures.map((p, i) => (
            <tr key={p} className="border-t border-chart-line/60">
              <th scope="row" className="pr-4 text-left font-normal">
                {format('pressure', p)} {system === 'SI' ? <span className="text-xs text-ink-faint">({bar(p)})</span> : null}
              </th>
              {d.ratios[i].map((r, j) => (
                <td key={j} className="pr-4 text-right tabular-nums">
                  {r === null ? <span className="text-ink-faint">—</span> : r.toFixed(3)}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
      <p className="mt-1 text-xs text-ink-soft">
        Minimum {ratio}; — where the source gives no value. Read linearly between rows and columns at the highest design temperature; never beyond the last row or column.
      </p>
    </div>
  );
}
