/**
 * Linear FQE throughput on the tank-levels plant: quadratic features (d = 10), 10 quadrature nodes.
 * Phases timed separately: load (CSV text → transitions), fit to tolerance, J, a 100×100 surface.
 * Run in a child process per size so each peak RSS belongs to one size only.
 */
import { createActionQuadrature } from '../src/core/actionQuadrature';
import { polynomialFeatureSpec } from '../src/core/features/polynomialFeatures';
import { createFeatureMap } from '../src/core/features/featureMap';
import { fitStateActionStandardiser } from '../src/core/features/standardiser';
import { fitLinearFqe } from '../src/core/fqe/linearFqe';
import { createGaussianPolicy } from '../src/core/policy';
import { policyValue, valueSurface } from '../src/core/value';
import { importDataset } from '../src/data/importDataset';
import { TANK_COLUMNS } from './tankColumns';
import { simulateTankLevels, tankDiscount, tankLevelsCsv, tankTunedPolicy } from '../sample-projects/tank-levels/simulate';


const seconds = (start: bigint) => Number(process.hrtime.bigint() - start) / 1e9;

export function runLinearBench(transitions: number): Record<string, number> {
  const stepsPerRun = 500;
  const runs = Math.ceil(transitions / (stepsPerRun - 1));
  const csv = tankLevelsCsv(simulateTankLevels({ runs, stepsPerRun, seed: 5 }));
  let t = process.hrtime.bigint();
  const imported = importDataset(csv, 'bench.csv', { delimiter: 'auto', decimalMark: 'auto', badRows: 'stop' }, TANK_COLUMNS);
  if (!imported.ok) throw new Error(imported.problems.map((p) => p.message).join('\n'));
  const data = imported.value.transitions;
  const loadSeconds = seconds(t);

  t = process.hrtime.bigint();
  const policy = createGaussianPolicy(tankTunedPolicy, 2);
  const features = createFeatureMap(polynomialFeatureSpec(fitStateActionStandardiser(data).spec, 2));
  const fit = fitLinearFqe({ data, policy, features, discount: tankDiscount, ridge: 1e-9, quadratureNodes: 10, tolerance: 1e-10, maxIterations: 5000 });
  const fitSeconds = seconds(t);
  if (!fit.iterative) throw new Error(fit.message);

  const quadrature = createActionQuadrature(policy, 10);
  t = process.hrtime.bigint();
  const j = policyValue(fit.iterative.q, policy, data.startStates, quadrature);
  const policyValueSeconds = seconds(t);

  t = process.hrtime.bigint();
  valueSurface(fit.iterative.q, policy, quadrature, { xAxis: 0, yAxis: 1, xRange: [1, 1.4], yRange: [0.6, 1], resolution: [100, 100], heldState: [1.2, 0.8] });
  const surfaceSeconds = seconds(t);

  return {
    transitions: data.count,
    loadSeconds, fitSeconds, policyValueSeconds, surfaceSeconds,
    loadTransitionsPerSecond: data.count / loadSeconds,
    fitTransitionsPerSecond: data.count / fitSeconds,
    iterations: fit.history.length,
    policyValue: -j.value,
    peakRssMiB: process.resourceUsage().maxRSS / 1024,
  };
}
