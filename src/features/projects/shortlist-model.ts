import type { CandidateResult, FailureMode } from '@shared/engine';
import type { PropertySetDto } from '@shared/schemas/catalogue';
import type { Permission, Role } from '@shared/schemas/auth';
import type { ShortlistStatus } from '@shared/schemas/projects';
import { SHORTLIST_STEPS } from '@shared/workflows/shortlist';
import { inputStatusText } from '@shared/schemas/provenance';
import { allowedSteps, type RefusalCode, type WorkflowSubject } from '@shared/workflows/steps';
import { formatQuantity, unitOf, type QuantityKind, type UnitSystem } from '@/lib/units';
import { formatMargin } from '@shared/labels';

export const SHORTLIST_STATUS_LABELS: Record<ShortlistStatus, string> = {
  open: 'open',
  submitted: 'submitted',
  checked: 'checked',
  returned: 'returned',
};

export const SHORTLIST_STATUS_TONE: Record<ShortlistStatus, 'sounding' | 'brass' | 'pass' | 'fail'> = {
  open: 'sounding',
  submitted: 'brass',
  checked: 'pass',
  returned: 'fail',
};

/** The list with the entry at `index` moved by `delta` places; the same list when it cannot move. */
export function moveItem<T>(list: readonly T[], index: number, delta: -1 | 1): T[] {
  const to = index + delta;
  if (index < 0 || index >= list.length || to < 0 || to >= list.length) return [...list];
  const next = [...list];
  [next[index], next[to]] = [next[to], next[index]];
  return next;
}

export interface Viewer {
  id: number;
  role: Role;
  permissions: readonly Permission[];
}

export type DecisionState = 'allowed' | 'own-work' | 'no-role' | 'not-member' | 'not-waiting';

export interface ShortlistRights {
  /** Add, edit, remove and reorder items (the author, while open or returned). */
  canEdit: boolean;
  /** Submit for checking (the author, while open or returned, with at least one item). */
  canSubmit: boolean;
  /** Whether this person may check or return it now, and if not, why. */
  decision: DecisionState;
}

type ShortlistLike = { status: ShortlistStatus; author: { id: number }; items: readonly unknown[] };

/** The shortlist as its workflow table sees it. */
export const shortlistSubject = (shortlist: ShortlistLike, memberIds: readonly number[] | null): WorkflowSubject<ShortlistStatus> => ({
  status: shortlist.status,
  authorIds: [shortlist.author.id],
  memberIds,
  facts: { hasItems: shortlist.items.length > 0 },
});

const DECISION: Record<RefusalCode, DecisionState> = {
  'wrong-status': 'not-waiting',
  'own-work': 'own-work',
  'no-role': 'no-role',
  'not-member': 'not-member',
  'not-author': 'own-work',
  unmet: 'not-waiting',
};

/**
 * What the viewer may do with a shortlist, from the shared workflow table the server runs (it
 * checks again): only the author edits and submits; a checker who is a project member, or an
 * admin, checks, never the author.
 */
export function shortlistRights(shortlist: ShortlistLike, viewer: Viewer, memberIds: readonly number[] | null): ShortlistRights {
  const steps = allowedSteps(SHORTLIST_STEPS, shortlistSubject(shortlist, memberIds), viewer);
  const submit = steps.find((s) => s.step.name === 'submit')!;
  const check = steps.find((s) => s.step.name === 'check')!;
  const editable = shortlist.status === 'open' || shortlist.status === 'returned';
  const canEdit = shortlist.author.id === viewer.id && editable && viewer.permissions.includes('project:write');
  return { canEdit, canSubmit: canEdit && submit.allowed, decision: check.allowed ? 'allowed' : DECISION[check.code!] };
}

// ---- Side-by-side comparison ----------------------------------------------------------------

export interface ComparisonCell {
  text: string;
  mode?: FailureMode;
  margin?: number;
  warnings?: string[];
}

export interface ComparisonRow {
  key: string;
  label: string;
  /** Unit of the cells, in the shown system (none for ratios and words). */
  unit?: string;
  cells: ComparisonCell[];
}

export interface ComparedCandidate {
  propertySet: PropertySetDto;
  result: CandidateResult | null;
}

const NONE: ComparisonCell = { text: '—' };

/**
 * Rows of the side-by-side table, one cell per candidate in shortlist order, in the shown units.
 * Yield rows appear only when some candidate has a yield (metals).
 */
export function comparisonRows(candidates: readonly ComparedCandidate[], system: UnitSystem): ComparisonRow[] {
  const quantity = (key: keyof PropertySetDto & string, label: string, kind: QuantityKind): ComparisonRow => ({
    key,
    label,
    unit: unitOf(kind, system).label,
    cells: candidates.map((c) => {
      const v = c.propertySet[key] as number | null;
      return v === null || v === undefined ? NONE : { text: formatQuantity(kind, system, v, { unit: false }) };
    }),
  });
  const result = (key: string, label: string, cell: (r: CandidateResult) => ComparisonCell, unit?: string): ComparisonRow => ({
    key,
    label,
    ...(unit ? { unit } : {}),
    cells: candidates.map((c) => (c.result ? cell(c.result) : NONE)),
  });
  const anyYield = (k: 'tensileYield' | 'compressiveYield') => candidates.some((c) => c.propertySet[k] !== null && c.propertySet[k] !== undefined);

  return [
    quantity('density', 'Density', 'density'),
    quantity('youngsModulus', "Young's modulus", 'modulus'),
    quantity('tensileStrength', 'Tensile strength', 'stress'),
    ...(anyYield('tensileYield') ? [quantity('tensileYield', 'Tensile yield', 'stress')] : []),
    quantity('compressiveStrength', 'Compressive strength', 'stress'),
    ...(anyYield('compressiveYield') ? [quantity('compressiveYield', 'Compressive yield', 'stress')] : []),
    quantity('shearStrength', 'Shear strength', 'stress'),
    result('governingMode', 'Governing mode', (r) => ({ text: r.governingMode, mode: r.governingMode })),
    result('safetyFactor', 'Safety factor', (r) => ({ text: r.safetyFactor.toFixed(2) })),
    result('targetSafetyFactor', 'Target safety factor', (r) => ({ text: r.targetSafetyFactor.toFixed(2) })),
    result('margin', 'Margin', (r) => ({ text: formatMargin(r.margin), margin: r.margin })),
    result(
      'requiredThickness',
      'Required thickness',
      (r) => ({ text: r.requiredThickness === null ? 'none suffices' : formatQuantity('length', system, r.requiredThickness, { unit: false }) }),
      unitOf('length', system).label,
    ),
    result('massPerArea', 'Mass per area', (r) => ({ text: formatQuantity('massPerArea', system, r.massPerArea, { unit: false }) }), unitOf('massPerArea', system).label),
    result('inputs', 'Inputs confirmed', (r) => ({ text: r.inputs ? inputStatusText(r.inputs) : '—' })),
    result('warnings', 'Warnings', (r) => ({ text: r.warnings.length ? `${r.warnings.length}` : 'none', warnings: r.warnings })),
  ];
}
