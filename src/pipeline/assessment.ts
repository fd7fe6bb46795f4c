/**
 * What an assessment returns: the evidence a reviewer asks for beside each J — bootstrap
 * intervals, the logged behaviour's baseline, cross-checks by other methods, coverage
 * diagnostics, sensitivity to settings, and the comparison of candidates. Plain data (numbers,
 * strings, arrays) so it crosses a worker boundary, prints as JSON and feeds the report and the
 * app's plots. Values are in the project's sense (costs stay costs; lower is better then).
 */

import type { PlantMemorySummary } from './plantMemoryCheck';
import type { HeldActionsSummary } from './heldActionsCheck';
import type { RunOrderSummary } from './runOrderCheck';
import type { ClassGap } from '../core/diagnostics/functionClassRange';

export interface IntervalEstimate {
  /** Point estimate on the full data. */
  value: number;
  /** Standard deviation of the bootstrap replicates; null with fewer than 2 replicates. */
  standardError: number | null;
  /** Percentile interval [q(α/2), q(1 − α/2)] of the replicates (Davison & Hinkley 1997, §5.3). */
  percentile: [number, number] | null;
  /** Basic interval [2θ̂ − q(1 − α/2), 2θ̂ − q(α/2)] (Davison & Hinkley 1997, §5.2). */
  basic: [number, number] | null;
  /** Replicates that gave a value, and those that did not (no solution on that resample). */
  replicates: number;
  failedReplicates: number;
  /** What the interval covers, in words (e.g. sampling of the logged runs only, with the function class held fixed). */
  covers: string;
}

export type CrossCheckMethod = 'weightedImportanceSampling' | 'weightedDoublyRobust' | 'modelRollouts' | 'linearQuadraticModel';
export type Agreement = 'agrees' | 'disagrees' | 'uninformative' | 'notApplicable';

export interface CrossCheck {
  method: CrossCheckMethod;
  label: string;
  /** The assumption the method rests on, in plain words. */
  assumption: string;
  estimate: IntervalEstimate | null;
  /** Paired difference (this method − fitted Q-evaluation) over the same resamples. */
  difference: IntervalEstimate | null;
  agreement: Agreement;
  /** Why it is not applicable or uninformative, or how it compares. */
  note: string;
  /** Model rollouts: the discounted shares of simulated steps, and of the model's |reward|, at the edge of the logged states (crossCheckVerdict.ts). */
  edge?: { stepShare: number; rewardShare: number };
}

export type Severity = 'caution' | 'serious';

export interface AssessmentWarning {
  severity: Severity;
  /** Stable key for hosts (e.g. "distributionShift"), and the sentence for a reviewer. */
  topic: string;
  message: string;
  /** In the whole-log list, the candidate a warning is about (its name); absent where it bears on every candidate. */
  candidate?: string;
}

export interface ImportanceWeightDiagnostics {
  /** Kish ESS of the one-step ratios ρ over all transitions, and as a share of them. */
  oneStepEffectiveSize: number;
  oneStepShare: number;
  /** Step H = round(1/(1 − γ)) (the effective horizon) and the ESS of the cumulative weights there, over the episodes reaching it and those that ended in an end state before it (with their last weight). */
  horizonSteps: number;
  horizonEffectiveEpisodes: number;
  horizonEpisodes: number;
  /** Runs whose weight at step H is not a number (NaN or +∞ in log form: effectiveRunsText.ts WHY_NOT_A_NUMBER); 0 as a rule. */
  horizonNotNumbers: number;
}

export interface ActionSupportDiagnostics {
  neighbours: number;
  queryStates: number;
  /** Mean, 90th percentile and largest outside-probability over the query states. */
  meanOutside: number;
  p90Outside: number;
  maxOutside: number;
  /** The same mean for the fitted behaviour model: the level the logs' own controller reaches. */
  behaviourMeanOutside: number | null;
}

export interface CoverageDiagnostics {
  /**
   * The calibrated shift (src/core/diagnostics/occupancyShift.ts): the candidate's discounted
   * state–action occupancy against the logs, in the linear features (1 = like the logs); null when
   * it cannot be formed.
   */
  occupancyShift: number | null;
  /** Its bootstrap percentile UPPER_PERCENTILE (core/diagnostics/severity.ts; the estimate is right-skewed); null without resamples. */
  occupancyShiftUpper: number | null;
  /** The same measure for the present controller's model: the level the logs' own controller reaches. */
  presentControllerShift: number | null;
  /** Which features the shift is measured in (the linear fit's, or a degree-2 polynomial beside a network). */
  shiftFeatures: string;
  importanceWeights: ImportanceWeightDiagnostics | null;
  actionSupport: ActionSupportDiagnostics;
}

export interface ActionSlice {
  /** Which state is varied to pick the slice states, and the state the slice is taken at. */
  label: string;
  state: number[];
  actionIndex: number;
  actions: number[];
  /** Q(s, a) along the action, in the project's sense. */
  values: number[];
  /** The candidate's mean action there, clipped to the slice's range (its actuator limits). */
  candidateMean: number;
  candidateStd: number;
  /** Range of the logged actions near this state (k nearest logged states). */
  loggedRange: [number, number];
}

/** One function class's estimate of a candidate's J, on the same resamples as every other class. */
export interface ClassAssessment {
  label: string;
  value: number;
  interval: [number, number] | null;
  standardError: number | null;
}

export interface FunctionClassAssessment {
  classes: ClassAssessment[];
  /** True when every pair of classes agrees within the rule (src/core/diagnostics/functionClassRange.ts). */
  settled: boolean;
  /** The hull of every class's interval, in the project's sense: the range to report. */
  range: [number, number];
  /** What the range covers, and why settled or not, in words. */
  coverage: string;
  reason: string;
  /**
   * Every pair of classes the rule compared, differences in the project's sense (empty for one class; a network's own
   * value is in none). Absent in results saved before the pairs were kept: a reopened project's verdict is shown from
   * its saved reason, which the pairs never reword, so nothing is lost; an empty list would claim no pair was compared.
   * Kept as JSON, a standard error of Infinity (J of 0) reads back null.
   */
  pairs?: ClassGap[];
}

export interface CandidateAssessment {
  name: string;
  policyValue: IntervalEstimate;
  /**
   * The value to report: the function-class range when more than one class could be fitted (it
   * covers sampling and the spread between classes), else the sampling interval; null without either.
   */
  reportedRange: [number, number] | null;
  /** Where the range to report was cut to the values the reward formula allows whatever the plant does, and why; absent when nothing was cut. */
  rangeCut?: string;
  /** Whether the estimate is settled across function classes; null when only one class was fitted. */
  settled: boolean | null;
  functionClasses: FunctionClassAssessment | null;
  /** Confirmed, contradicted or unconfirmed by the cross-checks, with the sentence for the headline. */
  confirmation: { status: 'confirmed' | 'contradicted' | 'unconfirmed'; text: string };
  crossChecks: CrossCheck[];
  diagnostics: CoverageDiagnostics;
  slices: ActionSlice[];
  warnings: AssessmentWarning[];
}

export interface PairedDifference {
  /** a − b in the project's sense. */
  a: string;
  b: string;
  difference: IntervalEstimate;
  /** Share of resamples in which a is better than b (higher reward or lower cost); null without replicates of both. */
  probabilityBetter: number | null;
}

export interface Ranking {
  /** Best first, by the point estimates; the logged behaviour is included. */
  order: string[];
  /** Share of resamples in which this whole order holds; null without replicates of every policy. */
  frequency: number | null;
  /** Share of resamples in which each neighbouring pair keeps its order. */
  neighbours: { better: string; worse: string; frequency: number | null }[];
}

export interface Comparison {
  /** What every candidate is compared with: the present controller's model (comparable), or the logged return when there is none. */
  baseline: { name: string; kind: 'presentController' | 'loggedReturn'; note: string };
  differences: PairedDifference[];
  ranking: Ranking;
}

export interface SensitivitySeries {
  name: string;
  /** J at each setting in the project's sense; null where the fit gave no value (status says why). */
  values: (number | null)[];
  status: string[];
  /** True on the logged return's series, drawn as the reference line (absent in results saved before it was added). */
  reference?: boolean;
  /** True at the crossed points: the fewest that account for every pair of swept discounts whose change lies outside what the rewards allow, so whose two J cannot both be right (assessSweepCheck.ts); absent where nothing was found or checked. */
  beyondPossible?: boolean[];
}

export interface SensitivityCurve {
  parameter: 'discount' | 'polynomialDegree' | 'centresPerInput' | 'networkWidth';
  label: string;
  settings: number[];
  /** Index of the project's own setting in `settings`. */
  projectIndex: number;
  series: SensitivitySeries[];
  /** Whether the ranking by J (candidates and behaviour where shown) is the same at every setting, those in `leftOut` aside. */
  rankingStable: boolean;
  /** Settings (indices) the ranking verdict leaves out because a J there is crossed (a series' beyondPossible; the project's own too, pipeline/sweepRanking.ts); absent when none. */
  leftOut?: number[];
  /** Where the ranking is not stable: each kept setting whose order differs from the project's own (or, where that is left out, the first kept), with the pairs that stand the other way round; absent when stable. */
  rankingChanges?: RankingChange[];
}

/** One swept setting at which the ranking differs from the reference setting's (pipeline/sweepRanking.ts). */
export interface RankingChange {
  /** Index into the sweep's settings. */
  at: number;
  /** [ahead, behind] at this setting, each pair ranked the other way round at the reference setting; series names; pairs of two candidates before those with a reference series. */
  swapped: [string, string][];
}

export interface Sensitivity {
  curves: SensitivityCurve[];
  notes: string[];
}

export interface AssessmentSettingsUsed {
  resamples: number;
  level: number;
  seed: number;
  resampledUnit: 'episodes';
  episodes: number;
  solver: string;
  /** Which thread computed what (developer detail: one thread, or the per-decision cross-checks on a second). */
  threads: string;
}

/** Today's controller, evaluated like the candidates: the baseline of every comparison. */
export interface PresentControllerAssessment {
  name: string;
  /** J of the present controller's model by fitted Q-evaluation, with its interval. */
  policyValue: IntervalEstimate;
  /** The logged return completed past time-limited run ends by the fitted value: a check that leans least on the fit. */
  completedReturn: IntervalEstimate;
  /** Its own calibrated shift (about 1 when the log starts in its steady state). */
  occupancyShift: number | null;
  crossChecks: CrossCheck[];
  confirmation: { status: 'confirmed' | 'contradicted' | 'unconfirmed'; text: string };
  /**
   * As a candidate's (CandidateAssessment): the range to report, the function-class verdict and the classes.
   * Absent in assessments saved before the present controller was fitted in the compared classes.
   */
  reportedRange?: [number, number] | null;
  rangeCut?: string;
  settled?: boolean | null;
  functionClasses?: FunctionClassAssessment | null;
}

export interface Assessment {
  settings: AssessmentSettingsUsed;
  /** The logged discounted return with its interval: a check, cut short where runs end on a time limit. */
  behaviour: IntervalEstimate;
  /** The comparable baseline; null when today's controller could not be modelled (the comparison then uses the logged return and says so). */
  presentController: PresentControllerAssessment | null;
  candidates: CandidateAssessment[];
  comparison: Comparison;
  sensitivity: Sensitivity | null;
  /** Share of the value-surface grid with no logged state within one grid step (V is extrapolated there); null without a surface. */
  unvisitedShare: number | null;
  /** Does the logged state carry the plant's memory (plantMemoryCheck.ts)? Once per project; absent in assessments made before the check. */
  plantMemory?: PlantMemorySummary;
  /** Is the log one plant under one controller, early runs against late (runOrderCheck.ts)? Once per project; absent in assessments made before the check. */
  runOrder?: RunOrderSummary;
  /** Rows whose action repeats the row before exactly, away from the limits, and how far they pull the present controller's law (heldActionsCheck.ts)? Once per project; absent in assessments made before the check. */
  heldActions?: HeldActionsSummary;
  warnings: AssessmentWarning[];
  /** Definitions and thresholds used, stated once for the report. */
  method: string[];
  valueSense: 'reward' | 'cost';
}
