import { Link } from 'react-router-dom';
import type { SessionUserDto } from '@shared/schemas/auth';
import { PROVENANCE_LABELS, type ValueConfirmationDto } from '@shared/schemas/provenance';
import { EmptyState, ErrorState, Panel, Spinner, Tag } from '@/components/ui/states';
import { PlainTable } from '@/components/ui/column-heads';
import { useConfirmations } from '../api/confirmations';
import { formatDateTime } from '../labels';

/** Proposed confirmations of published sets' values, each linking to its set where it is approved or rejected. */
export function ConfirmationQueue({ me }: { me: SessionUserDto | null | undefined }) {
  const query = useConfirmations({ status: 'proposed' });
  const items = query.data?.items ?? [];
  const own = (c: ValueConfirmationDto) => c.proposedBy.id === me?.id;
  return (
    <Panel title={`Values waiting for confirmation review (${items.length})`}>
      {query.isPending ? (
        <Spinner label="Loading the confirmations waiting for review…" />
      ) : query.isError ? (
        <ErrorState error={query.error} onRetry={() => void query.refetch()} />
      ) : items.length === 0 ? (
        <EmptyState title="No value waits for confirmation review">
          To confirm a value of a published set against its source, open the set and choose “Confirm a value”. A second librarian approves it on the
          set’s page; it is listed here until then.
        </EmptyState>
      ) : (
        <>
          <PlainTable label="Values waiting for confirmation review" columns={['Set', 'Value', 'Where the source shows it', 'Proposed by']}>
            {items.map((c) => (
              <tr key={c.id} className="border-t border-chart-line/60 align-top">
                <td className="py-1.5 pr-3">
                  <Link to={`/library/sets/${c.propertySetId}`} className="font-bold text-sounding hover:underline">
                    {c.setTitle}
                  </Link>
                </td>
                <td className="py-1.5 pr-3">{PROVENANCE_LABELS[c.key]}</td>
                <td className="py-1.5 pr-3">{c.location}</td>
                <td className="py-1.5">
                  {c.proposedBy.name}
                  {own(c) ? (
                    <span className="ml-1">
                      <Tag>yours</Tag>
                    </span>
                  ) : null}
                  <span className="block text-xs text-ink-soft">{formatDateTime(c.createdAt)}</span>
                </td>
              </tr>
            ))}
          </PlainTable>
          {items.some(own) ? <p className="mt-2 text-xs text-ink-soft">Your own proposals are approved or rejected by someone else.</p> : null}
        </>
      )}
    </Panel>
  );
}
