/**
 * Test fixture (invented, test only): a cascade log with episodes of unequal length (every fifth cut
 * at 30 steps), some ending in a terminal state, with the importance weights of one candidate
 * against the logging controller, invented Q̂/V̂ values and time-limit tails — the inputs of the
 * per-decision estimators, shared by the block route's tests and the helper thread's.
 */
import { indexEpisodes } from '../../../src/core/bootstrap/episodeTransitions';
import { episodeEnds } from '../../../src/core/loggedReturn';
import { importanceWeightTable } from '../../../src/core/offPolicy/importanceWeights';
import { createGaussianPolicy } from '../../../src/core/policy';
import type { TransitionSet } from '../../../src/core/transitions';
import { simulateLog, type TestController } from '../linearGaussianPlant';
import { candidateFamily, cascadeLogging, cascadePlant, startLaws } from '../testPlants';

const policyOf = (c: TestController) => createGaussianPolicy({ offset: c.offset, gain: [c.gain], std: c.std }, 3);

export function unevenLog(): TransitionSet {
  const full = simulateLog(cascadePlant, cascadeLogging, { episodes: 25, steps: 40, seed: 3, start: startLaws(cascadePlant, cascadeLogging)[0][1] });
  const keep = Array.from({ length: full.count }, (_, i) => i).filter((i) => full.episode[i] % 5 !== 0 || i % 40 < 30);
  const pick = <T extends Float64Array | Int32Array | Uint8Array>(a: T, w: number) => keep.flatMap((i) => Array.from(a.subarray(i * w, (i + 1) * w)));
  return {
    ...full, count: keep.length, states: Float64Array.from(pick(full.states, 3)), actions: Float64Array.from(pick(full.actions, 1)),
    rewards: Float64Array.from(pick(full.rewards, 1)), nextStates: Float64Array.from(pick(full.nextStates, 3)),
    terminal: Uint8Array.from(keep, (i) => (full.episode[i] % 7 === 3 && i % 40 === 39 ? 1 : 0)),
    episode: Int32Array.from(pick(full.episode, 1)), sourceLine: Int32Array.from(pick(full.sourceLine, 1)),
  };
}

/**
 * The log, its episode index, the weight table, invented Q̂ and V̂ (by index order) and the time-limit
 * tails at this discount; the candidate weighed against the logging controller, or with `present` the
 * logging controller against itself (every weight 1).
 */
export function unevenLogInputs(discount: number, present = false) {
  const data = unevenLog(), index = indexEpisodes(data), logging = policyOf(cascadeLogging);
  const table = importanceWeightTable(data, index, present ? logging : policyOf(candidateFamily(cascadeLogging)[3][1]), logging);
  const tails = { finalStateValues: Float64Array.from({ length: data.episodeCount }, (_, k) => -8 - Math.cos(k)), tailWeights: episodeEnds(data, discount).tailWeights };
  const values = { actionValues: Float64Array.from(index.order, (i) => Math.cos(data.rewards[i])), stateValues: Float64Array.from(index.order, (i) => Math.sin(data.rewards[i])) };
  return { data, index, table, tails, values };
}
