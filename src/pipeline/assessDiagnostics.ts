/**
 * Coverage diagnostics of one model and the warnings they raise, each by one rule stated once
 * (src/core/diagnostics/severity.ts: thresholds and sentences): the calibrated occupancy shift
 * (src/core/diagnostics/occupancyShift.ts, 1 = like the logs), the effective size of the importance
 * weights at the effective horizon, and the candidate's action probability outside the actions
 * logged nearby, each beside the present controller's own level for scale.
 */
import { resampleBellmanStatisticsBlock } from '../core/bootstrap/episodeBellmanSums';
import { startMultiplicities } from '../core/bootstrap/startMultiplicities';
import { meanStartFeatures } from '../core/features/policyFeatures';
import { probabilityOutsideLoggedActions, type LoggedActionRanges } from '../core/diagnostics/actionSupport';
import { effectiveSampleSizeFromLogs } from '../core/diagnostics/effectiveSampleSize';
import { weightsNotNumbers } from '../core/offPolicy/effectiveRunsText';
import { paddedLogWeightsAtStep } from '../core/offPolicy/paddedHorizonWeights';
import { occupancyShift } from '../core/diagnostics/occupancyShift';
import { actionSupportFinding, effectiveShareFinding, occupancyShiftFinding, upperPercentile } from '../core/diagnostics/severity';
import type { BellmanStatistics } from '../core/fqe/bellmanStatistics';
import type { ImportanceWeightTable } from '../core/offPolicy/importanceWeights';
import { RESAMPLE_BLOCK } from '../core/offPolicy/perDecisionResamples';
import type { GaussianPolicy } from '../core/policy';
import type { ActionSupportDiagnostics, AssessmentWarning, CoverageDiagnostics, ImportanceWeightDiagnostics } from './assessment';
import type { AssessmentContext, CandidateWork } from './assessCandidate';
import type { CandidateModel } from './model/candidateModel';
import { drawBlock } from './perDecisionBlocks';
import type { EvaluationPlan } from './plan/evaluationPlan';

/** Resamples on which the shift is recomputed for its upper percentile (each costs O(e·d² + d³); ours). */
const SHIFT_RESAMPLES = 100;

export interface CoverageReference {
  /** The present controller's own shift and outside-share: the logs' own level. */
  presentControllerShift: number | null;
  presentControllerOutside: number | null;
}

export function coverageDiagnostics(work: CandidateWork, context: AssessmentContext, ranges: LoggedActionRanges, reference: CoverageReference): CoverageDiagnostics {
  const shiftModel = linearModelOf(work);
  const shift = shiftModel ? shiftOf(context.plan, shiftModel) : null;
  return {
    occupancyShift: shift, occupancyShiftUpper: shiftModel && shift !== null ? shiftUpper(context, shiftModel) : null,
    presentControllerShift: reference.presentControllerShift,
    shiftFeatures: shiftModel ? `${work.model.linear ? 'the fit’s own' : 'degree-2 polynomial'} features (${shiftModel.linear!.features.dim})` : 'none: no linear fit to measure it in',
    importanceWeights: 'perDecision' in work.offPolicy ? weightDiagnostics(work.offPolicy.table, context.plan.discount) : null,
    actionSupport: actionSupport(work.model.policy, ranges, reference.presentControllerOutside),
  };
}

/** The model whose features the shift is measured in: the candidate's own linear fit, or its degree-2 class beside a network. */
export function linearModelOf(work: CandidateWork): CandidateModel | null {
  if (work.model.linear) return work.model;
  return work.classes.find((c) => c.model.linear && c.label === 'polynomial, degree 2')?.model ?? null;
}

/** The calibrated shift of a linear model on the full data; null where it cannot be formed. */
export function shiftOf(plan: EvaluationPlan, model: CandidateModel, statistics?: BellmanStatistics, startFeatureMean?: Float64Array): number | null {
  const linear = model.linear!;
  const result = occupancyShift({
    statistics: statistics ?? linear.statistics, startFeatureMean: startFeatureMean ?? meanStartFeatures(linear.startFeatures, linear.features.dim),
    discount: plan.discount, ridge: linear.ridge, constantIndex: linear.features.constantIndex,
  });
  return 'shift' in result ? result.shift : null;
}

/**
 * The 90th percentile of the shift over the first resamples (exact per-episode sums only); the
 * estimate is right-skewed. The resamples' statistics are formed a block at a time
 * (resampleBellmanStatisticsBlock: one read of each run's sums for the block), as in the resample loop.
 */
function shiftUpper(context: AssessmentContext, model: CandidateModel): number | null {
  const { plan } = context, linear = model.linear!, r = linear.resampling;
  if (r.kind !== 'exact') return null;
  const e = plan.episodes.episodes, d = linear.features.dim, values: number[] = [];
  const block = Array.from({ length: RESAMPLE_BLOCK }, () => new Uint32Array(e)), scratch = block.map(() => new Float64Array(r.sums.stride));
  for (let first = 0; first < SHIFT_RESAMPLES; first += RESAMPLE_BLOCK) {
    const drawn = drawBlock(e, plan.seed, first, SHIFT_RESAMPLES, block);
    resampleBellmanStatisticsBlock(r.sums, drawn, scratch).forEach((statistics, i) => {
      const weights = plan.starts.followEpisodes ? startMultiplicities(drawn[i], plan.starts.episode) : undefined;
      const v = shiftOf(plan, model, statistics, meanStartFeatures(linear.startFeatures, d, weights));
      if (v !== null) values.push(v);
    });
  }
  if (values.length < 10) return null;
  values.sort((a, b) => a - b);
  return upperPercentile(values);
}

function weightDiagnostics(table: ImportanceWeightTable, discount: number): ImportanceWeightDiagnostics {
  const oneStep = effectiveSampleSizeFromLogs(table.logRatio);
  const horizonSteps = Math.max(1, Math.min(table.horizon, Math.round(1 / (1 - discount))));
  // Runs that ended in an end state before that step are still there with their last weight (padded), times the censoring factor the estimators give them.
  const atHorizon = paddedLogWeightsAtStep(table, horizonSteps - 1);
  return {
    oneStepEffectiveSize: oneStep, oneStepShare: oneStep / table.step.length,
    horizonSteps, horizonEffectiveEpisodes: effectiveSampleSizeFromLogs(atHorizon), horizonEpisodes: atHorizon.length, horizonNotNumbers: weightsNotNumbers(atHorizon),
  };
}

export function meanOutside(policy: GaussianPolicy, ranges: LoggedActionRanges): number {
  const outside = probabilityOutsideLoggedActions(policy, ranges);
  return outside.reduce((a, b) => a + b, 0) / outside.length;
}

function actionSupport(policy: GaussianPolicy, ranges: LoggedActionRanges, behaviourMeanOutside: number | null): ActionSupportDiagnostics {
  const outside = Float64Array.from(probabilityOutsideLoggedActions(policy, ranges)).sort();
  const q = outside.length;
  return {
    neighbours: ranges.neighbours, queryStates: q,
    meanOutside: outside.reduce((a, b) => a + b, 0) / q, p90Outside: upperPercentile(outside), maxOutside: outside[q - 1],
    behaviourMeanOutside,
  };
}

/** The findings of the severity rule (src/core/diagnostics/severity.ts), one text per rule. */
export function coverageWarnings(d: CoverageDiagnostics): AssessmentWarning[] {
  const findings = [
    d.occupancyShift === null ? null : occupancyShiftFinding(d.occupancyShift, d.presentControllerShift),
    d.importanceWeights ? effectiveShareFinding(d.importanceWeights.horizonEffectiveEpisodes, d.importanceWeights.horizonEpisodes, d.importanceWeights.horizonSteps, d.importanceWeights.horizonNotNumbers) : null,
    actionSupportFinding(d.actionSupport.meanOutside, d.actionSupport.neighbours, d.actionSupport.behaviourMeanOutside),
  ];
  return findings.filter((f): f is AssessmentWarning => f !== null);
}
