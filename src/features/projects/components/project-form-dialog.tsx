import { useEffect, useState } from 'react';
import { projectCreateSchema } from '@shared/schemas/projects';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { TextField } from '@/components/ui/field';
import { TextAreaField } from '@/components/ui/text-area';
import { mapServerErrors } from '@/lib/field-errors';

type Values = { name: string; description: string };
type Errors = Partial<Record<keyof Values, string>> & { root?: string | null };
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
  const [values, setValues] = useState(initial);
  const [errors, setErrors] = useState<Errors>({});
  const [busy, setBusy] = useState(false);

  useEffect(() => {
    if (open) {
      setValues(initial);
      setErrors({});
    }
    // Reset only when the dialog opens, not while the user types.
  }, [open]);

  const save = async () => {
    const parsed = projectCreateSchema.safeParse(values);
    if (!parsed.success) {
      const next: Errors = {};
      for (const issue of parsed.error.issues) next[issue.path[0] as keyof Values] ??= issue.message;
      return setErrors(next);
    }
    setBusy(true);
    try {
      await onSave(parsed.data);
    } catch (err) {
      const mapped = mapServerErrors(err, LABELS);
      setErrors({ ...mapped.fields, root: mapped.root });
    } finally {
      setBusy(false);
    }
  };

  return (
    <ConfirmDialog open={open} title={title} confirmLabel={confirmLabel} busy={busy} busyLabel="Saving…" error={errors.root} onConfirm={() => void save()} onClose={onClose}>
      <TextField
        label="Name"
        data-autofocus
        value={values.name}
        maxLength={200}
        error={errors.name}
        onChange={(e) => setValues({ ...values, name: e.target.value })}
        placeholder="e.g. HS-2 research submersible (1,200 m)"
      />
      <TextAreaField
        label="Description"
        value={values.description}
        maxLength={4000}
        rows={4}
        error={errors.description}
        hint="What is being designed, for which service; the members see it."
        onChange={(e) => setValues({ ...values, description: e.target.value })}
      />
    </ConfirmDialog>
  );
}
