import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { Link } from 'react-router-dom';
import { ROLE_LABELS } from '@shared/schemas/auth';
import { memberAddSchema, type ProjectDto, type UserSummaryDto } from '@shared/schemas/projects';
import { Button, SubmitButton } from '@/components/ui/button';
import { ConfirmDialog, mutationState } from '@/components/ui/confirm-dialog';
import { SelectField } from '@/components/ui/field';
import { LinkButton } from '@/components/ui/link-button';
import { EmptyState, Panel, QueryStatus, Tag } from '@/components/ui/states';
import { errorText } from '@/lib/api-client';
import { formatDate, formatDateTime } from '@/lib/dates';
import { setServerErrors } from '@/lib/field-errors';
import { useUnits } from '@/lib/unit-system';
import {
  useAddMember,
  usePeople,
  useProject,
  useProjectLoadCases,
  useProjectRecords,
  useProjectShortlists,
  useRemoveMember,
  useUpdateProject,
} from '../api/projects';
import { summarizeLoadCase } from '../load-case-text';
import type { Viewer } from '../shortlist-model';
import { ShortlistStatusTag } from './bits';
import { ProjectFormDialog } from './project-form-dialog';
import { numeric, PlainTable } from '@/components/ui/column-heads';
import { Breadcrumb } from '@/components/ui/breadcrumb';

/** The member picker holds the chosen id as the select's text; the shared schema checks the number. */
const memberFormSchema = z
  .strictObject({ userId: z.string() })
  .transform((v) => ({ userId: Number(v.userId) }))
  .pipe(memberAddSchema);

function Members({ project, canManage }: { project: ProjectDto; canManage: boolean }) {
  const people = usePeople(canManage);
  const add = useAddMember(project.id);
  const remove = useRemoveMember(project.id);
  const form = useForm({ resolver: zodResolver(memberFormSchema), defaultValues: { userId: '' } });
  const chosen = form.watch('userId') !== '';
  const [removing, setRemoving] = useState<UserSummaryDto | null>(null);
  const memberIds = new Set(project.members.map((m) => m.id));
  const candidates = (people.data ?? []).filter((p) => !memberIds.has(p.id));

  return (
    <Panel title={`Members (${project.members.length})`}>
      <ul className="flex flex-col gap-2" aria-label="Members">
        {project.members.map((m) => (
          <li key={m.id} className="flex items-start justify-between gap-2 text-sm">
            <span>
              <span className="font-bold">{m.name}</span> {m.id === project.owner.id ? <Tag tone="brass">owner</Tag> : null}
              <span className="block text-xs text-ink-soft">
                {ROLE_LABELS[m.role]} · {m.email}
              </span>
            </span>
            {canManage && m.id !== project.owner.id ? (
              <Button
                tone="quiet"
                className="!px-2 !py-0.5 text-xs"
                aria-label={`Remove ${m.name} from the project`}
                onClick={() => {
                  remove.reset();
                  setRemoving(m);
                }}
              >
                Remove
              </Button>
            ) : null}
          </li>
        ))}
      </ul>
      {canManage ? (
        <form
          className="mt-4 flex items-end gap-2 border-t border-chart-line pt-3"
          onSubmit={form.handleSubmit(async ({ userId }) => {
            try {
              await add.mutateAsync(userId);
              form.reset();
            } catch (err) {
              setServerErrors(form.setError, err, { userId: 'Add a member' });
            }
          })}
        >
          <SelectField
            label="Add a member"
            wrapperClassName="flex-1"
            disabled={people.isPending || people.isError}
            error={form.formState.errors.userId?.message ?? form.formState.errors.root?.message ?? (people.isError ? errorText(people.error) : undefined)}
            hint={people.isPending ? 'Loading people…' : candidates.length === 0 ? 'Everyone with an active account is a member already.' : undefined}
            {...form.register('userId')}
          >
            <option value="">Choose a person…</option>
            {candidates.map((p) => (
              <option key={p.id} value={p.id}>
                {p.name} ({ROLE_LABELS[p.role]})
              </option>
            ))}
          </SelectField>
          <SubmitButton busy={add.isPending} busyLabel="Adding…" disabled={!chosen}>
            Add
          </SubmitButton>
        </form>
      ) : (
        <p className="mt-3 text-xs text-ink-soft">The project's owner or an administrator adds and removes members.</p>
      )}
      <ConfirmDialog
        open={removing !== null}
        title={`Remove ${removing?.name ?? ''} from the project?`}
        confirmLabel="Remove member"
        tone="danger"
        {...mutationState(remove)}
        busyLabel="Removing…"
        onClose={() => setRemoving(null)}
        onConfirm={() => removing && remove.mutate(removing.id, { onSuccess: () => setRemoving(null) })}
      >
        <p>They will no longer see this project's load cases, shortlists and design records. What they wrote stays in the project.</p>
      </ConfirmDialog>
    </Panel>
  );
}

function LoadCases({ projectId, canEvaluate }: { projectId: number; canEvaluate: boolean }) {
  const { system } = useUnits();
  const loadCases = useProjectLoadCases(projectId);
  if (loadCases.isPending || loadCases.isError) return <QueryStatus query={loadCases} loading="Loading load cases…" />;
  if (!loadCases.data.length) {
    return (
      <EmptyState title="No load cases yet" action={canEvaluate ? <LinkButton to="/evaluate">Go to Evaluate</LinkButton> : null}>
        In Evaluate, set up the load case and choose “Save to a project…”; it is kept here for shortlists and sign-off.
      </EmptyState>
    );
  }
  return (
    <PlainTable label="Load cases" columns={['Load case', 'Saved by', 'Updated', '']}>
      {loadCases.data.map((lc) => (
        <tr key={lc.id} className="border-t border-chart-line/60 align-top">
          <td className="py-2 pr-3">
            <span className="font-bold">{lc.name}</span>
            <span className="block text-xs text-ink-soft">{summarizeLoadCase(lc.loadCase, system)}</span>
            {lc.notes ? <span className="block whitespace-pre-line text-xs text-ink-faint">{lc.notes}</span> : null}
          </td>
          <td className="py-2 pr-3">{lc.createdBy?.name ?? '—'}</td>
          <td className="whitespace-nowrap py-2 pr-3">{formatDate(lc.updatedAt)}</td>
          <td className="py-2 text-right">
            {canEvaluate ? (
              <LinkButton tone="quiet" to={`/evaluate?loadCase=${lc.id}`} className="!px-2 !py-0.5 text-xs" aria-label={`Open ${lc.name} in Evaluate`}>
                Open in Evaluate
              </LinkButton>
            ) : null}
          </td>
        </tr>
      ))}
    </PlainTable>
  );
}

function Shortlists({ projectId }: { projectId: number }) {
  const shortlists = useProjectShortlists(projectId);
  const loadCases = useProjectLoadCases(projectId);
  if (shortlists.isPending || shortlists.isError) return <QueryStatus query={shortlists} loading="Loading shortlists…" />;
  if (!shortlists.data.length) {
    return (
      <EmptyState title="No shortlists yet">
        Open one of the load cases in Evaluate and use “+ Shortlist” on a candidate. Submit the shortlist when it is ready; a second engineer checks it.
      </EmptyState>
    );
  }
  const loadCaseName = (id: number) => loadCases.data?.find((lc) => lc.id === id)?.name ?? `Load case ${id}`;
  return (
    <PlainTable label="Shortlists" columns={['Shortlist', 'Status', 'Author', numeric('Candidates'), 'Updated', 'Record']}>
      {shortlists.data.map((s) => (
        <tr key={s.id} className="border-t border-chart-line/60 align-top">
          <td className="py-2 pr-3">
            <Link to={`/shortlists/${s.id}`} className="font-bold text-sounding hover:underline">
              {s.name}
            </Link>
            <span className="block text-xs text-ink-soft">for {loadCaseName(s.loadCaseId)}</span>
          </td>
          <td className="py-2 pr-3">
            <ShortlistStatusTag status={s.status} />
          </td>
          <td className="py-2 pr-3">{s.author.name}</td>
          <td className="py-2 pr-3 text-right">{s.itemCount}</td>
          <td className="whitespace-nowrap py-2 pr-3">{formatDate(s.updatedAt)}</td>
          <td className="py-2">
            {s.designRecordId ? (
              <Link to={`/records/${s.designRecordId}`} className="text-sounding underline">
                Design record
              </Link>
            ) : (
              <span className="text-ink-faint">—</span>
            )}
          </td>
        </tr>
      ))}
    </PlainTable>
  );
}

function Records({ projectId }: { projectId: number }) {
  const records = useProjectRecords(projectId);
  if (records.isPending || records.isError) return <QueryStatus query={records} loading="Loading design records…" />;
  if (!records.data.length) {
    return <EmptyState title="No design records yet">A design record is frozen when a checker checks a submitted shortlist. It keeps the inputs, results and data versions as they were.</EmptyState>;
  }
  return (
    <PlainTable label="Design records" columns={['Record', 'Load case', 'Author', 'Checker', 'Checked']}>
      {records.data.map((r) => (
        <tr key={r.id} className="border-t border-chart-line/60 align-top">
          <td className="py-2 pr-3">
            <Link to={`/records/${r.id}`} className="font-bold text-sounding hover:underline">
              {r.name}
            </Link>
          </td>
          <td className="py-2 pr-3">{r.loadCase}</td>
          <td className="py-2 pr-3">{r.author}</td>
          <td className="py-2 pr-3">{r.checker}</td>
          <td className="whitespace-nowrap py-2">{formatDateTime(r.checkedAt)}</td>
        </tr>
      ))}
    </PlainTable>
  );
}

export function ProjectPage({ id, me }: { id: number; me: Viewer }) {
  const project = useProject(id);
  const update = useUpdateProject(id);
  const [editing, setEditing] = useState(false);

  if (project.isPending || project.isError) return <QueryStatus query={project} loading="Loading the project…" />;
  const p = project.data;
  const canWrite = me.permissions.includes('project:write');
  const canManage = canWrite && (me.role === 'admin' || p.owner.id === me.id);
  const canEvaluate = me.permissions.includes('evaluate');

  return (
    <div className="flex flex-col gap-4">
      <Breadcrumb trail={[{ to: '/projects', label: 'Projects' }, { label: p.name }]} />
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <h1 className="text-2xl font-bold">{p.name}</h1>
          <p className="text-sm text-ink-soft">
            Owned by {p.owner.name} · started {formatDate(p.createdAt)} · {p.counts.loadCases} load case{p.counts.loadCases === 1 ? '' : 's'},{' '}
            {p.counts.shortlists} shortlist{p.counts.shortlists === 1 ? '' : 's'}, {p.counts.checked} checked
          </p>
        </div>
        {canManage ? (
          <Button tone="quiet" onClick={() => setEditing(true)}>
            Edit name and description…
          </Button>
        ) : null}
      </div>
      {p.description ? <p className="max-w-3xl whitespace-pre-line text-sm">{p.description}</p> : <p className="text-sm text-ink-faint">No description.</p>}

      <div className="grid gap-4 lg:grid-cols-[1fr_20rem]">
        <div className="flex min-w-0 flex-col gap-4">
          <Panel title="Load cases">
            <LoadCases projectId={id} canEvaluate={canEvaluate} />
          </Panel>
          <Panel title="Shortlists">
            <Shortlists projectId={id} />
          </Panel>
          <Panel title="Design records">
            <Records projectId={id} />
          </Panel>
        </div>
        <div>
          <Members project={p} canManage={canManage} />
        </div>
      </div>

      <ProjectFormDialog
        open={editing}
        title="Edit the project"
        confirmLabel="Save"
        initial={{ name: p.name, description: p.description, lockVersion: p.lockVersion }}
        onClose={() => setEditing(false)}
        onSave={async (values, lockVersion) => {
          await update.mutateAsync({ ...values, lockVersion: lockVersion ?? p.lockVersion });
          setEditing(false);
        }}
        onReload={async () => {
          const saved = await project.refetch();
          if (!saved.data) throw saved.error;
          return { name: saved.data.name, description: saved.data.description, lockVersion: saved.data.lockVersion };
        }}
      />
    </div>
  );
}
