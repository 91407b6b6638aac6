import type { ReactNode } from 'react';
import type { UseFormReturn } from 'react-hook-form';
import type { DraftInput } from '@shared/schemas/library';
import type { DraftForm } from '../draft-form';

/** What each part of the property-set editor gets: the form (typed values in, SI draft out) and its error at a path. */
export interface SetEditorSectionProps {
  form: UseFormReturn<DraftForm, unknown, DraftInput>;
  err: (path: string) => string | undefined;
}

/** One titled part of the property-set editor. */
export function Fieldset({ legend, children, hint }: { legend: string; children: ReactNode; hint?: ReactNode }) {
  return (
    <fieldset className="flex flex-col gap-3">
      <legend className="mb-2 text-xs font-bold uppercase tracking-wide text-sounding-dark">{legend}</legend>
      {hint ? <p className="-mt-2 text-xs text-ink-soft">{hint}</p> : null}
      {children}
    </fieldset>
  );
}
