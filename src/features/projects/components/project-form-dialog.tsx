import { useEffect } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { projectCreateSchema } from '@shared/schemas/projects';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { TextField } from '@/components/ui/field';
import { TextAreaField } from '@/components/ui/text-area';
import { setServerErrors } from '@/lib/field-errors';

type Values = { name: string; description: string };
const LABELS = { name: 'Name', description: 'Description' };

/** Name and description of a project, for creating one or changing it. */
export function ProjectFormDialog({
  open,
  title,
  confirmLabel,
  initial,
  onSave,
  onClose,
}: {
  open: boolean;
  title: string;
  confirmLabel: string;
  initial: Values;
  onSave: (values: Values) => Promise<unknown>;
  onClose: () => void;
}) {
  const form = useForm({ resolver: zodResolver(projectCreateSchema), defaultValues: initial });
  const { errors, isSubmitting } = form.formState;

  useEffect(() => {
    if (open) form.reset(initial);
    // Reset only when the dialog opens, not while the user types.
  }, [open]);

  const save = form.handleSubmit(async (values) => {
    try {
      await onSave(values);
    } catch (err) {
      setServerErrors(form.setError, err, LABELS);
    }
  });

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
