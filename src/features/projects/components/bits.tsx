import { Link } from 'react-router-dom';
import type { LoadCaseInput } from '@shared/schemas/evaluate';
import type { ShortlistStatus } from '@shared/schemas/projects';
import { Tag } from '@/components/ui/states';
import { useUnits } from '@/lib/unit-system';
import { describeLoadCase } from '../load-case-text';
import { SHORTLIST_STATUS_LABELS, SHORTLIST_STATUS_TONE } from '../shortlist-model';

export function ShortlistStatusTag({ status }: { status: ShortlistStatus }) {
  return <Tag tone={SHORTLIST_STATUS_TONE[status]}>{SHORTLIST_STATUS_LABELS[status]}</Tag>;
}

/** Every input of a load case, in the shown units. */
export function LoadCaseFacts({ loadCase, extra = [] }: { loadCase: LoadCaseInput; extra?: { label: string; value: string }[] }) {
  const { system } = useUnits();
  const rows = [...extra, ...describeLoadCase(loadCase, system)];
  return (
    <dl className="grid grid-cols-[minmax(8rem,max-content)_1fr] gap-x-4 gap-y-1 text-sm" data-testid="load-case-facts">
      {rows.map((r) => (
        <div key={r.label} className="contents">
          <dt className="text-ink-soft">{r.label}</dt>
          <dd>{r.value}</dd>
        </div>
      ))}
    </dl>
  );
}


/** "Cast acrylic (PMMA)" on one line and its condition below. */
export function SetName({ set, link = true }: { set: { id: number; condition: string; material: { name: string } }; link?: boolean }) {
  return (
    <span className="inline-block">
      {link ? (
        <Link to={`/sets/${set.id}`} className="font-bold text-sounding hover:underline">
          {set.material.name}
        </Link>
      ) : (
        <span className="font-bold">{set.material.name}</span>
      )}
      <span className="block text-xs text-ink-soft">{set.condition}</span>
    </span>
  );
}
