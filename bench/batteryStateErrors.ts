/**
 * Where a network fit's error in J comes from, state by state (issue 9's diagnosis of J over
 * upsets): for each nonlinear battery plant, seed and way of logging, the network (default
 * settings unless given) and the linear estimate it starts from are compared with the rollout truth
 * V(s0) at every state of the wide start set. J's error over a set is the mean of the per-state
 * errors, so it splits exactly into the parts of the states grouped by their distance from the
 * centre of the logs (quartiles of the standardised distance); the worst states are listed with how
 * many logged rows lie near them. Then J over the log's own run starts, the set a project takes J
 * over (data.startStates), against its own rollout truth.
 *
 * Distance: ‖(s − c)/σ‖ with c the mean of the steady start set (the logged steady state) and σ the
 * logged states' standard deviation per coordinate; "near" is within 0.5 of that unit.
 *
 * Run: nice -n 10 npx tsx bench/batteryStateErrors.ts [--plants a,b] [--seeds 1,2,3]
 *        [--run-starts steady|wide|both] [--candidate 0] [--transitions 100000]
 *        [--settings '{…}'] [--method '{…}'] [--no-run-starts]
 * Prints only; nothing is asserted (README, "Accuracy measured on plants with known answers").
 */
import { fileURLToPath } from 'node:url';
import { createActionQuadrature } from '../src/core/actionQuadrature';
import type { ActionValueFunction } from '../src/core/actionValue';
import { fitNetworkFqe, type NetworkFit } from '../src/core/fqe/networkFqe';
import { defaultNetworkSettings } from '../src/core/fqe/networkSettings';
import { createGaussianPolicy, type GaussianPolicy } from '../src/core/policy';
import type { TransitionSet } from '../src/core/transitions';
import { stateValues } from '../src/core/value';
import type { BatteryPlant, StartSet } from '../test/battery/batteryPlant';
import { runStartsOption } from './batteryBench';
import { batteryPlants } from '../test/battery/catalogue';

const wasmPath = fileURLToPath(new URL('../node_modules/@tensorflow/tfjs-backend-wasm/dist/', import.meta.url));
const QUADRATURE_NODES = 10;
const NEAR = 0.5;
const WORST_LISTED = 5;

interface Options {
  plants: string[];
  seeds: number[];
  runStarts: ('steady' | 'wide')[];
  candidate: number;
  transitions: number;
  settings: Record<string, unknown>;
  method: Record<string, unknown>;
  runStartSet: boolean;
}

function parseOptions(args: string[]): Options {
  const o: Options = {
    plants: ['greenhouse-clipped-g0.95', 'pendulum-saturating-g0.97'], seeds: [1], runStarts: ['wide'], candidate: 0,
    transitions: 100_000, settings: {}, method: {}, runStartSet: true,
  };
  for (let i = 0; i < args.length; i++) {
    const value = () => args[++i];
    if (args[i] === '--plants') o.plants = value().split(',');
    else if (args[i] === '--seeds') o.seeds = value().split(',').map(Number);
    else if (args[i] === '--run-starts') o.runStarts = runStartsOption(value());
    else if (args[i] === '--candidate') o.candidate = Number(value());
    else if (args[i] === '--transitions') o.transitions = Number(value());
    else if (args[i] === '--settings') o.settings = JSON.parse(value());
    else if (args[i] === '--method') o.method = JSON.parse(value());
    else if (args[i] === '--no-run-starts') o.runStartSet = false;
    else throw new Error(`batteryStateErrors: unknown option ${args[i]}`);
  }
  return o;
}

/** Mean and standard deviation per coordinate of n×ds rows. */
function columnMoments(rows: Float64Array, ds: number): { mean: number[]; sd: number[] } {
  const n = rows.length / ds, mean = new Array<number>(ds).fill(0), sd = new Array<number>(ds).fill(0);
  for (let i = 0; i < n; i++) for (let c = 0; c < ds; c++) mean[c] += rows[i * ds + c] / n;
  for (let i = 0; i < n; i++) for (let c = 0; c < ds; c++) sd[c] += (rows[i * ds + c] - mean[c]) ** 2 / n;
  return { mean, sd: sd.map(Math.sqrt) };
}

function distance(a: ArrayLike<number>, ao: number, b: ArrayLike<number>, bo: number, sd: number[]): number {
  let sum = 0;
  for (let c = 0; c < sd.length; c++) sum += ((a[ao + c] - b[bo + c]) / sd[c]) ** 2;
  return Math.sqrt(sum);
}

function loggedNear(data: TransitionSet, states: Float64Array, k: number, sd: number[]): number {
  let near = 0;
  for (let i = 0; i < data.count; i++) if (distance(data.states, i * data.stateDim, states, k * data.stateDim, sd) < NEAR) near++;
  return near;
}

function mean(x: ArrayLike<number>): number {
  let sum = 0;
  for (let i = 0; i < x.length; i++) sum += x[i];
  return sum / x.length;
}
const percentOf = (x: number, truth: number): string => `${(100 * x / Math.abs(truth)).toFixed(2)} %`;

interface Values { readonly network: Float64Array; readonly linear: Float64Array }

function valuesAt(fit: NetworkFit, policy: GaussianPolicy, states: Float64Array, count: number): Values {
  const quadrature = createActionQuadrature(policy, QUADRATURE_NODES);
  const at = (q: ActionValueFunction) => stateValues(q, policy, states, count, quadrature);
  return { network: at(fit.actionValue), linear: at(fit.linearStart) };
}

/** J's error over the set split by distance quartile, and the worst states. */
function printWideSet(plant: BatteryPlant, candidate: string, data: TransitionSet, set: StartSet, values: Values, centre: number[], sd: number[]): void {
  const truth = plant.rolloutStateValues!(candidate, set.states, set.count), jTruth = mean(truth), ds = plant.stateDim;
  const d = Array.from({ length: set.count }, (_, k) => distance(set.states, k * ds, centre, 0, sd));
  const order = d.map((_, k) => k).sort((a, b) => d[a] - d[b]), quarter = Math.ceil(set.count / 4);
  const share = (v: Float64Array, ks: number[]) => percentOf(ks.reduce((a, k) => a + v[k] - truth[k], 0) / set.count, jTruth);
  console.log(`    J over ${set.name}: truth ${jTruth.toPrecision(5)}, network ${percentOf(mean(values.network) - jTruth, jTruth)}, linear ${percentOf(mean(values.linear) - jTruth, jTruth)}; by distance quartile (network | linear):`);
  for (let q = 0; q < 4; q++) {
    const ks = order.slice(q * quarter, (q + 1) * quarter), near = ks.reduce((a, k) => a + loggedNear(data, set.states, k, sd), 0) / ks.length;
    console.log(`      q${q + 1} distance ${d[ks[0]].toFixed(1)}–${d[ks[ks.length - 1]].toFixed(1)}: ${share(values.network, ks)} | ${share(values.linear, ks)}  (logged rows near each: ${near.toFixed(0)} on average)`);
  }
  const worst = order.slice().sort((a, b) => (values.network[b] - truth[b]) - (values.network[a] - truth[a])).slice(0, WORST_LISTED);
  for (const k of worst) {
    const s = Array.from(set.states.subarray(k * ds, (k + 1) * ds), (v) => v.toPrecision(3)).join(', ');
    console.log(`      [${s}] distance ${d[k].toFixed(1)}: truth ${truth[k].toPrecision(4)}, network ${values.network[k].toPrecision(4)}, linear ${values.linear[k].toPrecision(4)}, logged rows near: ${loggedNear(data, set.states, k, sd)}`);
  }
}

function printRunStarts(plant: BatteryPlant, candidate: string, data: TransitionSet, fit: NetworkFit, policy: GaussianPolicy): void {
  const count = data.startStates.length / plant.stateDim, truth = mean(plant.rolloutStateValues!(candidate, data.startStates, count));
  const values = valuesAt(fit, policy, data.startStates, count), e = fit.estimate(data.startStates, { startsFollowEpisodes: true });
  const holds = e.interval.lower <= truth && truth <= e.interval.upper ? 'holds' : 'misses';
  console.log(`    J over the log's own ${count} run starts: truth ${truth.toPrecision(5)}, network ${percentOf(mean(values.network) - truth, truth)} (interval ${holds} it), linear ${percentOf(mean(values.linear) - truth, truth)}`);
}

async function diagnose(plant: BatteryPlant, o: Options, seed: number, runStarts: 'steady' | 'wide'): Promise<void> {
  const c = plant.candidates[o.candidate], [steady, wide] = plant.startSets(), policy = createGaussianPolicy(c.spec, plant.stateDim);
  const data = plant.simulate({ transitions: o.transitions, seed, runStarts });
  const fit = await fitNetworkFqe({
    data, policy, discount: plant.discount, quadratureNodes: QUADRATURE_NODES, seed, wasmPath, startStates: steady.states,
    settings: { ...defaultNetworkSettings, ...o.settings }, method: o.method,
  });
  try {
    const estimates = [steady, wide].map((set) => ({ set, e: fit.estimate(set.states, { startsFollowEpisodes: false }), truth: plant.truth(c.name, set.name).value }));
    const summary = estimates.map(({ set, e, truth }) => `${set.name} ${percentOf(e.value - truth, truth)} (interval ${e.interval.lower <= truth && truth <= e.interval.upper ? 'holds' : 'misses'})`);
    console.log(`  ${plant.name} ${c.name} seed ${seed}, runs logged ${runStarts}: network ${summary.join(', ')}; ${fit.status} after ${fit.history.length}`);
    const { sd } = columnMoments(data.states, plant.stateDim), { mean: centre } = columnMoments(steady.states, plant.stateDim);
    printWideSet(plant, c.name, data, wide, valuesAt(fit, policy, wide.states, wide.count), centre, sd);
    if (o.runStartSet) printRunStarts(plant, c.name, data, fit, policy);
  } finally {
    fit.dispose();
  }
}

export async function runBatteryStateErrors(args: string[]): Promise<void> {
  const o = parseOptions(args);
  const plants = batteryPlants().filter((p) => o.plants.includes(p.name) && p.rolloutStateValues);
  if (plants.length === 0) throw new Error(`batteryStateErrors: no plant with rollout truth among ${o.plants.join(', ')}`);
  console.log(`state-by-state errors: settings ${JSON.stringify(o.settings)}, method ${JSON.stringify(o.method)}, ${o.transitions.toLocaleString('en-US')} transitions`);
  for (const plant of plants) for (const runStarts of o.runStarts) for (const seed of o.seeds) await diagnose(plant, o, seed, runStarts);
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  await runBatteryStateErrors(process.argv.slice(2));
}
