import { lazy, Suspense, useCallback, useEffect, useMemo, useRef, useState, type ReactNode } from 'react';
import { Link, useLocation, useNavigate, useSearchParams } from 'react-router-dom';
import { useQuery } from '@tanstack/react-query';
import { candidateFromPropertySet, type CandidateMaterial, type CandidateResult } from '@shared/engine';
import { FIRST_PAGE_RESULTS, type EvaluateRequest, type ExclusionDto, type ExclusionReason, type SORT_KEYS } from '@shared/schemas/evaluate';
import type { LoadCaseDto, ShortlistDto } from '@shared/schemas/projects';
import { Cautions } from '@/components/cautions';
import { EmptyState, ErrorState, Panel, Spinner } from '@/components/ui/states';
import { SelectField } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { useUnits } from '@/lib/unit-system';
import { formatPressureAll } from '@/lib/units';
import { candidateSetQueryOptions, useEvaluation } from '../api/evaluate';
import { useMyProjects, useSavedLoadCase } from '../api/project-links';
import { DEMO_LOAD_CASE_SI, type LoadCaseForm } from '../form-model';
import { exampleRequest, formFromLoadCase, requestFromLoadCase, sameLoadCase, sameRequest } from '../saved-load-case';
import { LoadCaseFormPanel, type FormPoint } from './load-case-form';
import type { MapPoint } from './mode-map';
import { ResultsTable, resultKey, ModeTag } from './results-table';
import { MoreResults, nextLimit } from './more-results';
import { SaveLoadCaseDialog } from './save-load-case-dialog';
import { ShortlistDialog } from './shortlist-dialog';

const MarginChart = lazy(() => import('@/components/charts/margin-chart').then((m) => ({ default: m.MarginChart })));
const ThicknessChart = lazy(() => import('./thickness-chart').then((m) => ({ default: m.ThicknessChart })));
const ModeMap = lazy(() => import('./mode-map').then((m) => ({ default: m.ModeMap })));

type SortKey = (typeof SORT_KEYS)[number];
const SORT_LABELS: Record<SortKey, string> = {
  margin: 'Governing margin (best first)',
  requiredThickness: 'Required thickness (thinnest first)',
  massPerArea: 'Mass per unit area (lightest first)',
  weightToDisplacement: 'Weight to displacement (hulls)',
};

/**
 * A drawing of the selected catalogue candidate (its set loaded as an engine candidate), or why
 * there is none yet; `what` names the drawing for a candidate outside the catalogue.
 */
function CandidateDrawing({ result, what, draw }: { result: CandidateResult; what: string; draw: (candidate: CandidateMaterial) => ReactNode }) {
  const set = useQuery({ ...candidateSetQueryOptions(result.propertySetId ?? 0), enabled: result.propertySetId !== undefined });
  const candidate = useMemo(() => (set.data ? candidateFromPropertySet(set.data) : null), [set.data]);
  if (result.propertySetId === undefined) return <p className="text-sm text-ink-soft">{what} are drawn for catalogue candidates.</p>;
  if (set.isPending) return <Spinner label="Loading the candidate's data…" />;
  if (set.isError || !candidate) return <ErrorState error={set.error} />;
  return <Suspense fallback={<Spinner label="Drawing…" />}>{draw(candidate)}</Suspense>;
}

function SelectedCandidate({ request, result }: { request: EvaluateRequest; result: CandidateResult }) {
  return (
    <CandidateDrawing
      result={result}
      what="Thickness sweeps"
      draw={(candidate) => <ThicknessChart loadCase={request.loadCase} candidate={candidate} thickness={request.loadCase.component.thickness} requiredThickness={result.requiredThickness} />}
    />
  );
}

const EXCLUSION_WORDS: Record<ExclusionReason, (n: number, lc: EvaluateRequest['loadCase'], t: (c: number) => string) => string> = {
  family: (n) => `${n} of other families (family filter)`,
  transparency: (n) => `${n} left out by the transparency filter`,
  'service-range': (n, lc, t) => `${n} whose service range does not cover ${t(lc.temperature.min)} to ${t(lc.temperature.max)}`,
  unconfirmed: (n) => `${n} with inputs not confirmed against their source`,
  demo: (n) => `${n} with demo data`,
};

/** What the filters left out and why, so a missing candidate is never a silent drop. */
function ExcludedNote({ excluded, loadCase }: { excluded: ExclusionDto[]; loadCase: EvaluateRequest['loadCase'] }) {
  const { format } = useUnits();
  const total = excluded.reduce((n, x) => n + x.count, 0);
  if (!total) return null;
  return (
    <details className="mb-3 text-sm" data-testid="excluded-candidates">
      <summary className="cursor-pointer text-ink-soft">
        <strong className="text-ink">{total}</strong> published set{total === 1 ? '' : 's'} left out by the filters:{' '}
        {excluded.map((x) => EXCLUSION_WORDS[x.reason](x.count, loadCase, (c) => format('temperature', c))).join('; ')}.
      </summary>
      <ul className="mt-1 flex flex-col gap-1 pl-4 text-xs">
        {excluded.map((x) => (
          <li key={x.reason}>
            <span className="font-bold">{EXCLUSION_WORDS[x.reason](x.count, loadCase, (c) => format('temperature', c))}:</span> {x.names.join('; ')}
            {x.count > x.names.length ? ` and ${x.count - x.names.length} more` : ''}
          </li>
        ))}
      </ul>
    </details>
  );
}

/** What set a result's required thickness, in a sentence's words. */
function sizedByWords(s: NonNullable<CandidateResult['sizedBy']>) {
  return s.kind === 'mode' ? <ModeTag mode={s.mode} /> : <>the rating table “{s.name}”</>;
}

/** The mode map of the selected catalogue candidate; a click hands the point to the form. */
function SelectedModeMap({ request, result, onPick }: { request: EvaluateRequest; result: CandidateResult; onPick: (p: MapPoint) => void }) {
  return (
    <CandidateDrawing
      result={result}
      what="Mode maps"
      draw={(candidate) => <ModeMap loadCase={request.loadCase} candidate={candidate} requiredThickness={result.requiredThickness} onPick={onPick} />}
    />
  );
}

/** Navigation state after saving: shortlist this candidate once the saved case is evaluated. */
interface PendingShortlist {
  shortlistPropertySetId?: number;
}

function SavedCaseBanner({ saved, linked, onSave }: { saved: LoadCaseDto; linked: boolean; onSave: (() => void) | null }) {
  const projects = useMyProjects();
  const project = projects.data?.find((p) => p.id === saved.projectId);
  return (
    <div role="note" className="rounded-plate border-l-4 border-sounding bg-sounding-light/60 px-3 py-2 text-sm" data-testid="saved-load-case">
      Load case <strong>{saved.name}</strong> of{' '}
      <Link to={`/projects/${saved.projectId}`} className="font-bold text-sounding underline">
        {project?.name ?? 'its project'}
      </Link>
      .
      {linked ? (
        ' Shortlists added from this table belong to it.'
      ) : (
        <>
          {' '}
          <span className="font-bold text-verdict-watch">The form has changed since it was opened</span>: the table is for the changed case.{' '}
          {onSave ? (
            <button type="button" className="font-bold text-sounding underline" onClick={onSave}>
              Save it
            </button>
          ) : null}{' '}
          to shortlist candidates for it.
        </>
      )}
    </div>
  );
}

/**
 * The Evaluate page. `?loadCase=<id>` opens a load case saved in a project: the form shows it in
 * the chosen units and candidates can be shortlisted for it.
 */
export function EvaluatePage({ canSave = false, meId = 0 }: { canSave?: boolean; meId?: number }) {
  const [params] = useSearchParams();
  const raw = params.get('loadCase');
  const loadCaseId = raw && /^[1-9]\d{0,9}$/.test(raw) ? Number(raw) : null;
  const saved = useSavedLoadCase(loadCaseId);
  // Opening the saved case again (someone else changed it) starts the workspace afresh from it.
  const [opening, setOpening] = useState(0);
  const reopen = () => void saved.refetch().then(() => setOpening((n) => n + 1));
  if (raw !== null) {
    if (loadCaseId === null || saved.isError) {
      return (
        <div className="flex max-w-xl flex-col gap-3">
          <h1 className="text-2xl font-bold">Evaluate</h1>
          <ErrorState error={saved.error} onRetry={loadCaseId === null ? undefined : () => void saved.refetch()} />
          <Link to="/evaluate" className="font-bold text-sounding underline">
            Start from the example load case instead
          </Link>
        </div>
      );
    }
    if (saved.isPending) return <Spinner label="Opening the saved load case…" />;
    return <EvaluateWorkspace key={`saved-${saved.data.id}-${opening}`} saved={saved.data} canSave={canSave} meId={meId} onReopen={reopen} />;
  }
  return <EvaluateWorkspace key="example" saved={null} canSave={canSave} meId={meId} onReopen={reopen} />;
}

function EvaluateWorkspace({ saved, canSave, meId, onReopen }: { saved: LoadCaseDto | null; canSave: boolean; meId: number; onReopen: () => void }) {
  const { format, system } = useUnits();
  const navigate = useNavigate();
  const location = useLocation();
  const [request, setRequest] = useState<EvaluateRequest>(() => (saved ? requestFromLoadCase(saved.loadCase, saved.filters) : exampleRequest()));
  const [formValues, setFormValues] = useState<LoadCaseForm>(() => (saved ? formFromLoadCase(saved.loadCase, saved.filters) : DEMO_LOAD_CASE_SI));
  const [selected, setSelected] = useState<string | null>(null);
  // Whether the table is for the saved load case as saved (so shortlists can belong to it).
  const [linked, setLinked] = useState(saved !== null);
  const [saving, setSaving] = useState<EvaluateRequest | null>(null);
  const [shortlisting, setShortlisting] = useState<CandidateResult | null>(null);
  const [pendingCandidate, setPendingCandidate] = useState<CandidateResult | null>(null);
  const [notice, setNotice] = useState<{ text: string; shortlistId: number } | null>(null);
  // The page asks for the best FIRST_PAGE_RESULTS and more on demand (more-results.tsx).
  const [limit, setLimit] = useState(FIRST_PAGE_RESULTS);
  const asked = useMemo(() => ({ ...request, limit }), [request, limit]);
  const evaluation = useEvaluation(asked);
  const data = evaluation.data;
  // Whether the form still asks for what the ranking shows: 'changed' or 'invalid' dims it.
  const [draft, setDraft] = useState<'same' | 'changed' | 'invalid'>('same');
  const requestRef = useRef(request);
  requestRef.current = request;
  const onDraft = useCallback((d: EvaluateRequest | null) => setDraft(d === null ? 'invalid' : sameRequest(d, requestRef.current) ? 'same' : 'changed'), []);
  const stale = draft !== 'same';
  // A point picked on the mode map goes into the form (which then marks the ranking stale).
  const [point, setPoint] = useState<FormPoint | null>(null);
  const pickPoint = (p: MapPoint) => {
    setPoint({ key: Date.now(), ...p });
    document.getElementById('load-case-form')?.scrollIntoView({ block: 'nearest' });
  };
  // After an evaluation asked for from the form, the keyboard focus goes to its summary.
  const summaryRef = useRef<HTMLParagraphElement>(null);
  const focusSummary = useRef(false);
  useEffect(() => {
    if (focusSummary.current && data && !evaluation.isFetching) {
      focusSummary.current = false;
      summaryRef.current?.focus();
    }
  }, [data, evaluation.isFetching]);
  const hull = request.loadCase.component.type === 'sphere' || request.loadCase.component.type === 'cylinder';
  const selectedResult = data?.results.find((r) => resultKey(r) === selected) ?? data?.results[0];

  // Arrived here by saving in order to shortlist: open the shortlist dialog for that candidate.
  const pendingId = (location.state as PendingShortlist | null)?.shortlistPropertySetId;
  useEffect(() => {
    if (pendingId === undefined || !data || !saved) return;
    const result = data.results.find((r) => r.propertySetId === pendingId);
    // Picked further down than this page has asked for yet: ask for more first.
    if (!result && data.results.length < data.total) return setLimit((l) => Math.max(l, nextLimit(data.results.length)));
    if (result) setShortlisting(result);
    navigate(`${location.pathname}${location.search}`, { replace: true, state: null });
  }, [pendingId, data, saved, navigate, location.pathname, location.search]);

  const openSave = (req: EvaluateRequest = request) => setSaving(req);
  const shortlist = (result: CandidateResult) => {
    setNotice(null);
    if (saved && linked) return setShortlisting(result);
    // A shortlist belongs to a saved load case: save this one first, then come back to it.
    setPendingCandidate(result);
    openSave();
  };
  const onSaved = (lc: LoadCaseDto) => {
    setSaving(null);
    const candidate = pendingCandidate;
    setPendingCandidate(null);
    if (saved && lc.id === saved.id) {
      // Changes saved to the opened case (from the form or the table): evaluate it as saved.
      setRequest({ ...requestFromLoadCase(lc.loadCase, lc.filters), sortBy: request.sortBy });
      setSelected(null);
      setLinked(true);
      if (candidate) setShortlisting(candidate);
      return;
    }
    navigate(`/evaluate?loadCase=${lc.id}`, { state: candidate?.propertySetId !== undefined ? { shortlistPropertySetId: candidate.propertySetId } : null });
  };
  const onAdded = (s: ShortlistDto) => {
    const name = shortlisting?.name ?? 'The candidate';
    setShortlisting(null);
    setNotice({ text: `${name} is on the shortlist “${s.name}” (${s.items.length} candidate${s.items.length === 1 ? '' : 's'}).`, shortlistId: s.id });
  };

  return (
    <div className="grid gap-5 lg:grid-cols-[21rem_1fr]">
      <div className="flex flex-col gap-3">
        <h1 className="text-2xl font-bold">Evaluate</h1>
        <Panel>
          <LoadCaseFormPanel
            initial={formValues}
            busy={evaluation.isFetching}
            onDraft={onDraft}
            point={point}
            onSubmit={(req, si) => {
              focusSummary.current = true;
              setFormValues(si);
              setSelected(null);
              if (saved) setLinked(sameLoadCase(req.loadCase, saved.loadCase));
              setRequest({ ...req, sortBy: request.sortBy });
            }}
            onSave={
              canSave
                ? (req) => {
                    setPendingCandidate(null);
                    openSave({ ...req, sortBy: request.sortBy });
                  }
                : undefined
            }
          />
        </Panel>
      </div>

      <div className="flex min-w-0 flex-col gap-4">
        <Cautions compact />
        {saved ? <SavedCaseBanner saved={saved} linked={linked} onSave={canSave ? () => openSave() : null} /> : null}
        {notice ? (
          <div role="status" className="rounded-plate border-l-4 border-verdict-pass bg-verdict-pass/10 px-3 py-2 text-sm" data-testid="shortlist-notice">
            {notice.text}{' '}
            <Link to={`/shortlists/${notice.shortlistId}`} className="font-bold text-sounding underline">
              Open the shortlist
            </Link>
          </div>
        ) : null}
        {evaluation.isError ? <ErrorState error={evaluation.error} onRetry={() => void evaluation.refetch()} /> : null}
        {evaluation.isPending ? <Spinner label="Evaluating the catalogue…" /> : null}
        {data && stale ? (
          <div role="status" className="sticky top-0 z-10 flex flex-wrap items-center gap-3 rounded-plate border-l-4 border-verdict-watch bg-brass-light px-3 py-2 text-sm shadow-plate" data-testid="stale-results">
            <span>
              <strong>Inputs changed — evaluate again.</strong>{' '}
              {draft === 'invalid' ? 'Some inputs do not check yet: fix the marked fields first. ' : ''}
              The ranking below is for the inputs last evaluated.
            </span>
            <Button type="submit" form="load-case-form" tone="quiet" disabled={draft === 'invalid'}>
              Evaluate again
            </Button>
          </div>
        ) : null}
        {data ? (
          <div className={`flex flex-col gap-4 transition-opacity ${stale ? 'opacity-40' : ''}`} data-stale={stale} data-testid="evaluation-results">
            <Panel
              title="Ranked candidates"
              actions={
                <div className="flex min-w-0 max-w-full items-center gap-3">
                  {evaluation.isFetching ? <span className="text-xs text-ink-soft" role="status">Updating…</span> : null}
                  <SelectField
                    label="Rank by"
                    wrapperClassName="w-64 max-w-full"
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
              <p ref={summaryRef} tabIndex={-1} className="mb-3 text-sm" data-testid="evaluation-summary">
                Design pressure <strong>{formatPressureAll(data.pressure, system === 'US' ? 'psi' : 'MPa')} gauge</strong> (proof test {format('pressure', data.proofTestPressure)}) ·{' '}
                <span className="text-ink-soft">{data.pressureMethod}</span>
                <br />
                {data.total} candidate{data.total === 1 ? '' : 's'} evaluated{data.results.length < data.total ? `, best ${data.results.length} shown` : ''}.
                {data.results[0] ? (
                  <>
                    {' '}
                    Best: <strong>{data.results[0].name}</strong>, governed by <ModeTag mode={data.results[0].governingMode} />
                    {data.results[0].sizedBy ? <>; its required thickness is set by {sizedByWords(data.results[0].sizedBy)}</> : null}.
                  </>
                ) : null}
              </p>
              <ExcludedNote excluded={data.excluded ?? []} loadCase={request.loadCase} />
              {data.results.length ? (
                <ResultsTable
                  results={data.results}
                  selectedKey={selectedResult ? resultKey(selectedResult) : null}
                  onSelect={setSelected}
                  hull={hull}
                  onShortlist={canSave ? shortlist : undefined}
                />
              ) : (
                <EmptyState title="No catalogue candidates fit these filters">
                  Choose another family or transparency, or untick “Service range must cover the design temperatures”.
                </EmptyState>
              )}
              <MoreResults shown={data.results.length} total={data.total} loading={evaluation.isFetching && limit > data.results.length} onMore={setLimit} />
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
                <Panel title="Where each mode governs" className="xl:col-span-2">
                  {selectedResult ? <SelectedModeMap request={request} result={selectedResult} onPick={pickPoint} /> : null}
                </Panel>
              </div>
            ) : null}
          </div>
        ) : null}
      </div>
      {canSave ? (
        <>
          <SaveLoadCaseDialog
            open={saving !== null}
            request={saving}
            opened={saved}
            purpose={
              pendingCandidate
                ? `A shortlist belongs to a saved load case. Save this one first; then ${pendingCandidate.name} can go on a shortlist for it.`
                : undefined
            }
            onClose={() => {
              setSaving(null);
              setPendingCandidate(null);
            }}
            onSaved={onSaved}
            onReload={onReopen}
          />
          {saved ? <ShortlistDialog result={shortlisting} loadCase={saved} authorId={meId} onClose={() => setShortlisting(null)} onAdded={onAdded} /> : null}
        </>
      ) : null}
    </div>
  );
}
