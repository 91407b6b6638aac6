import { useEffect, useMemo, useRef, useState } from 'react';
import { modeMap, targetContour, type CandidateMaterial, type ModeMapAxis, type ModeMapResult } from '@shared/engine';
import type { LoadCaseInput } from '@shared/schemas/evaluate';
import { colors, MODE_COLOURS } from '@shared/design-tokens';
import { FAILURE_MODE_LABELS } from '@shared/labels';
import { useUnits } from '@/lib/unit-system';
import { formatPressureAll } from '@/lib/units';

/** Cells along each axis: 64 × 64 = 4,096 checks, computed here by the shared engine. */
const CELLS = 64;

/** A point of the map in SI, for the form. */
export interface MapPoint {
  thickness: number;
  includedAngle?: number;
  depth?: number;
  pressure?: number;
}

type Axes = 'ratio-angle' | 'thickness-load';

function axesFor(loadCase: LoadCaseInput, axes: Axes, requiredThickness: number | null): [ModeMapAxis, ModeMapAxis] {
  const c = loadCase.component;
  if (axes === 'ratio-angle' && c.type === 'conical-frustum') {
    return [
      { kind: 'thicknessRatio', from: 0.05, to: 1.5, cells: CELLS },
      { kind: 'includedAngle', from: 30, to: 180, cells: CELLS },
    ];
  }
  const tMax = Math.max(c.thickness * 3, (requiredThickness ?? 0) * 1.5);
  const thickness: ModeMapAxis = { kind: 'thickness', from: tMax / CELLS, to: tMax, cells: CELLS };
  const p = loadCase.pressure;
  return 'depth' in p
    ? [thickness, { kind: 'depth', from: 10, to: Math.min(11_000, Math.max(2 * p.depth, 1000)), cells: CELLS }]
    : [thickness, { kind: 'pressure', from: p.value / 10, to: p.value * 3, cells: CELLS }];
}

/** Pale where the candidate misses its target, full where it meets it. */
function paint(canvas: HTMLCanvasElement, map: ModeMapResult, marker: { x: number; y: number } | null) {
  const ctx = canvas.getContext('2d');
  if (!ctx) return;
  const nx = map.x.length;
  const ny = map.y.length;
  const w = canvas.width;
  const h = canvas.height;
  const cw = w / nx;
  const ch = h / ny;
  ctx.clearRect(0, 0, w, h);
  for (let j = 0; j < ny; j++) {
    for (let i = 0; i < nx; i++) {
      const k = j * nx + i;
      ctx.globalAlpha = map.ratio[k] >= 1 ? 0.9 : 0.3;
      ctx.fillStyle = MODE_COLOURS[map.modes[map.governing[k]]];
      // y grows upwards on the chart
      ctx.fillRect(Math.floor(i * cw), Math.floor(h - (j + 1) * ch), Math.ceil(cw), Math.ceil(ch));
    }
  }
  ctx.globalAlpha = 1;
  ctx.strokeStyle = colors.ink.DEFAULT;
  ctx.lineWidth = 2.5;
  ctx.beginPath();
  for (const [x1, y1, x2, y2] of targetContour(map)) {
    ctx.moveTo((x1 + 0.5) * cw, h - (y1 + 0.5) * ch);
    ctx.lineTo((x2 + 0.5) * cw, h - (y2 + 0.5) * ch);
  }
  ctx.stroke();
  if (marker) {
    ctx.strokeStyle = colors.brass.DEFAULT;
    ctx.fillStyle = colors.chart.raised;
    ctx.lineWidth = 3;
    ctx.beginPath();
    ctx.arc(marker.x * w, h - marker.y * h, 6, 0, 2 * Math.PI);
    ctx.fill();
    ctx.stroke();
  }
}

/**
 * Where each failure mode governs for one candidate, coloured by mode (Isobath's mode colours),
 * pale where the target is missed, with the target contour drawn in ink. Computed in the browser
 * by the shared engine; a click loads that point into the form.
 */
export function ModeMap({
  loadCase,
  candidate,
  requiredThickness,
  onPick,
}: {
  loadCase: LoadCaseInput;
  candidate: CandidateMaterial;
  requiredThickness: number | null;
  onPick: (point: MapPoint) => void;
}) {
  const { format, system, label } = useUnits();
  const cone = loadCase.component.type === 'conical-frustum';
  const [axes, setAxes] = useState<Axes>(cone ? 'ratio-angle' : 'thickness-load');
  const chosen: Axes = cone ? axes : 'thickness-load';
  const canvasRef = useRef<HTMLCanvasElement>(null);
  const computed = useMemo(() => {
    const [xa, ya] = axesFor(loadCase, chosen, requiredThickness);
    const t0 = performance.now();
    const map = modeMap(loadCase, candidate, xa, ya);
    return { map, ms: performance.now() - t0, xa, ya };
  }, [loadCase, candidate, chosen, requiredThickness]);
  const { map, ms, xa, ya } = computed;

  // Where the evaluated case sits on the map (fractions of each axis), when it is inside.
  const c = loadCase.component;
  const p = loadCase.pressure;
  const xNow = xa.kind === 'thicknessRatio' && c.type === 'conical-frustum' ? c.thickness / c.minorDiameter : c.thickness;
  const yNow = ya.kind === 'includedAngle' && c.type === 'conical-frustum' ? c.includedAngle : ya.kind === 'depth' && 'depth' in p ? p.depth : 'value' in p ? p.value : NaN;
  const frac = (v: number, a: ModeMapAxis) => (v - a.from) / (a.to - a.from);
  const marker = frac(xNow, xa) >= 0 && frac(xNow, xa) <= 1 && frac(yNow, ya) >= 0 && frac(yNow, ya) <= 1 ? { x: frac(xNow, xa), y: frac(yNow, ya) } : null;

  useEffect(() => {
    if (canvasRef.current) paint(canvasRef.current, map, marker);
  }, [map, marker?.x, marker?.y]);

  const show = (kind: ModeMapAxis['kind'], v: number) =>
    kind === 'thicknessRatio'
      ? v.toFixed(2)
      : kind === 'includedAngle'
        ? `${v.toFixed(0)}°`
        : kind === 'thickness'
          ? format('length', v)
          : kind === 'depth'
            ? format('depth', v)
            : formatPressureAll(v, system === 'US' ? 'psi' : 'MPa').split(' (')[0];
  const axisTitle = (kind: ModeMapAxis['kind']) =>
    kind === 'thicknessRatio'
      ? 't / Dᵢ (thickness over minor diameter)'
      : kind === 'includedAngle'
        ? 'included angle (°)'
        : kind === 'thickness'
          ? `thickness (${label('length')})`
          : kind === 'depth'
            ? `design depth (${label('depth')})`
            : 'design pressure (gauge)';

  const pick = (e: React.MouseEvent<HTMLCanvasElement>) => {
    const r = e.currentTarget.getBoundingClientRect();
    const fx = Math.min(1, Math.max(0, (e.clientX - r.left) / r.width));
    const fy = Math.min(1, Math.max(0, 1 - (e.clientY - r.top) / r.height));
    const xv = xa.from + fx * (xa.to - xa.from);
    const yv = ya.from + fy * (ya.to - ya.from);
    const thickness = xa.kind === 'thicknessRatio' && c.type === 'conical-frustum' ? xv * c.minorDiameter : xv;
    onPick(ya.kind === 'includedAngle' ? { thickness, includedAngle: yv } : ya.kind === 'depth' ? { thickness, depth: yv } : { thickness, pressure: yv });
  };

  const present = [...new Set(Array.from(map.governing, (g) => map.modes[g]))];
  return (
    <figure className="flex max-w-3xl flex-col gap-2" data-testid="mode-map">
      <figcaption className="flex flex-wrap items-center justify-between gap-2 text-xs">
        <span className="font-bold uppercase tracking-wide text-ink-soft">Where each mode governs — {candidate.name}</span>
        {cone ? (
          <label className="flex items-center gap-1">
            <span className="text-ink-soft">Axes</span>
            <select className="rounded-plate border border-chart-line bg-white px-1 py-0.5" value={chosen} onChange={(e) => setAxes(e.target.value as Axes)} aria-label="Mode map axes">
              <option value="ratio-angle">t/Dᵢ and included angle</option>
              <option value="thickness-load">thickness and depth</option>
            </select>
          </label>
        ) : null}
      </figcaption>
      <div className="grid grid-cols-[auto_1fr] gap-x-2">
        <div className="flex flex-col justify-between text-right text-[11px] text-ink-soft" aria-hidden>
          <span>{show(ya.kind, ya.to)}</span>
          <span className="[writing-mode:vertical-rl] rotate-180 self-center">{axisTitle(ya.kind)}</span>
          <span>{show(ya.kind, ya.from)}</span>
        </div>
        <canvas
          ref={canvasRef}
          width={CELLS * 6}
          height={CELLS * 4}
          className="aspect-[3/2] w-full cursor-crosshair rounded-plate border border-chart-line"
          role="img"
          aria-label={`Governing mode over ${axisTitle(xa.kind)} and ${axisTitle(ya.kind)} for ${candidate.name}; click a point to load it into the form`}
          onClick={pick}
          data-testid="mode-map-canvas"
        />
        <span />
        <div className="flex justify-between text-[11px] text-ink-soft" aria-hidden>
          <span>{show(xa.kind, xa.from)}</span>
          <span>{axisTitle(xa.kind)}</span>
          <span>{show(xa.kind, xa.to)}</span>
        </div>
      </div>
      <ul className="flex flex-wrap items-center gap-x-4 gap-y-1 text-xs" aria-label="Mode map legend">
        {present.map((m) => (
          <li key={m} className="flex items-center gap-1.5">
            <span aria-hidden className="inline-block h-3 w-3 rounded-sm" style={{ background: MODE_COLOURS[m] }} />
            {FAILURE_MODE_LABELS[m]} governs
          </li>
        ))}
        <li className="flex items-center gap-1.5">
          <span aria-hidden className="inline-block h-0.5 w-5" style={{ background: colors.ink.DEFAULT }} />
          target safety factor {map.target} met on the full-colour side; pale: below it
        </li>
        <li className="flex items-center gap-1.5">
          <span aria-hidden className="inline-block h-3 w-3 rounded-full border-2" style={{ borderColor: colors.brass.DEFAULT }} />
          the evaluated case
        </li>
      </ul>
      <p className="text-xs text-ink-soft">
        Analytical modes only (a rating table's sizing is not drawn).{' '}
        <span data-testid="mode-map-time" data-ms={ms.toFixed(1)}>
          {CELLS} × {CELLS} grid computed in your browser in {ms.toFixed(0)} ms
        </span>
        . Click a point to load its thickness and {ya.kind === 'includedAngle' ? 'included angle' : ya.kind === 'depth' ? 'depth' : 'pressure'} into the form.
      </p>
    </figure>
  );
}
