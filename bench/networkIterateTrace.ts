/**
 * Why a network fit's iterates wander: one fit, traced iterate by iterate
 * (`nice -n 10 npx tsx bench/networkIterateTrace.ts --plant holdout-steam-drum-g0.97 --seed 1
 * --candidate firmer [--method '{…}'] [--settings '{…}'] [--run-starts steady|wide]`).
 * Per outer iteration: J (and its error against the rollout truth over the plant's first start set),
 * the stopping rule's bound, the Adam loss, the hidden features' share of J (J − J of the polynomial
 * part's weights alone), J re-solved on the same features with the hidden ridge ×10 and ×100 (how
 * much the iterate rests on weakly determined directions), and the reciprocal condition number of
 * the last-layer system (G − M + Λ) at the default ridge (smallest / largest singular value, ml-matrix SVD).
 * At the end: the status, the message, and the iterates whose ridge the loop had to raise.
 * A diagnostic bench (it re-forms the last layer's sums once more per iterate); nothing here is asserted.
 */
import { fileURLToPath } from 'node:url';
import { SingularValueDecomposition, Matrix } from 'ml-matrix';
import { createFitSession, type FitSession } from '../src/core/fqe/networkFitSession';
import { hiddenFeatureRows } from '../src/core/fqe/networkHiddenFeatures';
import { lastLayerTotals } from '../src/core/fqe/networkLastLayerSums';
import { solveLastLayer } from '../src/core/fqe/networkLastLayer';
import { defaultNetworkMethod } from '../src/core/fqe/networkMethod';
import { defaultNetworkSettings } from '../src/core/fqe/networkSettings';
import { runOuterIterations } from '../src/core/fqe/networkIterations';
import { featureNetwork } from '../src/core/fqe/networkIterateValues';
import { partCancellation } from '../src/core/fqe/networkPartCancellation';
import { meanRow, startFeatureRows } from '../src/core/fqe/networkValueRows';
import { selectBackend } from '../src/core/fqe/tfBackend';
import { createGaussianPolicy } from '../src/core/policy';
import { batteryPlants } from '../test/battery/catalogue';
import { holdoutPlants } from '../test/battery/holdout/levelValvePlant';

const wasmPath = fileURLToPath(new URL('../node_modules/@tensorflow/tfjs-backend-wasm/dist/', import.meta.url));

function option(args: string[], name: string, fallback: string): string {
  const i = args.indexOf(`--${name}`);
  return i >= 0 ? args[i + 1] : fallback;
}

/** J of the last layer solved at `ridge` on θ's current features; and 1/cond of the system. */
function probeIterate(s: FitSession, starts: Float64Array, ds: number, ridges: number[]): { values: number[]; hiddenShare: number; cancellation: number[]; reciprocalCondition: number } {
  const features = hiddenFeatureRows(s.net.theta, s.layout, s.net.activation, s.rows.training.inputs, s.next.training);
  try {
    const sums = lastLayerTotals(s.linear.training.tensors, features, s.linearTotal);
    const rows = startFeatureRows(featureNetwork(s), s.quadrature, starts, ds), xi = meanRow(rows, sums.dim);
    const solves = ridges.map((ridge) => solveLastLayer(sums.sums, sums.dim, sums.linearDim, ridge, s.higherTermRidge));
    const values = solves.map((solved) => ('failure' in solved ? NaN : xi.reduce((acc, x, i) => acc + x * solved.weights[i], 0)));
    const cancellation = solves.map((solved) => ('failure' in solved ? NaN : partCancellation(rows, solved.weights, sums.dim, sums.linearDim)));
    const base = solveLastLayer(sums.sums, sums.dim, sums.linearDim, ridges[0], s.higherTermRidge);
    let hiddenShare = NaN;
    if (!('failure' in base)) {
      let hidden = 0;
      for (let i = sums.linearDim; i < sums.dim; i++) hidden += xi[i] * base.weights[i];
      hiddenShare = hidden;
    }
    return { values, hiddenShare, cancellation, reciprocalCondition: reciprocalCondition(sums.sums, sums.dim, sums.linearDim, ridges[0]) };
  } finally {
    features.dispose();
  }
}

/** σ_min/σ_max of (G − M + Λ) as solveLastLayer forms it (its ridge rule re-stated here for the diagnostic). */
function reciprocalCondition(packed: Float64Array, d: number, d1: number, hiddenRidge: number): number {
  const n = packed[packed.length - 1], width = 2 * d + 1, a = new Matrix(d, d);
  let trace = 0;
  for (let j = d1; j < d; j++) trace += packed[j * width + j] / n;
  const floor = d > d1 ? 1e-3 * (trace / (d - d1)) + 1e-12 : 0;
  for (let r = 0; r < d; r++) {
    for (let c = 0; c < d; c++) a.set(r, c, (packed[r * width + c] - packed[r * width + d + c]) / n);
    if (r >= d1) a.set(r, r, a.get(r, r) + hiddenRidge * (packed[r * width + r] / n + floor));
  }
  const sv = new SingularValueDecomposition(a, { computeLeftSingularVectors: false, computeRightSingularVectors: false }).diagonal;
  return Math.min(...sv) / Math.max(...sv);
}

async function main(args: string[]): Promise<void> {
  const name = option(args, 'plant', 'holdout-steam-drum-g0.97'), seed = Number(option(args, 'seed', '1'));
  const plant = [...batteryPlants(), ...holdoutPlants()].find((p) => p.name === name);
  if (!plant) throw new Error(`no plant ${name}`);
  const candidate = plant.candidates.find((c) => c.name === option(args, 'candidate', plant.candidates[0].name))!;
  const runStarts = option(args, 'run-starts', 'steady') as 'steady' | 'wide';
  const method = { ...defaultNetworkMethod, ...JSON.parse(option(args, 'method', '{}')) };
  const settings = { ...defaultNetworkSettings, ...JSON.parse(option(args, 'settings', '{}')) };
  const selection = await selectBackend(settings.backend, wasmPath);
  const data = plant.simulate({ transitions: 100_000, seed, runStarts });
  const set = plant.startSets()[0], truth = plant.truth(candidate.name, set.name).value;
  const policy = createGaussianPolicy(candidate.spec, plant.stateDim);
  const s = createFitSession({ data, policy, discount: plant.discount, quadratureNodes: 10, seed, settings, method });
  const pct = (x: number) => `${((100 * (x - truth)) / Math.abs(truth)).toFixed(1).padStart(7)} %`;
  console.log(`${plant.name} ${candidate.name} seed ${seed}, runs logged ${runStarts}, truth over ${set.name} ${truth.toFixed(4)}; method ${JSON.stringify(args.includes('--method') ? JSON.parse(option(args, 'method', '{}')) : {})}`);
  console.log('  k        J    error     bound      loss   hidden part of J   J at λh×10   J at λh×100   1/cond   κ at λh, ×10, ×100 (start rows)');
  try {
    const linear = solveLastLayer(s.linearTotal.sums, s.linearTotal.dim, s.linearTotal.dim, 0, s.higherTermRidge);
    if ('failure' in linear) throw new Error(linear.failure);
    const run = await runOuterIterations(s, {
      startStates: set.states, stateDim: plant.stateDim, tolerance: settings.tolerance, outerIterations: settings.outerIterations,
      patience: settings.patience, stepsPerIteration: settings.stepsPerIteration, learningRate: settings.learningRate,
      onProgress: (r) => {
        const p = probeIterate(s, set.states, plant.stateDim, [method.hiddenRidge, 10 * method.hiddenRidge, 100 * method.hiddenRidge]);
        console.log(`${String(r.iteration).padStart(3)} ${r.policyValue.toFixed(4).padStart(8)} ${pct(r.policyValue)} ${(r.remainingBound ?? NaN).toFixed(3).padStart(9)} ${(r.loss ?? NaN).toPrecision(3).padStart(9)} ${p.hiddenShare.toFixed(4).padStart(18)} ${pct(p.values[1])} ${pct(p.values[2])}   ${p.reciprocalCondition.toExponential(1)}   ${p.cancellation.map((c) => c.toFixed(2)).join(' ')}`);
      },
    }, selection.backend, linear.weights);
    console.log(`stop: ${run.stop.kind} — ${run.stop.message}`);
    console.log(`ridge raised at: ${run.raisedRidge.map((r) => `${r.iteration} (λh ${r.hiddenRidge}, ${r.why})`).join(', ') || 'none'}`);
    run.kept?.theta.dispose();
  } finally {
    s.dispose();
  }
}

await main(process.argv.slice(2));
