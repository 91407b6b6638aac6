import { useEffect, useRef, useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { projectCreateSchema } from '@shared/schemas/projects';
import { StaleBanner } from '@/components/stale-banner';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { TextField } from '@/components/ui/field';
import { TextAreaField } from '@/components/ui/text-area';
import { isStale, type ApiError } from '@/lib/api-client';
import { setServerErrors } from '@/lib/field-errors';

type Values = { name: string; description: string };
/** What the dialog edits, with the lock version it was read at (none when creating). */
export type ProjectFormInitial = Values & { lockVersion?: number };
const LABELS = { name: 'Name', description: 'Description' };

/**
 * Name and description of a project, for creating one or changing it. A change is saved with the
 * lock version read when the dialog opened; when someone saved the project since (409 stale) the
 * edits stay in the form beside a StaleBanner, whose reload loads the saved version instead.
 */
export function ProjectFormDialog({
  open,
  title,
  confirmLabel,
  initial,
  onSave,
  onReload,
  onClose,
}: {
  open: boolean;
  title: string;
  confirmLabel: string;
  initial: ProjectFormInitial;
  onSave: (values: Values, lockVersion: number | undefined) => Promise<unknown>;
  /** Reads the project as saved now (for a stale edit). */
  onReload?: () => Promise<ProjectFormInitial>;
  onClose: () => void;
}) {
  const form = useForm({ resolver: zodResolver(projectCreateSchema), defaultValues: { name: initial.name, description: initial.description } });
  const { errors, isSubmitting } = form.formState;
  const readVersion = useRef(initial.lockVersion);
  const [stale, setStale] = useState<ApiError | null>(null);

  useEffect(() => {
    if (!open) return;
    form.reset({ name: initial.name, description: initial.description });
    readVersion.current = initial.lockVersion;
    setStale(null);
    // Reset only when the dialog opens, not while the user types.
  }, [open]);

  const save = form.handleSubmit(async (values) => {
    setStale(null);
    try {
      await onSave(values, readVersion.current);
    } catch (err) {
      if (isStale(err) && onReload) setStale(err);
      else setServerErrors(form.setError, err, LABELS);
    }
  });

  const reload = async () => {
    if (!onReload) return;
    try {
      const saved = await onReload();
      form.reset({ name: saved.name, description: saved.description });
      readVersion.current = saved.lockVersion;
      setStale(null);
    } catch (err) {
      setServerErrors(form.setError, err, LABELS);
    }
  };

  return (
    <ConfirmDialog
      open={open}
      title={title}
      confirmLabel={confirmLabel}
      busy={isSubmitting}
      busyLabel="Saving…"
      error={errors.root?.message}
      onConfirm={() => void save()}
      onClose={onClose}
    >
      {stale ? <StaleBanner testId="project-stale" message={stale.message} onReload={() => void reload()} /> : null}
      <TextField label="Name" data-autofocus maxLength={200} error={errors.name?.message} placeholder="e.g. HS-2 research submersible (1,200 m)" {...form.register('name')} />
      <TextAreaField
        label="Description"
        maxLength={4000}
        rows={4}
        error={errors.description?.message}
        hint="What is being designed, for which service; the members see it."
        {...form.register('description')}
      />
    </ConfirmDialog>
  );
}
