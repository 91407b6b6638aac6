import { useEffect, useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { LibrarySetDto } from '@shared/schemas/library';
import type { SessionUserDto } from '@shared/schemas/auth';
import { can } from '@shared/roles';
import { PROVENANCE_LABELS, VALUE_STATUS_LABELS, type ConfirmationProposal, type ValueConfirmationDto } from '@shared/schemas/provenance';
import { CONFIRMATION_STEPS, type ConfirmationStatus, type ConfirmationStepName } from '@shared/workflows/confirmation';
import { allowedSteps, type WorkflowSubject } from '@shared/workflows/steps';
import { Button } from '@/components/ui/button';
import { SelectField, TextField } from '@/components/ui/field';
import { FormError, Notice } from '@/components/ui/form-error';
import { EmptyState, ErrorState, Panel, Spinner, Tag } from '@/components/ui/states';
import { WorkflowSteps } from '@/components/workflow-steps';
import { setServerErrors } from '@/lib/field-errors';
import { useUnits } from '@/lib/unit-system';
import { useConfirmationStep, useConfirmations, useProposeConfirmation } from '../api/confirmations';
import { formatChangeValue } from '../changes';
import {
  CONFIRMATION_FIELD_LABELS,
  confirmableValues,
  confirmationFormSchema,
  emptyConfirmationForm,
  type ConfirmableValue,
  type ConfirmationForm,
} from '../confirmation-form';
import { CONFIRMATION_STATUS_LABELS, CONFIRMATION_STATUS_TONE, formatDateTime } from '../labels';

const subjectOf = (c: ValueConfirmationDto): WorkflowSubject<ConfirmationStatus> => ({ status: c.status, authorIds: [c.proposedBy.id] });

/** Where the value stands, as the proposer quoted it: the location, another source, the stored document's page. */
function WhereCell({ c }: { c: ValueConfirmationDto }) {
  return (
    <>
      <span className="font-bold">{c.location}</span>
      {c.source ? <span className="block text-xs text-ink-soft">in {c.source}</span> : null}
      {c.documentPage ? <span className="block text-xs text-ink-soft">stored document, page {c.documentPage}</span> : null}
    </>
  );
}

/** Approve or reject one proposed confirmation, rendered from the confirmation workflow's table. */
function ConfirmationSteps({ c, set, me, onReload, onNotice }: { c: ValueConfirmationDto; set: LibrarySetDto; me: SessionUserDto; onReload: () => void; onNotice: (m: string) => void }) {
  const step = useConfirmationStep();
  const viewer = { id: me.id, role: me.role };
  const label = PROVENANCE_LABELS[c.key];
  const closed = allowedSteps(CONFIRMATION_STEPS, subjectOf(c), viewer).find((a) => !a.allowed && a.code !== 'wrong-status');
  const onStep = async (name: ConfirmationStepName, comment: string | undefined) => {
    const input = name === 'reject' ? { step: name, lockVersion: c.lockVersion, comment: comment ?? '' } : { step: name, lockVersion: c.lockVersion };
    await step.mutateAsync({ id: c.id, input });
    onNotice(
      name === 'approve'
        ? `${label} now reads as confirmed at “${c.location}”, here, in the catalogue and in Evaluate. ${c.proposedBy.name} is told by e-mail.`
        : `Rejected: ${label.toLowerCase()} stays as it was. ${c.proposedBy.name} is told by e-mail, with your comment.`,
    );
  };
  return (
    <div className="flex flex-col gap-1.5">
      {closed ? (
        <p className="rounded-plate bg-sounding-light px-2 py-1 text-xs text-sounding-dark" data-testid="confirmation-four-eyes">
          {closed.reason}
        </p>
      ) : null}
      <WorkflowSteps
        steps={CONFIRMATION_STEPS}
        subject={subjectOf(c)}
        viewer={viewer}
        busy={step.isPending}
        onStep={onStep}
        onReload={onReload}
        buttonLabels={{ approve: 'Approve…', reject: 'Reject…' }}
        reasons="none"
        empty={null}
        title={(s) => `${s.label}: ${label}?`}
        describe={(s) =>
          s.name === 'approve' ? (
            <>
              <p>
                <strong>{label}</strong> of {set.material.name} — {set.condition} will read as confirmed at <strong>“{c.location}”</strong>
                {c.source ? ` in ${c.source}` : ''}, confirmed by {c.proposedBy.name} and approved by you.
              </p>
              <p>Check the source first. The value itself does not change, nor does the set’s version.</p>
            </>
          ) : (
            <p>
              {label} stays as it is now. Say what is wrong with the location, so that {c.proposedBy.name} can propose it again.
            </p>
          )
        }
      />
    </div>
  );
}

function DecisionCell({ c, set, me, onReload, onNotice }: { c: ValueConfirmationDto; set: LibrarySetDto; me: SessionUserDto; onReload: () => void; onNotice: (m: string) => void }) {
  return (
    <div className="flex flex-col gap-1.5">
      <span>
        <Tag tone={CONFIRMATION_STATUS_TONE[c.status]}>{CONFIRMATION_STATUS_LABELS[c.status]}</Tag>
        {c.decidedBy ? (
          <span className="ml-1 text-xs text-ink-soft">
            by {c.decidedBy.name}
            {c.decidedAt ? `, ${formatDateTime(c.decidedAt)}` : ''}
          </span>
        ) : null}
      </span>
      {c.comment ? <p className="whitespace-pre-line text-xs">“{c.comment}”</p> : null}
      {c.status === 'proposed' && set.status === 'published' ? <ConfirmationSteps c={c} set={set} me={me} onReload={onReload} onNotice={onNotice} /> : null}
    </div>
  );
}

const COLUMNS = 'md:grid md:grid-cols-[9rem_minmax(0,1fr)_8rem_minmax(0,15rem)] md:gap-3';
const HEADS = ['Value', 'Where the source shows it', 'Proposed', 'Decision'] as const;

/** A cell's heading: shown above it on a narrow screen, where the entries stack; read out on a wide one. */
const CellHead = ({ children }: { children: string }) => <span className="block text-xs font-bold uppercase tracking-wide text-ink-soft md:sr-only">{children}</span>;

/**
 * The set's confirmations, newest first. One entry a row on a wide screen, under headings like a
 * plain table's; stacked on a narrow one, so the steps stay in view without scrolling sideways.
 */
function ConfirmationList({ items, set, me, onReload, onNotice }: { items: ValueConfirmationDto[]; set: LibrarySetDto; me: SessionUserDto; onReload: () => void; onNotice: (m: string) => void }) {
  return (
    <div className="text-sm">
      <div aria-hidden className={`hidden py-1 text-left text-xs font-bold uppercase tracking-wide text-ink-soft ${COLUMNS}`}>
        {HEADS.map((h) => (
          <span key={h}>{h}</span>
        ))}
      </div>
      <ul aria-label="Value confirmations">
        {items.map((c) => (
          <li key={c.id} className={`flex flex-col gap-1.5 border-t border-chart-line/60 py-2 ${COLUMNS}`} data-testid={`confirmation-${c.key}`}>
            <div>
              <span className="sr-only">{HEADS[0]}</span>
              <span className="font-bold md:font-normal">{PROVENANCE_LABELS[c.key]}</span>
            </div>
            <div className="min-w-0 break-words">
              <CellHead>{HEADS[1]}</CellHead>
              <WhereCell c={c} />
            </div>
            <div>
              <CellHead>{HEADS[2]}</CellHead>
              {c.proposedBy.name}
              {c.proposedBy.id === me.id ? <span className="text-ink-soft"> (you)</span> : null}
              <span className="block text-xs text-ink-soft">{formatDateTime(c.createdAt)}</span>
            </div>
            <div className="min-w-0">
              <CellHead>{HEADS[3]}</CellHead>
              <DecisionCell c={c} set={set} me={me} onReload={onReload} onNotice={onNotice} />
            </div>
          </li>
        ))}
      </ul>
    </div>
  );
}

/** The option for one value: its name and its status now (or that a proposal waits for it). */
const optionText = (v: ConfirmableValue) => `${PROVENANCE_LABELS[v.key]} — ${v.waiting ? 'a confirmation waits for review' : VALUE_STATUS_LABELS[v.status]}`;

/** Propose where the cited source shows one of the set's values; a second person approves it. */
function ProposeForm({ set, values, onDone, onCancel }: { set: LibrarySetDto; values: ConfirmableValue[]; onDone: (made: ValueConfirmationDto) => void; onCancel: () => void }) {
  const { system } = useUnits();
  const propose = useProposeConfirmation(set.id);
  const form = useForm<ConfirmationForm, unknown, ConfirmationProposal>({ resolver: zodResolver(confirmationFormSchema), defaultValues: emptyConfirmationForm() });
  const { register, handleSubmit, formState, setError, setFocus, watch } = form;
  const err = (k: keyof ConfirmationForm) => formState.errors[k]?.message;
  useEffect(() => setFocus('key'), [setFocus]);
  const key = watch('key');
  const chosen = values.find((v) => v.key === key);
  const hasDocument = !!set.reference?.hasDocument;

  const submit = handleSubmit(async (input) => {
    try {
      onDone(await propose.mutateAsync(input));
    } catch (e) {
      setServerErrors(setError, e, CONFIRMATION_FIELD_LABELS);
    }
  });

  return (
    <form onSubmit={submit} noValidate aria-label="Confirm a value" className="mb-4 flex flex-col gap-3 rounded-plate border border-chart-line bg-white p-3">
      <p className="text-xs text-ink-soft">
        Say where {set.reference ? <>“{set.reference.title}”</> : 'the cited source'} shows the value as this set gives it. A second librarian or an
        administrator checks it there and approves it; until then the value keeps its status.
      </p>
      <SelectField
        label={CONFIRMATION_FIELD_LABELS.key}
        error={err('key')}
        hint={chosen ? `The set gives ${formatChangeValue(chosen.key, set[chosen.key], system)}; now ${VALUE_STATUS_LABELS[chosen.status]}.` : undefined}
        {...register('key')}
      >
        <option value="">Choose a value…</option>
        {values.map((v) => (
          <option key={v.key} value={v.key} disabled={v.waiting}>
            {optionText(v)}
          </option>
        ))}
      </SelectField>
      <TextField label={CONFIRMATION_FIELD_LABELS.location} error={err('location')} hint="Table, page, figure or clause, e.g. Table 3.2, p. 41" {...register('location')} />
      <TextField
        label={`${CONFIRMATION_FIELD_LABELS.source} (optional)`}
        error={err('source')}
        hint="Only when another public source shows the value, not the set’s own reference"
        {...register('source')}
      />
      {hasDocument ? (
        <TextField
          label={`${CONFIRMATION_FIELD_LABELS.documentPage} (optional)`}
          inputMode="numeric"
          error={err('documentPage')}
          hint="The page of the reference’s uploaded document that shows the value"
          {...register('documentPage')}
        />
      ) : (
        <p className="text-xs text-ink-faint">The reference has no stored document to point a page at; its page on the desk takes an upload.</p>
      )}
      <FormError message={formState.errors.root?.message} />
      <div className="flex flex-wrap gap-2">
        <Button type="submit" disabled={propose.isPending}>
          {propose.isPending ? 'Proposing…' : 'Propose the confirmation'}
        </Button>
        <Button tone="quiet" onClick={onCancel} disabled={propose.isPending}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

/**
 * A published set's value confirmations: the form that proposes one, and every proposal with
 * who made it, who decided it and the comment; a proposal waiting for review carries the
 * confirmation workflow's steps.
 */
export function SetConfirmations({ set, me, onReloadSet }: { set: LibrarySetDto; me: SessionUserDto; onReloadSet: () => void }) {
  const query = useConfirmations({ propertySetId: set.id });
  const [proposing, setProposing] = useState(false);
  const [notice, setNotice] = useState<string | null>(null);
  const items = query.data?.items ?? [];
  const values = confirmableValues(set, items);
  const open = values.filter((v) => !v.waiting);
  const mayPropose = set.status === 'published' && can(me.role, 'catalogue:draft');
  const reload = () => {
    void query.refetch();
    onReloadSet();
  };

  return (
    <Panel
      title="Value confirmations"
      className="no-print"
      actions={
        mayPropose && !proposing && open.length > 0 && query.isSuccess ? (
          <Button
            tone="quiet"
            onClick={() => {
              setNotice(null);
              setProposing(true);
            }}
          >
            Confirm a value…
          </Button>
        ) : null
      }
    >
      <div className="flex flex-col gap-3" data-testid="set-confirmations">
        <Notice message={notice} />
        {proposing ? (
          <ProposeForm
            set={set}
            values={values}
            onCancel={() => setProposing(false)}
            onDone={(made) => {
              setProposing(false);
              setNotice(`Proposed: ${PROVENANCE_LABELS[made.key].toLowerCase()} at “${made.location}”. The other librarians and administrators are told by e-mail; one of them approves or rejects it.`);
            }}
          />
        ) : null}
        {query.isPending ? (
          <Spinner label="Loading the confirmations…" />
        ) : query.isError ? (
          <ErrorState error={query.error} onRetry={() => void query.refetch()} />
        ) : items.length === 0 ? (
          <EmptyState title="No value of this set has been put up for confirmation">
            {mayPropose
              ? 'Values read as recalled until someone confirms them against the source. Choose “Confirm a value” and say where the source shows it; a second librarian approves it.'
              : 'Values are confirmed on the published version of a set.'}
          </EmptyState>
        ) : (
          <ConfirmationList items={items} set={set} me={me} onReload={reload} onNotice={setNotice} />
        )}
        {mayPropose && query.isSuccess && values.length === 0 ? <p className="text-xs text-ink-soft">Every value of this set is confirmed against its source.</p> : null}
      </div>
    </Panel>
  );
}
