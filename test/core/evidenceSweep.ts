/**
 * The measured tables behind the evidence checks, printed (never asserted): run with
 *   npx tsx test/core/evidenceSweep.ts [linear] [pendulum] [classes]
 * Long (minutes); run under `nice -n 10`. The fast subsets that CI asserts are the *.test.ts files.
 */
import { indexEpisodes } from '../../src/core/bootstrap/episodeTransitions';
import { functionClassVerdict } from '../../src/core/diagnostics/functionClassRange';
import { createFeatureMap, type FeatureMapSpec } from '../../src/core/features/featureMap';
import { polynomialFeatureSpec } from '../../src/core/features/polynomialFeatures';
import { radialBasisGridSpec } from '../../src/core/features/radialBasisFeatures';
import { fitStateActionStandardiser } from '../../src/core/features/standardiser';
import { fittedBehaviourPolicy } from '../../src/core/offPolicy/behaviourPolicy';
import { crossCheckVerdict, type CrossCheckEvidence } from '../../src/core/offPolicy/crossCheckVerdict';
import { polynomialModelRegressions } from '../../src/core/offPolicy/polynomialDynamicsModel';
import { createGaussianPolicy, type GaussianPolicy } from '../../src/core/policy';
import type { TransitionSet } from '../../src/core/transitions';
import { exactPolicyValue, simulateLog } from './linearGaussianPlant';
import { fqeEstimate, paired, percentileInterval, runCrossChecks, standardDeviation, type CrossCheckRun, type Estimate } from './offPolicy/crossCheckHarness';
import { PENDULUM, pendulumLog, pendulumLogging, pendulumRolloutValue, type PendulumController } from './saturatingPendulum';
import { candidateFamily, cascadeLogging, cascadePlant, startLaws } from './testPlants';

interface Row { name: string; truth: number; truthSe: number; run: CrossCheckRun }

const fmt = (v: number) => (Math.abs(v) >= 10 ? v.toFixed(2) : v.toFixed(3)).padStart(8);
const withSe = (point: number, replicates: number[]) => `${fmt(point)} ± ${standardDeviation(replicates).toPrecision(2).padEnd(6)}`;
const short: Record<string, string> = { agrees: 'agrees', disagrees: 'DISAGREES', uninformative: 'uninf.' };

/** The rule's verdict (crossCheckVerdict.ts) on a check's paired difference from FQE. */
function verdictOf(label: string, check: Estimate, fqe: Estimate, extra: Partial<CrossCheckEvidence>): string {
  const d = paired(check, fqe);
  const v = crossCheckVerdict({ label, difference: d.point, differenceStandardError: standardDeviation(d.replicates), fqe: fqe.point, ...extra });
  return short[v.agreement];
}

function print(title: string, rows: Row[], discount: number): void {
  console.log(`\n${title}`);
  console.log('candidate                  truth            FQE (err)                IS+tail          DR+tail          ESS@H/300  IS      DR      model rollouts         outside  model   |FQE−truth|/SE');
  for (const { name, truth, truthSe, run } of rows) {
    const m = run.model, tailWeight = discount ** 100;
    const weights = { effectiveEpisodes: run.effectiveEpisodes, episodesReaching: run.episodesAtHorizon, horizonSteps: run.horizonSteps, tailWeight };
    const err = `(${(100 * (run.fqe.point / truth - 1)).toFixed(1)} %)`.padEnd(9);
    const model = m ? `${withSe(m.point, m.replicates)} ${(100 * m.shareOutsideLogs).toFixed(1).padStart(5)} %  ${verdictOf('model', m, run.fqe, { shareOutsideLogs: m.shareOutsideLogs, rewardShareAtEdge: m.rewardShareAtEdge }).padEnd(7)}` : '';
    console.log(`${name.padEnd(24)} ${fmt(truth)}${truthSe ? `±${truthSe.toPrecision(1)}` : '       '} ${withSe(run.fqe.point, run.fqe.replicates)}${err} ${withSe(run.importanceSampling.point, run.importanceSampling.replicates)} ` +
      `${withSe(run.doublyRobust.point, run.doublyRobust.replicates)} ${run.effectiveEpisodes.toFixed(1).padStart(6)}    ${verdictOf('IS', run.importanceSampling, run.fqe, { weights }).padEnd(7)} ` +
      `${verdictOf('DR', run.doublyRobust, run.fqe, { weights }).padEnd(7)} ${model} ${(Math.abs(run.fqe.point - truth) / standardDeviation(run.fqe.replicates)).toFixed(1).padStart(5)}`);
  }
}

function linearCrossChecks(discount: number): void {
  const data = simulateLog(cascadePlant, cascadeLogging, { episodes: 300, steps: 100, seed: 5, start: startLaws(cascadePlant, cascadeLogging)[1][1] });
  const behaviour = fittedBehaviourPolicy(data).policy;
  const features = createFeatureMap(polynomialFeatureSpec(fitStateActionStandardiser(data).spec, 2));
  const regressions = polynomialModelRegressions(data, indexEpisodes(data), { degree: 2, rewardDegree: 2 });
  const rows = candidateFamily(cascadeLogging).map(([name, c]): Row => ({
    name, truth: exactPolicyValue(cascadePlant, c, discount, data.startStates), truthSe: 0,
    run: runCrossChecks({ data, policy: createGaussianPolicy({ offset: c.offset, gain: [c.gain], std: c.std }, 3), behaviour, features, discount, resamples: 100, seed: 13, model: { regressions, resamples: 30, rolloutsPerStart: 2 } }),
  }));
  print(`Linear cascade plant, 300 runs × 100 steps, γ ${discount} (exact truth; FQE polynomial degree 2; model: degree-2 one-step model)`, rows, discount);
}

const pendulumCandidates: [string, PendulumController][] = [
  ['logged', pendulumLogging],
  ['stiffer (14, 4)', { offset: 0, gainAngle: 14, gainRate: 4, std: 0.3 }],
  ['softer (6, 2)', { offset: 0, gainAngle: 6, gainRate: 2, std: 0.4 }],
  ['pushed (offset 0.4)', { offset: 0.4, gainAngle: 8, gainRate: 3, std: 0.4 }],
];

function pendulumPolicy(c: PendulumController): GaussianPolicy {
  return createGaussianPolicy({ offset: [c.offset], gain: [[-c.gainAngle, -c.gainRate]], std: [c.std], bounds: { lo: [-PENDULUM.torqueLimit], hi: [PENDULUM.torqueLimit], mode: 'clip' } }, 2);
}

function pendulumCrossChecks(discount: number, data: TransitionSet): void {
  const behaviour = fittedBehaviourPolicy(data).policy;
  const features = createFeatureMap(polynomialFeatureSpec(fitStateActionStandardiser(data).spec, 3));
  const regressions = polynomialModelRegressions(data, indexEpisodes(data), { degree: 3, rewardDegree: 2 });
  const rows = pendulumCandidates.map(([name, c]): Row => {
    const truth = pendulumRolloutValue(c, discount, data.startStates, 10, 991);
    return {
      name, truth: truth.value, truthSe: truth.standardError,
      run: runCrossChecks({ data, policy: pendulumPolicy(c), behaviour, features, discount, resamples: 100, seed: 13, model: { regressions, resamples: 30, rolloutsPerStart: 2 } }),
    };
  });
  print(`Saturating pendulum, ${data.episodeCount} runs × 100 steps, γ ${discount} (rollout truth; FQE polynomial degree 3; model: degree-3 one-step model)`, rows, discount);
}

function pendulumClasses(discount: number, data: TransitionSet): void {
  const standardiser = fitStateActionStandardiser(data).spec;
  const classes: [string, FeatureMapSpec][] = [
    ['polynomial 2', polynomialFeatureSpec(standardiser, 2)], ['polynomial 3', polynomialFeatureSpec(standardiser, 3)],
    ['polynomial 4', polynomialFeatureSpec(standardiser, 4)], ['radial basis 4³', radialBasisGridSpec(standardiser, { pointsPerDimension: 4, linearTerms: true })],
  ];
  console.log(`\nFunction classes on the saturating pendulum, ${data.episodeCount} runs, γ ${discount}: estimate (relative error), 90 % interval, and the rule's verdict`);
  for (const [name, c] of pendulumCandidates) {
    const truth = pendulumRolloutValue(c, discount, data.startStates, 10, 991);
    const estimates = classes.map(([label, spec]) => {
      const { estimate } = fqeEstimate(data, pendulumPolicy(c), createFeatureMap(spec), discount, 60, 23);
      return { label, value: estimate.point, standardError: standardDeviation(estimate.replicates), interval: percentileInterval(estimate.replicates, 0.9), replicates: estimate.replicates };
    });
    const v = functionClassVerdict(estimates);
    const covers = v.range[0] <= truth.value && truth.value <= v.range[1];
    console.log(`${name}: truth ${truth.value.toFixed(4)} ± ${truth.standardError.toFixed(4)}; ` +
      estimates.map((e) => `${e.label} ${e.value.toFixed(4)} (${(100 * (e.value / truth.value - 1)).toFixed(1)} %) [${e.interval[0].toFixed(3)}, ${e.interval[1].toFixed(3)}]`).join('; ') +
      `\n   → range [${v.range[0].toFixed(4)}, ${v.range[1].toFixed(4)}] ${covers ? 'covers' : 'MISSES'} the truth; ${v.reason}`);
  }
}

const parts = process.argv.slice(2);
const want = (p: string) => parts.length === 0 || parts.includes(p);
if (want('linear')) for (const discount of [0.97, 0.99]) linearCrossChecks(discount);
if (want('pendulum')) {
  const data = pendulumLog(pendulumLogging, 300, 100, 3);
  for (const discount of [0.97, 0.99]) pendulumCrossChecks(discount, data);
}
if (want('classes')) {
  const data = pendulumLog(pendulumLogging, 600, 100, 3);
  for (const discount of [0.97, 0.99]) pendulumClasses(discount, data);
}
