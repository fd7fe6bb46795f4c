/**
 * The project's retune maps (project `retuneMaps`): one candidate over a grid of one or two of its
 * numbers, each point evaluated by linear fitted Q-evaluation on one shared structure
 * (src/core/retune/retuneGrid.ts: the sums that do not depend on the policy are formed once), with
 * per point
 *   - J in the project's sense and its percentile bootstrap interval over runs (MAP_RESAMPLES
 *     resamples, the per-run sums of the point reweighted and solved at the fixed point, seeded
 *     like the assessment so every point sees the same resamples);
 *   - the calibrated occupancy shift (src/core/diagnostics/occupancyShift.ts) and its level by the
 *     one severity rule (src/core/diagnostics/severity.ts): a point is "supported" when its shift is
 *     at or below the caution limit, the same words and limits as every candidate's;
 * and the best supported point, with the present controller's value for reference.
 *
 * A network project's map uses the degree-2 polynomial features (a grid of network fits would cost
 * one training per point), and says so.
 */
import { episodeMultiplicities } from '../core/bootstrap/episodeMultiplicities';
import { linearFqeReplicateBlock } from '../core/bootstrap/linearFqeReplicate';
import { occupancyShift } from '../core/diagnostics/occupancyShift';
import { outsidePossible, possibleValues } from '../core/diagnostics/possibleValues';
import { OCCUPANCY_SHIFT_LIMITS, occupancyShiftSeverity, shiftReference, type SeverityLevel } from '../core/diagnostics/severity';
import { shiftText } from '../core/diagnostics/shiftText';
import type { CancellationCheck } from '../core/fqe/cancellation';
import { CONFIDENCE_LEVEL, DEFAULT_POLYNOMIAL_DEGREE, MAX_ITERATIONS, MIN_EPISODES, RIDGE, TOLERANCE } from '../core/limits';
import { RESAMPLE_BLOCK } from '../core/offPolicy/perDecisionResamples';
import { PolicyError, type GaussianPolicy } from '../core/policy';
import { RetuneAxisError } from '../core/retune/retuneAxes';
import { retuneGrid, type RetuneRoute } from '../core/retune/retuneGrid';
import { failure, success, type Result } from '../core/result';
import { FqeCancelledError } from '../core/fqe/fqeErrors';
import { retuneMapCandidates } from '../project/retuneMapCandidates';
import { tunableParameters } from '../project/candidateParameters';
import type { CandidateSpec, RetuneMapSpec } from '../project/schema';
import { intervalEstimate } from './assessIntervals';
import { candidatePolicy } from './candidatePolicy';
import { featureMapFor } from './plan/featureMapFor';
import type { EvaluationPlan } from './plan/evaluationPlan';
import { quadratureProblem } from '../core/fqe/solveSettingChecks';
import { isEngineError } from './engineErrors';
import { shiftOf } from './assessDiagnostics';
import { certainEnds, cutToCertain } from './assessPossible';
import { CANCELLED_PROBLEM, type ProjectRun } from './projectRun';
import { shareText } from '../core/shareText';

/** Bootstrap resamples per grid point (ours: enough for a 90 % percentile interval to two digits of its width). */
export const MAP_RESAMPLES = 100;
/** Largest e·d²·points·resamples for which the intervals are formed (about a minute of one core; ours). */
const INTERVAL_BUDGET = 4e9;

export interface RetuneMapPoint {
  /** The axis values of this point, one per axis. */
  readonly coordinates: number[];
  /** J in the project's sense; null when the fit has no solution (status says why). */
  readonly value: number | null;
  readonly interval: [number, number] | null;
  readonly status: string;
  readonly occupancyShift: number | null;
  /** null: supported (shift at or below the caution limit); else the level the shift reaches; 'unknown' without a shift. */
  readonly support: SeverityLevel | 'unknown' | null;
  readonly route: RetuneRoute;
}

export interface RetuneMapResult {
  readonly candidate: string;
  /**
   * Each axis: its path in the candidate, its name in the trade's words with the unit, its values, and
   * the unit as data ('s' for an integral time; the figure shows a time in minutes or hours by it). The
   * unit is absent in maps saved before it was kept.
   */
  readonly axes: { parameter: string; label: string; values: number[]; unit?: string }[];
  /** Row-major over the axes (the last axis fastest). */
  readonly points: RetuneMapPoint[];
  /** The best converged, supported point; null when none is. */
  readonly best: { index: number; coordinates: number[]; value: number } | null;
  /** The present controller's J (project sense), for reference; null without its model. */
  readonly presentController: number | null;
  readonly features: string;
  readonly notes: string[];
  /** The points' intervals' level (0.9 for 90 %); absent without intervals, and in results saved before it was kept. */
  readonly level?: number;
}

export interface RetuneMapsOptions {
  readonly presentControllerValue: number | null;
  /** The present controller's own occupancy shift: the level every point's shift is read against. */
  readonly presentControllerShift: number | null;
  readonly cancel?: CancellationCheck;
  readonly onProgress?: (progress: { map: number; maps: number; pointsDone: number; pointsTotal: number }) => void;
}

export class RetuneMapError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'RetuneMapError';
  }
}

export function runRetuneMaps(plan: EvaluationPlan, options: RetuneMapsOptions): RetuneMapResult[] {
  const maps = plan.project.retuneMaps ?? [];
  return maps.map((spec, i) => runRetuneMap(plan, spec, {
    ...options, onProgress: (p) => options.onProgress?.({ map: i, maps: maps.length, ...p }),
  }));
}

function runRetuneMap(
  plan: EvaluationPlan, spec: RetuneMapSpec, options: Omit<RetuneMapsOptions, 'onProgress'> & { onProgress: (p: { pointsDone: number; pointsTotal: number }) => void },
): RetuneMapResult {
  const { data, sign } = plan, a = plan.approximator;
  const linear = a.kind === 'linear';
  const settings = linear ? { ridge: a.ridge, tolerance: a.tolerance, maxIterations: a.maxIterations } : { ridge: RIDGE.default, tolerance: TOLERANCE.default, maxIterations: MAX_ITERATIONS.default };
  const features = plan.features ?? featureMapFor({ kind: 'linear', features: { kind: 'polynomial', degree: DEFAULT_POLYNOMIAL_DEGREE }, ...settings }, data);
  const grid = retuneMapCandidates(plan.project, spec);
  const policies: GaussianPolicy[] = grid.candidates.map((c, p) => {
    try {
      const policy = candidatePolicy(c, data);
      const problem = quadratureProblem(policy, plan.quadratureNodes);
      if (problem) throw new RetuneMapError(`retune map of "${spec.candidate}", point ${p + 1}: ${problem}`);
      return policy;
    } catch (error) {
      if (error instanceof PolicyError) throw new RetuneMapError(`retune map of "${spec.candidate}", point ${p + 1} (${describePoint(spec, grid.points[p])}): ${error.message}`);
      throw error;
    }
  });
  const e = plan.episodes.episodes, d = features.dim;
  const withIntervals = e >= MIN_EPISODES && e * d * d * policies.length * MAP_RESAMPLES <= INTERVAL_BUDGET;
  const level = plan.project.bootstrap?.level ?? CONFIDENCE_LEVEL.default;
  // The same resamples at every point (seed, b), drawn once; each point's replicates are taken a block at a time (linearFqeReplicateBlock).
  const resamples = withIntervals ? Array.from({ length: MAP_RESAMPLES }, (_, b) => episodeMultiplicities(e, plan.seed, b)) : [];
  const points: RetuneMapPoint[] = [], possible = possibleValues(data.rewards, plan.discount, plan.absorbingEnds > 0);
  let cutPoints = 0;
  retuneGrid({
    data, features, policies, discount: plan.discount, ridge: settings.ridge, quadratureNodes: plan.quadratureNodes,
    tolerance: settings.tolerance, maxIterations: settings.maxIterations, startStates: plan.starts.states,
    withBellmanResidual: false, perEpisode: withIntervals, cancel: options.cancel,
    onProgress: (p) => options.onProgress({ pointsDone: p.pointsDone, pointsTotal: p.pointsTotal }),
    onPoint: (m) => {
      const shift = occupancyShift({ statistics: m.statistics, startFeatureMean: m.meanStartFeatures, discount: plan.discount, ridge: settings.ridge, constantIndex: features.constantIndex });
      const shiftValue = 'shift' in shift ? shift.shift : null;
      let interval: [number, number] | null = null;
      if (withIntervals && m.episodeSums && m.weights && m.policyValue !== null) {
        const setup = {
          ridge: settings.ridge, constantIndex: features.constantIndex, discount: plan.discount, solver: 'fixedPoint' as const, tolerance: settings.tolerance,
          maxIterations: settings.maxIterations, initialWeights: m.weights, sums: m.episodeSums, startFeatures: m.startFeatures,
          startsFollowEpisodes: plan.starts.followEpisodes, startEpisode: plan.starts.episode,
        };
        const scratch = Array.from({ length: RESAMPLE_BLOCK }, () => new Float64Array(setup.sums.stride)), values: (number | null)[] = [];
        for (let first = 0; first < MAP_RESAMPLES; first += RESAMPLE_BLOCK) {
          for (const r of linearFqeReplicateBlock(setup, resamples.slice(first, first + RESAMPLE_BLOCK), scratch)) values.push(r.policyValue);
        }
        // Cut where the reward's definition puts values out of reach of every policy, as a candidate's range to report is.
        const cut = cutToCertain(plan, intervalEstimate(m.policyValue, values, level, sign).percentile, sign * m.policyValue, possible);
        interval = cut.range;
        if (cut.note) cutPoints++;
      }
      // A value no policy can reach with rewards in the logged range is beyond the logs whatever its shift says.
      const impossible = m.policyValue !== null && outsidePossible(m.policyValue, possible);
      points.push({
        coordinates: grid.points[m.index], value: m.policyValue === null ? null : sign * m.policyValue, interval, status: impossible ? 'outside the possible range' : m.status,
        occupancyShift: shiftValue, support: impossible ? 'serious' : shiftValue === null ? 'unknown' : occupancyShiftSeverity(shiftValue, options.presentControllerShift), route: m.route,
      });
    },
  });
  const reference = shiftReference(options.presentControllerShift), fmt = shiftText;
  const better = (x: number, y: number) => (plan.sense === 'cost' ? x < y : x > y);
  let best: RetuneMapResult['best'] = null;
  points.forEach((p, index) => {
    if (p.value === null || p.status !== 'converged' || p.support !== null) return;
    if (!best || better(p.value, best.value)) best = { index, coordinates: p.coordinates, value: p.value };
  });
  const chosen = best as RetuneMapResult['best'];
  const onEdge = chosen !== null && chosen.coordinates.some((v, a) => v === grid.coordinates[a][0] || v === grid.coordinates[a][grid.coordinates[a].length - 1]);
  const notes = [
    ...(onEdge ? ['The best supported point lies on the edge of the grid: the optimum may lie beyond it; widen the range where the logs allow.'] : []),
    `Supported: occupancy shift at or below ${fmt(OCCUPANCY_SHIFT_LIMITS.caution * reference)}, ${OCCUPANCY_SHIFT_LIMITS.caution} times the present controller’s own level ${fmt(reference)} ` +
      `(the candidates’ rule); above ${fmt(OCCUPANCY_SHIFT_LIMITS.serious * reference)} the logs no longer speak for the estimate.`,
    withIntervals
      ? `Intervals: ${shareText(level)} percentile bootstrap over the ${e} logged runs, ${MAP_RESAMPLES} resamples per point (the same resamples at every point)` +
        `${cutPoints > 0 ? `; at ${cutPoints} point${cutPoints === 1 ? '' : 's'} cut where the ${plan.sense}’s definition puts values out of reach of every policy (${certainEnds(plan)})` : ''}.`
      : `No intervals: ${e < MIN_EPISODES ? `${e} runs are too few to resample` : 'the grid is too large to resample every point within a minute'}.`,
    ...(linear ? [] : ['The project uses the network approximator; the map uses degree-2 polynomial features (a network fit per point would cost a training each).']),
    'Each point is a retune of the same candidate; like every estimate here, it is a screening figure to plan a trial, not a substitute for a supervised test on the plant.',
  ];
  return {
    candidate: spec.candidate, axes: spec.axes.map((axis, i) => ({ parameter: axis.parameter, ...axisLabel(grid.base, axis.parameter, plan), values: grid.coordinates[i] })), points, best,
    presentController: options.presentControllerValue, features: `${features.dim} features (${plan.features ? 'the project’s own' : 'degree-2 polynomial'})`, notes,
    ...(withIntervals ? { level } : {}),
  };
}

function axisLabel(candidate: CandidateSpec, path: string, plan: EvaluationPlan): { label: string; unit?: string } {
  const known = tunableParameters(candidate, plan.project.columns).find((p) => p.path === path);
  if (!known) return { label: path };
  return known.unit ? { label: `${known.label} (${known.unit})`, unit: known.unit } : { label: known.label };
}


function describePoint(spec: RetuneMapSpec, point: number[]): string {
  return point.map((v, a) => `${spec.axes[a].parameter} = ${v}`).join(', '); // the project’s own paths, to find the field
}

/** The maps of a run, as a result: a map that cannot be formed is a problem naming it, not a crash. */
export function retuneMapsOfRun(run: ProjectRun, options: Omit<RetuneMapsOptions, 'presentControllerValue' | 'presentControllerShift'> = {}): Result<RetuneMapResult[]> {
  const pc = run.presentController, settled = pc !== null && pc.fit.status === 'converged';
  try {
    return success(runRetuneMaps(run.plan, {
      ...options, presentControllerValue: settled ? run.plan.sign * pc.fit.policyValue : null,
      presentControllerShift: settled && pc.linear ? shiftOf(run.plan, pc) : null,
    }));
  } catch (error) {
    if (error instanceof FqeCancelledError) return failure(CANCELLED_PROBLEM);
    if (error instanceof RetuneMapError || error instanceof RetuneAxisError || isEngineError(error)) return failure({ where: 'retuneMaps', message: (error as Error).message });
    throw error;
  }
}
