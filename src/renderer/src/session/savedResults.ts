/**
 * The last run's results kept in the project (schema `results`), so a reopened project shows its
 * findings without a rerun. Written after each run, each assessment and each retune map (an amendment, not an
 * undoable edit, like the data fingerprint); read back when the data has been imported again, with
 * the fingerprint of data + settings compared: results of other data or settings come back marked
 * out of date, never as current. The fitted models are not kept, so surfaces and slices at new
 * states need a new run.
 */
import type { Assessment } from '../../../pipeline/assessment';
import { assessmentToJson } from '../../../pipeline/assessmentJson';
import type { Evaluation, PolicyEstimate } from '../../../pipeline/estimates';
import { evaluationToJson } from '../../../pipeline/evaluationJson';
import type { RetuneMapResult } from '../../../pipeline/retuneMaps';
import type { ProjectDocument, SavedResults } from '../../../project/schema';
import { tunableParameters } from '../../../project/candidateParameters';
import type { DocumentStore } from '../document/documentStore';
import { runFingerprint, runKey, runKeyWithNotes } from '../../../shared/runKey';
import type { SessionStore } from './sessionStore';

/** What one run produced: the evaluation, and its assessment and retune maps once computed. */
export interface RunResults {
  readonly evaluation: Evaluation;
  readonly assessment: Assessment | null;
  readonly retuneMaps: readonly RetuneMapResult[] | null;
}

export function resultsOf({ evaluation, assessment, retuneMaps }: RunResults, key: string, now: Date): SavedResults {
  return {
    format: 1, fingerprint: runFingerprint(key), savedAt: now.toISOString(),
    evaluation: evaluationToJson(evaluation), ...(assessment ? { assessment: assessmentToJson(assessment) } : {}),
    // Plain data already (numbers, strings, nulls): kept as the CLI's --json writes it.
    ...(retuneMaps ? { retuneMaps: retuneMaps.map((m) => JSON.parse(JSON.stringify(m)) as Record<string, unknown>) } : {}),
  };
}

/** Keep the results in the document (every snapshot, so undo does not drop them). */
export function keepResults(documents: DocumentStore, results: SavedResults): void {
  documents.amendAll((d) => ({ ...d, results }));
}

const isNumber = (v: unknown): v is number => typeof v === 'number';

/** The evaluation from its JSON form, or null when it is not one this version can show. */
export function evaluationFromJson(json: Record<string, unknown>): Evaluation | null {
  const policies = json.policies, behaviour = json.behaviour as Record<string, unknown> | undefined;
  if (!Array.isArray(policies) || !behaviour || !isNumber(behaviour.value) || typeof json.evaluatedAt !== 'string') return null;
  if (json.valueSense !== 'cost' && json.valueSense !== 'reward') return null;
  const decoded = policies.map(policyFromJson);
  if (decoded.some((p) => p === null)) return null;
  // Results saved by a version before the present controller's model was part of every run have no baseline: say so.
  const presentController = (json.presentController ?? null) as Evaluation['presentController'];
  const presentControllerReason = typeof json.presentControllerReason === 'string' ? json.presentControllerReason : 'these results were saved by an earlier version; run again for the comparable baseline';
  return { ...(json as unknown as Evaluation), policies: decoded as PolicyEstimate[], presentController, presentControllerReason };
}

function policyFromJson(raw: unknown): PolicyEstimate | null {
  const p = raw as Record<string, unknown>;
  if (!p || typeof p.name !== 'string' || !isNumber(p.policyValue) || !Array.isArray(p.history)) return null;
  const s = p.surface as Record<string, unknown> | null;
  const surface = s && Array.isArray(s.x) && Array.isArray(s.y) && Array.isArray(s.values) && Array.isArray(s.visits)
    ? { ...(s as object), x: Float64Array.from(s.x), y: Float64Array.from(s.y), values: Float64Array.from(s.values as number[], (v) => (v === null ? NaN : v)), visits: Uint32Array.from(s.visits) }
    : null;
  return { ...(p as unknown as PolicyEstimate), surface: surface as PolicyEstimate['surface'] };
}

/** The assessment from its JSON form (already plain data), or null. */
export function assessmentFromJson(json: Record<string, unknown> | undefined): Assessment | null {
  if (!json || !Array.isArray(json.candidates) || !json.comparison || !json.settings) return null;
  // An assessment saved by an earlier version lacks the baseline, the class verdict and the shift: not shown (a rerun computes them).
  if (!('presentController' in json) || !json.candidates.every(hasCurrentShape)) return null;
  return json as unknown as Assessment;
}

function hasCurrentShape(raw: unknown): boolean {
  const c = raw as Record<string, unknown> | null;
  const d = c?.diagnostics as Record<string, unknown> | undefined;
  return !!c && typeof c.confirmation === 'object' && c.confirmation !== null && 'reportedRange' in c && !!d && 'occupancyShift' in d;
}

const isNumberList = (v: unknown): boolean => Array.isArray(v) && v.every(isNumber);

/** One kept map, checked for the fields the Findings panel and the report read; null when it lacks one. */
function retuneMapFromJson(raw: Record<string, unknown>): RetuneMapResult | null {
  const axes = raw.axes, points = raw.points, best = raw.best as Record<string, unknown> | null | undefined;
  if (typeof raw.candidate !== 'string' || typeof raw.features !== 'string' || !Array.isArray(raw.notes) || !Array.isArray(axes) || !Array.isArray(points)) return null;
  if (!axes.every((a) => typeof a?.parameter === 'string' && typeof a?.label === 'string' && isNumberList(a?.values))) return null;
  const cells = axes.reduce((n: number, a: { values: number[] }) => n * a.values.length, 1);
  const pointOk = (p: Record<string, unknown>) => !!p && isNumberList(p.coordinates) && (p.value === null || isNumber(p.value)) && typeof p.status === 'string' && 'support' in p;
  if (axes.length < 1 || points.length !== cells || !points.every(pointOk)) return null;
  if (best !== null && !(best && isNumber(best.index) && isNumber(best.value) && isNumberList(best.coordinates))) return null;
  if (raw.presentController !== null && !isNumber(raw.presentController)) return null;
  return raw as unknown as RetuneMapResult;
}

/** The kept retune maps, or null when there are none or one is not in a shape this version can show. */
export function retuneMapsFromJson(json: readonly Record<string, unknown>[] | undefined): RetuneMapResult[] | null {
  if (!json || json.length === 0) return null;
  const maps = json.map(retuneMapFromJson);
  return maps.every((m) => m !== null) ? (maps as RetuneMapResult[]) : null;
}

/**
 * A map saved before its axes kept their unit, with each axis's unit from the project's candidate by the
 * parameter's path (the tunableParameters the pipeline labels by), so a kept integral time reads in minutes
 * as a fresh map's does; an axis whose candidate or parameter is gone stays as saved.
 */
export function withAxisUnits(map: RetuneMapResult, doc: ProjectDocument): RetuneMapResult {
  const candidate = doc.candidates.find((c) => c.name === map.candidate);
  if (!candidate || map.axes.every((a) => a.unit !== undefined)) return map;
  const known = tunableParameters(candidate, doc.columns);
  const unitOf = (a: RetuneMapResult['axes'][number]) => a.unit ?? known.find((p) => p.path === a.parameter)?.unit;
  return { ...map, axes: map.axes.map((a) => (unitOf(a) ? { ...a, unit: unitOf(a) } : a)) };
}

/**
 * Results kept by a version that fitted the present controller's law on every row although the held-actions check
 * found held rows (its summary has a severity but no `lawFittedOn`): this version fits that law on the rows not held,
 * so the kept baseline, its checks and every difference are out of date, whatever the key says.
 */
export function fittedBeforeHeldRepair(assessment: Record<string, unknown> | undefined): boolean {
  const held = assessment?.heldActions as Record<string, unknown> | undefined;
  return !!held && typeof held.severity === 'string' && !('lawFittedOn' in held);
}

/** After an import of the current data: show the kept results, current or marked out of date. */
export function restoreResults(doc: ProjectDocument, dataFingerprint: string, session: SessionStore): boolean {
  const saved = doc.results;
  if (!saved || session.get().evaluation) return false;
  const evaluation = evaluationFromJson(saved.evaluation);
  if (!evaluation) {
    session.set((s) => ({ ...s, notice: { tone: 'warning', title: 'The results kept in this project could not be read by this version; run the evaluation again', problems: [] } }));
    return false;
  }
  const key = runKey(doc, dataFingerprint);
  // Results kept by a version whose key held the reasons and notes are current under that key too.
  const sameKey = runFingerprint(key) === saved.fingerprint || runFingerprint(runKeyWithNotes(doc, dataFingerprint)) === saved.fingerprint;
  const current = sameKey && !fittedBeforeHeldRepair(saved.assessment);
  const recordKey = current ? key : `out of date: ${saved.fingerprint}`;
  const assessment = assessmentFromJson(saved.assessment), maps = retuneMapsFromJson(saved.retuneMaps)?.map((m) => withAxisUnits(m, doc)) ?? null;
  session.set((s) => ({
    ...s,
    evaluation: { evaluation, runKey: recordKey, restored: { savedAt: saved.savedAt, current } },
    assessment: assessment ? { status: 'done', runKey: recordKey, assessment } : s.assessment,
    retuneMaps: maps ? { status: 'done', runKey: recordKey, maps } : s.retuneMaps,
  }));
  return true;
}

/**
 * Keep each fresh run's results (and its assessment once done) in the document, and read kept
 * results back once the data of an opened project has been imported. Returns the stop function.
 */
export function startResultsKeeping(documents: DocumentStore, session: SessionStore, now: () => Date = () => new Date()): () => void {
  let kept: RunResults | null = null, restoredFor = '';
  const check = (): void => {
    const s = session.get(), doc = documents.get().history.present;
    const record = s.evaluation;
    if (record && !record.restored) {
      const assessment = s.assessment.status === 'done' && s.assessment.runKey === record.runKey ? s.assessment.assessment : null;
      const retuneMaps = s.retuneMaps.status === 'done' && s.retuneMaps.runKey === record.runKey ? s.retuneMaps.maps : null;
      if (record.evaluation !== kept?.evaluation || assessment !== kept.assessment || retuneMaps !== kept.retuneMaps) {
        kept = { evaluation: record.evaluation, assessment, retuneMaps };
        keepResults(documents, resultsOf(kept, record.runKey, now()));
      }
      return;
    }
    const imported = s.importState;
    const attempt = `${documents.get().generation}|${imported.status === 'done' ? imported.key : ''}`;
    if (!record && doc.results && imported.status === 'done' && restoredFor !== attempt) {
      restoredFor = attempt;
      restoreResults(doc, imported.result.fingerprint, session);
    }
  };
  const stops = [session.subscribe(check), documents.subscribe(check)];
  return () => stops.forEach((stop) => stop());
}
