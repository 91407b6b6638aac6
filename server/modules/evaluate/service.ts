import { evaluate, pressureFromDepth, type CandidateMaterial, type EvaluateResult } from '../../../shared/engine';
import type { EvaluateRequest, PressureQuery } from '../../../shared/schemas/evaluate';
import { AppError, badRequest, type FieldErrors } from '../../errors';
import { candidateForSet, publishedCatalogue, type CatalogueEntry } from '../property-sets/snapshot';
import { getPropertySet, type Caller } from '../property-sets/service';

function matchesFilters(entry: CatalogueEntry, req: EvaluateRequest): boolean {
  const f = req.filters;
  if (!f) return true;
  const { material, serviceTemperature } = entry.set;
  if (f.family && material.family !== f.family) return false;
  if (f.transparent !== undefined && material.transparent !== f.transparent) return false;
  if (f.coversTemperature) {
    const t = req.loadCase.temperature;
    if (serviceTemperature.min > t.min || serviceTemperature.max < t.max) return false;
  }
  const inputs = entry.candidate.inputs;
  if (f.confirmedOnly && inputs && inputs.confirmed < inputs.total) return false;
  if (f.excludeDemo && inputs?.demo) return false;
  return true;
}

/** Candidates named in the request: catalogue ids (published, or any set the caller may read) and inline materials. */
async function resolveCandidates(req: EvaluateRequest, caller: Caller): Promise<CandidateMaterial[]> {
  const catalogue = await publishedCatalogue();
  if (!req.candidates) return catalogue.filter((e) => matchesFilters(e, req)).map((e) => e.candidate);

  const byId = new Map(catalogue.map((e) => [e.set.id, e.candidate]));
  const fields: FieldErrors = {};
  const resolved: CandidateMaterial[] = [];
  for (const [i, c] of req.candidates.entries()) {
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
  return resolved;
}

export async function evaluateLoadCase(req: EvaluateRequest, caller: Caller): Promise<EvaluateResult> {
  const candidates = await resolveCandidates(req, caller);
  return evaluate({ loadCase: req.loadCase, candidates, limit: req.limit, sortBy: req.sortBy, coveredFirst: req.coveredFirst });
}

export function pressureAt(q: PressureQuery) {
  return pressureFromDepth(q.depth, q.latitude, q.water);
}
