/**
 * The table that chose the plant-memory check's thresholds (src/core/diagnostics/plantMemoryFinding.ts):
 *   1. Markov plants (the battery, both ways of logging, and the hold-outs): the largest partial R²
 *      over the next-state components — the check must stay quiet on every one;
 *   2. the dead-time vessel (test/battery/deadTimePlant.ts), d = 0..5, two candidates: the product's
 *      J (linear fitted Q-evaluation, polynomial degree 2, the project default) against the exact J,
 *      beside the partial R².
 * Run: nice -n 10 npx tsx bench/plantMemoryTable.ts [seeds]
 */
import { fileURLToPath } from 'node:url';
import { adjustedPartialRSquared, plantMemoryFinding } from '../src/core/diagnostics/plantMemoryFinding';
import { createFeatureMap } from '../src/core/features/featureMap';
import { polynomialFeatureSpec } from '../src/core/features/polynomialFeatures';
import { fitStateActionStandardiser } from '../src/core/features/standardiser';
import { fitLinearFqe } from '../src/core/fqe/linearFqe';
import { RIDGE } from '../src/core/limits';
import { createGaussianPolicy } from '../src/core/policy';
import type { TransitionSet } from '../src/core/transitions';
import { loggedPlantMemory } from '../src/pipeline/plantMemoryCheck';
import { batteryPlants } from '../test/battery/catalogue';
import { DEAD_TIME_CANDIDATES, DEAD_TIME_DISCOUNT, deadTimeLog, deadTimeTruth, loggedCandidate } from '../test/battery/deadTimePlant';
import { holdoutPlants } from '../test/battery/holdout/levelValvePlant';

function largest(data: TransitionSet): string {
  const r = loggedPlantMemory(data);
  if ('reason' in r) return `n/a (${r.reason})`;
  const top = r.components.reduce((a, b) => (adjustedPartialRSquared(b) > adjustedPartialRSquared(a) ? b : a));
  const s = top.strongest, finding = plantMemoryFinding(r, { stateNames: [], actionNames: [] });
  return `${(100 * top.partialRSquared).toFixed(2)} %, adjusted ${(100 * adjustedPartialRSquared(top)).toFixed(2)} % → ${finding?.severity ?? 'quiet'} (state ${top.component}, F ${top.fStatistic.toFixed(1)} on ${top.numeratorDf}/${top.denominatorDf}` +
    `${s ? `; most: ${s.kind} ${s.index} lag ${s.lag} ${(100 * s.partialRSquared).toFixed(2)} %` : ''})`;
}

function markovTable(seeds: number[], transitions: number): void {
  console.log(`\nMarkov plants, ${transitions} transitions: largest partial R² over components`);
  for (const plant of [...batteryPlants(), ...holdoutPlants()]) {
    for (const runStarts of ['steady', 'wide'] as const) {
      for (const seed of seeds) {
        const data = plant.simulate({ transitions, seed, runStarts });
        console.log(`  ${plant.name.padEnd(38)} ${runStarts.padEnd(6)} seed ${seed}: ${largest(data)}`);
      }
    }
  }
}

/** Shares of the valve's effect that come after the dead time (1: all of it). */
const LATE_SHARES = [1, 0.5, 0.3, 0.2, 0.1, 0.03];

function deadTimeTable(seeds: number[], runs: number): void {
  console.log(`\nDead-time vessel, ${runs} runs × 200 steps: product J (linear, degree 2) vs exact`);
  for (const late of LATE_SHARES) for (let delay = late === 1 ? 0 : 1; delay <= 5; delay++) {
    for (const seed of seeds) {
      const log = deadTimeLog(delay, runs, seed, late), data = log.logged;
      const features = createFeatureMap(polynomialFeatureSpec(fitStateActionStandardiser(data).spec, 2));
      const errors = DEAD_TIME_CANDIDATES.map((c) => {
        const policy = createGaussianPolicy(loggedCandidate(c), 2);
        const fit = fitLinearFqe({ data, policy, features, discount: DEAD_TIME_DISCOUNT, ridge: RIDGE.default, quadratureNodes: 10, tolerance: 1e-10, maxIterations: 5000 });
        const j = fit.fixedPoint?.policyValue.value ?? fit.iterative?.policyValue.value ?? NaN, truth = deadTimeTruth(delay, c, log.augmentedStarts, late);
        return `${c.name} J ${j.toFixed(1)} exact ${truth.toFixed(1)} (${(100 * (j - truth) / Math.abs(truth)).toFixed(1)} %)`;
      });
      console.log(`  late ${late} d=${delay} seed ${seed}: ${errors.join('; ')}; memory ${largest(data)}`);
    }
  }
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  const seeds = Array.from({ length: Number(process.argv[2] ?? 3) }, (_, k) => k + 1);
  const only = process.argv[3];
  if (only !== 'markov') deadTimeTable(seeds, 400);
  if (only !== 'dead') {
    markovTable(seeds, 20_000);
    markovTable(seeds.slice(0, 1), 2_000);
  }
}
