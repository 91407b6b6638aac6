import { Link } from 'react-router-dom';
import type { ReferenceCitationDto, ReferenceDto } from '@shared/schemas/catalogue';
import { REFERENCE_KIND_LABELS } from '@shared/labels';
import { Tag } from '@/components/ui/states';

/** A citation's title, its authors, year and where in the source, and its note: the card's and the record's words. */
export function CitationLines({ reference }: { reference: ReferenceCitationDto }) {
  return (
    <>
      <p className="font-bold">{reference.title}</p>
      <p className="text-ink-soft">
        {[reference.authors, reference.year].filter(Boolean).join(', ')}
        {reference.location ? ` — ${reference.location}` : ''}
      </p>
      {reference.note ? <p className="whitespace-pre-line text-xs text-ink-soft">{reference.note}</p> : null}
    </>
  );
}

/** The full citation of a property set's source, with its PDF when one is stored. */
export function ReferenceCard({
  reference,
  missing = 'No reference yet: this set cannot be published without one.',
  testId = 'reference',
}: {
  reference: ReferenceDto | null;
  missing?: string;
  testId?: string;
}) {
  if (!reference) return <p className="text-sm font-bold text-verdict-fail">{missing}</p>;
  return (
    <div className="flex flex-col gap-1 text-sm" data-testid={testId}>
      <div className="flex items-center gap-2">
        <Tag tone="brass">{REFERENCE_KIND_LABELS[reference.kind]}</Tag>
        {reference.identifier ? <span className="font-mono text-xs">{reference.identifier}</span> : null}
      </div>
      <CitationLines reference={reference} />
      {reference.version !== undefined ? (
        <p className="text-xs text-ink-soft" data-testid={`${testId}-version`}>
          Citation version {reference.version}
          {reference.latestVersion !== undefined && reference.latestVersion > reference.version
            ? `; version ${reference.latestVersion} has been published since. This set keeps the version it was approved with until it is revised.`
            : ''}
        </p>
      ) : null}
      {reference.hasDocument ? (
        // A plain link: the browser downloads the PDF with the session cookie.
        <a
          href={reference.documentVersion ? `/api/references/${reference.id}/documents/${reference.documentVersion}` : `/api/references/${reference.id}/document`}
          className="no-print mt-1 font-bold text-sounding underline"
        >
          Download source PDF{reference.documentVersion ? ` (document version ${reference.documentVersion})` : ''}
        </a>
      ) : null}
      <Link to={`/library/references/${reference.id}`} className="no-print text-xs text-sounding underline">
        Versions and documents of this reference
      </Link>
    </div>
  );
}
