import { lazy, Suspense, useMemo, useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { candidateFromPropertySet, type CandidateResult } from '@shared/engine';
import type { EvaluateRequest, SORT_KEYS } from '@shared/schemas/evaluate';
import { Cautions } from '@/components/cautions';
import { EmptyState, ErrorState, Panel, Spinner } from '@/components/ui/states';
import { SelectField } from '@/components/ui/field';
import { useUnits } from '@/lib/unit-system';
import { candidateSetQueryOptions, useEvaluation } from '../api/evaluate';
import { checkForm, convertForm, DEMO_LOAD_CASE_SI, type LoadCaseForm } from '../form-model';
import { LoadCaseFormPanel } from './load-case-form';
import { ResultsTable, resultKey, ModeTag } from './results-table';

const MarginChart = lazy(() => import('./margin-chart').then((m) => ({ default: m.MarginChart })));
const ThicknessChart = lazy(() => import('./thickness-chart').then((m) => ({ default: m.ThicknessChart })));

type SortKey = (typeof SORT_KEYS)[number];
const SORT_LABELS: Record<SortKey, string> = {
  margin: 'Governing margin (best first)',
  requiredThickness: 'Required thickness (thinnest first)',
  massPerArea: 'Mass per unit area (lightest first)',
  weightToDisplacement: 'Weight to displacement (hulls)',
};

function initialRequest(): EvaluateRequest {
  const check = checkForm(convertForm(DEMO_LOAD_CASE_SI, 'SI-raw', 'SI'), 'SI');
  if (!check.ok) throw new Error('The demo load case does not validate');
  return check.request;
}

function SelectedCandidate({ request, result }: { request: EvaluateRequest; result: CandidateResult }) {
  const set = useQuery({ ...candidateSetQueryOptions(result.propertySetId ?? 0), enabled: result.propertySetId !== undefined });
  const candidate = useMemo(() => (set.data ? candidateFromPropertySet(set.data) : null), [set.data]);
  if (result.propertySetId === undefined) return <p className="text-sm text-ink-soft">Thickness sweeps are drawn for catalogue candidates.</p>;
  if (set.isPending) return <Spinner label="Loading the candidate's data…" />;
  if (set.isError || !candidate) return <ErrorState error={set.error} />;
  return (
    <Suspense fallback={<Spinner label="Drawing…" />}>
      <ThicknessChart loadCase={request.loadCase} candidate={candidate} thickness={request.loadCase.component.thickness} requiredThickness={result.requiredThickness} />
    </Suspense>
  );
}

export function EvaluatePage() {
  const { format } = useUnits();
  const [request, setRequest] = useState<EvaluateRequest>(initialRequest);
  const [formValues, setFormValues] = useState<LoadCaseForm>(DEMO_LOAD_CASE_SI);
  const [selected, setSelected] = useState<string | null>(null);
  const evaluation = useEvaluation(request);
  const data = evaluation.data;
  const hull = request.loadCase.component.type === 'sphere' || request.loadCase.component.type === 'cylinder';
  const selectedResult = data?.results.find((r) => resultKey(r) === selected) ?? data?.results[0];

  return (
    <div className="grid gap-5 lg:grid-cols-[23rem_1fr]">
      <div className="flex flex-col gap-3">
        <h1 className="text-2xl font-bold">Evaluate</h1>
        <Panel>
          <LoadCaseFormPanel
            initial={formValues}
            busy={evaluation.isFetching}
            onSubmit={(req, si) => {
              setFormValues(si);
              setSelected(null);
              setRequest({ ...req, sortBy: request.sortBy });
            }}
          />
        </Panel>
      </div>

      <div className="flex min-w-0 flex-col gap-4">
        <Cautions compact />
        {evaluation.isError ? <ErrorState error={evaluation.error} onRetry={() => void evaluation.refetch()} /> : null}
        {evaluation.isPending ? <Spinner label="Evaluating the catalogue…" /> : null}
        {data ? (
          <>
            <Panel
              title="Ranked candidates"
              actions={
                <div className="flex items-center gap-3">
                  {evaluation.isFetching ? <span className="text-xs text-ink-soft" role="status">Updating…</span> : null}
                  <SelectField
                    label="Rank by"
                    wrapperClassName="w-64"
                    value={request.sortBy}
                    onChange={(e) => setRequest({ ...request, sortBy: e.target.value as SortKey })}
                  >
                    {(Object.keys(SORT_LABELS) as SortKey[])
                      .filter((k) => hull || k !== 'weightToDisplacement')
                      .map((k) => (
                        <option key={k} value={k}>
                          {SORT_LABELS[k]}
                        </option>
                      ))}
                  </SelectField>
                </div>
              }
            >
              <p className="mb-3 text-sm" data-testid="evaluation-summary">
                Design pressure <strong>{format('pressure', data.pressure)}</strong> (proof test {format('pressure', data.proofTestPressure)}) ·{' '}
                <span className="text-ink-soft">{data.pressureMethod}</span>
                <br />
                {data.total} candidate{data.total === 1 ? '' : 's'} evaluated{data.results.length < data.total ? `, best ${data.results.length} shown` : ''}.
                {data.results[0] ? (
                  <>
                    {' '}
                    Best: <strong>{data.results[0].name}</strong>, governed by <ModeTag mode={data.results[0].governingMode} />.
                  </>
                ) : null}
              </p>
              {data.results.length ? (
                <ResultsTable results={data.results} selectedKey={selectedResult ? resultKey(selectedResult) : null} onSelect={setSelected} hull={hull} />
              ) : (
                <EmptyState title="No catalogue candidates fit these filters">
                  Choose another family or transparency, or untick “Service range must cover the design temperatures”.
                </EmptyState>
              )}
            </Panel>
            {data.results.length ? (
              <div className="grid gap-4 xl:grid-cols-2">
                <Panel title="Margins by mode">
                  <Suspense fallback={<Spinner label="Drawing…" />}>
                    <MarginChart results={data.results} />
                  </Suspense>
                </Panel>
                <Panel title="Where the governing mode changes">
                  {selectedResult ? <SelectedCandidate request={request} result={selectedResult} /> : null}
                </Panel>
              </div>
            ) : null}
          </>
        ) : null}
      </div>
    </div>
  );
}
