import { batteryPlants } from '../test/battery/catalogue';
import { createFeatureMap } from '../src/core/features/featureMap';
import { polynomialFeatureSpec } from '../src/core/features/polynomialFeatures';
import { fitStateActionStandardiser } from '../src/core/features/standardiser';
import { fitLinearFqe } from '../src/core/fqe/linearFqe';
import { createGaussianPolicy } from '../src/core/policy';
import { policyValue } from '../src/core/value';
import { createActionQuadrature } from '../src/core/actionQuadrature';

const only = process.argv[2];
for (const plant of batteryPlants()) {
  if (only && !plant.name.includes(only)) continue;
  let t = performance.now();
  const data = plant.simulate({ transitions: 100_000, seed: 1 });
  const simS = (performance.now() - t) / 1000;
  const ds = plant.stateDim;
  const sd = Array.from({ length: ds }, (_, c) => { let m = 0, q = 0; for (let i = 0; i < data.count; i++) m += data.states[i * ds + c]; m /= data.count; for (let i = 0; i < data.count; i++) q += (data.states[i * ds + c] - m) ** 2; return `${m.toFixed(2)}±${Math.sqrt(q / data.count).toFixed(3)}`; });
  let clipped = 0; for (let i = 0; i < data.count; i++) if (plant.name.startsWith('green') ? (data.actions[i] <= 0 || data.actions[i] >= 1) : plant.name.startsWith('pend') ? Math.abs(data.actions[i]) >= 0.8 : false) clipped++;
  console.log(`\n${plant.name}: sim ${simS.toFixed(2)} s, states ${sd.join(' ')}, action share at a limit ${(clipped / data.count).toFixed(3)}`);
  const features = createFeatureMap(polynomialFeatureSpec(fitStateActionStandardiser(data).spec, 2));
  for (const c of plant.candidates) {
    const policy = createGaussianPolicy(c.spec, ds);
    for (const set of plant.startSets()) {
      t = performance.now();
      const truth = plant.truth(c.name, set.name);
      const tt = (performance.now() - t) / 1000;
      const fit = fitLinearFqe({ data, policy, features, discount: plant.discount, ridge: 1e-6, quadratureNodes: 10, tolerance: 1e-10, maxIterations: 20000, startStates: set.states });
      const j = fit.fixedPoint!.policyValue.value;
      console.log(`  ${c.name.padEnd(10)} ${set.name.padEnd(7)} truth ${truth.value.toPrecision(6)} ±${truth.standardError.toPrecision(2)} (${tt.toFixed(1)} s)  linear2 ${j.toPrecision(6)} err ${((j - truth.value) / Math.abs(truth.value) * 100).toFixed(2)}%  ${fit.status}`);
    }
  }
}
