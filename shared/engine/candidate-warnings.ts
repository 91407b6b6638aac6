/**
 * Warnings a candidate's result carries about what the models leave out: creep, brittle windows,
 * unrated acrylic windows, the fallback target and human occupancy without a window rule.
 */
import type { CandidateMaterial } from './types';

export const CREEP_MODULUS_WARNING =
  "Buckling and deflection use the short-term Young's modulus; creep under sustained load lowers the effective modulus of " +
  'polymers, so buckling margins and deflections shown here are not conservative.';

export const FALLBACK_TARGET_WARNING =
  'No family given and no target safety factor in the load case: the most cautious family default was used as the target (common practice).';

export const BRITTLE_WINDOW_WARNING =
  'Brittle window material in a bearing seat: glass and ceramics fail by contact fracture where the window bears on its seat (edge chipping ' +
  'and cracks from local contact stresses, which these models do not compute) and lose strength under sustained stress in water (static ' +
  'fatigue). Seat fit, gaskets and proof testing decide them; defer to the applicable standard and to tests.';

export const ACRYLIC_UNRATED_WARNING =
  'No published rating table covers this acrylic set for this window geometry: it is sized by the analytical modes alone. Window rules ' +
  "can ask for more: below about 20 bar the classification rules' flat-window table needs up to 45 % more thickness (at 5 bar) than " +
  "a safety factor of 4 on short-term strength gives. Enter your standard's tables as rating tables.";

/** The warning of a window under human occupancy that no window rule covers (first in its list). */
export function uncoveredWarning(family: CandidateMaterial['family'], outsideTable: boolean): string {
  const base = outsideTable
    ? 'HUMAN OCCUPANCY: this load case is outside the rating table that covers this window, so no window rule covers it here'
    : 'HUMAN OCCUPANCY: no window rule in the catalogue covers this material and geometry';
  const tail =
    family && family !== 'acrylic'
      ? `; the pressure-window standards' tables are written for acrylic, and ${family.replace('-', ' ')} windows for crewed service need a qualification of their own.`
      : '.';
  return `${base}${tail} It ranks below covered candidates; do not use it for crewed service without the approval of the applicable rules.`;
}
