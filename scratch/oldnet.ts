import { batteryPlant } from '../test/battery/catalogue';
import { fitNetworkFqe } from '../src/core/fqe/networkFqe';
import { defaultNetworkSettings } from '../src/core/fqe/networkSettings';
import { createGaussianPolicy } from '../src/core/policy';
import { policyValue } from '../src/core/value';
import { createActionQuadrature } from '../src/core/actionQuadrature';
import { fileURLToPath } from 'node:url';
const wasmPath = fileURLToPath(new URL('../node_modules/@tensorflow/tfjs-backend-wasm/dist/', import.meta.url));
const plant = batteryPlant(process.argv[2]);
const cand = plant.candidates[Number(process.argv[3] ?? 0)];
const data = plant.simulate({ transitions: 100_000, seed: 1 });
const policy = createGaussianPolicy(cand.spec, plant.stateDim);
const t = performance.now(), c0 = process.cpuUsage();
const fit = await fitNetworkFqe({ data, policy, discount: plant.discount, quadratureNodes: 10, seed: 1, settings: { ...defaultNetworkSettings }, wasmPath });
const cpu = process.cpuUsage(c0);
for (const set of plant.startSets()) {
  const j = policyValue(fit.actionValue, policy, set.states, createActionQuadrature(policy, 10)).value, truth = plant.truth(cand.name, set.name).value;
  console.log(set.name, j.toPrecision(5), truth.toPrecision(5), ((j - truth) / Math.abs(truth) * 100).toFixed(1) + '%');
}
console.log(fit.status, fit.message, fit.backendNote, 'wall', ((performance.now() - t) / 1000).toFixed(1), 'cpu', ((cpu.user + cpu.system) / 1e6).toFixed(1));
