import type { RatingTableDto } from '@shared/schemas/rating-tables';
import { Panel } from '@/components/ui/states';
import { RatingGrid } from './rating-grid';

/** A table as read: grid, grade, limits, covered sets, citation and note. */
export function RatingTableSummary({ table: t }: { table: RatingTableDto }) {
  return (
    <Panel title={t.content.name}>
      <div className="flex flex-col gap-3">
        <RatingGrid content={t.content} />
        <dl className="grid gap-1 text-sm md:grid-cols-[12rem_1fr]">
          <dt className="text-ink-soft">Material grade</dt>
          <dd>{t.content.grade}</dd>
          <dt className="text-ink-soft">Covers</dt>
          <dd>{t.covers.length ? t.covers.map((c) => c.condition).join('; ') : `every set of ${t.material.name}`}</dd>
          {t.content.includedAngle ? (
            <>
              <dt className="text-ink-soft">Included angles</dt>
              <dd>
                {t.content.includedAngle.min}° to {t.content.includedAngle.max}°
              </dd>
            </>
          ) : null}
          <dt className="text-ink-soft">Data support</dt>
          <dd>
            {t.content.limits?.sustainedHours ? `up to ${t.content.limits.sustainedHours.toLocaleString('en-GB')} h of sustained load` : 'no stated limit on sustained load'}
            {t.content.limits?.cycles ? `, up to ${t.content.limits.cycles.toLocaleString('en-GB')} cycles` : ''}
          </dd>
          <dt className="text-ink-soft">Source</dt>
          <dd>{t.reference ? [t.reference.authors, t.reference.year, t.reference.title, t.reference.identifier, t.reference.location].filter(Boolean).join('; ') : 'none yet'}</dd>
        </dl>
        {t.content.note ? <p className="whitespace-pre-line text-xs text-ink-soft">{t.content.note}</p> : null}
      </div>
    </Panel>
  );
}
