/**
 * The model-based cross-check: J by simulating the candidate on a one-step model of the plant fitted
 * to the log (src/core/offPolicy/polynomialDynamicsModel.ts, modelRollouts.ts). It shares no fit with
 * Q, so it stays informative on long horizons where importance weights collapse.
 *
 * Its cost is rollouts, so it runs on fewer resamples than the main loop — the first
 * ROLLOUT_RESAMPLES, with the same episode multiplicities — and from at most ROLLOUT_STARTS start
 * states (an evenly spaced, fixed subset; our choices). Paired with fitted Q-evaluation on the same
 * start states: the difference on the full data is M − J_sub (J_sub the mean of V̂ over the subset),
 * and on resample b, M_b − J_sub − (J_b − J) — the candidate's resample deviation taken over all
 * its start states, the subset held fixed. Rollouts reuse their random numbers across resamples
 * (common random numbers), so their spread is the models' spread. The model and the simulations
 * (rolloutValues.ts) need nothing from the fit, so a helper thread may form and run them while the
 * function classes are fitted; rolloutCheck pairs them with the fit's values.
 */
import { episodeMultiplicities } from '../core/bootstrap/episodeMultiplicities';
import { monomialCount } from '../core/features/monomials';
import { throwIfCancelled } from '../core/fqe/cancellation';
import { modelDataOf, type PolynomialModelOptions } from '../core/offPolicy/polynomialDynamicsModel';
import type { GaussianPolicy } from '../core/policy';
import { stateValues } from '../core/value';
import type { AssessmentContext, CandidateWork } from './assessCandidate';
import type { AssessmentSettings } from './assessSettings';
import { openPerDecisionRoute, type PerDecisionRoute } from './perDecisionRoute';
import type { RolloutJob, RolloutValues } from './rolloutValues';

export const ROLLOUT_RESAMPLES = 30;
export const ROLLOUT_STARTS = 200;
export const ROLLOUTS_PER_START = 2;
/** At least this many simulated runs in all: with few start states each gets more rollouts (ours). */
export const ROLLOUTS_TOTAL = 400;
/** Dynamics of degree 3 where it has at most this many monomials, else degree 2 (ours). */
const CUBIC_MONOMIALS = 120;

export interface RolloutCheck {
  /** J by model rollouts over the start subset, reward sense. */
  readonly value: number;
  /** Model − fitted Q-evaluation on the same starts, on the full data and on each of the rollout resamples. */
  readonly difference: number;
  readonly differenceReplicates: number[];
  /** Discounted share of simulated steps held at the edge of the logged states. */
  readonly shareOutsideLogs: number;
  /** Share of the model's discounted |reward| collected in states held at that edge. */
  readonly rewardShareAtEdge: number;
  /** Monte Carlo standard error of the full-data value (the resamples reuse the random numbers, so it is not in their spread). */
  readonly monteCarloError: number;
  readonly starts: number;
  readonly rolloutsPerStart: number;
}

export type RolloutOutcome = RolloutCheck | { readonly reason: string };

/** The one-step model's degrees: dynamics of degree 3 where that has at most CUBIC_MONOMIALS monomials, else 2; the reward quadratic. */
export function rolloutModelOptions(data: { readonly stateDim: number; readonly actionDim: number }): PolynomialModelOptions {
  return { degree: monomialCount(data.stateDim + data.actionDim, 3) <= CUBIC_MONOMIALS ? 3 : 2, rewardDegree: 2 };
}

/**
 * The simulations of every policy's check (rolloutValues.ts), in the order given: the one-step model
 * formed from the plan's data (the arrays themselves; a host copies them to a thread) and simulated.
 */
export function rolloutJob(context: AssessmentContext, policies: readonly GaussianPolicy[], settings: AssessmentSettings): RolloutJob {
  const { plan } = context, starts = startSubset(plan.starts.states, plan.starts.count, plan.data.stateDim);
  return {
    source: { data: modelDataOf(plan.data), index: plan.episodes, options: rolloutModelOptions(plan.data) },
    policies, discount: plan.discount, startStates: starts.states, rollout: rolloutSettings(context, starts.count),
    seed: settings.seed, episodes: plan.episodes.episodes, resamples: Math.min(ROLLOUT_RESAMPLES, settings.resamples),
  };
}

/**
 * The model and its simulations for every policy's check, opened before the function classes are
 * fitted: on the host's helper, a thread of their own that forms the model and runs them meanwhile
 * (their work, resampleWork, decides as for the loop's), else on this thread when `rollouts()` is
 * asked for after the loop. Where the log's runs end in an end state, the model has the chance of
 * that end too (rolloutValues.ts).
 */
export function openRolloutSimulations(context: AssessmentContext, policies: readonly GaussianPolicy[], settings: AssessmentSettings): PerDecisionRoute | { reason: string } {
  const { plan } = context;
  return openPerDecisionRoute([], { discount: plan.discount, episodes: plan.episodes.episodes, seed: settings.seed, resamples: 0 }, context.helper,
    { model: null, rollouts: () => rolloutJob(context, policies, settings) });
}

function rolloutSettings(context: AssessmentContext, starts: number): { rolloutsPerStart: number; seed: number } {
  return { rolloutsPerStart: Math.max(ROLLOUTS_PER_START, Math.ceil(ROLLOUTS_TOTAL / starts)), seed: context.plan.seed };
}

/**
 * The check of one work from its simulations (rolloutValues): the rollouts' J against the fit's on
 * the same start states, on the full data and on each rollout resample (the fit's replicate on the
 * same multiplicities; a resample without one is left out).
 */
export function rolloutCheck(context: AssessmentContext, work: CandidateWork, simulated: RolloutValues, settings: AssessmentSettings): RolloutOutcome {
  if ('reason' in simulated) return { reason: simulated.reason };
  const { plan } = context, ds = plan.data.stateDim, starts = startSubset(plan.starts.states, plan.starts.count, ds);
  const { q } = work.model.fit;
  const values = stateValues(q, work.model.policy, starts.states, starts.count, work.model.quadrature);
  const fqeOnStarts = values.reduce((a, b) => a + b, 0) / starts.count, fqe = work.model.fit.policyValue;
  const e = plan.episodes.episodes, c = new Uint32Array(e), differenceReplicates: number[] = [], { full } = simulated;
  simulated.resampled.forEach((m, b) => {
    throwIfCancelled(context.cancel);
    episodeMultiplicities(e, settings.seed, b, c);
    const j = work.replicate?.value(c) ?? fqe;
    if (j !== null) differenceReplicates.push(m - fqeOnStarts - (j - fqe));
  });
  return { value: full.value, difference: full.value - fqeOnStarts, differenceReplicates, shareOutsideLogs: full.shareOutsideLogs, rewardShareAtEdge: full.rewardShareAtEdge, monteCarloError: full.monteCarloError,
    starts: starts.count, rolloutsPerStart: rolloutSettings(context, starts.count).rolloutsPerStart };
}

/** At most ROLLOUT_STARTS start states, evenly spaced through the list. */
function startSubset(states: Float64Array, count: number, ds: number): { states: Float64Array; count: number } {
  if (count <= ROLLOUT_STARTS) return { states, count };
  const out = new Float64Array(ROLLOUT_STARTS * ds);
  for (let s = 0; s < ROLLOUT_STARTS; s++) {
    const k = Math.floor(((s + 0.5) * count) / ROLLOUT_STARTS);
    out.set(states.subarray(k * ds, (k + 1) * ds), s * ds);
  }
  return { states: out, count: ROLLOUT_STARTS };
}
