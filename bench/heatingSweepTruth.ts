/**
 * Rollout truth of the heating-loop sample's candidates at the sensitivity sweep's discounts, beside
 * the linear fit the sweep shows: which of the sweep's values are right, and did the check
 * (pipeline/assessSweepCheck.ts) cross the wrong ones? Seeded rollouts of the sample's own
 * simulator (sample-projects/heating-loop/simulate.ts) from the project's start states; horizon
 * long enough that γ^horizon < 1e−8 at every swept γ. Prints a table.
 *   npx tsx bench/heatingSweepTruth.ts            (ROLLOUTS=200 per start by default)
 */
import { readFile } from 'node:fs/promises';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { assessProject } from '../src/pipeline/assessProject';
import { openProject } from '../src/pipeline/openProject';
import { candidatePolicy } from '../src/pipeline/candidatePolicy';
import { heatingCandidateCost } from '../sample-projects/heating-loop/simulate';

async function main(): Promise<void> {
  const folder = join(dirname(fileURLToPath(import.meta.url)), '..', 'sample-projects', 'heating-loop'), rollouts = Number(process.env.ROLLOUTS ?? 200);
  const opened = await openProject(await readFile(join(folder, 'heating-loop.spcritic'), 'utf8'), 'heating-loop.spcritic', async (p) => new Uint8Array(await readFile(join(folder, p))));
  if (!opened.ok) throw new Error(opened.problems.map((p) => p.message).join('\n'));
  const { project, dataset } = opened.value;
  const result = await assessProject({ project, dataset, settings: { resamples: 200, level: 0.9, seed: 1, sensitivity: true } });
  if (!result.ok) throw new Error(result.problems.map((p) => p.message).join('\n'));
  const curve = result.value.sensitivity!.curves.find((c) => c.parameter === 'discount')!;
  console.log(`heating-loop sample: linear fit (degree 2) at the swept discounts vs rollout truth (${rollouts} rollouts per start, ${dataset.episodeCount} starts)`);
  console.log(['candidate', 'γ', 'fit', 'truth ± s.e.', 'error', 'crossed'].join(' | '));
  for (const spec of project.candidates) {
    const policy = candidatePolicy(spec, dataset), series = curve.series.find((s) => s.name === spec.name)!;
    curve.settings.forEach((g, k) => {
      const horizon = Math.ceil(Math.log(1e-8) / Math.log(g));
      const truth = heatingCandidateCost(policy, dataset.startStates, rollouts, 7_001 + k, horizon, g), fit = series.values[k];
      const error = fit === null ? 'no value' : `${(100 * (fit / truth.cost - 1)).toFixed(1)} %`;
      console.log([spec.name, g.toFixed(4), fit === null ? '—' : fit.toFixed(3), `${truth.cost.toFixed(3)} ± ${truth.standardError.toFixed(3)}`, error, series.beyondPossible?.[k] ? 'crossed' : ''].join(' | '));
    });
  }
}

void main();
