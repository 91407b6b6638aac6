import type { ShortlistRoundDto } from '@shared/schemas/projects';
import { roundText } from '@shared/labels';
import { formatDateTime } from '@/lib/dates';

/** Every round of checking, oldest first: who submitted, what changed, how it ended. */
export function Rounds({ rounds }: { rounds: readonly ShortlistRoundDto[] }) {
  if (!rounds.length) return <p className="text-sm text-ink-soft">Not submitted yet.</p>;
  return (
    <ol className="flex flex-col gap-3 text-sm" aria-label="Rounds of checking" data-testid="rounds">
      {rounds.map((r) => {
        const text = roundText(r, formatDateTime);
        return (
          <li key={r.round} className="border-l-2 border-chart-line pl-3">
            <p className="font-bold">{text.heading}</p>
            {r.changes.length ? (
              <ul className="list-disc pl-5 text-ink-soft">
                {r.changes.map((c) => (
                  <li key={c}>{c}</li>
                ))}
              </ul>
            ) : null}
            <p className={r.outcome === 'returned' ? 'text-verdict-fail' : r.outcome === 'checked' ? 'text-verdict-pass' : 'text-ink-soft'}>{text.outcome}</p>
          </li>
        );
      })}
    </ol>
  );
}
