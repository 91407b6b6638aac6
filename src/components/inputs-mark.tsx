import { inputStatusText, PROVENANCE_LABELS, VALUE_STATUS_LABELS, type InputStatus, type Provenance, type ProvenanceKey } from '@shared/schemas/provenance';

/** A compact mark of how many of a candidate's inputs are confirmed; the rest are named on hover and for screen readers. */
export function InputsMark({ inputs }: { inputs: InputStatus | undefined }) {
  if (!inputs) return <span className="text-ink-faint" title="Entered by hand: no source to confirm against">—</span>;
  const all = inputs.confirmed === inputs.total;
  const rest = inputs.unconfirmed.map((u) => `${PROVENANCE_LABELS[u.key]}: ${VALUE_STATUS_LABELS[u.status]}`).join('; ');
  return (
    <span className={`whitespace-nowrap text-xs font-bold ${inputs.demo ? 'text-verdict-fail' : all ? 'text-verdict-pass' : 'text-verdict-watch'}`} title={rest || 'Every input confirmed against its source'} data-testid="inputs-mark">
      {inputs.confirmed}/{inputs.total}
      <span className="sr-only"> {inputStatusText(inputs)}{rest ? `. Not confirmed: ${rest}` : ''}</span>
      {inputs.demo ? <span className="ml-1 rounded bg-verdict-fail/10 px-1">demo</span> : null}
    </span>
  );
}

/** One value's status in words, with where it was confirmed or how it was derived. */
export function ValueStatusNote({ provenance, field }: { provenance: Provenance | undefined; field: ProvenanceKey }) {
  const entry = provenance?.[field];
  const status = entry?.status ?? 'recalled';
  const tone = status === 'confirmed' ? 'text-verdict-pass' : status === 'demo' ? 'text-verdict-fail' : status === 'derived' ? 'text-ink-soft' : 'text-verdict-watch';
  const detail = status === 'confirmed' ? [entry?.location, entry?.source].filter(Boolean).join(' · ') : status === 'derived' ? entry?.rule : undefined;
  return (
    <span className={`text-xs ${tone}`} data-testid={`status-${field}`}>
      {VALUE_STATUS_LABELS[status]}
      {detail ? <span className="text-ink-faint"> — {detail}</span> : null}
    </span>
  );
}
