import { Line } from 'react-chartjs-2';
import { palette } from './setup';

interface Point {
  x: number;
  y: number;
}

/** Strength factor against temperature, load duration or cycles, as the property set gives it. */
export function FactorChart({ title, xLabel, points, logX = false }: { title: string; xLabel: string; points: Point[]; logX?: boolean }) {
  const data = {
    datasets: [
      {
        label: 'Strength factor',
        data: points,
        borderColor: palette.sounding.DEFAULT,
        backgroundColor: palette.sounding.DEFAULT,
        pointRadius: 3,
        tension: 0,
      },
    ],
  };
  return (
    <figure className="flex flex-col gap-1">
      <figcaption className="text-xs font-bold uppercase tracking-wide text-ink-soft">{title}</figcaption>
      <div className="h-44">
        <Line
          data={data}
          options={{
            maintainAspectRatio: false,
            parsing: false,
            plugins: { legend: { display: false } },
            scales: {
              x: { type: logX ? 'logarithmic' : 'linear', title: { display: true, text: xLabel } },
              y: { title: { display: true, text: 'factor' }, suggestedMin: 0, suggestedMax: 1.2 },
            },
          }}
          aria-label={`${title} chart`}
          role="img"
        />
      </div>
    </figure>
  );
}
