// The engine as it is on main (before this branch), with its default settings, on the battery.
import { batteryPlants } from '../test/battery/catalogue';
import { fitNetworkFqe } from '../../../main/src/core/fqe/networkFqe';
import { defaultNetworkSettings } from '../../../main/src/core/fqe/networkSettings';
import { createActionQuadrature } from '../../../main/src/core/actionQuadrature';
import { createGaussianPolicy } from '../../../main/src/core/policy';
import { policyValue } from '../../../main/src/core/value';
const wasmPath = '/work/main/node_modules/@tensorflow/tfjs-backend-wasm/dist/';
const seeds = Number(process.argv[2] ?? 3);
for (const plant of batteryPlants()) {
  const c = plant.candidates[0];
  for (let seed = 1; seed <= seeds; seed++) {
    const data = plant.simulate({ transitions: 100_000, seed });
    const policy = createGaussianPolicy(c.spec, plant.stateDim);
    const cpu0 = process.cpuUsage();
    const fit = await fitNetworkFqe({ data, policy, discount: plant.discount, quadratureNodes: 10, seed, settings: { ...defaultNetworkSettings }, wasmPath });
    const cpu = process.cpuUsage(cpu0);
    const errs = plant.startSets().map((set) => {
      const j = policyValue(fit.actionValue, policy, set.states, createActionQuadrature(policy, 10)).value, t = plant.truth(c.name, set.name).value;
      return `${set.name} ${(100 * (j - t) / Math.abs(t)).toFixed(1)} %`;
    });
    console.log(JSON.stringify({ plant: plant.name, seed, errs, status: fit.status, iterations: fit.history.length, cpu: (cpu.user + cpu.system) / 1e6 }));
    fit.dispose();
  }
}
