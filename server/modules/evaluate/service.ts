import { evaluate, pressureFromDepth, type CandidateMaterial } from '../../../shared/engine';
import { EXCLUDED_NAMES_SHOWN, type EvaluateAnswerDto, type EvaluateRequest, type ExclusionDto, type ExclusionReason, type PressureQuery } from '../../../shared/schemas/evaluate';
import { AppError, badRequest, type FieldErrors } from '../../errors';
import { candidateForSet, publishedCatalogue, type CatalogueEntry } from '../property-sets/snapshot';
import { getPropertySet, type Caller } from '../property-sets/service';

/** The first filter that leaves this set out, or null when it stays in. */
function exclusionOf(entry: CatalogueEntry, req: EvaluateRequest): ExclusionReason | null {
  const f = req.filters;
  if (!f) return null;
  const { material, serviceTemperature } = entry.set;
  if (f.family && material.family !== f.family) return 'family';
  if (f.transparent !== undefined && material.transparent !== f.transparent) return 'transparency';
  if (f.coversTemperature) {
    const t = req.loadCase.temperature;
    if (serviceTemperature.min > t.min || serviceTemperature.max < t.max) return 'service-range';
  }
  const inputs = entry.candidate.inputs;
  if (f.confirmedOnly && inputs && inputs.confirmed < inputs.total) return 'unconfirmed';
  if (f.excludeDemo && inputs?.demo) return 'demo';
  return null;
}

/** Candidates named in the request: catalogue ids (published, or any set the caller may read) and inline materials. */
type Resolved = { candidates: CandidateMaterial[]; excluded: ExclusionDto[] };

/**
 * The catalogue's candidates left by each set of filters, kept per catalogue snapshot (a new
 * snapshot is a new array, so a change anywhere drops these with it): the same list object for
 * the same filters lets the engine reuse its ranking table (shared/engine/ranking-table.ts).
 */
const FILTERED = new WeakMap<readonly CatalogueEntry[], Map<string, Resolved>>();

function filterKey(req: EvaluateRequest): string {
  const f = req.filters;
  if (!f) return '';
  const t = f.coversTemperature ? req.loadCase.temperature : null;
  return JSON.stringify([f.family ?? null, f.transparent ?? null, t && t.min, t && t.max, !!f.confirmedOnly, !!f.excludeDemo]);
}

async function resolveCandidates(req: EvaluateRequest, caller: Caller): Promise<Resolved> {
  const catalogue = await publishedCatalogue();
  if (!req.candidates) {
    let perFilter = FILTERED.get(catalogue);
    if (perFilter === undefined) FILTERED.set(catalogue, (perFilter = new Map()));
    const key = filterKey(req);
    let hit = perFilter.get(key);
    if (hit === undefined) {
      // Bounded: filter combinations are few, but temperatures are free numbers.
      if (perFilter.size >= 64) perFilter.clear();
      perFilter.set(key, (hit = filterCatalogue(catalogue, req)));
    }
    return hit;
  }
  return resolveNamed(catalogue, req.candidates, caller);
}

function filterCatalogue(catalogue: readonly CatalogueEntry[], req: EvaluateRequest): Resolved {
  const kept: CandidateMaterial[] = [];
  const left = new Map<ExclusionReason, ExclusionDto>();
  for (const e of catalogue) {
    const reason = exclusionOf(e, req);
    if (reason === null) {
      kept.push(e.candidate);
      continue;
    }
    const x = left.get(reason) ?? { reason, count: 0, names: [] };
    x.count++;
    if (x.names.length < EXCLUDED_NAMES_SHOWN) x.names.push(e.candidate.name);
    left.set(reason, x);
  }
  return { candidates: kept, excluded: [...left.values()] };
}

async function resolveNamed(catalogue: readonly CatalogueEntry[], named: NonNullable<EvaluateRequest['candidates']>, caller: Caller): Promise<Resolved> {
  const byId = new Map(catalogue.map((e) => [e.set.id, e.candidate]));
  const fields: FieldErrors = {};
  const resolved: CandidateMaterial[] = [];
  for (const [i, c] of named.entries()) {
    if ('inline' in c) {
      resolved.push({ ...c.inline });
      continue;
    }
    const known = byId.get(c.propertySetId);
    if (known) {
      resolved.push(known);
      continue;
    }
    try {
      resolved.push(await candidateForSet(await getPropertySet(c.propertySetId, caller)));
    } catch (err) {
      if (err instanceof AppError && err.status === 404) fields[`candidates.${i}.propertySetId`] = 'No property set you can read has this id.';
      else throw err;
    }
  }
  if (Object.keys(fields).length) throw badRequest('Some candidates could not be found.', fields);
  return { candidates: resolved, excluded: [] };
}

export async function evaluateLoadCase(req: EvaluateRequest, caller: Caller): Promise<EvaluateAnswerDto> {
  const { candidates, excluded } = await resolveCandidates(req, caller);
  return { ...evaluate({ loadCase: req.loadCase, candidates, limit: req.limit, sortBy: req.sortBy, coveredFirst: req.coveredFirst }), excluded };
}

export function pressureAt(q: PressureQuery) {
  return pressureFromDepth(q.depth, q.latitude, q.water);
}
