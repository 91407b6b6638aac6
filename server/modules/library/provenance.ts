// The status of a set's values across the desk's steps: a draft's claim that a value is
// confirmed (with its location) is approved with the set, by its four-eyes reviewer; an edit
// keeps an earlier approval only for a value and a claim that did not change.
import type { PropertySet } from '../../db/models';
import { PROVENANCE_KEYS, type Provenance, type ProvenanceKey, type ValueStatusRecord } from '../../../shared/schemas/provenance';

type Values = Pick<PropertySet, 'serviceTempMin' | 'serviceTempMax' | 'temperatureFactors' | 'sustainedLoadFactors' | 'cyclicFactors'>;

const valueOf = (v: Values, key: ProvenanceKey): string => JSON.stringify(key === 'serviceTemperature' ? [v.serviceTempMin, v.serviceTempMax] : ((v as unknown as Record<string, unknown>)[key] ?? null));
const claim = (r: ValueStatusRecord | undefined) => JSON.stringify(r ? [r.status, r.location ?? null, r.source ?? null, r.rule ?? null] : null);

/** The provenance of an edited draft: the new claims, with an earlier approval kept where neither the value nor the claim changed. */
export function keepApprovals(stored: Values & { provenance: Provenance }, next: Values & { provenance: Provenance }): Provenance {
  const out: Provenance = {};
  for (const key of PROVENANCE_KEYS) {
    const entry = next.provenance[key];
    if (!entry) continue;
    const old = stored.provenance?.[key];
    out[key] = old?.approvedBy && claim(old) === claim(entry) && valueOf(stored, key) === valueOf(next, key) ? old : entry;
  }
  return out;
}

/** On approval of the set: every confirmed value not yet approved is confirmed by its author and approved by the reviewer. */
export function stampConfirmations(p: Provenance, author: { id: number; name: string }, approver: { id: number; name: string }, now: Date): Provenance {
  const out: Provenance = {};
  for (const [key, entry] of Object.entries(p) as [ProvenanceKey, ValueStatusRecord][]) {
    out[key] = entry.status === 'confirmed' && !entry.approvedBy ? { ...entry, confirmedBy: author, confirmedAt: now.toISOString(), approvedBy: approver } : entry;
  }
  return out;
}
