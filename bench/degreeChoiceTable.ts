/**
 * What the per-project degree choice (src/core/fqe/networkDegreeChoice.ts) decides on the battery's
 * logs, without fitting a network: `npx tsx bench/degreeChoiceTable.ts [--seeds 3] [--plants a,b]
 * [--run-starts steady|wide|both] [--holdout]`. Per plant, way of logging and seed: the chosen degree,
 * each degree's root mean squared error of the present controller's held-out returns in % of the
 * mean |return| at the run starts, the paired difference (degree 4 − degree 2) of the runs' squared
 * errors in standard errors, the runs scored and the seconds the choice took.
 */
import { fileURLToPath } from 'node:url';
import { chooseLinearPartDegree } from '../src/core/fqe/networkDegreeChoice';
import { batteryPlants } from '../test/battery/catalogue';
import { holdoutPlants } from '../test/battery/holdout/levelValvePlant';
import { runStartsOption } from './batteryBench';

export function printDegreeChoiceTable(args: string[]): void {
  let seeds = 3, names: string[] | null = null, runStarts: ('steady' | 'wide')[] = ['steady', 'wide'], holdout = false;
  for (let i = 0; i < args.length; i++) {
    if (args[i] === '--seeds') seeds = Number(args[++i]);
    else if (args[i] === '--plants') names = args[++i].split(',');
    else if (args[i] === '--run-starts') runStarts = runStartsOption(args[++i]);
    else if (args[i] === '--holdout') holdout = true;
    else throw new Error(`degree choice table: unknown option ${args[i]}`);
  }
  const plants = (holdout ? holdoutPlants() : batteryPlants()).filter((p) => !names || names.includes(p.name));
  console.log('plant | logged | seed | chosen | RMS error deg 2 / deg 4 (% of |return|) | Δ / SE | runs scored | s');
  for (const plant of plants) for (const logged of runStarts) for (let seed = 1; seed <= seeds; seed++) {
    const data = plant.simulate({ transitions: 100_000, seed, runStarts: logged });
    const t = performance.now(), c = chooseLinearPartDegree({ data, discount: plant.discount, seed });
    const seconds = (performance.now() - t) / 1000;
    const rms = c.relativeError.map((x) => (100 * x).toFixed(2)).join(' / ');
    const z = c.difference !== null && c.standardError ? (c.difference / c.standardError).toFixed(2) : '—';
    console.log(`${plant.name} | ${logged} | ${seed} | ${c.chosen} | ${rms || c.notCompared} | ${z} | ${c.runsScored} | ${seconds.toFixed(1)}`);
  }
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) printDegreeChoiceTable(process.argv.slice(2));
