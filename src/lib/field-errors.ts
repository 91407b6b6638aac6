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

/**
 * Maps an error from the api client onto a form: `known` gives each form field's label, keyed by
 * the server's field path. Anything the form cannot place goes to `root`, so nothing is lost.
 */
export function mapServerErrors<K extends string>(error: unknown, known: Record<K, string>): MappedErrors<K> {
  if (!(error instanceof ApiError)) return { fields: {}, root: 'The server did not answer. Check your connection and try again.' };
  const fields: Partial<Record<K, string>> = {};
  const rest: string[] = [];
  for (const [path, message] of Object.entries(error.fields)) {
    if (Object.prototype.hasOwnProperty.call(known, path)) {
      const key = path as K;
      fields[key] ??= fieldSentence(known[key], message);
    } else {
      rest.push(fieldSentence(path, message));
    }
  }
  const placed = Object.keys(fields).length > 0;
  const root = [placed && !rest.length ? null : error.message, ...rest].filter(Boolean).join(' ');
  return { fields, root: root || null };
}
