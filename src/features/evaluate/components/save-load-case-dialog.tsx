import { useEffect, useState } from 'react';
import { Link } from 'react-router-dom';
import { loadCaseSaveSchema, type LoadCaseDto } from '@shared/schemas/projects';
import type { EvaluateRequest } from '@shared/schemas/evaluate';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { SelectField, TextField } from '@/components/ui/field';
import { TextAreaField } from '@/components/ui/text-area';
import { Spinner } from '@/components/ui/states';
import { ApiError } from '@/lib/api-client';
import { mapServerErrors } from '@/lib/field-errors';
import { useMyProjects, useSaveLoadCase } from '../api/project-links';

type Field = 'projectId' | 'name' | 'notes';
const LABELS: Record<Field, string> = { projectId: 'Project', name: 'Name', notes: 'Notes' };

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
}) {
  const projects = useMyProjects(open);
  const save = useSaveLoadCase();
  const [mode, setMode] = useState<'new' | 'update'>('new');
  const [projectId, setProjectId] = useState('');
  const [name, setName] = useState('');
  const [notes, setNotes] = useState('');
  const [errors, setErrors] = useState<Partial<Record<Field, string>> & { root?: string | null }>({});

  // Start afresh each time the dialog opens (not while the user types).
  useEffect(() => {
    if (!open) return;
    save.reset();
    setErrors({});
    setMode('new');
    setProjectId(opened ? String(opened.projectId) : '');
    setName(opened ? `${opened.name} (revised)` : '');
    setNotes(opened?.notes ?? '');
  }, [open]);

  // With a single project there is nothing to choose.
  useEffect(() => {
    if (open && !projectId && projects.data?.length === 1) setProjectId(String(projects.data[0].id));
  }, [open, projectId, projects.data]);

  const confirm = () => {
    if (!request) return;
    const next: typeof errors = {};
    if (mode === 'new' && !projectId) next.projectId = 'Choose the project to keep it in.';
    const parsed = loadCaseSaveSchema.safeParse({ name, notes, loadCase: request.loadCase, ...(request.filters ? { filters: request.filters } : {}) });
    if (!parsed.success) {
      for (const issue of parsed.error.issues) {
        const key = String(issue.path[0]);
        if (key === 'name' || key === 'notes') next[key] ??= issue.message;
        else next.root ??= issue.message;
      }
    }
    if (Object.keys(next).length) return setErrors(next);
    setErrors({});
    const body = { name: name.trim(), notes: notes.trim(), request };
    save.mutate(mode === 'update' && opened ? { mode: 'update', loadCase: opened, ...body } : { mode: 'new', projectId: Number(projectId), ...body }, {
      onSuccess: onSaved,
      onError: (err) => {
        const mapped = mapServerErrors(err, LABELS);
        const hint =
          err instanceof ApiError && err.code === 'frozen'
            ? ' Choose “Save as a new load case”.'
            : err instanceof ApiError && err.code === 'stale'
              ? ' Save it as a new load case, or reopen the saved one to see the other change.'
              : '';
        setErrors({ ...mapped.fields, root: mapped.root ? mapped.root + hint : null });
      },
    });
  };

  const noProjects = projects.data?.length === 0;
  return (
    <ConfirmDialog
      open={open}
      title="Save the load case to a project"
      confirmLabel={mode === 'update' ? 'Save changes' : 'Save load case'}
      busy={save.isPending}
      busyLabel="Saving…"
      error={errors.root}
      confirmDisabled={noProjects && mode === 'new'}
      onClose={onClose}
      onConfirm={confirm}
    >
      {purpose ? <p className="rounded-plate bg-sounding-light px-3 py-2 text-sounding-dark">{purpose}</p> : null}
      <p className="text-ink-soft">The inputs are kept in SI with their catalogue filters; the project's members can open it in Evaluate and shortlist candidates for it.</p>
      {opened ? (
        <fieldset className="flex flex-col gap-1">
          <legend className="text-xs font-bold uppercase tracking-wide text-ink-soft">Save as</legend>
          <label className="flex items-center gap-2">
            <input type="radio" name="save-mode" checked={mode === 'new'} onChange={() => setMode('new')} /> A new load case
          </label>
          <label className="flex items-center gap-2">
            <input
              type="radio"
              name="save-mode"
              checked={mode === 'update'}
              onChange={() => {
                setMode('update');
                setName(opened.name);
              }}
            />{' '}
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
          <SelectField label="Project" data-autofocus value={projectId} error={errors.projectId} onChange={(e) => setProjectId(e.target.value)}>
            <option value="">Choose a project…</option>
            {projects.data.map((p) => (
              <option key={p.id} value={p.id}>
                {p.name}
              </option>
            ))}
          </SelectField>
        )
      ) : null}
      <TextField
        label="Name"
        value={name}
        maxLength={200}
        error={errors.name}
        placeholder="e.g. Forward viewport, 90° cone at 1,200 m"
        onChange={(e) => setName(e.target.value)}
      />
      <TextAreaField
        label="Notes"
        value={notes}
        maxLength={4000}
        error={errors.notes}
        hint="Where the numbers come from: the seat drawing, the dive profile, the client's specification."
        onChange={(e) => setNotes(e.target.value)}
      />
    </ConfirmDialog>
  );
}
