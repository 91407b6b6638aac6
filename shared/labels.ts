/**
 * Words shown for the domain's values, written once for the client, the record and its PDF.
 */
import type { ComponentType } from './schemas/evaluate';
import type { ReferenceKind, ValueBasis } from './schemas/catalogue';
import type { FailureMode } from './engine/types';
import type { ShortlistRoundDto } from './schemas/projects';

export const COMPONENT_LABELS: Record<ComponentType, string> = {
  'flat-disc': 'Flat disc window',
  'conical-frustum': 'Conical frustum window',
  'spherical-sector': 'Spherical sector window',
  sphere: 'Spherical shell',
  cylinder: 'Cylindrical shell between stiffeners',
  'ring-stiffened-cylinder': 'Ring-stiffened cylinder',
};

export const FAILURE_MODE_LABELS: Record<FailureMode, string> = {
  tension: 'Tension',
  compression: 'Compression',
  shear: 'Shear',
  buckling: 'Buckling',
};

/** How a property value was established. */
export const VALUE_BASIS_LABELS: Record<ValueBasis, string> = {
  minimum: 'Minimum',
  typical: 'Typical',
  'statistical-allowable': 'Statistical allowable',
};

/** What kind of source a reference is. */
export const REFERENCE_KIND_LABELS: Record<ReferenceKind, string> = {
  standard: 'Standard',
  handbook: 'Handbook',
  paper: 'Paper',
  'test-report': 'Test report',
  'supplier-data-sheet': 'Supplier data sheet',
};

/** Margin = safety factor / target − 1, as a signed whole percentage ("+15 %", "-20 %"). */
export function formatMargin(margin: number): string {
  return `${margin >= 0 ? '+' : ''}${(margin * 100).toFixed(0)} %`;
}

/** Which components are windows (a rating table can cover them; human-occupancy rules apply). */
export const WINDOW_COMPONENTS: readonly ComponentType[] = ['flat-disc', 'conical-frustum', 'spherical-sector'];

/** What set a result's required thickness, in words. */
export function sizedByText(sizedBy: { kind: 'mode'; mode: string } | { kind: 'rating-table'; name: string } | null): string {
  if (sizedBy === null) return 'no thickness given';
  return sizedBy.kind === 'mode' ? `${sizedBy.mode} (analytical)` : `rating table: ${sizedBy.name}`;
}

/** The strength factors a result applied, in words; records frozen before the life rule lack its fields. */
export function factorsText(
  f: { temperature: number; worstTemperature: number; temperatureSource?: string; sustainedLoad: number; cyclic: number; life?: number },
  temperature: (celsius: number) => string = (c) => `${c} °C`,
): string {
  const t = `temperature ${f.temperature.toFixed(2)} (worst at ${temperature(f.worstTemperature)}${f.temperatureSource === 'family' ? ', family default curve' : ''})`;
  const life =
    f.life === undefined
      ? `sustained load ${f.sustainedLoad.toFixed(2)} × cycles ${f.cyclic.toFixed(2)} (multiplied, as before the life rule)`
      : `life ${f.life.toFixed(2)}, the lower of sustained load ${f.sustainedLoad.toFixed(2)} and cycles ${f.cyclic.toFixed(2)}`;
  return `Strength factors applied: ${t}; ${life}.`;
}

/** One round of checking in words: who submitted it and how it ended; `date` formats the times. */
export function roundText(r: ShortlistRoundDto, date: (iso: string) => string): { heading: string; outcome: string } {
  const heading = `Round ${r.round}: submitted by ${r.submittedBy.name} on ${date(r.submittedAt)}, ${r.candidates.length} candidate${r.candidates.length === 1 ? '' : 's'}`;
  if (!r.outcome || !r.decidedAt) return { heading, outcome: 'Waiting for a check.' };
  const who = `${r.decidedBy?.name ?? 'a checker'} on ${date(r.decidedAt)}`;
  const said = r.comment ? `: “${r.comment}”` : '.';
  return { heading, outcome: `${r.outcome === 'returned' ? 'Returned' : 'Checked'} by ${who}${said}` };
}

/**
 * The design record's sections, in order: the page and its PDF use these titles, so a reader
 * (and tests/e2e/record-pdf.test.ts) can match them one for one.
 */
export const RECORD_SECTIONS = {
  cautions: 'Cautions',
  signOff: 'Sign-off',
  rounds: 'Rounds of checking',
  loadCase: 'Load case',
  candidates: "Candidates in the author's order",
  margins: 'Margins by mode',
  modes: "Each candidate's modes, models and warnings",
  sources: 'Data sources',
  models: 'Models used',
} as const;

/** The margin charts' axis (page and PDF alike): −100 % to +500 %; longer bars are clipped. */
export const MARGIN_CHART_RANGE = { min: -1, max: 5 } as const;
