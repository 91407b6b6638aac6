import {
  confirmationProposalSchema,
  PROVENANCE_KEYS,
  presentKeys,
  statusOf,
  type ConfirmationProposal,
  type ProvenanceKey,
  type ValueConfirmationDto,
  type ValueStatus,
} from '@shared/schemas/provenance';
import type { PropertySetDto } from '@shared/schemas/catalogue';
import { checkedFormSchema, type FormCheck } from '@/lib/form-schema';
import { issueMessage, parseNumber } from './draft-form';

/**
 * The form that proposes confirming one value of a published set, as typed: the value chosen,
 * where the cited source shows it, optionally another source, and the page of the reference's
 * stored document (text until checked). Checked by the shared `confirmationProposalSchema`.
 */
export interface ConfirmationForm {
  key: ProvenanceKey | '';
  location: string;
  source: string;
  documentPage: string;
}

export const emptyConfirmationForm = (): ConfirmationForm => ({ key: '', location: '', source: '', documentPage: '' });

/** Each field's label, keyed as the server names the fields of a refused proposal. */
export const CONFIRMATION_FIELD_LABELS: Record<keyof ConfirmationForm, string> = {
  key: 'Value',
  location: 'Where the source shows it',
  source: 'Other source',
  documentPage: 'Page of the stored document',
};

const MESSAGES: Partial<Record<keyof ConfirmationForm, string>> = {
  key: 'Choose one of the set’s values.',
  location: 'Say where the source shows the value: table, page, figure or clause.',
};

const optional = (s: string) => (s.trim() === '' ? undefined : s.trim());

/** Builds the proposal from the form and checks it with the shared schema. */
export function checkConfirmationForm(form: ConfirmationForm): FormCheck<ConfirmationProposal> {
  const errors: Partial<Record<keyof ConfirmationForm, string>> = {};
  const page = parseNumber(form.documentPage);
  if (page !== undefined && !Number.isFinite(page)) errors.documentPage = 'Enter a page number, e.g. 41';
  const parsed = confirmationProposalSchema.safeParse({
    key: form.key === '' ? undefined : form.key,
    location: form.location.trim(),
    source: optional(form.source),
    documentPage: page !== undefined && Number.isFinite(page) ? page : undefined,
  });
  if (!parsed.success) {
    for (const issue of parsed.error.issues) {
      const field = String(issue.path[0] ?? '') as keyof ConfirmationForm;
      if (!(field in CONFIRMATION_FIELD_LABELS)) continue;
      const blank = field === 'key' ? form.key === '' : field === 'location' && form.location.trim() === '';
      errors[field] ??= blank ? MESSAGES[field]! : field === 'documentPage' ? 'Enter a whole page number, 1 to 100,000' : issueMessage(issue);
    }
  }
  if (parsed.success && Object.keys(errors).length === 0) return { ok: true, value: parsed.data };
  return { ok: false, errors: Object.keys(errors).length ? errors : { root: 'The proposal could not be checked.' } };
}

/** The proposal form's zod schema for zodResolver: the typed form in, the proposal out. */
export const confirmationFormSchema = checkedFormSchema(checkConfirmationForm);

/** One value the form may offer: its current status, and whether a proposal for it already waits. */
export interface ConfirmableValue {
  key: ProvenanceKey;
  status: ValueStatus;
  /** A confirmation of this value waits for review: the server takes one at a time. */
  waiting: boolean;
}

/**
 * The set's values that are not confirmed yet, in the order of the value table, each with its
 * status and whether a proposal waits for it.
 */
export function confirmableValues(set: PropertySetDto, confirmations: readonly Pick<ValueConfirmationDto, 'key' | 'status'>[]): ConfirmableValue[] {
  const present = new Set(presentKeys(set));
  const waiting = new Set(confirmations.filter((c) => c.status === 'proposed').map((c) => c.key));
  return PROVENANCE_KEYS.filter((k) => present.has(k) && statusOf(set.provenance, k) !== 'confirmed').map((key) => ({
    key,
    status: statusOf(set.provenance, key),
    waiting: waiting.has(key),
  }));
}
