import type { ComponentType } from '@shared/schemas/evaluate';
import { colors } from '@shared/design-tokens';

interface SketchProps {
  type: ComponentType;
  /** Dimension labels already formatted in the shown units. */
  labels: { diameter?: string; minorDiameter?: string; thickness?: string; includedAngle?: string; innerRadius?: string; length?: string; frameSpacing?: string };
}

const INK = colors.ink.DEFAULT;
const DIM = colors.brass.DEFAULT;
const BODY = colors.sounding.light;
const SEAT = colors.ink.faint;

function Arrowhead() {
  return (
    <defs>
      <marker id="dim-arrow" viewBox="0 0 10 10" refX="5" refY="5" markerWidth="6" markerHeight="6" orient="auto-start-reverse">
        <path d="M0,0 L10,5 L0,10 z" fill={DIM} />
      </marker>
      <marker id="load-arrow" viewBox="0 0 10 10" refX="5" refY="5" markerWidth="5" markerHeight="5" orient="auto">
        <path d="M0,0 L10,5 L0,10 z" fill={INK} />
      </marker>
    </defs>
  );
}

function Dim({ x1, y1, x2, y2, label, dx = 0, dy = -6 }: { x1: number; y1: number; x2: number; y2: number; label?: string; dx?: number; dy?: number }) {
  return (
    <g>
      <line x1={x1} y1={y1} x2={x2} y2={y2} stroke={DIM} strokeWidth={1.2} markerStart="url(#dim-arrow)" markerEnd="url(#dim-arrow)" />
      {label ? (
        <text x={(x1 + x2) / 2 + dx} y={(y1 + y2) / 2 + dy} fill={DIM} fontSize={11} textAnchor="middle" fontWeight={700}>
          {label}
        </text>
      ) : null}
    </g>
  );
}

function Pressure({ x1, x2, y }: { x1: number; x2: number; y: number }) {
  const xs = [0, 1, 2, 3, 4].map((i) => x1 + ((x2 - x1) * i) / 4);
  return (
    <g>
      {xs.map((x) => (
        <line key={x} x1={x} y1={y - 18} x2={x} y2={y - 3} stroke={INK} strokeWidth={1.2} markerEnd="url(#load-arrow)" />
      ))}
      <text x={x2 + 8} y={y - 8} fontSize={11} fill={INK}>
        p
      </text>
    </g>
  );
}

/** A small dimensioned section of the chosen component, so the inputs read unambiguously. */
export function ComponentSketch({ type, labels }: SketchProps) {
  return (
    <svg viewBox="0 0 260 150" className="h-36 w-full" role="img" aria-label={`Sketch of the ${type.replace('-', ' ')} with its dimensions`}>
      <Arrowhead />
      {type === 'flat-disc' ? (
        <g>
          <Pressure x1={60} x2={200} y={48} />
          <rect x={45} y={50} width={170} height={26} fill={BODY} stroke={INK} />
          <rect x={20} y={76} width={55} height={22} fill={SEAT} />
          <rect x={185} y={76} width={55} height={22} fill={SEAT} />
          <Dim x1={75} y1={112} x2={185} y2={112} label={`D ${labels.diameter ?? ''}`} dy={14} />
          <Dim x1={228} y1={50} x2={228} y2={76} />
          <text x={236} y={67} fontSize={11} fill={DIM} fontWeight={700}>
            t {labels.thickness}
          </text>
        </g>
      ) : null}
      {type === 'conical-frustum' ? (
        <g>
          <Pressure x1={70} x2={190} y={40} />
          <polygon points="55,42 205,42 165,92 95,92" fill={BODY} stroke={INK} />
          <polygon points="30,42 55,42 95,92 95,110 30,110" fill={SEAT} />
          <polygon points="230,42 205,42 165,92 165,110 230,110" fill={SEAT} />
          <Dim x1={95} y1={124} x2={165} y2={124} label={`Dᵢ ${labels.minorDiameter ?? ''}`} dy={14} />
          <Dim x1={40} y1={42} x2={40} y2={92} />
          <text x={4} y={71} fontSize={11} fill={DIM} fontWeight={700}>
            t
          </text>
          <text x={250} y={12} fontSize={11} fill={DIM} fontWeight={700} textAnchor="end">
            t {labels.thickness} · α {labels.includedAngle}
          </text>
          <line x1={130} y1={140} x2={130} y2={20} stroke={DIM} strokeDasharray="3 3" strokeWidth={0.8} />
        </g>
      ) : null}
      {type === 'spherical-sector' ? (
        <g>
          {/* a 90° sector seen in section: convex face up (pressure), concave face down, conical seat */}
          <path d="M60,70 A99,99 0 0 1 200,70 L165,105 A49,49 0 0 0 95,105 Z" fill={BODY} stroke={INK} />
          <polygon points="30,70 60,70 95,105 95,122 30,122" fill={SEAT} />
          <polygon points="230,70 200,70 165,105 165,122 230,122" fill={SEAT} />
          <Pressure x1={95} x2={165} y={38} />
          <line x1={130} y1={140} x2={130} y2={10} stroke={DIM} strokeDasharray="3 3" strokeWidth={0.8} />
          <Dim x1={130} y1={140} x2={165} y2={105} label={`Rᵢ ${labels.innerRadius ?? ''}`} dx={22} dy={14} />
          <text x={250} y={12} fontSize={11} fill={DIM} fontWeight={700} textAnchor="end">
            t {labels.thickness} · α {labels.includedAngle}
          </text>
        </g>
      ) : null}
      {type === 'sphere' ? (
        <g>
          <circle cx={110} cy={75} r={60} fill={BODY} stroke={INK} />
          <circle cx={110} cy={75} r={46} fill="white" stroke={INK} />
          <Dim x1={110} y1={75} x2={156} y2={75} label={`Rᵢ ${labels.innerRadius ?? ''}`} />
          <Dim x1={156} y1={75} x2={170} y2={75} />
          <text x={178} y={79} fontSize={11} fill={DIM} fontWeight={700}>
            t {labels.thickness}
          </text>
        </g>
      ) : null}
      {type === 'ring-stiffened-cylinder' ? (
        <g>
          {/* half section along the axis: shell on top, tee frames inside it, bulkheads at the ends */}
          <rect x={30} y={30} width={200} height={10} fill={BODY} stroke={INK} />
          {[62, 102, 142, 182].map((x) => (
            <g key={x}>
              <rect x={x - 2} y={40} width={4} height={26} fill={SEAT} />
              <rect x={x - 10} y={66} width={20} height={5} fill={SEAT} />
            </g>
          ))}
          <rect x={24} y={24} width={8} height={70} fill={SEAT} />
          <rect x={228} y={24} width={8} height={70} fill={SEAT} />
          <line x1={20} y1={118} x2={240} y2={118} stroke={DIM} strokeDasharray="3 3" strokeWidth={0.8} />
          <Dim x1={62} y1={84} x2={102} y2={84} label={`Lf ${labels.frameSpacing ?? ''}`} dy={12} />
          <Dim x1={32} y1={140} x2={228} y2={140} label={`L ${labels.length ?? ''}`} dy={-4} />
          <Dim x1={210} y1={118} x2={210} y2={40} />
          <text x={214} y={104} fontSize={11} fill={DIM} fontWeight={700}>
            Rᵢ {labels.innerRadius}
          </text>
          <text x={150} y={22} fontSize={11} fill={DIM} fontWeight={700}>
            t {labels.thickness}
          </text>
        </g>
      ) : null}
      {type === 'cylinder' ? (
        <g>
          <rect x={30} y={35} width={200} height={14} fill={BODY} stroke={INK} />
          <rect x={30} y={101} width={200} height={14} fill={BODY} stroke={INK} />
          <rect x={24} y={28} width={8} height={94} fill={SEAT} />
          <rect x={228} y={28} width={8} height={94} fill={SEAT} />
          <line x1={20} y1={75} x2={240} y2={75} stroke={DIM} strokeDasharray="3 3" strokeWidth={0.8} />
          <Dim x1={32} y1={140} x2={228} y2={140} label={`L ${labels.length ?? ''}`} dy={-4} />
          <Dim x1={70} y1={75} x2={70} y2={49} />
          <text x={76} y={66} fontSize={11} fill={DIM} fontWeight={700}>
            Rᵢ {labels.innerRadius}
          </text>
          <text x={150} y={30} fontSize={11} fill={DIM} fontWeight={700}>
            t {labels.thickness}
          </text>
        </g>
      ) : null}
    </svg>
  );
}
