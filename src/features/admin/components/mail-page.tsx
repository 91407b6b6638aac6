import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { EmptyState, ErrorState, Panel, Spinner } from '@/components/ui/states';
import { useCaughtMail } from '../api/admin';
import { AdminNav } from './admin-nav';

const when = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'short' });

/** The e-mail the local catcher received (dev and test); with a real mail server there is nothing to show. */
export function MailPage() {
  const query = useCaughtMail();
  const [selectedId, setSelectedId] = useState<string | null>(null);
  const items = query.data?.items ?? [];
  const selected = items.find((m) => m.id === selectedId) ?? items[0];

  return (
    <div className="flex flex-col gap-4">
      <AdminNav />
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 className="text-2xl font-bold">Caught mail</h1>
          <p className="text-sm text-ink-soft">Messages Isobath sent, as received by the local mail catcher, newest first.</p>
        </div>
        <Button tone="quiet" onClick={() => void query.refetch()} disabled={query.isFetching}>
          {query.isFetching ? 'Refreshing…' : 'Refresh'}
        </Button>
      </div>
      {query.isPending ? (
        <Spinner label="Loading caught mail…" />
      ) : query.isError ? (
        <ErrorState error={query.error} onRetry={() => void query.refetch()} />
      ) : !query.data.enabled ? (
        <EmptyState title="Mail goes to a real mail server">
          This installation sends e-mail through its SMTP server, so messages are not kept here. Look in the recipients’ mailboxes, or the mail server’s log.
        </EmptyState>
      ) : items.length === 0 ? (
        <EmptyState title="No mail caught yet">Submitting a property set for review, or returning one, sends a message; it appears here.</EmptyState>
      ) : (
        <div className="grid gap-4 md:grid-cols-[22rem_1fr]">
          <Panel title={`Messages (${items.length})`}>
            <ul className="flex flex-col gap-1" role="listbox" aria-label="Caught messages">
              {items.map((m) => (
                <li key={m.id}>
                  <button
                    type="button"
                    role="option"
                    aria-selected={m.id === selected?.id}
                    onClick={() => setSelectedId(m.id)}
                    className={`w-full rounded-plate px-2 py-1.5 text-left text-sm ${m.id === selected?.id ? 'bg-sounding text-white' : 'hover:bg-chart-deep'}`}
                  >
                    <span className="block font-bold">{m.subject || '(no subject)'}</span>
                    <span className="block truncate text-xs opacity-80">to {m.to.join(', ')}</span>
                    <span className="block text-xs opacity-80">{when.format(new Date(m.receivedAt))}</span>
                  </button>
                </li>
              ))}
            </ul>
          </Panel>
          {selected ? (
            <Panel title="Message">
              <article aria-label={`Message: ${selected.subject}`} data-testid="mail-message">
                <dl className="grid grid-cols-[5rem_1fr] gap-x-3 gap-y-1 text-sm">
                  <dt className="text-ink-soft">From</dt>
                  <dd>{selected.from}</dd>
                  <dt className="text-ink-soft">To</dt>
                  <dd>{selected.to.join(', ')}</dd>
                  <dt className="text-ink-soft">Subject</dt>
                  <dd className="font-bold">{selected.subject}</dd>
                  <dt className="text-ink-soft">Received</dt>
                  <dd>{when.format(new Date(selected.receivedAt))}</dd>
                </dl>
                <pre className="mt-3 whitespace-pre-wrap break-words rounded-plate bg-white p-3 font-sans text-sm">{selected.text}</pre>
              </article>
            </Panel>
          ) : null}
        </div>
      )}
    </div>
  );
}
