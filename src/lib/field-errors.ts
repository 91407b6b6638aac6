import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { ApiError } from './api-client';

/**
 * The server names bad fields with either a sentence ("Use at least 12 characters") or a
 * fragment that reads after the field's name ("is not right"). Shown under a field, a fragment
 * gets the field's label in front so it reads as a sentence.
 */
export function fieldSentence(label: string, message: string): string {
  const text = message.trim();
  if (!text) return `${label} is not valid.`;
  const first = text[0];
  const sentence = first === first.toLowerCase() && first !== first.toUpperCase() ? `${label} ${text}` : text;
  return /[.!?]$/.test(sentence) ? sentence : `${sentence}.`;
}

export interface MappedErrors<K extends string> {
  /** Messages for the form's own fields. */
  fields: Partial<Record<K, string>>;
  /** What to show above the buttons: the server's message when no field took it, plus fields the form does not have. */
  root: string | null;
}

/** Each form field's label by field path, or a function giving it (undefined: the form has no such field). */
export type FieldLabels<K extends string> = Record<K, string> | ((field: string) => string | undefined);

/**
 * Maps an error from the api client onto a form: `known` gives each form field's label, keyed by
 * the server's field path, or by the form's path that `fieldOf` makes of it. Anything the form
 * cannot place goes to `root`, so nothing is lost.
 */
export function mapServerErrors<K extends string>(error: unknown, known: FieldLabels<K>, fieldOf: (path: string) => string = (p) => p): MappedErrors<K> {
  if (!(error instanceof ApiError)) return { fields: {}, root: 'The server did not answer. Check your connection and try again.' };
  const labelOf = (key: string) => (typeof known === 'function' ? known(key) : Object.prototype.hasOwnProperty.call(known, key) ? known[key as K] : undefined);
  const fields: Partial<Record<K, string>> = {};
  const rest: string[] = [];
  for (const [path, message] of Object.entries(error.fields)) {
    const key = fieldOf(path) as K;
    const label = labelOf(key);
    if (label !== undefined) fields[key] ??= fieldSentence(label, message);
    else rest.push(fieldSentence(path, message));
  }
  const placed = Object.keys(fields).length > 0;
  const root = [placed && !rest.length ? null : error.message, ...rest].filter(Boolean).join(' ');
  return { fields, root: root || null };
}

/**
 * How every form shows a refused save: the server's field errors on the react-hook-form fields
 * they name (mapServerErrors), the rest as the form's root error (`formState.errors.root`), which
 * the next submit clears.
 */
export function setServerErrors<T extends FieldValues>(
  setError: UseFormSetError<T>,
  error: unknown,
  known: FieldLabels<string>,
  fieldOf?: (path: string) => string,
): void {
  const { fields, root } = mapServerErrors(error, known, fieldOf);
  for (const [field, message] of Object.entries(fields)) setError(field as Path<T>, { type: 'server', message: message as string });
  if (root) setError('root', { type: 'server', message: root });
}
