import type { ReactNode } from 'react';
import { ApiError } from '@/lib/api-client';

export function Spinner({ label = 'Loading…' }: { label?: string }) {
  return (
    <div role="status" aria-live="polite" className="flex items-center gap-3 py-8 text-sm text-ink-soft">
      <span className="inline-block h-4 w-4 animate-spin rounded-full border-2 border-sounding border-t-transparent" aria-hidden />
      {label}
    </div>
  );
}

export function EmptyState({ title, children, action }: { title: string; children?: ReactNode; action?: ReactNode }) {
  return (
    <div className="rounded-plate border border-dashed border-chart-line bg-chart-raised px-6 py-10 text-center">
      <p className="font-bold">{title}</p>
      {children ? <div className="mt-1 text-sm text-ink-soft">{children}</div> : null}
      {action ? <div className="mt-4">{action}</div> : null}
    </div>
  );
}

export function ErrorState({ error, onRetry }: { error: unknown; onRetry?: () => void }) {
  const message = error instanceof ApiError ? error.message : 'Something went wrong while loading this page.';
  return (
    <div role="alert" className="rounded-plate border border-verdict-fail/40 bg-white px-4 py-3 text-sm">
      <p className="font-bold text-verdict-fail">Could not load</p>
      <p className="mt-1 text-ink-soft">{message}</p>
      {onRetry ? (
        <button type="button" onClick={onRetry} className="mt-2 text-sm font-bold text-sounding underline">
          Try again
        </button>
      ) : null}
    </div>
  );
}

/**
 * What a query shows until its data is there: a spinner saying what loads, or the error with a
 * retry. Render it when `query.isPending || query.isError`, so the code after it has the data.
 */
export function QueryStatus({ query, loading }: { query: { isPending: boolean; error: unknown; refetch: () => unknown }; loading: string }) {
  return query.isPending ? <Spinner label={loading} /> : <ErrorState error={query.error} onRetry={() => void query.refetch()} />;
}

export function Panel({ title, actions, children, className = '' }: { title?: ReactNode; actions?: ReactNode; children: ReactNode; className?: string }) {
  return (
    <section className={`rounded-plate bg-chart-raised shadow-plate ${className}`}>
      {title || actions ? (
        <header className="flex flex-wrap items-center justify-between gap-3 border-b border-chart-line px-4 py-2.5">
          {title ? <h2 className="text-sm font-bold uppercase tracking-wide text-ink-soft">{title}</h2> : <span />}
          {actions}
        </header>
      ) : null}
      <div className="p-4">{children}</div>
    </section>
  );
}

export function Tag({ children, tone = 'neutral' }: { children: ReactNode; tone?: 'neutral' | 'sounding' | 'brass' | 'fail' | 'pass' }) {
  const tones = {
    neutral: 'bg-chart-deep text-ink-soft',
    sounding: 'bg-sounding-light text-sounding-dark',
    brass: 'bg-brass-light text-brass',
    fail: 'bg-verdict-fail/10 text-verdict-fail',
    pass: 'bg-verdict-pass/10 text-verdict-pass',
  };
  return <span className={`inline-block rounded-plate px-1.5 py-0.5 text-xs font-bold ${tones[tone]}`}>{children}</span>;
}
