/**
 * The retune map's cost on the heating-loop sample (4 states: zone, outdoor, error integral,
 * previous opening; 1 action) scaled to 100,000 transitions: its 10×10 map of the PI candidate
 * (K_c × T_i) with polynomial features of degree 2 (d = 21) and 3 (d = 56). Printed side by side,
 * in CPU seconds of this process (the machine is shared, so wall time says little): a plain fit per
 * point (fitLinearFqe: quadrature and a full data pass each time) against the map's routes —
 * a pass with moments per row; the closed form (the same PI without its 0–100 % clip, so no row
 * needs a correction); the rate-limited PI — and the whole 10×10 map each way.
 */
import { readFileSync } from 'node:fs';
import { createFeatureMap } from '../src/core/features/featureMap';
import { polynomialFeatureSpec } from '../src/core/features/polynomialFeatures';
import { fitStateActionStandardiser } from '../src/core/features/standardiser';
import { fitLinearFqe } from '../src/core/fqe/linearFqe';
import { retuneGrid, type RetuneGridInput } from '../src/core/retune/retuneGrid';
import type { TransitionSet } from '../src/core/transitions';
import { importDataset } from '../src/data/importDataset';
import { candidatePolicy } from '../src/pipeline/candidatePolicy';
import { parseProjectText } from '../src/project/projectFile';
import { retuneMapCandidates } from '../src/project/retuneMapCandidates';
import { planEvaluation } from '../src/pipeline/plan/evaluationPlan';
import { runRetuneMaps } from '../src/pipeline/retuneMaps';
import type { CandidateSpec, ProjectDocument } from '../src/project/schema';
import { heatingLoopCsv, simulateHeatingLoop } from '../sample-projects/heating-loop/simulate';

const OPTIONS = { discount: 0.95, ridge: 1e-9, quadratureNodes: 10, tolerance: 1e-10, maxIterations: 5000 };

function cpuSeconds<T>(f: () => T): [T, number] {
  const start = process.cpuUsage();
  const value = f();
  const used = process.cpuUsage(start);
  return [value, (used.user + used.system) / 1e6];
}

function sample(): { doc: ProjectDocument; data: TransitionSet } {
  const parsed = parseProjectText(readFileSync(new URL('../sample-projects/heating-loop/heating-loop.spcritic', import.meta.url), 'utf8'), 'heating-loop.spcritic');
  if (!parsed.ok) throw new Error(parsed.problems.map((p) => p.message).join('\n'));
  const doc = parsed.value.document;
  // 200 runs × 502 rows; each run's first row only supplies the previous opening: 100,000 transitions.
  const imported = importDataset(heatingLoopCsv(simulateHeatingLoop({ runs: 200, stepsPerRun: 502, seed: 5 })), 'bench.csv', doc.data.csv, doc.columns);
  if (!imported.ok) throw new Error(imported.problems.map((p) => p.message).join('\n'));
  return { doc, data: imported.value.transitions };
}

function mapPolicies(doc: ProjectDocument, data: TransitionSet, candidate: CandidateSpec) {
  const map = doc.retuneMaps![0];
  const grid = retuneMapCandidates({ ...doc, candidates: [candidate] }, { ...map, candidate: candidate.name });
  return grid.candidates.map((c) => candidatePolicy(c, data));
}

export function runRetuneBench(): Record<string, number | string> {
  const { doc, data } = sample();
  const [pi, , rateLimited] = doc.candidates;
  const unclipped: CandidateSpec = { name: 'PI unclipped', description: '', form: pi.form, dither: pi.dither };
  const maps = { clipped: mapPolicies(doc, data, pi), unclipped: mapPolicies(doc, data, unclipped), rate: mapPolicies(doc, data, rateLimited) };
  const standardiser = fitStateActionStandardiser(data).spec;
  const figures: Record<string, number | string> = { transitions: data.count, 'grid points': maps.clipped.length };
  for (const degree of [2, 3]) {
    const features = createFeatureMap(polynomialFeatureSpec(standardiser, degree)), tag = `deg ${degree} (d ${features.dim})`;
    const [, plain] = cpuSeconds(() => fitLinearFqe({ data, policy: maps.clipped[44], features, ...OPTIONS }));
    figures[`${tag}: plain fit per point`] = plain;
    const run = (policies: RetuneGridInput['policies'], extra: Partial<RetuneGridInput> = {}) => cpuSeconds(() => retuneGrid({ data, features, policies, ...OPTIONS, ...extra }));
    const [, shared] = cpuSeconds(() => retuneGrid({ data, features, policies: maps.unclipped.slice(0, 1), ...OPTIONS }));
    figures[`${tag}: shared sums + 1 closed-form point`] = shared;
    for (const [name, policies, extra] of [
      ['clipped PI map', maps.clipped, {}], ['clipped PI map, no residual', maps.clipped, { withBellmanResidual: false }],
      ['unclipped PI map', maps.unclipped, {}], ['rate-limited PI map', maps.rate, {}],
    ] as [string, RetuneGridInput['policies'], Partial<RetuneGridInput>][]) {
      const [result, total] = run(policies, extra);
      const routes = [...new Set(result.points.map((p) => p.route))].join('+');
      figures[`${tag}: ${name} 10×10`] = total;
      figures[`${tag}: ${name} per point`] = total / policies.length;
      figures[`${tag}: ${name} route`] = routes;
      if (name === 'clipped PI map') {
        const best = result.points.reduce((a, b) => ((b.policyValue ?? -Infinity) > (a.policyValue ?? -Infinity) ? b : a));
        figures[`${tag}: best point (cost)`] = `${best.index} (${(-(best.policyValue ?? NaN)).toFixed(4)})`;
        figures[`${tag}: plain ÷ map per point`] = plain / (total / policies.length);
      }
    }
  }
  // The whole map as hosts run it (src/pipeline/retuneMaps.ts): J, a 100-resample interval and the occupancy shift per point.
  const plan = planEvaluation(doc, data);
  if (plan.ok) {
    const [result, total] = cpuSeconds(() => runRetuneMaps(plan.value, { presentControllerValue: null, presentControllerShift: null }));
    figures[`pipeline map with intervals and shift (project features) 10×10`] = total;
    figures['pipeline map: supported points'] = result[0].points.filter((p) => p.support === null).length;
  }
  figures.peakRssMiB = process.resourceUsage().maxRSS / 1024;
  return figures;
}
