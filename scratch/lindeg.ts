import { batteryPlant } from '../test/battery/catalogue';
import { createFeatureMap } from '../src/core/features/featureMap';
import { polynomialFeatureSpec } from '../src/core/features/polynomialFeatures';
import { fitStateActionStandardiser } from '../src/core/features/standardiser';
import { fitLinearFqe } from '../src/core/fqe/linearFqe';
import { createGaussianPolicy } from '../src/core/policy';
const plant = batteryPlant(process.argv[2]);
for (const seed of [1, 2]) {
  const data = plant.simulate({ transitions: 100_000, seed });
  for (const c of plant.candidates) {
    const policy = createGaussianPolicy(c.spec, plant.stateDim);
    const line: string[] = [];
    for (const deg of [2, 3, 4, 5]) {
      const features = createFeatureMap(polynomialFeatureSpec(fitStateActionStandardiser(data).spec, deg));
      for (const set of plant.startSets()) {
        const truth = plant.truth(c.name, set.name).value;
        const fit = fitLinearFqe({ data, policy, features, discount: plant.discount, ridge: 1e-6, quadratureNodes: 10, tolerance: 1e-10, maxIterations: 5, startStates: set.states });
        const j = fit.fixedPoint!.policyValue.value;
        line.push(`d${deg} ${set.name} ${((j - truth) / Math.abs(truth) * 100).toFixed(2)}%`);
      }
    }
    console.log(seed, c.name, line.join('  '));
  }
}
