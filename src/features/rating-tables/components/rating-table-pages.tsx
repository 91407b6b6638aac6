import { useMemo, useState } from 'react';
import { Link, useNavigate, useParams, useSearchParams } from 'react-router-dom';
import type { SessionUserDto } from '@shared/schemas/auth';
import { RATING_GEOMETRY_LABELS, type RatingTableDraftInput, type RatingTableDto } from '@shared/schemas/rating-tables';
import { CURATED_STATUS_LABELS, CURATED_STEPS, type CuratedStepName } from '@shared/workflows/curated';
import { EmptyState, ErrorState, Panel, Spinner, Tag } from '@/components/ui/states';
import { SelectField } from '@/components/ui/field';
import { LinkButton } from '@/components/ui/link-button';
import { WorkflowSteps } from '@/components/workflow-steps';
import { useQuery } from '@tanstack/react-query';
import { materialsQueryOptions, referencesQueryOptions } from '@/features/library';
import { materialQueryOptions } from '@/features/catalogue';
import { useCreateRatingTable, useRatingTable, useRatingTables, useRatingTableStep, useUpdateRatingTable } from '../api/rating-tables';
import { EMPTY_EDITOR, editorFrom } from '../editor-model';
import { RatingTableEditor } from './rating-table-editor';
import { RatingTableSummary } from './rating-table-summary';
import { ColumnHeads } from '@/components/ui/column-heads';
import { Breadcrumb } from '@/components/ui/breadcrumb';

const TONE = { draft: 'brass', 'in-review': 'sounding', published: 'pass', retired: 'neutral' } as const;

/** The choices the editor needs: references and the material's property-set lineages. */
function useEditorChoices(materialId: number | null) {
  const refs = useQuery(referencesQueryOptions(''));
  const material = useQuery({ ...materialQueryOptions(materialId ?? 0), enabled: materialId !== null });
  return {
    references: (refs.data?.items ?? []).map((r) => ({ id: r.id, label: [r.title, r.year].filter(Boolean).join(', ') })),
    sets: (material.data?.propertySets ?? []).filter((s) => s.status === 'published').map((s) => ({ id: s.lineageId ?? s.id, label: s.condition })),
  };
}

/** Rating tables on the desk: the open ones (drafts and reviews) and every published one. */
export function RatingTablesDesk() {
  const open = useRatingTables({ status: 'open' });
  const published = useRatingTables({ status: 'published' });
  const row = (t: RatingTableDto) => (
    <tr key={t.id} className="border-t border-chart-line/60">
      <td className="py-1.5 pr-3">
        <Link to={`/library/rating-tables/${t.id}`} className="font-bold text-sounding hover:underline">
          {t.content.name}
        </Link>
        <span className="block text-xs text-ink-soft">{t.material.name}</span>
      </td>
      <td className="py-1.5 pr-3">{RATING_GEOMETRY_LABELS[t.content.geometry]}</td>
      <td className="py-1.5 pr-3">
        <Tag tone={TONE[t.status]}>{CURATED_STATUS_LABELS[t.status]}</Tag>
      </td>
      <td className="py-1.5">v{t.version}</td>
    </tr>
  );
  const table = (label: string, items: RatingTableDto[]) => (
    <table className="w-full text-sm" aria-label={label}>
      <ColumnHeads columns={['Table and material', 'Geometry', 'Status', 'Version']} />
      <tbody>{items.map(row)}</tbody>
    </table>
  );
  return (
    <div className="flex flex-col gap-4">
      <Breadcrumb trail={[{ to: '/library', label: 'Library desk' }, { to: '/library/rating-tables', label: 'Rating tables' }, { label: 'All' }]} />
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 className="text-2xl font-bold">Rating tables</h1>
          <p className="text-sm text-ink-soft">
            The trade's window data for one geometry and material grade. Where a published table covers a window, it sets the thickness and the analytical models cross-check it. Enter your licensed standard's tables here.
          </p>
        </div>
        <LinkButton to="/library/rating-tables/new">New rating table</LinkButton>
      </div>
      <Panel title="Drafts and reviews">
        {open.isPending ? <Spinner /> : open.isError ? <ErrorState error={open.error} /> : open.data.items.length ? table('Open rating tables', open.data.items) : <EmptyState title="No rating table is being drafted or reviewed" />}
      </Panel>
      <Panel title="Published">
        {published.isPending ? <Spinner /> : published.isError ? <ErrorState error={published.error} /> : published.data.items.length ? table('Published rating tables', published.data.items) : <EmptyState title="No published rating table yet" />}
      </Panel>
    </div>
  );
}

export function NewRatingTablePage() {
  const [params, setParams] = useSearchParams();
  const navigate = useNavigate();
  const materialId = Number(params.get('material')) || null;
  const materials = useQuery(materialsQueryOptions());
  const choices = useEditorChoices(materialId);
  const create = useCreateRatingTable();
  const save = async (draft: RatingTableDraftInput) => {
    const t = await create.mutateAsync(draft);
    navigate(`/library/rating-tables/${t.id}`, { replace: true });
  };
  return (
    <div className="flex flex-col gap-4">
      <Breadcrumb trail={[{ to: '/library', label: 'Library desk' }, { to: '/library/rating-tables', label: 'Rating tables' }, { label: 'New' }]} />
      <h1 className="text-2xl font-bold">New rating table</h1>
      <Panel>
        <SelectField label="Material" value={materialId ?? ''} onChange={(e) => setParams({ material: e.target.value }, { replace: true })} hint="The table applies to sets of this material">
          <option value="">Choose the material…</option>
          {(materials.data?.items ?? []).map((m) => (
            <option key={m.id} value={m.id}>
              {m.name}
            </option>
          ))}
        </SelectField>
      </Panel>
      {materialId ? (
        <Panel title="Draft">
          <RatingTableEditor materialId={materialId} initial={EMPTY_EDITOR} references={choices.references} sets={choices.sets} onSave={save} />
        </Panel>
      ) : null}
    </div>
  );
}

export function RatingTablePage({ me }: { me: SessionUserDto | null | undefined }) {
  const id = Number(useParams().id);
  const navigate = useNavigate();
  const query = useRatingTable(id);
  const update = useUpdateRatingTable(id);
  const step = useRatingTableStep(id);
  const [saved, setSaved] = useState<string | null>(null);
  const t = query.data;
  const choices = useEditorChoices(t?.material.id ?? null);
  const initial = useMemo(() => (t ? editorFrom(t) : EMPTY_EDITOR), [t]);
  if (query.isPending) return <Spinner label="Loading the rating table…" />;
  if (query.isError || !t) return <ErrorState error={query.error} onRetry={() => void query.refetch()} />;
  const editable = t.status === 'draft' && !!me?.permissions.includes('catalogue:draft');
  const onStep = async (name: CuratedStepName, comment: string | undefined) => {
    const input = name === 'return' || name === 'retire' ? { step: name, lockVersion: t.lockVersion, comment: comment ?? '' } : { step: name, lockVersion: t.lockVersion };
    const next = await step.mutateAsync(input as never);
    if (next.id !== t.id) navigate(`/library/rating-tables/${next.id}`);
  };
  return (
    <div className="flex flex-col gap-4">
      <Breadcrumb trail={[{ to: '/library', label: 'Library desk' }, { to: '/library/rating-tables', label: 'Rating tables' }, { label: t.content.name }]} />
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <h1 className="text-2xl font-bold">{t.content.name}</h1>
          <p className="text-sm text-ink-soft">
            {t.material.name} · {RATING_GEOMETRY_LABELS[t.content.geometry]}
            {t.content.includedAngle ? ` · ${t.content.includedAngle.min}–${t.content.includedAngle.max}°` : ''} · version {t.version}
          </p>
        </div>
        <Tag tone={TONE[t.status]}>{CURATED_STATUS_LABELS[t.status]}</Tag>
      </div>
      {t.returnedComment && t.status === 'draft' ? (
        <p role="status" className="rounded-plate border border-verdict-watch/40 bg-white px-3 py-2 text-sm">
          <span className="font-bold">Returned by the reviewer: </span>
          {t.returnedComment}
        </p>
      ) : null}
      {me ? (
        <Panel title="Review">
          <WorkflowSteps
            steps={CURATED_STEPS}
            subject={{ status: t.status, authorIds: [t.draftedBy?.id, t.lastEditedBy?.id], facts: { cited: t.reference !== null } }}
            viewer={{ id: me.id, role: me.role }}
            busy={step.isPending}
            onStep={onStep}
            onReload={() => void query.refetch()}
          />
          <p className="mt-2 text-xs text-ink-soft">
            {t.draftedBy ? `Drafted by ${t.draftedBy.name}. ` : 'Seeded from public sources. '}
            {t.lastEditedBy && t.lastEditedBy.id !== t.draftedBy?.id ? `Last edited by ${t.lastEditedBy.name}. ` : ''}
            {t.approvedBy ? `Approved by ${t.approvedBy.name}.` : ''}
          </p>
        </Panel>
      ) : null}
      {editable ? (
        <Panel title="Draft">
          {saved ? <p role="status" className="mb-2 text-sm text-verdict-pass">{saved}</p> : null}
          <RatingTableEditor
            key={`${t.id}:${t.lockVersion}`}
            materialId={t.material.id}
            initial={initial}
            references={choices.references}
            sets={choices.sets}
            onSave={async (draft) => {
              await update.mutateAsync({ lockVersion: t.lockVersion, draft });
              setSaved('Draft saved.');
            }}
            onReload={() => void query.refetch()}
          />
        </Panel>
      ) : (
        <RatingTableSummary table={t} />
      )}
    </div>
  );
}
