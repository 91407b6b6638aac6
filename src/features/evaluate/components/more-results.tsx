import { Button } from '@/components/ui/button';
import { MAX_CANDIDATES } from '@shared/schemas/evaluate';

/** Each "more" asks for up to this many results in all, then this many more. */
export const MORE_STEP = 100;

/** How many results the next "more" asks for in all (at most what one evaluation may return). */
export function nextLimit(shown: number): number {
  return Math.min(shown < MORE_STEP ? MORE_STEP : shown + MORE_STEP, MAX_CANDIDATES);
}

/** "Show n more" under the ranking while the answer holds fewer results than were evaluated. */
export function MoreResults({ shown, total, loading, onMore }: { shown: number; total: number; loading: boolean; onMore: (limit: number) => void }) {
  if (shown >= Math.min(total, MAX_CANDIDATES)) return null;
  const next = nextLimit(shown);
  const more = Math.min(next, total) - shown;
  return (
    <div className="mt-3 flex items-center gap-3 text-sm">
      <Button tone="quiet" onClick={() => onMore(next)} disabled={loading} aria-busy={loading} data-testid="more-results">
        {loading ? 'Loading more results…' : `Show ${more} more`}
      </Button>
      <span className="text-ink-soft">
        {shown} of {total} shown, best first.
      </span>
    </div>
  );
}
