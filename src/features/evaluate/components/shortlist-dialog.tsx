import { useEffect, useState } from 'react';
import type { CandidateResult } from '@shared/engine';
import { shortlistCreateSchema, shortlistItemAddSchema, type LoadCaseDto, type ShortlistDto } from '@shared/schemas/projects';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { TextField } from '@/components/ui/field';
import { TextAreaField } from '@/components/ui/text-area';
import { Spinner } from '@/components/ui/states';
import { ApiError } from '@/lib/api-client';
import { mapServerErrors } from '@/lib/field-errors';
import { useAddToShortlist, useShortlistChoices } from '../api/project-links';

type Field = 'name' | 'note';
const LABELS: Record<Field, string> = { name: 'Shortlist name', note: 'Note' };

/**
 * Adds one catalogue candidate to one of the caller's open (or returned) shortlists for the saved
 * load case being evaluated, or to a new one. The note says why it is in and what to confirm.
 */
export function ShortlistDialog({
  result,
  loadCase,
  authorId,
  onClose,
  onAdded,
}: {
  /** The candidate to add; null while the dialog is closed. */
  result: CandidateResult | null;
  loadCase: LoadCaseDto;
  authorId: number;
  onClose: () => void;
  onAdded: (shortlist: ShortlistDto) => void;
}) {
  const open = result !== null;
  const choices = useShortlistChoices(loadCase.projectId, loadCase.id, authorId, open);
  const add = useAddToShortlist();
  const [target, setTarget] = useState<string>('');
  const [name, setName] = useState('');
  const [note, setNote] = useState('');
  const [errors, setErrors] = useState<Partial<Record<Field, string>> & { root?: string | null }>({});

  // Start afresh each time the dialog opens.
  useEffect(() => {
    if (!open) return;
    add.reset();
    setErrors({});
    setNote('');
    setName('');
    setTarget('');
  }, [open, result?.propertySetId]);

  // Offer the newest of the caller's shortlists first; "new" when there is none.
  const list = choices.data ?? [];
  const chosen = target || (choices.isSuccess ? (list[0] ? String(list[0].id) : 'new') : '');

  const confirm = () => {
    if (!result || result.propertySetId === undefined || !chosen) return;
    const next: typeof errors = {};
    const item = shortlistItemAddSchema.safeParse({ propertySetId: result.propertySetId, note });
    if (!item.success) next.note = item.error.issues[0]?.message;
    if (chosen === 'new') {
      const created = shortlistCreateSchema.safeParse({ loadCaseId: loadCase.id, name });
      if (!created.success) next.name = created.error.issues.find((i) => i.path[0] === 'name')?.message ?? created.error.issues[0]?.message;
    }
    if (Object.keys(next).length) return setErrors(next);
    setErrors({});
    add.mutate(
      chosen === 'new'
        ? { to: 'new', projectId: loadCase.projectId, loadCaseId: loadCase.id, name: name.trim(), propertySetId: result.propertySetId, note: note.trim() }
        : { to: 'existing', shortlistId: Number(chosen), propertySetId: result.propertySetId, note: note.trim() },
      {
        onSuccess: onAdded,
        onError: (err) => {
          const mapped = mapServerErrors(err, LABELS);
          // A shortlist made before the item failed now exists: offer it next time.
          if (chosen === 'new') void choices.refetch();
          setErrors({ ...mapped.fields, root: err instanceof ApiError && err.code === 'duplicate' ? `${result.name} is already on that shortlist.` : mapped.root });
        },
      },
    );
  };

  return (
    <ConfirmDialog
      open={open}
      title="Add to a shortlist"
      confirmLabel="Add to shortlist"
      busy={add.isPending}
      busyLabel="Adding…"
      error={errors.root}
      confirmDisabled={!chosen}
      onClose={onClose}
      onConfirm={confirm}
    >
      <p>
        <strong>{result?.name}</strong> for the load case “{loadCase.name}”.
      </p>
      {choices.isPending ? (
        <Spinner label="Loading your shortlists…" />
      ) : choices.isError ? (
        <p role="alert" className="text-verdict-fail">
          {choices.error instanceof ApiError ? choices.error.message : 'Your shortlists could not be loaded.'}
        </p>
      ) : (
        <fieldset className="flex flex-col gap-1.5">
          <legend className="mb-1 text-xs font-bold uppercase tracking-wide text-ink-soft">Shortlist</legend>
          {list.map((s) => (
            <label key={s.id} className="flex items-center gap-2">
              <input type="radio" name="shortlist-target" value={s.id} checked={chosen === String(s.id)} onChange={() => setTarget(String(s.id))} />
              <span>
                {s.name}{' '}
                <span className="text-xs text-ink-soft">
                  ({s.status}, {s.itemCount} candidate{s.itemCount === 1 ? '' : 's'})
                </span>
              </span>
            </label>
          ))}
          <label className="flex items-center gap-2">
            <input type="radio" name="shortlist-target" value="new" checked={chosen === 'new'} onChange={() => setTarget('new')} /> A new shortlist
          </label>
          {chosen === 'new' ? (
            <TextField
              label="Shortlist name"
              wrapperClassName="ml-6"
              value={name}
              maxLength={200}
              error={errors.name}
              placeholder="e.g. Viewport window material"
              onChange={(e) => setName(e.target.value)}
            />
          ) : null}
        </fieldset>
      )}
      <TextAreaField
        label="Note"
        data-autofocus
        rows={4}
        value={note}
        maxLength={2000}
        error={errors.note}
        hint="Why it is on the list, and what to confirm with the supplier (lot data, certification, lead time)."
        onChange={(e) => setNote(e.target.value)}
      />
    </ConfirmDialog>
  );
}
