import { lazy, Suspense } from 'react';
import { useParams, useSearchParams } from 'react-router-dom';
import { FAMILY_LABELS, QUANTITIES, QUANTITY_LABELS, type PropertySetDto } from '@shared/schemas/catalogue';
import { QUANTITY_KIND } from '@shared/schemas/quantities';
import { useMaterial } from '../api/property-sets';
import { ReferenceCard } from '@/components/reference-card';
import { ValueStatusNote } from '@/components/inputs-mark';
import { VALUE_BASIS_LABELS } from '@shared/labels';
import { engineInputKeys, inputStatus, inputStatusText, PROVENANCE_LABELS } from '@shared/schemas/provenance';
import { Panel, QueryStatus, Spinner, Tag } from '@/components/ui/states';
import { useUnits } from '@/lib/unit-system';
import { formatDate } from '@/lib/dates';
import { toDisplay } from '@/lib/units';
import { RatingTableSummary, useRatingTables } from '@/features/rating-tables';
import { ColumnHeads, numeric } from '@/components/ui/column-heads';
import { Breadcrumb } from '@/components/ui/breadcrumb';

const FactorChart = lazy(() => import('@/components/charts/factor-chart').then((m) => ({ default: m.FactorChart })));

function ValuesTable({ set }: { set: PropertySetDto }) {
  const { format } = useUnits();
  const rows = QUANTITIES.filter((q) => set[q] !== null && set[q] !== undefined);
  return (
    <table className="w-full text-sm" aria-label="Values">
      <ColumnHeads columns={['Quantity', numeric('Value'), 'Basis', 'Test method', 'Tested at', 'Status']} />
      <tbody>
        {rows.map((q) => {
          const kind = QUANTITY_KIND[q];
          const value = set[q] as number;
          const detail = set.valueDetails[q];
          return (
            <tr key={q} className="border-t border-chart-line/60">
              <td className="py-1 pr-3">{QUANTITY_LABELS[q]}</td>
              <td className="py-1 pr-3 text-right font-bold">{kind ? format(kind, value) : value.toFixed(3)}</td>
              <td className="py-1 pr-3">{detail?.basis ? VALUE_BASIS_LABELS[detail.basis] : '—'}</td>
              <td className="py-1 pr-3">{detail?.testMethod ?? '—'}</td>
              <td className="py-1 pr-3">{detail?.temperature !== undefined ? format('temperature', detail.temperature) : '—'}</td>
              <td className="py-1">
                <ValueStatusNote provenance={set.provenance} field={q} />
              </td>
            </tr>
          );
        })}
      </tbody>
    </table>
  );
}

function SetDetail({ set }: { set: PropertySetDto }) {
  const { format, label, system } = useUnits();
  const charts = [
    set.temperatureFactors.length > 1 && (
      <FactorChart
        key="t"
        title="Strength vs temperature"
        xLabel={label('temperature')}
        points={set.temperatureFactors.map((p) => ({ x: toDisplay('temperature', system, p.temperature), y: p.factor }))}
      />
    ),
    set.sustainedLoadFactors.length > 1 && (
      <FactorChart key="h" title="Strength vs sustained load" xLabel="hours (log)" logX points={set.sustainedLoadFactors.filter((p) => p.hours > 0).map((p) => ({ x: p.hours, y: p.factor }))} />
    ),
    set.cyclicFactors.length > 1 && (
      <FactorChart key="c" title="Strength vs pressure cycles" xLabel="cycles (log)" logX points={set.cyclicFactors.filter((p) => p.cycles > 0).map((p) => ({ x: p.cycles, y: p.factor }))} />
    ),
  ].filter(Boolean);
  return (
    <div className="flex flex-col gap-4">
      <Panel
        title={set.condition}
        actions={
          <div className="flex items-center gap-2 text-xs">
            <Tag tone={set.status === 'published' ? 'pass' : set.status === 'retired' ? 'neutral' : 'brass'}>{set.status}</Tag>
            <span>version {set.version}</span>
          </div>
        }
      >
        <ValuesTable set={set} />
        <p className="mt-3 text-sm">
          Service temperature {format('temperature', set.serviceTemperature.min)} to {format('temperature', set.serviceTemperature.max)}{' '}
          <ValueStatusNote provenance={set.provenance} field="serviceTemperature" />
        </p>
        <p className="mt-1 text-sm" data-testid="set-inputs">
          {inputStatusText(inputStatus(set.provenance, engineInputKeys(set)))} (of the values the calculation uses).
        </p>
        <p className="mt-1 text-xs text-ink-faint">
          {set.draftedBy ? `Drafted by ${set.draftedBy.name}. ` : 'Seeded from the project catalogue. '}
          {set.approvedBy ? `Approved by ${set.approvedBy.name}. ` : ''}
          {set.publishedAt ? `Published ${formatDate(set.publishedAt)}.` : ''}
        </p>
      </Panel>
      <Panel title="Dependence data">
        {charts.length ? (
          <Suspense fallback={<Spinner label="Drawing curves…" />}>
            <div className="grid gap-4 md:grid-cols-3">{charts}</div>
          </Suspense>
        ) : (
          <p className="text-sm text-ink-soft">This set carries no temperature, sustained-load or cyclic data. Evaluations using it will say so.</p>
        )}
        <ul className="mt-2 flex flex-col gap-0.5">
          {(['temperatureFactors', 'sustainedLoadFactors', 'cyclicFactors'] as const)
            .filter((k) => set[k].length)
            .map((k) => (
              <li key={k} className="text-xs">
                {PROVENANCE_LABELS[k]}: <ValueStatusNote provenance={set.provenance} field={k} />
              </li>
            ))}
        </ul>
        {set.sustainedLoadFactors.length === 0 && set.temperatureFactors.length > 0 ? (
          <p className="mt-2 text-xs text-ink-soft">No sustained-load (creep) data in this set.</p>
        ) : null}
      </Panel>
      <Panel title="Source">
        <ReferenceCard reference={set.reference} />
      </Panel>
    </div>
  );
}

export function MaterialPage() {
  const id = Number(useParams().id);
  const [params, setParams] = useSearchParams();
  const query = useMaterial(id);
  if (query.isPending || query.isError) return <QueryStatus query={query} loading="Loading material…" />;
  const material = query.data;
  const selectedId = Number(params.get('set')) || material.propertySets[0]?.id;
  const selected = material.propertySets.find((s) => s.id === selectedId) ?? material.propertySets[0];

  return (
    <div className="flex flex-col gap-4">
      <Breadcrumb trail={[{ to: '/catalogue', label: 'Catalogue' }, { label: material.name }]} />
      <div>
        <h1 className="text-2xl font-bold">{material.name}</h1>
        <p className="text-sm text-ink-soft">
          {FAMILY_LABELS[material.family]} · {material.transparent ? 'transparent' : 'opaque'}
          {material.description ? ` · ${material.description}` : ''}
        </p>
      </div>
      <div className="grid gap-4 md:grid-cols-[16rem_1fr]">
        <Panel title="Property sets">
          <ul className="flex flex-col gap-1" role="listbox" aria-label="Property sets of this material">
            {material.propertySets.map((s) => (
              <li key={s.id}>
                <button
                  type="button"
                  role="option"
                  aria-selected={s.id === selected?.id}
                  onClick={() => setParams({ set: String(s.id) }, { replace: true })}
                  className={`w-full rounded-plate px-2 py-1.5 text-left text-sm ${s.id === selected?.id ? 'bg-sounding text-white' : 'hover:bg-chart-deep'}`}
                >
                  <span className="block font-bold">{s.condition}</span>
                  <span className="text-xs opacity-80">
                    v{s.version} · {s.status}
                  </span>
                </button>
              </li>
            ))}
          </ul>
        </Panel>
        {selected ? <SetDetail set={selected} /> : <p>No property sets yet.</p>}
      </div>
      <MaterialRatingTables materialId={material.id} />
    </div>
  );
}

/** The published rating tables of the material: the window data that size its windows. */
function MaterialRatingTables({ materialId }: { materialId: number }) {
  const tables = useRatingTables({ materialId, status: 'published' });
  if (tables.isPending || tables.isError) return <QueryStatus query={tables} loading="Loading rating tables…" />;
  if (!tables.data.items.length) return null;
  return (
    <section aria-label="Rating tables" className="flex flex-col gap-3">
      <h2 className="text-lg font-bold">Rating tables</h2>
      <p className="text-sm text-ink-soft">Where one of these covers a window's geometry, Evaluate takes the required thickness from it; the analytical models cross-check it.</p>
      {tables.data.items.map((t) => (
        <RatingTableSummary key={t.id} table={t} />
      ))}
    </section>
  );
}
