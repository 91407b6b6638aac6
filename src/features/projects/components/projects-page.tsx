import { useState } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { EmptyState, Panel, QueryStatus } from '@/components/ui/states';
import { formatDate } from '@/lib/dates';
import { useCreateProject, useProjects } from '../api/projects';
import { ProjectFormDialog } from './project-form-dialog';
import { numeric, PlainTable } from '@/components/ui/column-heads';

function WhatAProjectHolds() {
  return (
    <ul className="mx-auto mt-2 max-w-xl list-disc text-left text-sm text-ink-soft">
      <li>
        <strong>Load cases</strong> saved from Evaluate: design depth or pressure, temperatures, service life and the component.
      </li>
      <li>
        <strong>Shortlists</strong> of catalogue candidates for a load case, each with a note on why it is in and what to confirm with the supplier.
      </li>
      <li>
        <strong>Design records</strong>, frozen when a second engineer checks a shortlist, printable and exportable as PDF.
      </li>
      <li>
        <strong>Members</strong>: only they can open the project.
      </li>
    </ul>
  );
}

export function ProjectsPage({ canCreate }: { canCreate: boolean }) {
  const navigate = useNavigate();
  const projects = useProjects();
  const create = useCreateProject();
  const [creating, setCreating] = useState(false);

  const newButton = canCreate ? <Button onClick={() => setCreating(true)}>New project…</Button> : null;

  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 className="text-2xl font-bold">Projects</h1>
          <p className="text-sm text-ink-soft">Load cases, shortlists and signed-off design records, kept per project for its members.</p>
        </div>
        {projects.data?.length ? newButton : null}
      </div>

      {projects.isPending || projects.isError ? (
        <QueryStatus query={projects} loading="Loading your projects…" />
      ) : projects.data.length === 0 ? (
        <EmptyState
          title="No projects yet"
          action={newButton}
        >
          <p>A project keeps together what you need to defend a window or hull choice:</p>
          <WhatAProjectHolds />
          {!canCreate ? <p className="mt-2">Ask an engineer to add you to their project; it then appears here.</p> : null}
        </EmptyState>
      ) : (
        <Panel>
          <PlainTable label="Projects" columns={['Project', 'Owner', numeric('Members'), numeric('Load cases'), numeric('Shortlists'), numeric('Awaiting check'), numeric('Checked'), 'Updated']}>
            {projects.data.map((p) => (
              <tr key={p.id} className="border-t border-chart-line/60 align-top">
                <td className="max-w-md py-2 pr-3">
                  <Link to={`/projects/${p.id}`} className="font-bold text-sounding hover:underline">
                    {p.name}
                  </Link>
                  {p.description ? <p className="line-clamp-2 text-xs text-ink-soft">{p.description}</p> : null}
                </td>
                <td className="py-2 pr-3">{p.owner.name}</td>
                <td className="py-2 pr-3 text-right">{p.members.length}</td>
                <td className="py-2 pr-3 text-right">{p.counts.loadCases}</td>
                <td className="py-2 pr-3 text-right">{p.counts.shortlists}</td>
                <td className="py-2 pr-3 text-right" data-testid="awaiting-check-count">
                  {p.counts.awaitingCheck ? <span className="font-bold text-brass">{p.counts.awaitingCheck}</span> : <span className="text-ink-faint">0</span>}
                </td>
                <td className="py-2 pr-3 text-right">{p.counts.checked}</td>
                <td className="whitespace-nowrap py-2">{formatDate(p.updatedAt)}</td>
              </tr>
            ))}
          </PlainTable>
        </Panel>
      )}

      <ProjectFormDialog
        open={creating}
        title="New project"
        confirmLabel="Create project"
        initial={{ name: '', description: '' }}
        onClose={() => setCreating(false)}
        onSave={async (values) => {
          const project = await create.mutateAsync(values);
          setCreating(false);
          navigate(`/projects/${project.id}`);
        }}
      />
    </div>
  );
}
