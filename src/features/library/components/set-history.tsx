import { Link } from 'react-router-dom';
import type { LibrarySetDto } from '@shared/schemas/library';
import { Panel, Tag } from '@/components/ui/states';
import { STATUS_LABELS, STATUS_TONE, formatDateTime } from '../labels';

/** Status, version and who did what to this set (from the set itself; the full trail is the audit log). */
export function SetHistory({ set }: { set: LibrarySetDto }) {
  const rows: [string, React.ReactNode][] = [
    ['Status', <Tag key="s" tone={STATUS_TONE[set.status]}>{STATUS_LABELS[set.status]}</Tag>],
    ['Version', String(set.version)],
    ['Drafted by', set.draftedBy?.name ?? 'seeded catalogue'],
  ];
  if (set.lastEditedBy && set.lastEditedBy.id !== set.draftedBy?.id) rows.push(['Last edited by', set.lastEditedBy.name]);
  rows.push(['Last saved', formatDateTime(set.updatedAt)]);
  if (set.submittedAt) rows.push(['Submitted', formatDateTime(set.submittedAt)]);
  if (set.approvedBy) rows.push(['Approved by', set.approvedBy.name]);
  if (set.publishedAt) rows.push(['Published', formatDateTime(set.publishedAt)]);
  if (set.supersedesId) rows.push(['Revises', <Link key="r" className="text-sounding underline" to={`/library/sets/${set.supersedesId}`}>version {set.version - 1}</Link>]);
  if (set.supersededById)
    rows.push(['Superseded by', <Link key="n" className="text-sounding underline" to={`/library/sets/${set.supersededById}`}>the next version</Link>]);
  return (
    <Panel title="History">
      <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-1.5 text-sm" data-testid="set-history">
        {rows.map(([k, v]) => (
          <div key={k} className="contents">
            <dt className="text-ink-soft">{k}</dt>
            <dd>{v}</dd>
          </div>
        ))}
      </dl>
      {set.returnedComment && set.status === 'draft' ? (
        <div className="mt-3 border-t border-chart-line pt-2 text-sm">
          <p className="text-xs font-bold uppercase tracking-wide text-brass">Returned with</p>
          <p className="whitespace-pre-line">{set.returnedComment}</p>
        </div>
      ) : null}
    </Panel>
  );
}
