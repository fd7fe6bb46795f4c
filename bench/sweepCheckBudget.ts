/**
 * The discount sweep check's work and wall time per candidate (pipeline/assessSweepCheck.ts): on
 * every sample project, the heating-loop sample with degree-3 features, and that project with the
 * linear fit's tolerance at 1e-300 (no iteration meets it, so every resample solve not proved to
 * contract runs to its limit; invented edits). Each candidate's check runs alone, three times; the
 * median wall time is printed beside the work counted by solveWork.ts (where the sources count it)
 * and whether it was checked. Printed, never asserted (the rule: /work/notes/solve37-budget-rule.md).
 *
 *   nice -n 10 npx tsx bench/sweepCheckBudget.ts                 these sources
 *   SRC=/path/to/other/src nice -n 10 npx tsx bench/sweepCheckBudget.ts   another copy (before a change)
 */
import { readFile } from 'node:fs/promises';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

const here = dirname(fileURLToPath(import.meta.url));

const src = resolve(process.env.SRC ?? join(here, '..', 'src'));
const samples = join(here, '..', 'sample-projects');
const FACTORS = [0.5, 0.75, 1, 1.5, 2]; // assessSensitivity.ts HORIZON_FACTORS

interface Case { sample: string; degree?: number; tolerance?: number }
const CASES: Case[] = [
  { sample: 'heating-loop' }, { sample: 'heating-historian' }, { sample: 'tank-levels' },
  { sample: 'heating-loop', degree: 3 }, { sample: 'heating-loop', degree: 3, tolerance: 1e-300 },
];

async function main(): Promise<void> {
  const { openProject } = await import(join(src, 'pipeline/openProject'));
  const { startRun } = await import(join(src, 'pipeline/projectRun'));
  const { candidateWork, linearSolveSettings } = await import(join(src, 'pipeline/assessCandidate'));
  const { sweptDiscount } = await import(join(src, 'pipeline/assessSensitivity'));
  const { checkDiscountSweep } = await import(join(src, 'pipeline/assessSweepCheck'));
  const { reachedSolve } = await import(join(src, 'core/bootstrap/linearFqeReplicate'));
  const { meanStartFeatures } = await import(join(src, 'core/features/policyFeatures'));
  console.log(`sources: ${src}`);
  console.log('| case | candidate | d | checked | old estimate | new estimate | wall s (median of 3) | counted units | units/s | marks |');
  console.log('|---|---|---|---|---|---|---|---|---|---|');
  for (const c of CASES) {
    const folder = join(samples, c.sample);
    const doc = JSON.parse(await readFile(join(folder, `${c.sample}.spcritic`), 'utf8'));
    if (c.degree !== undefined) doc.approximator.features.degree = c.degree;
    const opened = await openProject(JSON.stringify(doc), `${c.sample}.spcritic`, async (p: string) => new Uint8Array(await readFile(join(folder, p))));
    const run = (await startRun(opened.value.project, opened.value.dataset)).value;
    const context = { plan: run.plan, presentController: null, presentControllerModel: null, presentControllerReason: '' };
    const settings = FACTORS.map((f) => sweptDiscount(run.plan.discount, f)), e = run.plan.episodes.episodes;
    for (const model of run.models) {
      const edited = c.tolerance === undefined ? model : { ...model, linear: { ...model.linear, tolerance: c.tolerance } };
      const w = candidateWork(context, edited), linear = edited.linear, d = linear.features.dim;
      const setup = linearSolveSettings(run.plan, edited), xiBar = meanStartFeatures(linear.startFeatures, d);
      const points = settings.map((g) => reachedSolve({ ...setup, discount: g }, linear.statistics, xiBar));
      const steps = points.reduce((s: number, p: { iterations?: number }) => s + (p.iterations ?? 0), 0);
      const oldEstimate = (e * d * d + settings.length * d ** 3 + steps * d * d) * 200;
      const converged = points.reduce((s: number, p: { status: string; work?: number }) => s + (p.status === 'converged' ? p.work ?? 0 : 0), 0);
      const newEstimate = points[0].work === undefined ? null : (e * d * d + d ** 3 / 6 + converged) * 200; // as assessSweepCheck.ts expectedWork
      const times: number[] = [];
      let check: { marks: boolean[][]; note: string | null; work?: number[] } | null = null;
      for (let i = 0; i < 3; i++) {
        const t = performance.now();
        check = checkDiscountSweep(context, [w], settings, 2, [points], { level: 0.9, seed: 1, resamples: 200 });
        times.push((performance.now() - t) / 1000);
      }
      const wall = times.sort((a, b) => a - b)[1], skipped = /not checked/.test(check!.note ?? ''), units = check!.work?.[0];
      const name = `${c.sample}${c.degree ? `, degree ${c.degree}` : ''}${c.tolerance ? `, tolerance ${c.tolerance}` : ''}`;
      console.log(`| ${name} | ${model.name} | ${d} | ${skipped ? 'skipped' : 'yes'} | ${oldEstimate.toExponential(2)} | ${newEstimate === null ? '–' : newEstimate.toExponential(2)} | ${wall.toFixed(3)} | ${units === undefined ? '–' : units.toExponential(2)} | ${units === undefined ? '–' : (units / wall).toExponential(2)} | ${check!.marks[0].map((m) => (m ? 'x' : '.')).join('')} |`);
      if (check!.note) console.log(`  note: ${check!.note}`);
    }
    run.dispose();
  }
}

void main();
