/**
 * The held-actions check (src/core/diagnostics/heldActions.ts, heldActionsFinding.ts) on simulated logs directly,
 * no evaluation: the logs of bench/runOrderBattery.ts (every battery plant, every hold-out, the broken-log and
 * moved-setpoint plants and the controls) and the three sample projects (limits as the pipeline reads them).
 * Per log: held rows, share, stretches, longest, effect E, the finding, and whether the present controller's law
 * would be fitted on the rows not held (heldLawRepaired; held42).
 *
 *   nice -n 10 npx tsx bench/heldActionsBattery.ts [--seeds 1,2,3,4,5] [--transitions 100000] [--plants a,b]
 *
 * The rule these columns are read by: test/battery/README.md, "Held actions".
 */
import { readFile } from 'node:fs/promises';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { batteryPlants } from '../test/battery/catalogue';
import { holdoutPlants } from '../test/battery/holdout/levelValvePlant';
import { brokenLogPlants, keptAssumptionPlants, movedSetpointPlants } from '../test/battery/holdout/brokenLogPlants';
import { heldActionEffect, heldRowMask, heldStretches, type ActionLimits, type HeldActionData } from '../src/core/diagnostics/heldActions';
import { heldLawRepaired, heldSeverity } from '../src/core/diagnostics/heldActionsFinding';
import { loggedActionLimits } from '../src/core/loggedActionLimits';
import { openProject } from '../src/pipeline/openProject';
import { startRun } from '../src/pipeline/projectRun';

function option(name: string, fallback: string): string {
  const at = process.argv.indexOf(`--${name}`);
  return at >= 0 ? process.argv[at + 1] : fallback;
}

function row(name: string, seed: number | string, data: HeldActionData, limits: ActionLimits): string {
  const held = heldRowMask(data, limits), s = heldStretches(held), e = heldActionEffect(data, limits, held), severity = heldSeverity(s, e);
  console.log([name, seed, s.rows, `${(100 * s.share).toFixed(2)} %`, s.stretches, s.longest, 'reason' in e ? e.reason : e.effect.toFixed(3), severity ?? '·', heldLawRepaired(s, e) ? 'law on the moving rows' : 'law on every row'].join(' | '));
  return severity ?? 'none';
}

async function main(): Promise<void> {
  const seeds = option('seeds', '1,2,3,4,5').split(',').map(Number), transitions = Number(option('transitions', '100000'));
  const only = option('plants', '').split(',').filter(Boolean);
  const plants = [...batteryPlants(), ...holdoutPlants(), ...brokenLogPlants(), ...movedSetpointPlants(), ...keptAssumptionPlants().map((p) => ({ ...p, name: `${p.name} (control)` }))]
    .filter((p) => only.length === 0 || only.some((o) => p.name.includes(o)));
  console.log(`# ${transitions} transitions, seeds ${seeds.join(',')}`);
  console.log('log | seed | held rows | share | stretches | longest | E | finding | present controller\'s law');
  const tally = new Map<string, number>();
  const count = (severity: string) => tally.set(severity, (tally.get(severity) ?? 0) + 1);
  for (const plant of plants) for (const seed of seeds) {
    const data = plant.simulate({ transitions, seed });
    count(row(plant.name, seed, data, loggedActionLimits(data.actions, data.count, data.actionDim)));
  }
  if (only.length === 0) {
    for (const sample of ['heating-loop', 'heating-historian', 'tank-levels']) {
      const folder = join(dirname(fileURLToPath(import.meta.url)), '..', 'sample-projects', sample);
      const opened = await openProject(await readFile(join(folder, `${sample}.spcritic`), 'utf8'), `${sample}.spcritic`, async (p: string) => new Uint8Array(await readFile(join(folder, p))));
      if (!opened.ok) throw new Error(`${sample}: ${opened.problems.map((p) => p.message).join('; ')}`);
      const started = await startRun(opened.value.project, opened.value.dataset);
      if (!started.ok) throw new Error(`${sample}: ${started.problems.map((p) => p.message).join('; ')}`);
      try {
        const data = started.value.plan.data;
        count(row(`sample ${sample}`, '—', data, started.value.plan.presentController.fitted?.limits ?? loggedActionLimits(data.actions, data.count, data.actionDim)));
      } finally { started.value.dispose(); }
    }
  }
  console.log(`# findings: ${[...tally].map(([k, v]) => `${k} ${v}`).join(', ')}`);
}

void main();
