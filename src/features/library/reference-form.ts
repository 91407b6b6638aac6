import { referenceInputSchema, type ReferenceDto, type ReferenceInput, type ReferenceKind } from '@shared/schemas/catalogue';
import { checkedFormSchema } from '@/lib/form-schema';
import { issueMessage, parseNumber } from './draft-form';

/** The reference form as typed (the year is text until checked). */
export interface ReferenceForm {
  kind: ReferenceKind | '';
  title: string;
  authors: string;
  year: string;
  identifier: string;
  location: string;
  note: string;
}

export const emptyReferenceForm = (): ReferenceForm => ({ kind: '', title: '', authors: '', year: '', identifier: '', location: '', note: '' });

/** The form holding a reference's citation (a reference, or one of its versions). */
export function referenceFormFrom(r: Pick<ReferenceDto, 'kind' | 'title' | 'authors' | 'year' | 'identifier' | 'location' | 'note'> & Partial<ReferenceDto>): ReferenceForm {
  return {
    kind: r.kind,
    title: r.title,
    authors: r.authors ?? '',
    year: r.year === null ? '' : String(r.year),
    identifier: r.identifier ?? '',
    location: r.location ?? '',
    note: r.note ?? '',
  };
}

const optional = (s: string) => (s.trim() === '' ? undefined : s.trim());

export type ReferenceCheck = { ok: true; input: ReferenceInput } | { ok: false; errors: Partial<Record<keyof ReferenceForm | 'root', string>> };

/** Checks the form through the shared reference schema. */
export function checkReferenceForm(form: ReferenceForm): ReferenceCheck {
  const errors: Partial<Record<keyof ReferenceForm | 'root', string>> = {};
  const year = parseNumber(form.year);
  if (year !== undefined && !Number.isFinite(year)) errors.year = 'Enter a year, e.g. 2024';
  const parsed = referenceInputSchema.strict().safeParse({
    kind: form.kind === '' ? undefined : form.kind,
    title: form.title,
    authors: optional(form.authors),
    year,
    identifier: optional(form.identifier),
    location: optional(form.location),
    note: optional(form.note),
  });
  if (parsed.success && !errors.year) return { ok: true, input: parsed.data };
  if (!parsed.success) {
    for (const issue of parsed.error.issues) {
      const key = String(issue.path[0] ?? 'root') as keyof ReferenceForm | 'root';
      errors[key in emptyReferenceForm() ? key : 'root'] ??= issue.code === 'invalid_type' && key === 'year' ? 'Enter a whole year' : issueMessage(issue);
    }
  }
  return { ok: false, errors };
}

/** The reference form's zod schema for zodResolver: the typed form in, the reference input out. */
export const referenceFormSchema = checkedFormSchema((form: ReferenceForm) => {
  const check = checkReferenceForm(form);
  return check.ok ? { ok: true, value: check.input } : check;
});

/** Each field's label (also the path under "reference." in a draft's new reference). */
export const REFERENCE_FIELD_LABELS: Record<keyof ReferenceForm, string> = {
  kind: 'Kind',
  title: 'Title',
  authors: 'Authors or issuer',
  year: 'Year',
  identifier: 'Identifier',
  location: 'Table or page',
  note: 'Note',
};
