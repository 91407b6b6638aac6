/**
 * The load case in words, in the shown units: the project pages, the design record and its PDF.
 */
import type { LoadCaseInput } from './schemas/evaluate';
import { COMPONENT_LABELS } from './labels';
import { FAMILY_LABELS, type Family } from './schemas/catalogue';
import { formatQuantity, type UnitSystem } from './units';

export { COMPONENT_LABELS };

const count = (v: number) => v.toLocaleString('en-GB', { maximumFractionDigits: 0 });

/** Where the design pressure comes from, in words and the shown units. */
export function pressureSource(lc: LoadCaseInput, system: UnitSystem): string {
  const p = lc.pressure;
  if ('value' in p) return `${formatQuantity('pressure', system, p.value)} given`;
  const water = p.water === 'sea' ? 'seawater' : 'fresh water';
  return `${formatQuantity('depth', system, p.depth)} in ${water} at ${p.latitude}° latitude`;
}

/** One line for lists: "Conical frustum window · 1,200 m in seawater at 57° latitude". */
export function summarizeLoadCase(lc: LoadCaseInput, system: UnitSystem): string {
  return `${COMPONENT_LABELS[lc.component.type]} · ${pressureSource(lc, system)}`;
}

/** Every input of a load case as label/value rows in the shown units (SI inside). */
export function describeLoadCase(lc: LoadCaseInput, system: UnitSystem): { label: string; value: string }[] {
  const len = (m: number) => formatQuantity('length', system, m);
  const c = lc.component;
  const geometry: { label: string; value: string }[] =
    c.type === 'flat-disc'
      ? [
          { label: 'Unsupported diameter', value: len(c.diameter) },
          { label: 'Edge', value: c.edge === 'clamped' ? 'Clamped' : 'Simply supported' },
        ]
      : c.type === 'conical-frustum'
        ? [
            { label: 'Minor diameter', value: len(c.minorDiameter) },
            { label: 'Included angle', value: `${c.includedAngle}°` },
            ...(c.seatOuterDiameter !== undefined ? [{ label: 'Seat outer diameter', value: len(c.seatOuterDiameter) }] : []),
          ]
        : c.type === 'spherical-sector'
          ? [
              { label: 'Inner spherical radius', value: len(c.innerRadius) },
              { label: 'Included angle', value: `${c.includedAngle}°` },
            ]
        : c.type === 'sphere'
          ? [
              { label: 'Inner radius', value: len(c.innerRadius) },
              { label: 'Fabrication', value: c.fabrication === 'machined' ? 'Machined, stress-relieved' : 'Fabricated (welded or formed)' },
              ...(c.localRadiusRatio !== undefined ? [{ label: 'Measured local radius', value: `${c.localRadiusRatio} × R` }] : []),
            ]
          : c.type === 'cylinder'
            ? [
                { label: 'Inner radius', value: len(c.innerRadius) },
                { label: 'Unsupported length', value: len(c.length) },
                ...(c.outOfRoundness !== undefined ? [{ label: 'Out-of-roundness', value: `${(c.outOfRoundness * 100).toFixed(2)} % of R` }] : []),
              ]
            : [
                { label: 'Inner radius', value: len(c.innerRadius) },
                { label: 'Length between bulkheads', value: len(c.length) },
                { label: 'Frame spacing', value: len(c.frameSpacing) },
                { label: 'Frames', value: `${c.framePosition === 'internal' ? 'inside' : 'outside'} the shell` },
                {
                  label: 'Frame',
                  value:
                    c.frame.shape === 'tee'
                      ? `tee: web ${len(c.frame.webHeight)} × ${len(c.frame.webThickness)}, flange ${len(c.frame.flangeWidth)} × ${len(c.frame.flangeThickness)}`
                      : `area ${formatQuantity('area', system, c.frame.area)}, second moment ${formatQuantity('secondMoment', system, c.frame.secondMoment)}, depth ${len(c.frame.depth)}`,
                },
                { label: 'Out-of-roundness', value: `${((c.outOfRoundness ?? 0.005) * 100).toFixed(2)} % of R${c.outOfRoundness === undefined ? ' (default)' : ''}` },
              ];
  return [
    { label: 'Pressure from', value: pressureSource(lc, system) },
    {
      label: 'Design temperatures',
      value: `${formatQuantity('temperature', system, lc.temperature.min)} to ${formatQuantity('temperature', system, lc.temperature.max)}`,
    },
    { label: 'Sustained load', value: `${count(lc.sustainedHours)} h` },
    { label: 'Pressure cycles', value: count(lc.cycles) },
    {
      label: 'Target safety factor',
      value:
        lc.targetSafetyFactor !== undefined
          ? lc.targetSafetyFactor.toFixed(2)
          : lc.familyTargets && Object.keys(lc.familyTargets).length
            ? `Each family's default (common practice), except ${(Object.entries(lc.familyTargets) as [Family, number][]).map(([f, t]) => `${FAMILY_LABELS[f]} ${t}`).join(', ')}`
            : "Each family's default (common practice)",
    },
    { label: 'Proof-test factor', value: (lc.proofFactor ?? 1.25).toFixed(2) },
    { label: 'Human occupancy', value: lc.humanOccupancy ? 'Yes: window rules apply' : 'No' },
    { label: 'Component', value: COMPONENT_LABELS[c.type] },
    ...geometry,
    { label: 'Thickness', value: len(c.thickness) },
  ];
}
