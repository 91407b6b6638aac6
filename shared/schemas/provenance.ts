/**
 * The status of each value of a property set, stored with the set (column `provenance`):
 * confirmed against the cited source (who, when, approved by whom, and the location quoted —
 * table, page, figure or clause), recalled (not confirmed), derived (computed from other values by
 * a named rule) or demo (invented for the Harrow Sound demonstration). A value with no entry is
 * recalled. Confirming is reviewed: a draft may claim "confirmed" with a location, which the set's
 * approver checks; on a published set a value is confirmed through its own four-eyes step.
 */
import { z } from 'zod';
import { QUANTITIES, QUANTITY_LABELS, type Quantity } from './quantities';

/** Every value that carries a status: the scalar quantities, the service range and the three curves. */
export const PROVENANCE_KEYS = [...QUANTITIES, 'serviceTemperature', 'temperatureFactors', 'sustainedLoadFactors', 'cyclicFactors'] as const;
export type ProvenanceKey = (typeof PROVENANCE_KEYS)[number];

export const PROVENANCE_LABELS: Record<ProvenanceKey, string> = {
  ...QUANTITY_LABELS,
  serviceTemperature: 'Service temperature range',
  temperatureFactors: 'Temperature factors',
  sustainedLoadFactors: 'Sustained-load factors',
  cyclicFactors: 'Cyclic factors',
};

export const VALUE_STATUSES = ['confirmed', 'recalled', 'derived', 'demo'] as const;
export type ValueStatus = (typeof VALUE_STATUSES)[number];
export const valueStatusSchema = z.enum(VALUE_STATUSES);

export const VALUE_STATUS_LABELS: Record<ValueStatus, string> = {
  confirmed: 'confirmed',
  recalled: 'recalled, not confirmed',
  derived: 'derived',
  demo: 'demo data',
};

const text = (max: number) => z.string().trim().min(2, 'must say something').max(max, `must be at most ${max} characters`);
/** A person of the team, or (no id) the check that produced the seed catalogue. */
const person = z.object({ id: z.number().int().positive().optional(), name: z.string().max(200) });

/** What a librarian writes for one value (a draft, the CSV import, a confirmation request). */
const statusInputShape = {
  status: valueStatusSchema,
  /** Where in the cited source the value stands: table, page, figure or clause (required to confirm). */
  location: text(300).optional(),
  /** Another public source, when it is not the set's own reference that shows the value. */
  source: text(300).optional(),
  /** The rule a derived value comes from, e.g. "shear yield = tensile yield/√3 (von Mises)". */
  rule: text(200).optional(),
};

const needs = <T extends { status: ValueStatus; location?: string; rule?: string }>(v: T, ctx: z.RefinementCtx) => {
  if (v.status === 'confirmed' && !v.location) ctx.addIssue({ code: 'custom', path: ['location'], message: 'is required for a confirmed value (table, page, figure or clause)' });
  if (v.status === 'derived' && !v.rule) ctx.addIssue({ code: 'custom', path: ['rule'], message: 'is required for a derived value (the rule it comes from)' });
};

export const valueStatusInputSchema = z.strictObject(statusInputShape).superRefine(needs);
export type ValueStatusInput = z.infer<typeof valueStatusInputSchema>;

/** As stored and sent: the input plus who confirmed it and who approved that, set by the server. */
export const valueStatusRecordSchema = z
  .strictObject({ ...statusInputShape, confirmedBy: person.optional(), confirmedAt: z.string().optional(), approvedBy: person.optional() })
  .superRefine(needs);
export type ValueStatusRecord = z.infer<typeof valueStatusRecordSchema>;

export const provenanceInputSchema = z.partialRecord(z.enum(PROVENANCE_KEYS), valueStatusInputSchema).default({});
export type ProvenanceInput = z.infer<typeof provenanceInputSchema>;
export type Provenance = Partial<Record<ProvenanceKey, ValueStatusRecord>>;

/** The status of one value; a value with no entry is recalled. */
export const statusOf = (p: Provenance | undefined, key: ProvenanceKey): ValueStatus => p?.[key]?.status ?? 'recalled';

/** The values a set actually has (optional quantities only when given; curves only when not empty). */
export function presentKeys(set: Partial<Record<Quantity, number | null | undefined>> & { temperatureFactors?: readonly unknown[]; sustainedLoadFactors?: readonly unknown[]; cyclicFactors?: readonly unknown[] }): ProvenanceKey[] {
  const out: ProvenanceKey[] = QUANTITIES.filter((q) => set[q] !== null && set[q] !== undefined);
  out.push('serviceTemperature');
  for (const k of ['temperatureFactors', 'sustainedLoadFactors', 'cyclicFactors'] as const) if (set[k]?.length) out.push(k);
  return out;
}

/** How many of the given values are confirmed, which are not, and whether any is demo data. */
export interface InputStatus {
  confirmed: number;
  total: number;
  /** Values not confirmed, with their status (recalled, derived or demo). */
  unconfirmed: { key: ProvenanceKey; status: ValueStatus }[];
  demo: boolean;
}

export function inputStatus(p: Provenance | undefined, keys: readonly ProvenanceKey[]): InputStatus {
  const unconfirmed = keys.map((key) => ({ key, status: statusOf(p, key) })).filter((v) => v.status !== 'confirmed');
  return { confirmed: keys.length - unconfirmed.length, total: keys.length, unconfirmed, demo: unconfirmed.some((v) => v.status === 'demo') };
}

/** "5 of 7 inputs confirmed", for a compact mark. */
export const inputStatusText = (s: InputStatus) => `${s.confirmed} of ${s.total} input${s.total === 1 ? '' : 's'} confirmed${s.demo ? ' · demo data' : ''}`;

/** The values the calculation uses for a candidate (elongation and transmittance are only shown). */
export function engineInputKeys(set: Parameters<typeof presentKeys>[0]): ProvenanceKey[] {
  return presentKeys(set).filter((k) => k !== 'elongation' && k !== 'luminousTransmittance');
}

/** Each input the calculation uses, with its status and where it was confirmed or how derived, for records. */
export function describeInputs(set: Parameters<typeof presentKeys>[0] & { provenance?: Provenance }): { key: ProvenanceKey; label: string; status: ValueStatus; detail: string }[] {
  return engineInputKeys(set).map((key) => {
    const e = set.provenance?.[key];
    const status = e?.status ?? 'recalled';
    const who = e?.confirmedBy ? `confirmed by ${e.confirmedBy.name}${e.approvedBy ? `, approved by ${e.approvedBy.name}` : ''}` : '';
    const detail = status === 'confirmed' ? [e?.location, e?.source, who].filter(Boolean).join('; ') : status === 'derived' ? (e?.rule ?? '') : '';
    return { key, label: PROVENANCE_LABELS[key], status, detail };
  });
}
