/** How audit entries read in the log. */

const ENTITY_LABELS: Record<string, string> = {
  'property-set': 'Property set',
  'rating-table': 'Rating table',
  reference: 'Reference',
  'reference-version': 'Reference change',
  material: 'Material',
  import: 'CSV import',
  user: 'User',
  project: 'Project',
  'load-case': 'Load case',
  shortlist: 'Shortlist',
  'value-confirmation': 'Value confirmation',
};

export const entityLabel = (type: string) => ENTITY_LABELS[type] ?? type;

/** Where an entity can be looked at in the app, when it has a page. */
export function entityHref(type: string, id: string | null): string | null {
  if (!id) return null;
  if (type === 'property-set') return `/library/sets/${encodeURIComponent(id)}`;
  if (type === 'material') return `/materials/${encodeURIComponent(id)}`;
  if (type === 'reference') return `/library/references/${encodeURIComponent(id)}`;
  if (type === 'rating-table') return `/library/rating-tables/${encodeURIComponent(id)}`;
  if (type === 'project') return `/projects/${encodeURIComponent(id)}`;
  if (type === 'shortlist') return `/shortlists/${encodeURIComponent(id)}`;
  return null;
}

/** Pretty JSON for the before/after panes; "nothing" for an absent side (a creation has no before). */
export function formatState(value: unknown): string {
  if (value === null || value === undefined) return 'nothing';
  return JSON.stringify(value, null, 2);
}

/** Top-level keys whose values differ between before and after (for a one-line summary). */
export function changedKeys(before: unknown, after: unknown): string[] {
  const isObj = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);
  if (!isObj(before) || !isObj(after)) return [];
  const keys = new Set([...Object.keys(before), ...Object.keys(after)]);
  return [...keys].filter((k) => JSON.stringify(before[k]) !== JSON.stringify(after[k])).sort();
}
