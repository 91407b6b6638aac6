import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { EmptyState, Panel, QueryStatus, Tag } from '@/components/ui/states';
import type { OutboxMailDto } from '@shared/schemas/library';
import { useCaughtMail, useOutbox } from '../api/admin';
import { AdminNav } from './admin-nav';
import { PlainTable } from '@/components/ui/column-heads';

const when = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'short' });

const STATUS: Record<OutboxMailDto['status'], { label: string; tone: 'pass' | 'brass' | 'fail' }> = {
  sent: { label: 'sent', tone: 'pass' },
  pending: { label: 'not sent yet', tone: 'brass' },
  failed: { label: 'not delivered', tone: 'fail' },
};

/** What Isobath sends through its mail server, and how each message fared (with any real server too). */
function Outgoing({ outbox }: { outbox: ReturnType<typeof useOutbox> }) {
  if (outbox.isPending || outbox.isError) return <QueryStatus query={outbox} loading="Loading outgoing mail…" />;
  if (!outbox.data.length) return <EmptyState title="Nothing sent lately">Invitations, reset links and review notices appear here as they go out.</EmptyState>;
  const trouble = outbox.data.filter((m) => m.status !== 'sent').length;
  return (
    <div className="flex flex-col gap-2">
      {trouble ? (
        <p role="status" className="rounded-plate border-l-4 border-verdict-fail bg-white px-3 py-2 text-sm" data-testid="outbox-trouble">
          <strong>{trouble === 1 ? 'One message has' : `${trouble} messages have`} not reached the mail server.</strong> Isobath tries again with a growing wait; a message
          marked “not delivered” has used up its attempts.
        </p>
      ) : null}
      <PlainTable label="Outgoing mail" columns={['Subject', 'To', 'State', 'Attempts', 'Queued']}>
        {outbox.data.map((m) => (
          <tr key={m.id} className="border-t border-chart-line/60 align-top">
            <td className="py-1.5 pr-3">{m.subject}</td>
            <td className="max-w-[16rem] truncate py-1.5 pr-3">{m.to.join(', ')}</td>
            <td className="py-1.5 pr-3">
              <Tag tone={STATUS[m.status].tone}>{STATUS[m.status].label}</Tag>
              {m.lastError ? <span className="block text-xs text-verdict-fail">{m.lastError}</span> : null}
              {m.nextAttemptAt ? <span className="block text-xs text-ink-soft">next attempt {when.format(new Date(m.nextAttemptAt))}</span> : null}
            </td>
            <td className="py-1.5 pr-3">{m.attempts}</td>
            <td className="whitespace-nowrap py-1.5">{when.format(new Date(m.createdAt))}</td>
          </tr>
        ))}
      </PlainTable>
    </div>
  );
}

/** The e-mail the local catcher received (dev and test); with a real mail server there is nothing to show. */
export function MailPage() {
  const query = useCaughtMail();
  const outbox = useOutbox();
  const [selectedId, setSelectedId] = useState<string | null>(null);
  const items = query.data?.items ?? [];
  const selected = items.find((m) => m.id === selectedId) ?? items[0];

  return (
    <div className="flex flex-col gap-4">
      <AdminNav />
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 className="text-2xl font-bold">Mail</h1>
          <p className="text-sm text-ink-soft">What Isobath sends and how each message fared; below it, the messages the local mail catcher received, newest first.</p>
        </div>
        <Button tone="quiet" onClick={() => void Promise.all([query.refetch(), outbox.refetch()])} disabled={query.isFetching || outbox.isFetching}>
          {query.isFetching || outbox.isFetching ? 'Refreshing…' : 'Refresh'}
        </Button>
      </div>
      <Panel title="Outgoing mail">
        <Outgoing outbox={outbox} />
      </Panel>
      {query.isPending || query.isError ? (
        <QueryStatus query={query} loading="Loading caught mail…" />
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
