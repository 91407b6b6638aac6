import { Link } from 'react-router-dom';
import { EmptyState, Panel, QueryStatus } from '@/components/ui/states';
import { formatDateTime } from '@/lib/dates';
import { useAwaitingCheck } from '../api/shortlists';

/** A checker's landing page: the shortlists others submitted in their projects, oldest first. */
export function WaitingPage({ name }: { name: string }) {
  const waiting = useAwaitingCheck();
  return (
    <div className="flex max-w-4xl flex-col gap-4">
      <h1 className="text-2xl font-bold">Waiting for you</h1>
      <p className="text-sm text-ink-soft">
        {name}, these shortlists were submitted by others in your projects and wait for a check. Open one to check it or return it with comments; nobody checks
        their own.
      </p>
      <Panel title="Shortlists to check">
        {waiting.isPending || waiting.isError ? (
          <QueryStatus query={waiting} loading="Looking for submitted shortlists…" />
        ) : waiting.data.items.length === 0 ? (
          <EmptyState title="Nothing waits for your check">
            When an engineer submits a shortlist in one of your projects, it appears here and you get an e-mail.{' '}
            <Link to="/projects" className="font-bold text-sounding underline">
              Your projects
            </Link>{' '}
            ·{' '}
            <Link to="/catalogue" className="font-bold text-sounding underline">
              the catalogue
            </Link>
          </EmptyState>
        ) : (
          <ul className="flex flex-col divide-y divide-chart-line/60" aria-label="Shortlists waiting for your check" data-testid="waiting-list">
            {waiting.data.items.map((w) => (
              <li key={w.id} className="flex flex-wrap items-baseline justify-between gap-2 py-2 text-sm">
                <div>
                  <Link to={`/shortlists/${w.id}`} className="font-bold text-sounding hover:underline">
                    {w.name}
                  </Link>{' '}
                  <span className="text-ink-soft">
                    in {w.project.name} · {w.itemCount} candidate{w.itemCount === 1 ? '' : 's'} · by {w.author.name}, {formatDateTime(w.submittedAt)}
                  </span>
                  {w.belowTarget.length ? (
                    <p className="text-xs font-bold text-verdict-fail">
                      {w.belowTarget.length} below target: {w.belowTarget.join('; ')}
                    </p>
                  ) : null}
                </div>
              </li>
            ))}
          </ul>
        )}
      </Panel>
      <p className="text-sm">
        <Link to="/catalogue" className="font-bold text-sounding underline">
          Go to the catalogue
        </Link>{' '}
        ·{' '}
        <Link to="/evaluate" className="font-bold text-sounding underline">
          Evaluate a load case
        </Link>
      </p>
    </div>
  );
}
