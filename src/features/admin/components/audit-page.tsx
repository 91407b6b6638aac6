import { Fragment, useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { auditQuerySchema, type AuditEntryDto } from '@shared/schemas/library';
import { Button } from '@/components/ui/button';
import { SelectField, TextField } from '@/components/ui/field';
import { EmptyState, QueryStatus } from '@/components/ui/states';
import { useAuditLog } from '../api/admin';
import { changedKeys, entityHref, entityLabel, formatState } from '../audit-format';
import { AdminNav } from './admin-nav';

const ENTITY_TYPES = auditQuerySchema.shape.entityType.unwrap().options;
const when = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'medium' });

function EntryRow({ entry }: { entry: AuditEntryDto }) {
  const [open, setOpen] = useState(false);
  const detailId = `audit-${entry.id}`;
  const changed = changedKeys(entry.before, entry.after);
  const href = entityHref(entry.entityType, entry.entityId);
  return (
    <Fragment>
      <tr className="border-t border-chart-line/60 align-top">
        <td className="whitespace-nowrap px-3 py-1.5 tabular-nums">{when.format(new Date(entry.at))}</td>
        <td className="px-3 py-1.5">{entry.actor?.name ?? <span className="text-ink-faint">system</span>}</td>
        <td className="px-3 py-1.5 font-bold">{entry.action}</td>
        <td className="px-3 py-1.5">
          {entityLabel(entry.entityType)}{' '}
          {entry.entityId ? href ? <Link to={href} className="text-sounding underline">#{entry.entityId}</Link> : <span>#{entry.entityId}</span> : null}
        </td>
        <td className="px-3 py-1.5 text-xs text-ink-soft">{changed.length ? changed.join(', ') : entry.before === null ? 'created' : '—'}</td>
        <td className="no-print px-3 py-1.5 text-right">
          <button
            type="button"
            aria-expanded={open}
            aria-controls={detailId}
            onClick={() => setOpen((o) => !o)}
            className="text-sm font-bold text-sounding hover:underline"
          >
            {open ? 'Hide' : 'Before / after'}
            <span className="sr-only"> of entry {entry.id}</span>
          </button>
        </td>
      </tr>
      {open ? (
        <tr id={detailId} className="bg-chart-deep/40">
          <td colSpan={6} className="px-3 py-2">
            <div className="grid gap-3 md:grid-cols-2">
              {(['before', 'after'] as const).map((side) => (
                <div key={side} className="min-w-0">
                  <p className="text-xs font-bold uppercase tracking-wide text-ink-soft">{side}</p>
                  <pre className="mt-1 max-h-80 overflow-auto rounded-plate bg-white p-2 font-mono text-xs">{formatState(entry[side])}</pre>
                </div>
              ))}
            </div>
          </td>
        </tr>
      ) : null}
    </Fragment>
  );
}

/** Who changed what and when, newest first, with each entry's before and after. */
export function AuditPage() {
  const [params, setParams] = useSearchParams();
  const entityType = params.get('entityType') ?? '';
  const entityId = params.get('entityId') ?? '';
  const [idText, setIdText] = useState(entityId);
  const query = useAuditLog({ entityType: entityType || undefined, entityId: entityId || undefined });
  const entries = query.data?.pages.flatMap((p) => p.items) ?? [];

  const setParam = (key: string, value: string) =>
    setParams(
      (prev) => {
        const next = new URLSearchParams(prev);
        if (value) next.set(key, value);
        else next.delete(key);
        return next;
      },
      { replace: true },
    );

  return (
    <div className="flex flex-col gap-4">
      <AdminNav />
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 className="text-2xl font-bold">Audit log</h1>
          <p className="text-sm text-ink-soft">Every change to sets, references, materials, imports and accounts: who, when, and the values before and after.</p>
        </div>
        <Button tone="quiet" className="no-print" onClick={() => window.print()}>
          Print
        </Button>
      </div>
      <form
        role="search"
        className="no-print flex flex-wrap items-end gap-3"
        onSubmit={(e) => {
          e.preventDefault();
          setParam('entityId', idText.trim());
        }}
      >
        <SelectField label="Entity" wrapperClassName="w-48" value={entityType} onChange={(e) => setParam('entityType', e.target.value)}>
          <option value="">All</option>
          {ENTITY_TYPES.map((t) => (
            <option key={t} value={t}>
              {entityLabel(t)}
            </option>
          ))}
        </SelectField>
        <TextField label="Entity id" wrapperClassName="w-32" value={idText} onChange={(e) => setIdText(e.target.value)} />
        <Button type="submit" tone="quiet">
          Filter
        </Button>
      </form>

      {query.isPending || query.isError ? (
        <QueryStatus query={query} loading="Loading the audit log…" />
      ) : entries.length === 0 ? (
        <EmptyState title="No entries">
          {entityType || entityId ? 'Nothing recorded for this filter. Choose “All” to see every entry.' : 'Nothing has been changed yet.'}
        </EmptyState>
      ) : (
        <div className="overflow-x-auto rounded-plate bg-chart-raised shadow-plate">
          <table className="w-full text-sm" aria-label="Audit entries">
            <thead className="border-b border-chart-line text-left text-xs uppercase tracking-wide text-ink-soft">
              <tr>
                <th scope="col" className="px-3 py-2">When</th>
                <th scope="col" className="px-3 py-2">Who</th>
                <th scope="col" className="px-3 py-2">Action</th>
                <th scope="col" className="px-3 py-2">Entity</th>
                <th scope="col" className="px-3 py-2">Changed</th>
                <th scope="col" className="no-print px-3 py-2">
                  <span className="sr-only">Details</span>
                </th>
              </tr>
            </thead>
            <tbody>
              {entries.map((e) => (
                <EntryRow key={e.id} entry={e} />
              ))}
            </tbody>
          </table>
        </div>
      )}
      {query.hasNextPage ? (
        <div className="no-print">
          <Button tone="quiet" onClick={() => void query.fetchNextPage()} disabled={query.isFetchingNextPage}>
            {query.isFetchingNextPage ? 'Loading…' : 'Load older entries'}
          </Button>
        </div>
      ) : entries.length ? (
        <p className="text-xs text-ink-faint">Start of the log{entityType || entityId ? ' for this filter' : ''}.</p>
      ) : null}
    </div>
  );
}
