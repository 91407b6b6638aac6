import type { ReferencePageDto, ReferenceVersionDto } from '@shared/schemas/library';
import type { SessionUserDto } from '@shared/schemas/auth';
import { allowedSteps, type CuratedStatus, type CuratedStepName, type WorkflowSubject } from '@shared/workflows/curated';
import { REFERENCE_VERSION_STEPS } from '@shared/workflows/reference-version';
import { ColumnHeads } from '@/components/ui/column-heads';
import { Tag } from '@/components/ui/states';
import { WorkflowSteps } from '@/components/workflow-steps';
import { useReferenceVersionStep } from '../api/references';
import { REFERENCE_KIND_LABELS, STATUS_LABELS, STATUS_TONE, formatDateTime } from '../labels';
import { REFERENCE_FIELD_LABELS } from '../reference-form';

const subjectOf = (v: ReferenceVersionDto): WorkflowSubject<CuratedStatus> => ({
  status: v.status,
  authorIds: [v.draftedBy?.id, v.lastEditedBy?.id],
  facts: { cited: true },
});

const shown = (field: string, value: unknown) =>
  value === null || value === undefined || value === '' ? '—' : field === 'kind' ? REFERENCE_KIND_LABELS[value as keyof typeof REFERENCE_KIND_LABELS] : String(value);

/** A version's changes against the one it supersedes, field by field. */
export function CitationChanges({ version, label }: { version: ReferenceVersionDto; label: string }) {
  if (!version.changes.length) return <p className="text-sm text-ink-soft">No field differs from the version before.</p>;
  return (
    <table className="w-full text-sm" aria-label={label}>
      <ColumnHeads columns={['Field', 'Before', 'Proposed']} />
      <tbody>
        {version.changes.map((c) => (
          <tr key={c.field} className="border-t border-chart-line/60 align-top">
            <th scope="row" className="py-1 pr-3 text-left font-normal">
              {REFERENCE_FIELD_LABELS[c.field as keyof typeof REFERENCE_FIELD_LABELS] ?? c.field}
            </th>
            <td className="py-1 pr-3 text-ink-soft">{shown(c.field, c.before)}</td>
            <td className="py-1 font-bold">{shown(c.field, c.after)}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

/** Why the viewer cannot approve, in the desk's words, or null when they can (or the change is not in review). */
function approveBlocker(v: ReferenceVersionDto, me: SessionUserDto): string | null {
  if (v.status !== 'in-review') return null;
  const approve = allowedSteps(REFERENCE_VERSION_STEPS, subjectOf(v), { id: me.id, role: me.role }).find((a) => a.step.name === 'approve')!;
  if (approve.allowed) return null;
  if (approve.code === 'own-work') return 'You proposed or last edited this change, so a second librarian must approve or return it (four-eyes).';
  if (approve.code === 'no-role') return 'Your role cannot approve reference changes.';
  return approve.reason ?? null;
}

/** The open proposed change of a reference: what it changes, who proposed it, and its review steps. */
export function ProposedChange({ reference, me, onReload, onNotice }: { reference: ReferencePageDto; me: SessionUserDto; onReload: () => void; onNotice: (message: string) => void }) {
  const version = reference.pending!;
  const step = useReferenceVersionStep(reference.id);
  const blocker = approveBlocker(version, me);
  const onStep = async (name: CuratedStepName, comment: string | undefined) => {
    const input =
      name === 'return' ? { step: 'return' as const, lockVersion: version.lockVersion, comment: comment ?? '' } : { step: name as 'submit' | 'approve', lockVersion: version.lockVersion };
    await step.mutateAsync({ version: version.version, input });
    onNotice(
      name === 'approve'
        ? `Version ${version.version} is published. Drafts cite it from now on; published sets keep the version they cite until they are revised.`
        : name === 'submit'
          ? `Version ${version.version} is in review. The other librarians and administrators are told by e-mail.`
          : `Version ${version.version} is back with its author.`,
    );
  };
  return (
    <div className="flex flex-col gap-3 text-sm" data-testid="proposed-change">
      <p className="flex flex-wrap items-center gap-2">
        <strong>Version {version.version}</strong>
        <Tag tone={STATUS_TONE[version.status]}>{STATUS_LABELS[version.status]}</Tag>
        <span className="text-ink-soft">
          proposed by {version.draftedBy?.name ?? 'unknown'}
          {version.lastEditedBy && version.lastEditedBy.id !== version.draftedBy?.id ? `, last edited by ${version.lastEditedBy.name}` : ''}
          {version.submittedAt ? `, submitted ${formatDateTime(version.submittedAt)}` : ''}
        </span>
      </p>
      {version.returnedComment && version.status === 'draft' ? (
        <div className="rounded-plate border border-brass/40 bg-brass-light px-3 py-2" data-testid="returned-comment">
          <p className="text-xs font-bold uppercase tracking-wide text-brass">Returned with this comment</p>
          <p className="whitespace-pre-line">{version.returnedComment}</p>
        </div>
      ) : null}
      <CitationChanges version={version} label={`Changes proposed in version ${version.version}`} />
      {blocker ? (
        <p className="rounded-plate bg-sounding-light px-3 py-2 text-sounding-dark" data-testid="four-eyes">
          {blocker}
        </p>
      ) : version.status === 'in-review' ? (
        <p className="text-ink-soft">Check the change against the source, then approve it to publish it, or return it with a comment.</p>
      ) : (
        <p className="text-ink-soft">Edit the proposed change beside this, then submit it for a second librarian’s review.</p>
      )}
      <WorkflowSteps
        steps={REFERENCE_VERSION_STEPS}
        subject={subjectOf(version)}
        viewer={{ id: me.id, role: me.role }}
        busy={step.isPending}
        onStep={onStep}
        onReload={onReload}
        buttonLabels={{ submit: 'Submit for review…', approve: 'Approve…', return: 'Return to author…' }}
        reasons="none"
        empty={null}
        title={(s) => `${s.label}: version ${version.version}?`}
        describe={(s) =>
          s.name === 'approve' ? (
            <p>
              Version {version.version} replaces version {reference.version} as the published citation. Drafts cite it from now on; published sets, rating
              tables and design records keep the version they cite until they are revised.
            </p>
          ) : s.name === 'submit' ? (
            <p>A second librarian reviews it; until then the published citation stays as it is.</p>
          ) : null
        }
      />
    </div>
  );
}
