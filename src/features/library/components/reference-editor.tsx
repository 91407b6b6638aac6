import { useEffect, useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { REFERENCE_KINDS, type ReferenceInput } from '@shared/schemas/catalogue';
import type { ReferencePageDto } from '@shared/schemas/library';
import { Button, SubmitButton } from '@/components/ui/button';
import { SelectField, TextField, LabelledOptions } from '@/components/ui/field';
import { StaleBanner } from '@/components/stale-banner';
import { FormError, Notice } from '@/components/ui/form-error';
import { ApiError, isStale } from '@/lib/api-client';
import { setServerErrors } from '@/lib/field-errors';
import { useCreateReference, useUpdateProposedVersion, useUpdateReference } from '../api/references';
import { REFERENCE_KIND_LABELS } from '../labels';
import { emptyReferenceForm, REFERENCE_FIELD_LABELS, referenceFormFrom, referenceFormSchema, type ReferenceForm } from '../reference-form';

/** What a save writes to: the reference itself (not in use: in place; in use: a proposed version), or the proposed version in draft. */
type Target = { kind: 'reference'; lockVersion: number } | { kind: 'version'; version: number; lockVersion: number };

const targetOf = (reference: ReferencePageDto | null): Target =>
  reference?.pending?.status === 'draft'
    ? { kind: 'version', version: reference.pending.version, lockVersion: reference.pending.lockVersion }
    : { kind: 'reference', lockVersion: reference?.lockVersion ?? 0 };

/**
 * The reference form. A reference cited only by drafts is saved in place. One in use is never
 * changed here: saving proposes the change as its next version (or saves the proposal again,
 * while it is a draft), and a second librarian's approval publishes it.
 */
export function ReferenceEditor({
  reference,
  onCreated,
  onReload,
  onClose,
}: {
  reference: ReferencePageDto | null;
  onCreated?: (r: ReferencePageDto) => void;
  onReload: () => void;
  onClose?: () => void;
}) {
  const create = useCreateReference();
  const update = useUpdateReference(reference?.id ?? 0);
  const updateProposed = useUpdateProposedVersion(reference?.id ?? 0);
  const [target, setTarget] = useState<Target>(() => targetOf(reference));
  const [notice, setNotice] = useState<string | null>(null);
  const [stale, setStale] = useState<ApiError | null>(null);
  const pending = reference?.pending ?? null;
  const form = useForm<ReferenceForm, unknown, ReferenceInput>({
    resolver: zodResolver(referenceFormSchema),
    defaultValues: reference ? referenceFormFrom(pending?.status === 'draft' ? pending.citation : reference) : emptyReferenceForm(),
  });
  const { register, handleSubmit, formState, reset, setFocus, setError } = form;
  const err = (k: keyof ReferenceForm) => formState.errors[k]?.message;

  useEffect(() => setFocus('kind'), [setFocus]);
  // A proposal that comes back to draft (returned by a reviewer) is edited from its stored content
  // and lock version. Keyed on its id and status only: someone else's save must still read as stale.
  const pendingKey = pending ? `${pending.id}:${pending.status}` : 'none';
  useEffect(() => {
    if (pending?.status !== 'draft') return;
    setTarget({ kind: 'version', version: pending.version, lockVersion: pending.lockVersion });
    reset(referenceFormFrom(pending.citation));
  }, [pendingKey]);

  const submit = handleSubmit(async (input) => {
    setNotice(null);
    setStale(null);
    try {
      if (!reference) {
        const saved = await create.mutateAsync(input);
        setTarget(targetOf(saved));
        reset(referenceFormFrom(saved));
        setNotice('Reference created. You can attach its document now.');
        onCreated?.(saved);
        return;
      }
      if (target.kind === 'version') {
        const saved = await updateProposed.mutateAsync({ version: target.version, lockVersion: target.lockVersion, reference: input });
        setTarget(targetOf(saved));
        setNotice(`Proposed change saved (version ${target.version}). Submit it for review when it is ready.`);
        return;
      }
      const saved = await update.mutateAsync({ lockVersion: target.lockVersion, reference: input });
      setTarget(targetOf(saved));
      if (saved.pending) {
        setNotice(`Change proposed as version ${saved.pending.version}. The published citation stays as it is until a second librarian approves it.`);
      } else {
        reset(referenceFormFrom(saved));
        setNotice('Reference saved.');
      }
    } catch (e) {
      if (isStale(e)) setStale(e);
      // A PUT names the fields under "reference.".
      else setServerErrors(setError, e, REFERENCE_FIELD_LABELS, (path) => path.replace(/^reference\./, ''));
    }
  });

  if (pending?.status === 'in-review') {
    return (
      <p className="text-sm text-ink-soft" data-testid="change-in-review">
        Version {pending.version} of this reference is in review. It can be changed again once it is approved, or if the reviewer returns it.
      </p>
    );
  }

  const busy = create.isPending || update.isPending || updateProposed.isPending;
  const inUse = reference?.inUse ?? false;
  const label = !reference ? 'New reference' : !inUse ? 'Edit reference' : target.kind === 'version' ? 'Edit the proposed change' : 'Propose a change';
  const submitLabel = !reference ? 'Create reference' : !inUse ? 'Save reference' : target.kind === 'version' ? 'Save the proposed change' : 'Propose this change';
  return (
    <form onSubmit={submit} noValidate aria-label={label} className="flex flex-col gap-3">
      {reference && inUse ? (
        <p className="text-xs text-ink-soft" data-testid="in-use-note">
          Cited by published records, so it is not edited in place: a change becomes version {target.kind === 'version' ? target.version : reference.version + 1} and takes
          effect when a second librarian approves it. Published sets and design records keep the version they cite.
        </p>
      ) : null}
      <SelectField label="Kind" error={err('kind')} {...register('kind')}>
        <option value="">Choose a kind…</option>
        <LabelledOptions values={REFERENCE_KINDS} labels={REFERENCE_KIND_LABELS} />
      </SelectField>
      <TextField label="Title" error={err('title')} {...register('title')} />
      <TextField label="Authors or issuer" error={err('authors')} {...register('authors')} />
      <div className="grid grid-cols-2 gap-3">
        <TextField label="Year" inputMode="numeric" error={err('year')} {...register('year')} />
        <TextField label="Table or page" error={err('location')} {...register('location')} />
      </div>
      <TextField label="Identifier" error={err('identifier')} hint="Standard number, DOI or report number" {...register('identifier')} />
      <TextField label="Note" error={err('note')} {...register('note')} />
      {stale ? <StaleBanner message={stale.message} onReload={onReload} /> : null}
      <FormError message={formState.errors.root?.message} />
      <Notice message={notice} />
      <div className="flex gap-2">
        <SubmitButton busy={busy} busyLabel="Saving…">
          {submitLabel}
        </SubmitButton>
        {onClose ? (
          <Button tone="quiet" onClick={onClose}>
            Close
          </Button>
        ) : null}
      </div>
      {reference && !inUse ? (
        <p className="text-xs text-ink-soft">
          Cited by {reference.usedBy} draft{reference.usedBy === 1 ? '' : 's'} at most, so a save changes it at once. Once a set citing it is published, changes
          are reviewed.
        </p>
      ) : null}
    </form>
  );
}
