import { batteryPlant } from '../test/battery/catalogue';
import { fitNetworkFqe } from '../src/core/fqe/networkFqe';
import { defaultNetworkSettings } from '../src/core/fqe/networkSettings';
import { createGaussianPolicy } from '../src/core/policy';
import { fileURLToPath } from 'node:url';
const wasmPath = fileURLToPath(new URL('../node_modules/@tensorflow/tfjs-backend-wasm/dist/', import.meta.url));
const [plantName, candIdx = '0', seedArg = '1', settingsJson = '{}', methodJson = '{}'] = process.argv.slice(2);
const plant = batteryPlant(plantName);
const cand = plant.candidates[Number(candIdx)];
const seed = Number(seedArg);
const data = plant.simulate({ transitions: 100_000, seed });
const policy = createGaussianPolicy(cand.spec, plant.stateDim);
const sets = plant.startSets();
const truth = sets.map((s) => plant.truth(cand.name, s.name).value);
const t = performance.now(), c0 = process.cpuUsage();
const fit = await fitNetworkFqe({ data, policy, discount: plant.discount, quadratureNodes: 10, seed, settings: { ...defaultNetworkSettings, ...JSON.parse(settingsJson) }, method: JSON.parse(methodJson), wasmPath, startStates: sets[0].states,
  onProgress: (p) => { if (process.env.VERBOSE) console.log(`  it ${p.iteration} lr ? J ${p.policyValue.toPrecision(6)} err ${((p.policyValue - truth[0]) / Math.abs(truth[0]) * 100).toFixed(2)}% bound ${p.remainingBound?.toPrecision(2)} loss ${p.loss?.toPrecision(3)} t ${((performance.now() - t) / 1000).toFixed(1)}`); } });
const cpu = process.cpuUsage(c0), wall = (performance.now() - t) / 1000;
const out: string[] = [];
sets.forEach((set, i) => {
  const e = fit.estimate(set.states);
  const err = (x: number) => ((x - truth[i]) / Math.abs(truth[i]) * 100).toFixed(2) + '%';
  const covers = e.interval.lower <= truth[i] && truth[i] <= e.interval.upper;
  out.push(`${set.name}: net ${err(e.value)} [${err(e.interval.lower)}, ${err(e.interval.upper)}] ${covers ? 'C' : '-'} | lin ${err(e.linear.value)} [${err(e.linear.interval.lower)}, ${err(e.linear.interval.upper)}]`);
});
console.log(`${plantName} ${cand.name} seed ${seed} ${fit.status} it ${fit.history.length} wall ${wall.toFixed(1)} cpu ${((cpu.user + cpu.system) / 1e6).toFixed(1)} :: ${out.join(' || ')}`);
if (process.env.VERBOSE) console.log(fit.message);
fit.dispose();
