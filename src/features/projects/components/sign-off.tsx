// A shortlist's status and its sign-off steps, rendered from the shared workflow table.
import type { ReactNode } from 'react';
import type { ShortlistDto } from '@shared/schemas/projects';
import { SHORTLIST_STEPS, type ShortlistStepName } from '@shared/workflows/shortlist';
import { PROVENANCE_LABELS, VALUE_STATUS_LABELS } from '@shared/schemas/provenance';
import { LinkButton } from '@/components/ui/link-button';
import { Panel } from '@/components/ui/states';
import { WorkflowSteps } from '@/components/workflow-steps';
import { formatDateTime } from '@/lib/dates';
import { formatMargin } from '@shared/labels';
import { useShortlistStep } from '../api/shortlists';
import { shortlistSubject, type ShortlistRights, type Viewer } from '../shortlist-model';
import { ShortlistStatusTag } from './bits';

const SUBMIT = SHORTLIST_STEPS.filter((s) => s.name === 'submit');
const DECIDE = SHORTLIST_STEPS.filter((s) => s.name !== 'submit');

export function StatusBanner({ shortlist }: { shortlist: ShortlistDto }) {
  const s = shortlist;
  const box = 'rounded-plate border-l-4 px-4 py-3 text-sm';
  switch (s.status) {
    case 'open':
      return (
        <div className={`${box} border-sounding bg-sounding-light/60`} data-testid="shortlist-status">
          <p>
            <ShortlistStatusTag status="open" /> <strong>{s.author.name}</strong> is choosing candidates. When the list and its notes are ready, the author submits it for
            checking.
          </p>
        </div>
      );
    case 'submitted':
      return (
        <div className={`${box} border-brass bg-brass-light/60`} data-testid="shortlist-status">
          <p>
            <ShortlistStatusTag status="submitted" /> Submitted by <strong>{s.author.name}</strong> on {formatDateTime(s.submittedAt)}; waiting for a second engineer to check
            it. It cannot be changed meanwhile.
          </p>
        </div>
      );
    case 'checked':
      return (
        <div className={`${box} border-verdict-pass bg-verdict-pass/10`} data-testid="shortlist-status">
          <p>
            <ShortlistStatusTag status="checked" /> Checked by <strong>{s.checker?.name ?? 'a checker'}</strong> on {formatDateTime(s.checkedAt)}. Its design record is
            frozen.
          </p>
          {s.checkComment ? <blockquote className="mt-2 whitespace-pre-line border-l-2 border-verdict-pass/40 pl-3 italic">{s.checkComment}</blockquote> : null}
          {s.designRecordId ? (
            <LinkButton to={`/records/${s.designRecordId}`} className="mt-3">
              Open the design record
            </LinkButton>
          ) : null}
        </div>
      );
    case 'returned':
      return (
        <div className={`${box} border-verdict-fail bg-verdict-fail/5`} data-testid="shortlist-status">
          <p>
            <ShortlistStatusTag status="returned" /> Returned by <strong>{s.checker?.name ?? 'a checker'}</strong> with this comment; the author changes it and submits it
            again.
          </p>
          {s.returnedComment ? <blockquote className="mt-2 whitespace-pre-line border-l-2 border-verdict-fail/40 pl-3 italic">{s.returnedComment}</blockquote> : null}
        </div>
      );
  }
}

/** What the checker signs on trust: every input not confirmed against its source, per candidate. */
function UnconfirmedInputs({ items }: { items: ShortlistDto['items'] }) {
  const open = items.filter((i) => i.result?.inputs && i.result.inputs.unconfirmed.length);
  if (!open.length) return <p data-testid="unconfirmed-inputs">Every input of every candidate is confirmed against its source.</p>;
  return (
    <div data-testid="unconfirmed-inputs">
      <p className="font-bold">Inputs not confirmed against their source:</p>
      <ul className="list-disc pl-5 text-sm">
        {open.map((i) => (
          <li key={i.id}>
            {i.propertySet.material.name} — {i.propertySet.condition}: {i.result!.inputs!.unconfirmed.map((u) => `${PROVENANCE_LABELS[u.key]} (${VALUE_STATUS_LABELS[u.status]})`).join(', ')}
          </li>
        ))}
      </ul>
    </div>
  );
}

/** What the checker would sign despite: candidates whose governing margin misses their target. */
function BelowTarget({ items }: { items: ShortlistDto['items'] }) {
  const below = items.filter((i) => i.result && i.result.margin < 0);
  if (!below.length) return <p data-testid="below-target">Every candidate meets its target safety factor at the entered thickness.</p>;
  return (
    <div data-testid="below-target">
      <p className="font-bold text-verdict-fail">
        {below.length} candidate{below.length === 1 ? ' misses its' : 's miss their'} target safety factor:
      </p>
      <ul className="list-disc pl-5 text-sm">
        {below.map((i) => (
          <li key={i.id}>
            {i.propertySet.material.name} — {i.propertySet.condition}: safety factor {i.result!.safetyFactor.toFixed(2)} against {i.result!.targetSafetyFactor} (margin{' '}
            {formatMargin(i.result!.margin)})
          </li>
        ))}
      </ul>
    </div>
  );
}

/** The sign-off steps of the shortlist, from the shared workflow table: submit; check or return. */
export function SignOff({
  shortlist,
  rights,
  viewer,
  memberIds,
  onReload,
}: {
  shortlist: ShortlistDto;
  rights: ShortlistRights;
  viewer: Viewer;
  memberIds: readonly number[] | null;
  onReload: () => void;
}) {
  const step = useShortlistStep(shortlist.id);
  const { status, name, items } = shortlist;
  const subject = shortlistSubject(shortlist, memberIds);
  const onStep = (which: ShortlistStepName, comment: string | undefined) =>
    step.mutateAsync(which === 'return' ? { step: which, lockVersion: shortlist.lockVersion, comment: comment ?? '' } : { step: which, lockVersion: shortlist.lockVersion, comment });
  const common = { subject, viewer: { id: viewer.id, role: viewer.role }, busy: step.isPending, onStep, onReload, reasons: 'none' as const, empty: null };

  let body: ReactNode = null;
  if (rights.canEdit && (status === 'open' || status === 'returned')) {
    body = (
      <div className="flex flex-wrap items-center gap-3">
        <WorkflowSteps
          {...common}
          steps={SUBMIT}
          title={() => `Submit “${name}” for checking?`}
          describe={() => (
            <p>
              Its {items.length} candidate{items.length === 1 ? '' : 's'} and notes are locked while it waits.
            </p>
          )}
        />
        <p className="text-sm text-ink-soft">
          {rights.canSubmit ? 'A second engineer, a checker in this project, then checks it or returns it with comments.' : 'Add at least one candidate before submitting.'}
        </p>
      </div>
    );
  } else if (status === 'submitted') {
    body =
      rights.decision === 'allowed' ? (
        <div className="flex flex-wrap items-center gap-3">
          <WorkflowSteps
            {...common}
            steps={DECIDE}
            buttonLabels={{ check: 'Check…', return: 'Return with comments…' }}
            title={(s) => (s.name === 'check' ? `Check “${name}”?` : `Return “${name}” to ${shortlist.author.name}?`)}
            describe={(s) =>
              s.name === 'check' ? (
                <>
                  <p>
                    Checking freezes a design record: the load case, each candidate's results, the property set versions and both names, as they are now. It cannot be
                    changed afterwards. A comment is kept in the record.
                  </p>
                  <BelowTarget items={items} />
                  <UnconfirmedInputs items={items} />
                </>
              ) : (
                <p>Say what must change; the author reads it on the shortlist and by e-mail.</p>
              )
            }
          />
          <p className="text-sm text-ink-soft">Check each candidate's data and note against the load case before you decide.</p>
        </div>
      ) : (
        <p className="rounded-plate bg-sounding-light px-3 py-2 text-sm text-sounding-dark" data-testid="second-engineer">
          {rights.decision === 'own-work'
            ? 'You wrote this shortlist, so a second engineer must check it: a checker who is a member of this project.'
            : rights.decision === 'not-member'
              ? 'Only a checker who is a member of this project can check it.'
              : 'A checker who is a member of this project checks it.'}
        </p>
      );
  }
  if (!body) return null;
  return (
    <Panel title="Sign-off" className="no-print">
      {body}
    </Panel>
  );
}
