import { useMemo } from 'react';
import { useSearchParams } from 'react-router-dom';
import Fuse from 'fuse.js';
import { FAMILIES, FAMILY_LABELS } from '@shared/schemas/catalogue';
import { usePropertySets } from '../api/property-sets';
import { filtersFromSearch, serverFilters } from '../filters';
import { CatalogueTable } from './catalogue-table';
import { SelectField, TextField, LabelledOptions } from '@/components/ui/field';
import { EmptyState, ErrorState, Spinner } from '@/components/ui/states';
import { Button } from '@/components/ui/button';
import { useUnits } from '@/lib/unit-system';
import { TemperatureInput } from './temperature-input';

export function CataloguePage() {
  const [params, setParams] = useSearchParams();
  const filters = filtersFromSearch(params);
  const query = usePropertySets(serverFilters(filters));
  const { system } = useUnits();

  const setParam = (key: string, value: string | undefined) =>
    setParams(
      (prev) => {
        const next = new URLSearchParams(prev);
        if (value === undefined || value === '') next.delete(key);
        else next.set(key, value);
        return next;
      },
      { replace: true },
    );
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
      </form>

      <div className="flex items-center justify-between text-sm text-ink-soft" aria-live="polite">
        <span>{query.data ? `${shown.length} of ${query.data.total} property sets` : ' '}</span>
        {hasFilters ? (
          <Button tone="quiet" onClick={() => setParams(new URLSearchParams(), { replace: true })}>
            Clear filters
          </Button>
        ) : null}
      </div>

      {query.isPending ? (
        <Spinner label="Loading the catalogue…" />
      ) : query.isError ? (
        <ErrorState error={query.error} onRetry={() => void query.refetch()} />
      ) : shown.length === 0 ? (
        <EmptyState title="No property sets match these filters">
          Widen the service temperature range, choose another family, or clear the search.
        </EmptyState>
      ) : (
        <CatalogueTable items={shown} />
      )}
    </div>
  );
}
