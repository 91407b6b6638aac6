import { useEffect } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import type { CandidateResult } from '@shared/engine';
import { shortlistCreateSchema, shortlistItemAddSchema, type LoadCaseDto, type ShortlistDto } from '@shared/schemas/projects';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { TextField } from '@/components/ui/field';
import { TextAreaField } from '@/components/ui/text-area';
import { Spinner } from '@/components/ui/states';
import { ApiError } from '@/lib/api-client';
import { setServerErrors } from '@/lib/field-errors';
import { useAddToShortlist, useShortlistChoices } from '../api/project-links';

const LABELS = { name: 'Shortlist name', note: 'Note' };

/**
 * The target ("new" or a shortlist's id, set by the radios), the shared schemas' note and, for a
 * new shortlist, its name: the name field exists only while "A new shortlist" is chosen
 * (shouldUnregister), so an absent name is one not asked for.
 */
const shortlistFormSchema = z.object({
  target: z.string().min(1),
  name: shortlistCreateSchema.shape.name.optional(),
  note: shortlistItemAddSchema.shape.note,
});
type ShortlistForm = z.input<typeof shortlistFormSchema>;

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
  const form = useForm<ShortlistForm, unknown, z.output<typeof shortlistFormSchema>>({
    resolver: zodResolver(shortlistFormSchema),
    defaultValues: { target: '', note: '' },
  });
  const { errors } = form.formState;

  // Start afresh each time the dialog opens.
  useEffect(() => {
    if (!open) return;
    add.reset();
    form.reset({ target: '', note: '' });
  }, [open, result?.propertySetId]);

  // Offer the newest of the caller's shortlists first; "new" when there is none.
  const list = choices.data ?? [];
  const target = form.watch('target');
  const chosen = target || (choices.isSuccess ? (list[0] ? String(list[0].id) : 'new') : '');
  const choose = (value: string) => form.setValue('target', value);

  const confirm = form.handleSubmit(async ({ target, name, note }) => {
    if (!result || result.propertySetId === undefined) return;
    try {
      onAdded(
        await add.mutateAsync(
          target === 'new'
            ? { to: 'new', projectId: loadCase.projectId, loadCaseId: loadCase.id, name: name ?? '', propertySetId: result.propertySetId, note }
            : { to: 'existing', shortlistId: Number(target), propertySetId: result.propertySetId, note },
        ),
      );
    } catch (err) {
      // A shortlist made before the item failed now exists: offer it next time.
      if (target === 'new') void choices.refetch();
      if (err instanceof ApiError && err.code === 'duplicate') form.setError('root', { type: 'server', message: `${result.name} is already on that shortlist.` });
      else setServerErrors(form.setError, err, LABELS);
    }
  });

  return (
    <ConfirmDialog
      open={open}
      title="Add to a shortlist"
      confirmLabel="Add to shortlist"
      busy={add.isPending}
      busyLabel="Adding…"
      error={errors.root?.message}
      confirmDisabled={!chosen}
      onClose={onClose}
      onConfirm={() => {
        // Nothing clicked: the shortlist offered first is the one meant.
        if (!target) choose(chosen);
        void confirm();
      }}
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
              <input type="radio" name="shortlist-target" value={s.id} checked={chosen === String(s.id)} onChange={() => choose(String(s.id))} />
              <span>
                {s.name}{' '}
                <span className="text-xs text-ink-soft">
                  ({s.status}, {s.itemCount} candidate{s.itemCount === 1 ? '' : 's'})
                </span>
              </span>
            </label>
          ))}
          <label className="flex items-center gap-2">
            <input type="radio" name="shortlist-target" value="new" checked={chosen === 'new'} onChange={() => choose('new')} /> A new shortlist
          </label>
          {chosen === 'new' ? (
            <TextField
              label="Shortlist name"
              wrapperClassName="ml-6"
              maxLength={200}
              error={errors.name?.message}
              placeholder="e.g. Viewport window material"
              {...form.register('name', { shouldUnregister: true })}
            />
          ) : null}
        </fieldset>
      )}
      <TextAreaField
        label="Note"
        data-autofocus
        rows={4}
        maxLength={2000}
        error={errors.note?.message}
        hint="Why it is on the list, and what to confirm with the supplier (lot data, certification, lead time)."
        {...form.register('note')}
      />
    </ConfirmDialog>
  );
}
