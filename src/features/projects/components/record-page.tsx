import { lazy, Suspense } from 'react';
import { Link } from 'react-router-dom';
import type { CandidateResult } from '@shared/engine';
import type { DesignRecordContent, DesignRecordDto } from '@shared/schemas/projects';
import { FAMILY_LABELS } from '@shared/schemas/catalogue';
import { MarginCell, ModeTag, ModesTable, SizingSummary } from '@/components/failure-modes';
import { Button } from '@/components/ui/button';
import { CitationLines } from '@/components/reference-card';
import { QueryStatus, Spinner, Tag } from '@/components/ui/states';
import { formatDateTime } from '@/lib/dates';
import { useUnits } from '@/lib/unit-system';
import { RECORD_SECTIONS, REFERENCE_KIND_LABELS, factorsText } from '@shared/labels';
import { designRecordPdfUrl, useDesignRecord } from '../api/shortlists';
import { LoadCaseFacts, SetName } from './bits';
import { Rounds } from './rounds';
import { describeInputs, VALUE_STATUS_LABELS } from '@shared/schemas/provenance';
import './record-print.css';
import { ColumnHeads } from '@/components/ui/column-heads';
import { Breadcrumb } from '@/components/ui/breadcrumb';

const MarginChart = lazy(() => import('@/components/charts/margin-chart').then((m) => ({ default: m.MarginChart })));

/** A titled part of the record; short ones are kept on one printed page. */
function Section({ title, children, className = '', keepTogether = false }: { title: string; children: React.ReactNode; className?: string; keepTogether?: boolean }) {
  return (
    <section className={`${keepTogether ? 'record-keep' : ''} rounded-plate bg-chart-raised p-4 shadow-plate print:bg-white print:p-0 print:shadow-none ${className}`}>
      <h2 className="mb-2 border-b border-chart-line pb-1 text-sm font-bold uppercase tracking-wide text-ink-soft">{title}</h2>
      {children}
    </section>
  );
}

function SignOff({ content }: { content: DesignRecordContent }) {
  return (
    <table className="w-full text-sm" aria-label="Sign-off">
      <ColumnHeads columns={['', 'Name', 'E-mail', 'Date']} />
      <tbody>
        <tr className="border-t border-chart-line/60">
          <th scope="row" className="py-1.5 pr-3 text-left">Prepared and submitted</th>
          <td className="py-1.5 pr-3" data-testid="record-author">{content.author.name}</td>
          <td className="py-1.5 pr-3">{content.author.email}</td>
          <td className="py-1.5">{formatDateTime(content.shortlist.submittedAt)}</td>
        </tr>
        <tr className="border-t border-chart-line/60">
          <th scope="row" className="py-1.5 pr-3 text-left">Checked</th>
          <td className="py-1.5 pr-3" data-testid="record-checker">{content.checker.name}</td>
          <td className="py-1.5 pr-3">{content.checker.email}</td>
          <td className="py-1.5">{formatDateTime(content.shortlist.checkedAt)}</td>
        </tr>
        <tr className="border-t border-chart-line/60 align-top">
          <th scope="row" className="py-1.5 pr-3 text-left">Checker's comment</th>
          <td colSpan={3} className="whitespace-pre-line py-1.5">
            {content.shortlist.checkComment || <span className="text-ink-faint">none</span>}
          </td>
        </tr>
      </tbody>
    </table>
  );
}

function RankedTable({ content }: { content: DesignRecordContent }) {
  const { format, label } = useUnits();
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-sm" aria-label="Shortlisted candidates">
        <thead className="text-left text-xs uppercase tracking-wide text-ink-soft">
          <tr>
            <th scope="col" className="py-1 pr-2 text-right">#</th>
            <th scope="col" className="py-1 pr-3">Candidate</th>
            <th scope="col" className="py-1 pr-3">Governed by</th>
            <th scope="col" className="py-1 pr-3 text-right">Safety factor</th>
            <th scope="col" className="py-1 pr-3 text-right">Target</th>
            <th scope="col" className="py-1 pr-3 text-right">Margin</th>
            <th scope="col" className="py-1 pr-3 text-right">
              Required t <span className="normal-case">({label('length')})</span>
            </th>
            <th scope="col" className="py-1 pr-3 text-right">
              Mass <span className="normal-case">({label('massPerArea')})</span>
            </th>
            <th scope="col" className="py-1 text-right">Warnings</th>
          </tr>
        </thead>
        <tbody>
          {content.candidates.map((c, i) => (
            <tr key={c.propertySet.id} className="border-t border-chart-line/60 align-top">
              <td className="py-1.5 pr-2 text-right">{i + 1}</td>
              <td className="py-1.5 pr-3">
                <SetName set={c.propertySet} link={false} />
              </td>
              <td className="py-1.5 pr-3">
                <ModeTag mode={c.result.governingMode} />
              </td>
              <td className="py-1.5 pr-3 text-right">{c.result.safetyFactor.toFixed(2)}</td>
              <td className="py-1.5 pr-3 text-right">{c.result.targetSafetyFactor.toFixed(2)}</td>
              <td className="py-1.5 pr-3 text-right">
                <MarginCell margin={c.result.margin} />
              </td>
              <td className="py-1.5 pr-3 text-right">
                {c.result.requiredThickness === null ? 'none suffices' : format('length', c.result.requiredThickness, { unit: false })}
              </td>
              <td className="py-1.5 pr-3 text-right">{format('massPerArea', c.result.massPerArea, { unit: false })}</td>
              <td className="py-1.5 text-right">{c.result.warnings.length || '—'}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

function CandidateModes({ index, note, result }: { index: number; note: string; result: CandidateResult }) {
  const { format } = useUnits();
  return (
    <article className="record-candidate border-t border-chart-line pt-3 first:border-t-0 first:pt-0" aria-label={`Candidate ${index + 1}: ${result.name}`}>
      <h3 className="font-bold">
        {index + 1}. {result.name}
      </h3>
      <p className="mt-1 whitespace-pre-line text-sm">
        <span className="text-ink-soft">Note: </span>
        {note || <span className="text-ink-faint">none</span>}
      </p>
      <ModesTable result={result} className="mt-2" />
      <div className="mt-2">
        <SizingSummary result={result} />
      </div>
      <p className="mt-2 text-xs text-ink-soft">
        {factorsText(result.factors, (c) => format('temperature', c))}
      </p>
      {result.warnings.length ? (
        <ul className="mt-1 list-disc pl-5 text-xs text-verdict-watch">
          {result.warnings.map((w) => (
            <li key={w}>{w}</li>
          ))}
        </ul>
      ) : (
        <p className="mt-1 text-xs text-ink-soft">No warnings for this load case.</p>
      )}
    </article>
  );
}

function Sources({ content }: { content: DesignRecordContent }) {
  return (
    <ol className="flex flex-col gap-3 text-sm" aria-label="Data sources">
      {content.candidates.map((c, i) => {
        const s = c.propertySet;
        const r = s.reference;
        return (
          <li key={s.id} className="grid gap-1 md:grid-cols-[16rem_1fr] print:grid-cols-[14rem_1fr]">
            <div>
              <span className="font-bold">
                {i + 1}. {s.material.name}
              </span>
              <span className="block text-xs text-ink-soft">{s.condition}</span>
              <span className="block text-xs text-ink-soft" data-testid="record-set-version">
                Property set #{s.id}, version {s.version} · {FAMILY_LABELS[s.material.family]}
              </span>
              <Link to={`/sets/${s.id}`} className="no-print text-xs text-sounding underline">
                Open in the catalogue
              </Link>
              <ul className="mt-1 text-xs" aria-label={`Inputs of ${s.material.name}`} data-testid="record-inputs">
                {describeInputs(s).map((v) => (
                  <li key={v.key}>
                    {v.label}: <span className={v.status === 'confirmed' ? 'text-verdict-pass' : v.status === 'demo' ? 'text-verdict-fail' : 'text-verdict-watch'}>{VALUE_STATUS_LABELS[v.status]}</span>
                    {v.detail ? <span className="text-ink-faint"> — {v.detail}</span> : null}
                  </li>
                ))}
              </ul>
            </div>
            {r ? (
              <div>
                <Tag tone="brass">{REFERENCE_KIND_LABELS[r.kind]}</Tag> {r.identifier ? <span className="font-mono text-xs">{r.identifier}</span> : null}
                <CitationLines reference={r} />
                {/* Records frozen before references were versioned cite version 1 and name no document version. */}
                <p className="text-xs text-ink-soft" data-testid="record-reference-version">
                  Citation version {r.version ?? 1}
                  {r.documentVersion ? `, document version ${r.documentVersion}` : ''} (as frozen)
                </p>
                {r.documentVersion ? (
                  <a href={`/api/references/${r.id}/documents/${r.documentVersion}`} className="no-print text-xs font-bold text-sounding underline">
                    Download the source PDF as frozen
                  </a>
                ) : null}
              </div>
            ) : (
              <p className="text-verdict-fail">No reference was recorded for this set.</p>
            )}
          </li>
        );
      })}
    </ol>
  );
}

function RecordView({ record, canExport }: { record: DesignRecordDto; canExport: boolean }) {
  const { format, label } = useUnits();
  const c = record.content;
  const results = c.candidates.map((x) => x.result);
  return (
    <div className="record-page flex flex-col gap-4">
      <div className="no-print flex flex-wrap items-center justify-between gap-3">
        <Breadcrumb
          trail={[
            { to: '/projects', label: 'Projects' },
            { to: `/projects/${record.projectId}`, label: c.project.name },
            { to: `/shortlists/${record.shortlistId}`, label: c.shortlist.name },
            { label: 'Design record' },
          ]}
        />
        <div className="flex gap-2">
          <Button tone="quiet" onClick={() => window.print()}>
            Print
          </Button>
          {canExport ? (
            <a href={designRecordPdfUrl(record.id)} download className="inline-flex items-center rounded-plate bg-sounding px-3 py-1.5 text-sm font-bold text-white hover:bg-sounding-dark">
              Download PDF
            </a>
          ) : (
            // Shown, not hidden: a viewer learns why there is no PDF instead of finding none.
            <span className="flex flex-col items-end gap-0.5">
              <Button tone="quiet" disabled aria-describedby="record-pdf-refusal">
                Download PDF
              </Button>
              <span id="record-pdf-refusal" className="max-w-xs text-right text-xs text-ink-soft" data-testid="record-pdf-refusal">
                Your role can read this record but not export it; engineers, checkers and administrators can download the PDF. Print works for everyone.
              </span>
            </span>
          )}
        </div>
      </div>

      <header className="flex flex-wrap items-end justify-between gap-2 border-b-2 border-ink pb-2 print:flex-nowrap">
        <div>
          <p className="text-xs font-bold uppercase tracking-wide text-ink-soft">Isobath design record #{record.id}</p>
          <h1 className="text-2xl font-bold">{c.shortlist.name}</h1>
          <p className="text-sm text-ink-soft">
            Project: {c.project.name} · load case “{c.loadCase.name}”
          </p>
        </div>
        <p className="text-right text-xs text-ink-soft">
          Frozen {formatDateTime(c.frozenAt)}
          <br />
          Pressure in {label('pressure')}, stress in {label('stress')}, length in {label('length')}
        </p>
      </header>

      {record.newerData.length ? (
        <div role="note" className="rounded-plate border-l-4 border-brass bg-brass-light/60 px-4 py-3 text-sm" data-testid="record-newer-data">
          <strong>Newer data exists.</strong> The catalogue has published newer versions of property sets this record used. The record keeps the versions it was checked
          with; review whether the change matters.
          <ul className="mt-1 list-disc pl-5">
            {record.newerData.map((n) => (
              <li key={n.propertySetId}>
                {n.name}: version in the record #{n.propertySetId}, newer{' '}
                <Link to={`/sets/${n.newerVersionId}`} className="font-bold text-sounding underline">
                  #{n.newerVersionId}
                </Link>
              </li>
            ))}
          </ul>
        </div>
      ) : null}

      <aside aria-labelledby="record-cautions" className="record-keep rounded-plate border-l-4 border-brass bg-brass-light/60 px-4 py-3 text-sm print:bg-white">
        <h2 id="record-cautions" className="mb-1 text-sm font-bold uppercase tracking-wide text-ink-soft">
          {RECORD_SECTIONS.cautions}
        </h2>
        {c.cautions}
      </aside>

      <Section title={RECORD_SECTIONS.signOff} keepTogether>
        <SignOff content={c} />
      </Section>

      {c.rounds?.length ? (
        <Section title={RECORD_SECTIONS.rounds} keepTogether>
          <Rounds rounds={c.rounds} />
        </Section>
      ) : null}

      <Section title={RECORD_SECTIONS.loadCase} keepTogether>
        <p className="mb-2 font-bold">{c.loadCase.name}</p>
        <LoadCaseFacts
          loadCase={c.loadCase.input}
          extra={[
            { label: 'Design pressure', value: `${format('pressure', c.pressure)} gauge` },
            { label: 'Proof test', value: `${format('pressure', c.proofTestPressure)} gauge` },
            { label: 'Pressure method', value: c.pressureMethod },
          ]}
        />
        {c.loadCase.notes ? <p className="mt-2 whitespace-pre-line text-sm text-ink-soft">{c.loadCase.notes}</p> : null}
      </Section>

      <Section title={RECORD_SECTIONS.candidates} keepTogether>
        <RankedTable content={c} />
      </Section>

      <Section title={RECORD_SECTIONS.margins} className="record-chart" keepTogether>
        {/* Drawn at about the printable width of A4, so the printed chart is not scaled down. */}
        <div className="max-w-[700px]">
          <Suspense fallback={<Spinner label="Drawing…" />}>
            <MarginChart results={results} pageSize={Math.max(results.length, 1)} />
          </Suspense>
        </div>
      </Section>

      <Section title={RECORD_SECTIONS.modes}>
        <div className="flex flex-col gap-4">
          {c.candidates.map((x, i) => (
            <CandidateModes key={x.propertySet.id} index={i} note={x.note} result={x.result} />
          ))}
        </div>
      </Section>

      <Section title={RECORD_SECTIONS.sources}>
        <Sources content={c} />
      </Section>

      <Section title={RECORD_SECTIONS.models}>
        <ul className="list-disc pl-5 text-xs text-ink-soft">
          {c.engine.models.map((m) => (
            <li key={m}>{m}</li>
          ))}
        </ul>
        <p className="mt-2 text-xs text-ink-faint">
          Record format {c.format} v{c.formatVersion}, frozen {formatDateTime(c.frozenAt)} from shortlist #{c.shortlist.id}.
        </p>
      </Section>
    </div>
  );
}

export function RecordPage({ id, canExport }: { id: number; canExport: boolean }) {
  const record = useDesignRecord(id);
  if (record.isPending || record.isError) return <QueryStatus query={record} loading="Loading the design record…" />;
  return <RecordView record={record.data} canExport={canExport} />;
}
