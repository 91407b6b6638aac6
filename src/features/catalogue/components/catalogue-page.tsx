import { useEffect, useMemo, useRef, useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import Fuse from 'fuse.js';
import { FAMILIES, FAMILY_LABELS } from '@shared/schemas/catalogue';
import { usePropertySets } from '../api/property-sets';
import { filtersFromSearch, serverFilters, usableFromSearch } from '../filters';
import { geometryText, USABLE_COMPONENTS, useUsableAt, type UsableAt } from '../usable-at';
import { COMPONENT_LABELS } from '@shared/labels';
import { formatPressureAll, fromDisplay, PRESSURE_UNITS, roundForInput, toDisplay, unitOf } from '@/lib/units';
import { CatalogueTable } from './catalogue-table';
import { SelectField, TextField, LabelledOptions } from '@/components/ui/field';
import { EmptyState, QueryStatus } from '@/components/ui/states';
import { Button } from '@/components/ui/button';
import { useUnits } from '@/lib/unit-system';
import { TemperatureInput } from './temperature-input';

/** "Usable at" a depth or pressure for a component: typed in the shown units, kept in the URL in SI. */
function UsableAtFields({ params, setParam }: { params: URLSearchParams; setParam: (key: string, value: string | undefined) => void }) {
  const { system, label } = useUnits();
  const component = params.get('usable') ?? '';
  const byPressure = params.has('atPressure');
  const unit = system === 'US' ? PRESSURE_UNITS.psi : PRESSURE_UNITS.MPa;
  const si = Number(params.get(byPressure ? 'atPressure' : 'atDepth'));
  const shownValue = params.get(byPressure ? 'atPressure' : 'atDepth') ? String(roundForInput(byPressure ? unit : unitOf('depth', system), byPressure ? unit.fromSI(si) : toDisplay('depth', system, si))) : '';
  const [text, setText] = useState(shownValue);
  useEffect(() => setText(shownValue), [shownValue]);
  const commit = (mode: 'depth' | 'pressure', raw: string) => {
    const v = Number(raw);
    setParam('atDepth', undefined);
    setParam('atPressure', undefined);
    if (raw.trim() === '' || !Number.isFinite(v) || v <= 0) return;
    if (mode === 'depth') setParam('atDepth', String(fromDisplay('depth', system, v)));
    else setParam('atPressure', String(unit.toSI(v)));
  };
  return (
    <fieldset className="col-span-2 grid grid-cols-3 gap-2 md:col-span-6 md:grid-cols-6" aria-label="Usable at">
      <SelectField label="Usable as" value={component} onChange={(e) => setParam('usable', e.target.value || undefined)} wrapperClassName="col-span-3 md:col-span-2">
        <option value="">Any use (no pressure filter)</option>
        {USABLE_COMPONENTS.map((c) => (
          <option key={c} value={c}>
            {COMPONENT_LABELS[c]}
          </option>
        ))}
      </SelectField>
      <SelectField label="At" value={byPressure ? 'pressure' : 'depth'} onChange={(e) => commit(e.target.value as 'depth' | 'pressure', '')} disabled={!component}>
        <option value="depth">Depth</option>
        <option value="pressure">Pressure</option>
      </SelectField>
      <TextField
        label={byPressure ? 'Design pressure' : 'Design depth'}
        unit={byPressure ? `${unit.label}, gauge` : label('depth')}
        inputMode="decimal"
        disabled={!component}
        value={text}
        onChange={(e) => setText(e.target.value)}
        onBlur={() => commit(byPressure ? 'pressure' : 'depth', text)}
        onKeyDown={(e) => {
          if (e.key === 'Enter') commit(byPressure ? 'pressure' : 'depth', text);
        }}
        wrapperClassName="col-span-2 md:col-span-1"
      />
      {component ? <p className="col-span-3 self-end text-xs text-ink-soft">{geometryText(component as UsableAt['component'])} (the Harrow Sound demo sizes); the required thickness is shown beside each set.</p> : null}
    </fieldset>
  );
}

export function CataloguePage({ canEvaluate = false }: { canEvaluate?: boolean }) {
  const [params, setParams] = useSearchParams();
  const filters = filtersFromSearch(params);
  const query = usePropertySets(serverFilters(filters));
  const { system, format } = useUnits();

  // Changes build on the last one asked for, not on the URL: the route's loader runs before the URL
  // changes, so a second change made meanwhile (leaving one field for the next) must not drop the first.
  const latest = useRef(params);
  useEffect(() => {
    latest.current = params;
  }, [params]);
  const setParam = (key: string, value: string | undefined) => {
    const next = new URLSearchParams(latest.current);
    if (value === undefined || value === '') next.delete(key);
    else next.set(key, value);
    latest.current = next;
    setParams(next, { replace: true });
  };
  const rangeError =
    filters.tmin !== undefined && filters.tmax !== undefined && filters.tmin > filters.tmax ? 'Must not be below the minimum' : undefined;

  const items = query.data?.items;
  const fuse = useMemo(
    () =>
      new Fuse(items ?? [], {
        keys: ['material.name', 'condition', 'material.family', 'reference.title', 'reference.identifier'],
        threshold: 0.35,
        ignoreLocation: true,
      }),
    [items],
  );
  const shown = useMemo(() => {
    if (!items) return [];
    const q = filters.q?.trim();
    return q ? fuse.search(q).map((r) => r.item) : items;
  }, [items, fuse, filters.q]);

  const usable = canEvaluate ? usableFromSearch(params) : null;
  const temperature = { min: filters.tmin ?? 2, max: Math.max(filters.tmax ?? 25, filters.tmin ?? 2) };
  const usableAt = useUsableAt(usable, temperature);
  const listed = useMemo(() => (usable && usableAt.data ? shown.filter((s) => { const t = usableAt.data.get(s.id); return t !== undefined && t !== null && Number.isFinite(t); }) : shown), [shown, usable, usableAt.data]);
  const hasFilters = params.toString() !== '';

  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 className="text-2xl font-bold">Catalogue</h1>
          <p className="text-sm text-ink-soft">Published property sets, each with its source. Values shown in {system === 'SI' ? 'SI' : 'US customary'} units.</p>
        </div>
      </div>

      <form role="search" className="grid grid-cols-2 gap-3 rounded-plate bg-chart-raised p-3 shadow-plate md:grid-cols-6" onSubmit={(e) => e.preventDefault()}>
        <TextField
          wrapperClassName="col-span-2"
          label="Search"
          type="search"
          placeholder="e.g. acrylic, 7075, PVHO"
          value={filters.q ?? ''}
          onChange={(e) => setParam('q', e.target.value)}
          hint="Fuzzy match on material, condition and source"
        />
        <SelectField label="Family" value={filters.family ?? ''} onChange={(e) => setParam('family', e.target.value || undefined)}>
          <option value="">All families</option>
          <LabelledOptions values={FAMILIES} labels={FAMILY_LABELS} />
        </SelectField>
        <SelectField
          label="Transparency"
          value={filters.transparent === undefined ? '' : String(filters.transparent)}
          onChange={(e) => setParam('transparent', e.target.value || undefined)}
        >
          <option value="">Any</option>
          <option value="true">Transparent (windows)</option>
          <option value="false">Opaque (hulls)</option>
        </SelectField>
        <TemperatureInput label="Service from" celsius={filters.tmin} onCommit={(c) => setParam('tmin', c === undefined ? undefined : String(c))} />
        <TemperatureInput
          label="Service to"
          celsius={filters.tmax}
          onCommit={(c) => setParam('tmax', c === undefined ? undefined : String(c))}
          extraError={rangeError}
        />
        {canEvaluate ? <UsableAtFields params={params} setParam={setParam} /> : null}
      </form>

      <div className="flex items-center justify-between text-sm text-ink-soft" aria-live="polite">
        <span>{query.data ? `${shown.length} of ${query.data.total} property sets` : ' '}</span>
        {hasFilters ? (
          <Button tone="quiet" onClick={() => {
            latest.current = new URLSearchParams();
            setParams(latest.current, { replace: true });
          }}>
            Clear filters
          </Button>
        ) : null}
      </div>

      {query.isPending || query.isError ? (
        <QueryStatus query={query} loading="Loading the catalogue…" />
      ) : shown.length === 0 ? (
        <EmptyState title="No property sets match these filters">
          Widen the service temperature range, choose another family, or clear the search.
        </EmptyState>
      ) : (
        <>
          {usable ? (
            <p className="text-sm" data-testid="usable-summary" role="status">
              {usableAt.isPending ? (
                'Working out the thickness each set needs…'
              ) : usableAt.isError ? (
                <span className="text-verdict-fail">The thicknesses could not be worked out: {usableAt.error.message}</span>
              ) : (
                <>
                  <strong>{listed.length}</strong> of {shown.length} sets have a finite required thickness for a {geometryText(usable.component).toLowerCase()} at{' '}
                  {usable.depth !== undefined ? `${format('depth', usable.depth)} in seawater` : `${formatPressureAll(usable.pressure, system === 'US' ? 'psi' : 'MPa')} gauge`}, {format('temperature', temperature.min)} to{' '}
                  {format('temperature', temperature.max)}, 1,000 h and 2,000 cycles, each against its family's target.
                </>
              )}
            </p>
          ) : null}
          <CatalogueTable items={listed} requiredThickness={usable && usableAt.data ? usableAt.data : undefined} />
        </>
      )}
    </div>
  );
}
