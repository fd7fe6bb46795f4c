/**
 * The linearised bootstrap's pass over the data (linearisedReplicate.ts) for several function
 * classes of one policy at once, when their features are nested: polynomial maps on the same
 * standardised inputs, the first of the highest degree, the others' monomials leading its own
 * (polynomialFeatures.ts leadsPolynomial) and their expected next features taken by the same route
 * (policyFeatureAverage.ts averageRoute). Then each class's φ_i and ψ_i are the leading parts of the
 * first's, to the last bit, so one read of every transition serves them all, and each class's
 *   s_k = Σ_{i∈k} (δ_i φ_iᵀv − λvᵀDw),   δ_i = r_i + γψ_iᵀw − φ_iᵀw,
 * is summed with the same operations in the same order as a pass of its own: the same numbers.
 * The features are the dearest part of the pass (a quadrature or moments per next state), so k
 * nested classes cost about one pass rather than k.
 *
 * inputs[c] and setups[c] (influenceSetup) per class, the first the enclosing one; all on the same
 * data, episodes, discount and policy (the caller's to ensure).
 */
import { throwIfCancelled, type PassSteps } from '../fqe/cancellation';
import { createTransitionFeatureReader } from '../fqe/transitionFeatures';
import { dot } from '../linalg/dense';
import type { InfluenceSetup, LinearisationInput, LinearisedReplicates } from './linearisedReplicate';

/** Transitions read between two yields of the pass (as a block of the Bellman pass). */
const ROWS_PER_STEP = 1024;

export function* nestedInfluenceSteps(inputs: readonly LinearisationInput[], setups: readonly InfluenceSetup[]): PassSteps<LinearisedReplicates[]> {
  const outer = inputs[0], { data, index, discount } = outer, classes = inputs.length;
  const e = index.episodes, influence = inputs.map(() => new Float64Array(e)), counts = new Float64Array(e);
  const dims = inputs.map((input) => input.features.dim), weights = inputs.map((input) => input.weights), sums = new Float64Array(classes);
  const reader = createTransitionFeatureReader(data, outer.features, outer.quadrature);
  let sinceStep = 0;
  for (let k = 0; k < e; k++) {
    throwIfCancelled(outer.cancel);
    if (sinceStep >= ROWS_PER_STEP) { sinceStep = 0; yield; }
    sinceStep += index.offsets[k + 1] - index.offsets[k];
    sums.fill(0);
    for (let p = index.offsets[k]; p < index.offsets[k + 1]; p++) {
      const i = index.order[p];
      reader.read(i);
      for (let c = 0; c < classes; c++) {
        const w = weights[c], d = dims[c];
        const delta = data.rewards[i] + discount * dot(reader.psi, w, d) - dot(reader.phi, w, d);
        sums[c] += delta * dot(reader.phi, setups[c].v, d) - setups[c].ridgeTerm;
      }
    }
    for (let c = 0; c < classes; c++) influence[c][k] = sums[c];
    counts[k] = index.offsets[k + 1] - index.offsets[k];
  }
  return inputs.map((input, c) => ({
    influence: influence[c], counts: c === 0 ? counts : counts.slice(), startValues: setups[c].startValues,
    startsFollowEpisodes: input.startsFollowEpisodes, startEpisode: input.startEpisode,
  }));
}
