/**
 * The shape every battery plant has: invented plants with a known answer, on which estimators are
 * checked and their defaults chosen (see README.md in this folder). Values are in REWARD terms
 * (reward = −cost), as the engine works; a plant's truth is J(π) = mean over a start set of V^π(s0).
 *
 * A new plant (e.g. a PI loop on an augmented state) implements this interface, usually through
 * linearQuadraticBatteryPlant (exact truth by the Lyapunov equation) or nonlinearBatteryPlant
 * (truth by seeded rollouts), and is added to catalogue.ts.
 */
import type { GaussianPolicySpec } from '../../src/core/policy';
import type { TransitionSet } from '../../src/core/transitions';
import type { PlantDynamics } from './episodeLog';

export interface SimulationOptions {
  /** Total transitions; rounded up to whole episodes. */
  readonly transitions: number;
  readonly seed: number;
  /** Steps per logged episode (default: the plant's stepsPerEpisode). Episodes end on this time limit, never on a terminal state. */
  readonly stepsPerEpisode?: number;
  /**
   * Where logged runs start (startSets.ts, runStartSampler): 'steady' (default) at the logged steady
   * state, so the wide start set lies outside the logs; 'wide' as far out as the wide start set,
   * as logs with start-ups and upsets do, so both start sets lie inside the logs.
   */
  readonly runStarts?: 'steady' | 'wide';
}

export interface BatteryCandidate {
  readonly name: string;
  readonly description: string;
  readonly spec: GaussianPolicySpec;
}

/** A named set of start states (count×ds row-major) that J is taken over. */
export interface StartSet {
  readonly name: string; // 'steady' | 'wide' | a plant's own
  readonly description: string;
  readonly states: Float64Array;
  readonly count: number;
}

export interface BatteryTruth {
  /** J in reward terms over the start set. */
  readonly value: number;
  /** Monte Carlo standard error of value; 0 for a closed form. */
  readonly standardError: number;
  readonly method: 'lyapunov' | 'rollouts';
  /** How the truth was formed, for the bench table. */
  readonly note: string;
}

export interface BatteryPlant {
  /** Short unique name used on the bench command line, e.g. "lq3-oven-g0.97". */
  readonly name: string;
  readonly description: string;
  readonly kind: 'linearQuadratic' | 'nonlinear';
  readonly stateDim: number;
  readonly actionDim: number;
  readonly stateNames: readonly string[];
  readonly actionNames: readonly string[];
  readonly discount: number;
  readonly stepsPerEpisode: number;
  /** The logging controller (with its dither and, where the plant has one, its actuator limit). */
  readonly behaviour: GaussianPolicySpec;
  readonly candidates: readonly BatteryCandidate[];
  /** Logged episodes under the behaviour policy; same options, same numbers. */
  simulate(options: SimulationOptions): TransitionSet;
  /** 'steady' (drawn from the logged steady state) and 'wide' (the same states, WIDE_FACTOR = 2× further from the operating point). */
  startSets(): readonly StartSet[];
  /** The known answer for a candidate (by name) over a start set (by name); memoised. */
  truth(candidate: string, startSet: string): BatteryTruth;
  /**
   * V^π(s) of a candidate at each of `count` states (count×ds), in reward terms, by the same seeded
   * rollouts as the truth (plants whose truth comes from rollouts); for state-by-state diagnosis.
   */
  rolloutStateValues?(candidate: string, states: Float64Array, count: number): Float64Array;
  /**
   * The plant's own dynamics, where its truth comes from rollouts: the route a bench takes to the truth
   * over start states or a discount of its own (a log's run starts, a swept γ′; rolloutTruth.ts).
   */
  readonly dynamics?: PlantDynamics;
}

/** What every plant definition states about itself (the kind-specific parts are added by each maker). */
export type PlantDescription = Pick<BatteryPlant, 'name' | 'description' | 'stateNames' | 'actionNames' | 'discount' | 'stepsPerEpisode' | 'behaviour' | 'candidates'>;

export function candidateNamed(plant: BatteryPlant, name: string): BatteryCandidate {
  const found = plant.candidates.find((c) => c.name === name);
  if (!found) throw new Error(`${plant.name}: no candidate "${name}" (have ${plant.candidates.map((c) => c.name).join(', ')})`);
  return found;
}

export function startSetNamed(plant: BatteryPlant, name: string): StartSet {
  const found = plant.startSets().find((s) => s.name === name);
  if (!found) throw new Error(`${plant.name}: no start set "${name}"`);
  return found;
}
