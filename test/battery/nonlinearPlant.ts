/**
 * Battery plants with nonlinear dynamics or a clipped actuator: the same BatteryPlant shape, with
 * the truth from seeded rollouts (rolloutTruth.ts, with its standard error) and episodes that
 * start from a burn-in under the logging controller (the logged steady state), or from the plant's
 * own run start (`runStart`, e.g. a batch's charge).
 */
import { createGaussianPolicy } from '../../src/core/policy';
import { candidateNamed, startSetNamed, type BatteryPlant, type BatteryTruth, type PlantDescription, type StartSet } from './batteryPlant';
import { burnInStart, episodesFor, logEpisodes, type PlantDynamics, type StartSampler } from './episodeLog';
import { rolloutStateValues, rolloutTruth } from './rolloutTruth';
import { runStartSampler, standardStartSets } from './startSets';

export interface NonlinearDefinition extends PlantDescription {
  readonly dynamics: PlantDynamics;
  /** The state the plant is held at; burn-ins start here and the wide start set is scaled around it. */
  readonly operatingState: readonly number[];
  /** Steps of the behaviour policy before an episode's first logged row. */
  readonly burnIn: number;
  /** Where a run starts when it is not the logged steady state (a batch's charge); replaces the burn-in. */
  readonly runStart?: StartSampler;
  /** Rollouts per start state for the truth (their count sets its standard error). */
  readonly rolloutsPerStart: number;
}

const ROLLOUT_SEED = 31_337;

export function nonlinearBatteryPlant(def: NonlinearDefinition): BatteryPlant {
  const behaviour = createGaussianPolicy(def.behaviour, def.dynamics.stateDim);
  const sampler = def.runStart ?? burnInStart(def.dynamics, behaviour, def.operatingState, def.burnIn);
  let sets: StartSet[] | null = null;
  const truths = new Map<string, BatteryTruth>();
  const plant: BatteryPlant = {
    name: def.name, description: def.description, kind: 'nonlinear',
    stateDim: def.dynamics.stateDim, actionDim: def.dynamics.actionDim, stateNames: def.stateNames, actionNames: def.actionNames,
    discount: def.discount, stepsPerEpisode: def.stepsPerEpisode, behaviour: def.behaviour, candidates: def.candidates, dynamics: def.dynamics,
    simulate: (o) => {
      const steps = o.stepsPerEpisode ?? def.stepsPerEpisode;
      return logEpisodes(def.dynamics, behaviour, runStartSampler(sampler, def.operatingState, o.runStarts), {
        episodes: episodesFor(o.transitions, steps), stepsPerEpisode: steps, seed: o.seed, stateNames: def.stateNames, actionNames: def.actionNames,
      });
    },
    startSets: () => (sets ??= standardStartSets(sampler, def.operatingState)),
    truth: (candidate, setName) => {
      const key = `${candidate}|${setName}`;
      if (!truths.has(key)) {
        const spec = candidateNamed(plant, candidate).spec, set = startSetNamed(plant, setName);
        truths.set(key, rolloutTruth(def.dynamics, spec, def.discount, set, { rolloutsPerStart: def.rolloutsPerStart, seed: ROLLOUT_SEED }));
      }
      return truths.get(key)!;
    },
    rolloutStateValues: (candidate, states, count) => rolloutStateValues(
      def.dynamics, candidateNamed(plant, candidate).spec, def.discount, states, count, { rolloutsPerStart: def.rolloutsPerStart, seed: ROLLOUT_SEED },
    ).values,
  };
  return plant;
}
