import { useEffect, useState } from 'react';
import { Link } from 'react-router-dom';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { loadCaseSaveSchema, type LoadCaseDto } from '@shared/schemas/projects';
import type { EvaluateRequest } from '@shared/schemas/evaluate';
import { StaleBanner } from '@/components/stale-banner';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { SelectField, TextField } from '@/components/ui/field';
import { TextAreaField } from '@/components/ui/text-area';
import { Spinner } from '@/components/ui/states';
import { ApiError, isStale } from '@/lib/api-client';
import { setServerErrors } from '@/lib/field-errors';
import { useMyProjects, useSaveLoadCase } from '../api/project-links';

const LABELS = { projectId: 'Project', name: 'Name', notes: 'Notes' };

/** The dialog's own fields around the shared schema's name and notes (the load case is the checked request). */
const saveFormSchema = loadCaseSaveSchema
  .pick({ name: true, notes: true })
  .extend({ mode: z.enum(['new', 'update']), projectId: z.string() })
  .refine((v) => v.mode === 'update' || v.projectId !== '', { path: ['projectId'], message: 'Choose the project to keep it in.' });
type SaveForm = z.input<typeof saveFormSchema>;

/**
 * Saves the load case in the form to a project (or, when it was opened from one, updates that
 * saved case). What is saved is the validated request in SI, with its catalogue filters.
 */
export function SaveLoadCaseDialog({
  open,
  request,
  opened,
  purpose,
  onClose,
  onSaved,
  onReload,
}: {
  open: boolean;
  /** The validated request built from the form, or null while the dialog is closed. */
  request: EvaluateRequest | null;
  /** The saved load case the page was opened from, if any. */
  opened: LoadCaseDto | null;
  /** Why saving was asked for, when it was not the user's own choice. */
  purpose?: string;
  onClose: () => void;
  onSaved: (saved: LoadCaseDto) => void;
  /** Opens the saved load case again as it is now (after someone else changed it). */
  onReload: () => void;
}) {
  const projects = useMyProjects(open);
  const save = useSaveLoadCase();
  const form = useForm<SaveForm, unknown, z.output<typeof saveFormSchema>>({
    resolver: zodResolver(saveFormSchema),
    defaultValues: { mode: 'new', projectId: '', name: '', notes: '' },
  });
  const { errors } = form.formState;
  const mode = form.watch('mode');
  const projectId = form.watch('projectId');
  const [stale, setStale] = useState<ApiError | null>(null);

  // Start afresh each time the dialog opens (not while the user types).
  useEffect(() => {
    if (!open) return;
    save.reset();
    setStale(null);
    form.reset({ mode: 'new', projectId: opened ? String(opened.projectId) : '', name: opened ? `${opened.name} (revised)` : '', notes: opened?.notes ?? '' });
  }, [open]);

  // With a single project there is nothing to choose.
  useEffect(() => {
    if (open && !projectId && projects.data?.length === 1) form.setValue('projectId', String(projects.data[0].id));
  }, [open, projectId, projects.data]);

  const confirm = form.handleSubmit(async ({ mode, projectId, name, notes }) => {
    if (!request) return;
    setStale(null);
    const body = { name, notes, request };
    try {
      onSaved(await save.mutateAsync(mode === 'update' && opened ? { mode: 'update', loadCase: opened, ...body } : { mode: 'new', projectId: Number(projectId), ...body }));
    } catch (err) {
      if (isStale(err)) setStale(err);
      else if (err instanceof ApiError && err.code === 'frozen') form.setError('root', { type: 'server', message: `${err.message} Choose “Save as a new load case”.` });
      else setServerErrors(form.setError, err, LABELS);
    }
  });

  const noProjects = projects.data?.length === 0;
  return (
    <ConfirmDialog
      open={open}
      title="Save the load case to a project"
      confirmLabel={mode === 'update' ? 'Save changes' : 'Save load case'}
      busy={save.isPending}
      busyLabel="Saving…"
      error={errors.root?.message}
      confirmDisabled={noProjects && mode === 'new'}
      onClose={onClose}
      onConfirm={() => void confirm()}
    >
      {stale ? <StaleBanner message={stale.message} onReload={onReload} /> : null}
      {purpose ? <p className="rounded-plate bg-sounding-light px-3 py-2 text-sounding-dark">{purpose}</p> : null}
      <p className="text-ink-soft">The inputs are kept in SI with their catalogue filters; the project's members can open it in Evaluate and shortlist candidates for it.</p>
      {opened ? (
        <fieldset className="flex flex-col gap-1">
          <legend className="text-xs font-bold uppercase tracking-wide text-ink-soft">Save as</legend>
          <label className="flex items-center gap-2">
            <input type="radio" value="new" {...form.register('mode')} /> A new load case
          </label>
          <label className="flex items-center gap-2">
            <input type="radio" value="update" {...form.register('mode', { onChange: (e) => e.target.value === 'update' && form.setValue('name', opened.name) })} />{' '}
            Changes to “{opened.name}”
          </label>
        </fieldset>
      ) : null}
      {mode === 'new' ? (
        projects.isPending ? (
          <Spinner label="Loading your projects…" />
        ) : projects.isError ? (
          <p role="alert" className="text-verdict-fail">
            {projects.error instanceof ApiError ? projects.error.message : 'Your projects could not be loaded.'}
          </p>
        ) : noProjects ? (
          <p className="rounded-plate bg-sounding-light px-3 py-2 text-sounding-dark">
            You are not a member of any project yet.{' '}
            <Link to="/projects" className="font-bold underline">
              Create a project
            </Link>{' '}
            first, then save the load case to it.
          </p>
        ) : (
          <SelectField label="Project" data-autofocus error={errors.projectId?.message} {...form.register('projectId')}>
            <option value="">Choose a project…</option>
            {projects.data.map((p) => (
              <option key={p.id} value={p.id}>
                {p.name}
              </option>
            ))}
          </SelectField>
        )
      ) : null}
      <TextField label="Name" maxLength={200} error={errors.name?.message} placeholder="e.g. Forward viewport, 90° cone at 1,200 m" {...form.register('name')} />
      <TextAreaField
        label="Notes"
        maxLength={4000}
        error={errors.notes?.message}
        hint="Where the numbers come from: the seat drawing, the dive profile, the client's specification."
        {...form.register('notes')}
      />
    </ConfirmDialog>
  );
}
