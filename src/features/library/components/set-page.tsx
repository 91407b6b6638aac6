import { useState } from 'react';
import { useParams } from 'react-router-dom';
import { FAMILY_LABELS } from '@shared/schemas/catalogue';
import type { LibrarySetDto } from '@shared/schemas/library';
import type { SessionUserDto } from '@shared/schemas/auth';
import { Button } from '@/components/ui/button';
import { ErrorState, Panel, Spinner, Tag } from '@/components/ui/states';
import { useUnits } from '@/lib/unit-system';
import { useLibrarySet, useSetChanges } from '../api/library-sets';
import { describeChanges, formatChangeValue } from '../changes';
import { STATUS_LABELS, STATUS_TONE } from '../labels';
import { ReferenceCard } from '@/components/reference-card';
import { PublishedActions, ReviewPanel } from './review-panel';
import { SetEditor } from './set-editor';
import { SetHistory } from './set-history';
import { SetValues } from './set-values';
import { SetConfirmations } from './set-confirmations';
import { ValueStatusNote } from '@/components/inputs-mark';
import { ColumnHeads } from '@/components/ui/column-heads';
import { Notice } from '@/components/ui/form-error';
import { Breadcrumb } from '@/components/ui/breadcrumb';


function DependenceList({ set }: { set: LibrarySetDto }) {
  const { system } = useUnits();
  const rows = [
    ['Strength vs temperature', 'temperatureFactors', set.temperatureFactors],
    ['Strength vs sustained load', 'sustainedLoadFactors', set.sustainedLoadFactors],
    ['Strength vs pressure cycles', 'cyclicFactors', set.cyclicFactors],
  ] as const;
  return (
    <dl className="grid gap-2 text-sm md:grid-cols-[14rem_1fr]">
      {rows.map(([label, field, points]) => (
        <div key={field} className="contents">
          <dt className="text-ink-soft">{label}</dt>
          <dd>
            {formatChangeValue(field, points, system)}
            {points.length ? (
              <>
                {' '}
                <ValueStatusNote provenance={set.provenance} field={field} />
              </>
            ) : null}
          </dd>
        </div>
      ))}
    </dl>
  );
}

/** What changed against the version this one revises. */
function ChangesPanel({ set }: { set: LibrarySetDto }) {
  const { system } = useUnits();
  const changes = useSetChanges(set.id);
  if (changes.isPending) return <Spinner label="Comparing with the previous version…" />;
  if (changes.isError) return <ErrorState error={changes.error} onRetry={() => void changes.refetch()} />;
  const { previous } = changes.data;
  const rows = describeChanges(changes.data.changes, system);
  return (
    <>
      <Panel title={previous ? `Values against version ${previous.version}` : 'Values'}>
        {!previous ? <p className="mb-2 text-sm text-ink-soft">First version of this set: there is nothing earlier to compare with.</p> : null}
        <SetValues set={set} previous={previous} />
      </Panel>
      {previous ? (
        <Panel title={`All changes since version ${previous.version}`}>
          {rows.length === 0 ? (
            <p className="text-sm text-ink-soft">No values changed.</p>
          ) : (
            <table className="w-full text-sm" aria-label="Changes">
              <ColumnHeads columns={['Field', 'Before', 'After']} />
              <tbody>
                {rows.map((r) => (
                  <tr key={r.field} className="border-t border-chart-line/60 align-top">
                    <th scope="row" className="py-1 pr-3 text-left font-normal">{r.label}</th>
                    <td className="py-1 pr-3 text-ink-soft">{r.before}</td>
                    <td className="bg-brass-light py-1 font-bold">{r.after}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          )}
        </Panel>
      ) : null}
    </>
  );
}

function SetView({ set, me, onReload }: { set: LibrarySetDto; me: SessionUserDto; onReload: () => void }) {
  const compare = set.status === 'in-review' || !!set.supersedesId;
  // Kept here, not in the panels: approving or retiring changes the status and so the panel shown.
  const [notice, setNotice] = useState<string | null>(null);
  return (
    <div className="flex flex-col gap-4">
      <Notice message={notice} boxed />
      <div className="grid gap-5 lg:grid-cols-[1fr_20rem]">
        <div className="flex min-w-0 flex-col gap-4">
          {compare ? (
            <ChangesPanel set={set} />
          ) : (
            <Panel title="Values">
              <SetValues set={set} />
            </Panel>
          )}
          {set.status === 'published' || set.status === 'retired' ? <SetConfirmations set={set} me={me} onReloadSet={onReload} /> : null}
          <Panel title="Dependence data">
            <DependenceList set={set} />
          </Panel>
          <Panel title="Source">
            <ReferenceCard testId="set-reference" missing="No reference yet: this set cannot be approved without one." reference={set.reference} />
          </Panel>
        </div>
        <aside className="flex flex-col gap-4" aria-label="Review and history">
          {set.status === 'in-review' ? <ReviewPanel set={set} me={me} onReload={onReload} onNotice={setNotice} /> : null}
          {set.status === 'published' ? <PublishedActions set={set} me={me} onReload={onReload} onNotice={setNotice} /> : null}
          {set.status === 'retired' ? (
            <Panel title="Retired">
              <p className="text-sm text-ink-soft">
                This set is no longer offered by the catalogue or Evaluate. It stays readable for the design records that used it.
              </p>
            </Panel>
          ) : null}
          <SetHistory set={set} />
        </aside>
      </div>
    </div>
  );
}

function SetHeading({ set }: { set: LibrarySetDto }) {
  return (
    <div className="flex flex-wrap items-end justify-between gap-3">
      <div>
        <h1 className="text-2xl font-bold">
          {set.material.name} <span className="font-normal text-ink-soft">— {set.condition}</span>
        </h1>
        <p className="mt-1 flex items-center gap-2 text-sm text-ink-soft">
          <Tag tone={STATUS_TONE[set.status]}>{STATUS_LABELS[set.status]}</Tag>
          version {set.version} · {FAMILY_LABELS[set.material.family]} · {set.material.transparent ? 'transparent' : 'opaque'}
        </p>
      </div>
      {set.status !== 'draft' ? (
        <Button tone="quiet" className="no-print" onClick={() => window.print()}>
          Print
        </Button>
      ) : null}
    </div>
  );
}

/** `me` comes from the app layer (the signed-in user), so this feature does not reach into auth. */
export function SetPage({ me }: { me: SessionUserDto | null | undefined }) {
  const id = Number(useParams().id);
  const query = useLibrarySet(id);
  if (query.isPending) return <Spinner label="Loading the property set…" />;
  if (query.isError) return <ErrorState error={query.error} onRetry={() => void query.refetch()} />;
  const set = query.data;
  return (
    <div className="flex flex-col gap-4">
      <Breadcrumb trail={[{ to: '/library', label: 'Library desk' }, { label: `${set.material.name} — ${set.condition}` }]} />
      <SetHeading set={set} />
      {set.status === 'draft' ? (
        <SetEditor key={set.id} set={set} />
      ) : me ? (
        <SetView set={set} me={me} onReload={() => void query.refetch()} />
      ) : null}
    </div>
  );
}

export function NewSetPage() {
  return (
    <div className="flex flex-col gap-4">
      <Breadcrumb trail={[{ to: '/library', label: 'Library desk' }, { label: 'New property set' }]} />
      <div>
        <h1 className="text-2xl font-bold">New property set</h1>
        <p className="text-sm text-ink-soft">One cited set of values for a material in one condition. It starts as your draft.</p>
      </div>
      <SetEditor />
    </div>
  );
}
