import { useEffect, useMemo, useRef, useState, type ReactNode } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { useLocation, useNavigate } from 'react-router-dom';
import { get, useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { DraftInput, LibrarySetDto } from '@shared/schemas/library';
import { StaleBanner } from '@/components/stale-banner';
import { Button } from '@/components/ui/button';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { FormError } from '@/components/ui/form-error';
import { Panel } from '@/components/ui/states';
import { ApiError, isStale } from '@/lib/api-client';
import { setServerErrors } from '@/lib/field-errors';
import { useUnits } from '@/lib/unit-system';
import { librarySetQueryOptions, useCreateDraft, useSaveDraft, useSetStep } from '../api/library-sets';
import { fieldLabel } from '../changes';
import { convertDraftForm, draftFormSchema, emptyDraftForm, formFromSet, formPathFor, type DraftForm } from '../draft-form';
import { SetHistory } from './set-history';
import { MaterialSection, ReferenceSection } from './set-source-fields';
import { DependenceSection, ValuesSection } from './set-values-editor';
import { StatusSection } from './set-status-editor';
import type { SetEditorSectionProps } from './set-editor-fieldset';

/** The editor's sections, top to bottom, each in its own panel. */
const SECTIONS: ((props: SetEditorSectionProps) => ReactNode)[] = [MaterialSection, ReferenceSection, ValuesSection, DependenceSection, StatusSection];

type Banner = { tone: 'error' | 'info'; message: string } | null;

/** A server field error's words, for each form path but the form as a whole. */
const draftLabel = (field: string) => (field === 'root' ? undefined : fieldLabel(field));

/**
 * Draft a new property set or edit a draft. The form holds the numbers in the units on screen;
 * the draft is sent in SI. A stale save (someone else saved first) keeps the user's edits.
 */
export function SetEditor({ set }: { set?: LibrarySetDto }) {
  const { system } = useUnits();
  const systemRef = useRef(system);
  const navigate = useNavigate();
  const location = useLocation();
  const qc = useQueryClient();
  const [lockVersion, setLockVersion] = useState(set?.lockVersion ?? 0);
  const [banner, setBanner] = useState<Banner>(() => {
    const notice = (location.state as { notice?: string } | null)?.notice;
    return notice ? { tone: 'error', message: notice } : null;
  });
  const [stale, setStale] = useState<ApiError | null>(null);
  useEffect(() => {
    // The notice is for this arrival only; a reload should not show it again.
    if ((location.state as { notice?: string } | null)?.notice) navigate(location.pathname, { replace: true, state: null });
  }, [location, navigate]);
  const [confirmSubmit, setConfirmSubmit] = useState(false);
  const [submitError, setSubmitError] = useState<string | null>(null);

  // Numbers left as shown keep the values of the set as loaded; the units are those of the moment.
  const resolver = useMemo(() => zodResolver(draftFormSchema(() => systemRef.current, set)), [set]);
  const form = useForm<DraftForm, unknown, DraftInput>({
    resolver,
    defaultValues: set ? formFromSet(set, system) : emptyDraftForm(),
    mode: 'onSubmit',
    reValidateMode: 'onChange',
  });
  const { formState, getValues, reset } = form;
  const dirty = formState.isDirty;

  // Switching units converts what is typed, so the set stays the same.
  useEffect(() => {
    if (systemRef.current !== system) {
      reset(convertDraftForm(getValues(), systemRef.current, system), { keepDirty: true });
      systemRef.current = system;
    }
  }, [system, reset, getValues]);

  const create = useCreateDraft();
  const save = useSaveDraft();
  const step = useSetStep();
  const saving = create.isPending || save.isPending;
  const busy = saving || step.isPending;

  const err = (path: string) => (get(formState.errors, path) as { message?: string } | undefined)?.message;

  /** Saves the checked draft; the saved set, or null when the server refused it. */
  async function persist(draft: DraftInput): Promise<LibrarySetDto | null> {
    setBanner(null);
    setStale(null);
    try {
      const saved = set ? await save.mutateAsync({ id: set.id, lockVersion, draft }) : await create.mutateAsync(draft);
      setLockVersion(saved.lockVersion);
      // New materials and references now exist: from here on the form points at them.
      reset(formFromSet(saved, system));
      return saved;
    } catch (e) {
      if (isStale(e)) setStale(e);
      else setServerErrors(form.setError, e, draftLabel, formPathFor);
      return null;
    }
  }

  const onSave = form.handleSubmit(async (draft) => {
    const saved = await persist(draft);
    if (!saved) return;
    if (!set) navigate(`/library/sets/${saved.id}`, { replace: true });
    else setBanner({ tone: 'info', message: `Draft saved at ${new Date().toLocaleTimeString('en-GB', { hour: '2-digit', minute: '2-digit' })}.` });
  });

  const askSubmit = form.handleSubmit(() => {
    setSubmitError(null);
    setConfirmSubmit(true);
  });

  const saveAndSubmit = form.handleSubmit(
    async (draft) => {
      setSubmitError(null);
      // Nothing typed since the last save: submit that version as it is.
      const saved = set && !dirty ? { ...set, lockVersion } : await persist(draft);
      if (!saved) {
        setConfirmSubmit(false);
        return;
      }
      try {
        await step.mutateAsync({ step: 'submit', id: saved.id, lockVersion: saved.lockVersion });
      } catch (e) {
        const message = e instanceof ApiError ? e.message : 'The set could not be submitted.';
        // Saved, not submitted: a new set goes to its own page, which says so.
        if (!set) navigate(`/library/sets/${saved.id}`, { replace: true, state: { notice: `Saved as a draft, not submitted: ${message}` } });
        else setSubmitError(message);
        return;
      }
      setConfirmSubmit(false);
      await qc.invalidateQueries({ queryKey: librarySetQueryOptions(saved.id).queryKey });
      navigate(`/library/sets/${saved.id}`, { replace: true });
    },
    () => setConfirmSubmit(false),
  );

  async function reloadSaved() {
    if (!set) return;
    const fresh = await qc.fetchQuery({ ...librarySetQueryOptions(set.id), staleTime: 0 });
    setLockVersion(fresh.lockVersion);
    reset(formFromSet(fresh, system));
    setStale(null);
    setBanner(fresh.status === 'draft' ? { tone: 'info', message: 'Loaded the saved version.' } : null);
  }

  return (
    <>
      <form onSubmit={onSave} noValidate aria-label="Property set" className="grid gap-5 lg:grid-cols-[1fr_18rem]">
        <div className="flex min-w-0 flex-col gap-4">
          {set?.returnedComment ? (
            <div role="note" className="rounded-plate border border-brass/40 bg-brass-light px-4 py-3 text-sm" data-testid="returned-comment">
              <p className="font-bold text-brass">Returned by the reviewer</p>
              <p className="mt-1 whitespace-pre-line">{set.returnedComment}</p>
            </div>
          ) : null}
          {SECTIONS.map((Section, i) => (
            <Panel key={i}>
              <Section form={form} err={err} />
            </Panel>
          ))}
        </div>

        <aside className="flex flex-col gap-4 lg:sticky lg:top-4 lg:self-start" aria-label="Draft actions">
          <Panel title="Draft" className="no-print">
            <div className="flex flex-col gap-3">
              {stale ? (
                <StaleBanner testId="editor-banner" message={stale.message} onReload={() => void reloadSaved()} />
              ) : banner ? (
                <div
                  role={banner.tone === 'error' ? 'alert' : 'status'}
                  data-testid="editor-banner"
                  className={`rounded-plate border px-3 py-2 text-sm ${banner.tone === 'error' ? 'border-verdict-fail/40 bg-white text-verdict-fail' : 'border-verdict-pass/30 bg-white text-verdict-pass'}`}
                >
                  <p>{banner.message}</p>
                </div>
              ) : null}
              {Object.keys(formState.errors).length ? <FormError message={err('root') ?? 'Some fields need attention; each says what is wrong.'} /> : null}
              <Button type="submit" disabled={busy}>
                {saving && !confirmSubmit ? 'Saving…' : 'Save draft'}
              </Button>
              <Button tone="quiet" onClick={() => void askSubmit()} disabled={busy}>
                Submit for review…
              </Button>
              <p className="text-xs text-ink-soft">A second librarian must approve the set before it reaches the catalogue.</p>
            </div>
          </Panel>
          {set ? <SetHistory set={set} /> : null}
        </aside>
      </form>

      <ConfirmDialog
        open={confirmSubmit}
        title="Submit for review?"
        confirmLabel="Save and submit"
        busy={busy}
        busyLabel="Submitting…"
        error={submitError}
        onClose={() => setConfirmSubmit(false)}
        onConfirm={() => void saveAndSubmit()}
      >
        <p>
          The draft is saved and sent to the other librarians, who get an e-mail. You cannot edit it while it is in review; a reviewer approves it
          or returns it to you with a comment.
        </p>
        {form.watch('referenceMode') === 'none' ? <p className="font-bold text-brass">It has no reference yet, so it cannot be approved.</p> : null}
      </ConfirmDialog>
    </>
  );
}
