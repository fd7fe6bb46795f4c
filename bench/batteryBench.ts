/**
 * The full battery sweep (`npm run bench -- battery [options]`): for every battery plant
 * (test/battery), candidate and seed, simulate a log, fit the network approximator with its
 * default settings, and compare its J — and the linear estimate it is compared with (the linear
 * approximator's default class by LSTD-Q on the same data; src/core/fqe/networkComparator.ts) — with
 * the plant's known answer on both start sets.
 * Prints, per plant, candidate and start set: truth, mean error %, largest |error| %, how often the
 * 90 % interval held the truth, and for the network its convergence, time per fit, Adam steps/s
 * and GFLOP/s. Results also go to test-artifacts/battery-<time>.json.
 *
 * Options: --seeds 20  --transitions 100000  --plants name,name  --candidates all|first
 *          --run-starts steady|wide|both (where the logged runs start: test/battery/startSets.ts)
 *          --settings '{"outerIterations": 60}'  --method '{"lastLayer": "gradient"}'  --cpu
 *          --out file (records, rewritten after every log; default test-artifacts/battery-<time>.json)
 *          --fit-seed-offset k (fit with seed s + k on the data of seed s: the training's own randomness)
 *          --holdout (the hold-out plants of test/battery/holdout/ instead of the battery's six)
 *          --skip-default-choice (fit only the logs whose degree choice, networkDegreeChoice.ts, is not degree 2:
 *          with the default method, which chooses, and with '{"linearPartDegree":2}', to pair; bench/batteryChoiceMerge.ts)
 * Seeds: the data of seed s is simulated with seed s and the network is fitted with seed s (+ k).
 * Run it under `nice`; it takes about a minute of CPU per fit.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { approximatorAgreement } from '../src/core/fqe/approximatorAgreement';
import { fitNetworkFqe, type NetworkFit } from '../src/core/fqe/networkFqe';
import { chooseLinearPartDegree, type DegreeChoice } from '../src/core/fqe/networkDegreeChoice';
import { startGuard } from '../src/core/fqe/degreeChoiceStartGuard';
import { LINEAR_PART_DEGREE } from '../src/core/fqe/networkLinearPart';
import { COMPARATOR_DEGREE } from '../src/core/fqe/comparatorDegree';
import { NetworkDivergedError } from '../src/core/fqe/networkErrors';
import { defaultNetworkSettings } from '../src/core/fqe/networkSettings';
import { createGaussianPolicy } from '../src/core/policy';
import { batteryPlants } from '../test/battery/catalogue';
import { holdoutPlants } from '../test/battery/holdout/levelValvePlant';
import type { BatteryPlant } from '../test/battery/batteryPlant';
import { printAllowanceTable } from './batteryAllowanceTable';
import { printBatteryTable, type FitRecord } from './batteryTable';

const wasmPath = fileURLToPath(new URL('../node_modules/@tensorflow/tfjs-backend-wasm/dist/', import.meta.url));

interface Options {
  seeds: number;
  transitions: number;
  plants: string[] | null;
  candidates: 'all' | 'first';
  settings: Record<string, unknown>;
  method: Record<string, unknown>;
  backend: 'auto' | 'cpu';
  runStarts: ('steady' | 'wide')[];
  /** Added to the seed of the network's fit only (the data keep theirs): measures the training's own randomness. */
  fitSeedOffset: number;
  /** Run the hold-out plants (test/battery/holdout/) instead of the battery: they check choices made on the battery. */
  holdout: boolean;
  /**
   * Fit only the logs where the degree choice (networkDegreeChoice.ts) is not the default, with the
   * method given. With `linearPartDegree: 'choose'` a log where the default is chosen gets exactly
   * the default fit (same data, seed and method), so its paired change is 0 by construction: it is
   * listed in `choseDefault` instead (bench/batteryChoiceMerge.ts can take its records from a default
   * sweep). With the default method it gives the degree-2 fits to pair with those logs' chosen fits.
   */
  skipDefaultChoice: boolean;
  /** Records file; written after every log, so a sweep stopped part-way keeps what it measured. Default test-artifacts/battery-<time>.json. */
  out: string | null;
}

function parseOptions(args: string[]): Options {
  const o: Options = { seeds: 20, transitions: 100_000, plants: null, candidates: 'all', settings: {}, method: {}, backend: 'auto', runStarts: ['steady'], fitSeedOffset: 0, holdout: false, skipDefaultChoice: false, out: null };
  for (let i = 0; i < args.length; i++) {
    const value = () => args[++i];
    if (args[i] === '--seeds') o.seeds = Number(value());
    else if (args[i] === '--transitions') o.transitions = Number(value());
    else if (args[i] === '--plants') o.plants = value().split(',');
    else if (args[i] === '--candidates') o.candidates = value() === 'first' ? 'first' : 'all';
    else if (args[i] === '--settings') o.settings = JSON.parse(value());
    else if (args[i] === '--method') o.method = JSON.parse(value());
    else if (args[i] === '--cpu') o.backend = 'cpu';
    else if (args[i] === '--run-starts') o.runStarts = runStartsOption(value());
    else if (args[i] === '--fit-seed-offset') o.fitSeedOffset = Number(value());
    else if (args[i] === '--holdout') o.holdout = true;
    else if (args[i] === '--skip-default-choice') o.skipDefaultChoice = true;
    else if (args[i] === '--out') o.out = value();
    else throw new Error(`battery bench: unknown option ${args[i]}`);
  }
  return o;
}

export function runStartsOption(v: string): ('steady' | 'wide')[] {
  if (v === 'both') return ['steady', 'wide'];
  if (v === 'steady' || v === 'wide') return [v];
  throw new Error(`battery bench: --run-starts expects steady, wide or both, got ${v}`);
}

async function fitOne(plant: BatteryPlant, candidate: number, seed: number, runStarts: 'steady' | 'wide', o: Options): Promise<FitRecord[]> {
  const c = plant.candidates[candidate], sets = plant.startSets();
  const data = plant.simulate({ transitions: o.transitions, seed, runStarts });
  const policy = createGaussianPolicy(c.spec, plant.stateDim);
  const cpuStart = process.cpuUsage();
  const fit = await fitNetworkFqe({
    data, policy, discount: plant.discount, quadratureNodes: 10, seed: seed + o.fitSeedOffset, wasmPath, startStates: sets[0].states,
    settings: { ...defaultNetworkSettings, backend: o.backend, ...o.settings }, method: o.method,
  });
  const cpu = process.cpuUsage(cpuStart);
  try {
    const truth0 = plant.truth(c.name, sets[0].name).value;
    return sets.map((set, index) => {
      const e = fit.estimate(set.states, { startsFollowEpisodes: false });
      // The start sets are drawn apart from the log (test/battery/startSets.ts), never its run starts: scored.
      const guard = startGuard(data, set.states, false);
      return {
        plant: plant.name, candidate: c.name, startSet: set.name, runStarts, seed, truth: plant.truth(c.name, set.name),
        network: { value: e.value, lower: e.interval.lower, upper: e.interval.upper },
        networkParts: {
          percentile: [...e.parts.percentile], basic: [...e.parts.basic], bootstrapStandardError: e.parts.bootstrapStandardError, iterateSpread: e.parts.iterateSpread,
          classErrorAllowance: e.parts.classErrorAllowance,
        },
        linear: { value: e.linear.value, lower: e.linear.interval.lower, upper: e.linear.interval.upper },
        difference: { value: e.difference.value, lower: e.difference.interval.lower, upper: e.difference.interval.upper },
        agreement: approximatorAgreement({ network: e, linear: e.linear, difference: e.difference }).verdict,
        status: fit.status, iterations: fit.history.length, seconds: fit.work.seconds, cpuSeconds: (cpu.user + cpu.system) / 1e6,
        ...(index === 0 ? { secondsToWithin3: secondsToWithin(fit, truth0, 0.03) } : {}),
        adamSteps: fit.work.adamSteps, stepSeconds: fit.work.stepSeconds, flop: fit.work.flop, backend: fit.backend,
        ...(fit.degreeChoice ? { degreeChoice: degreeChoiceRecord(fit.degreeChoice) } : {}),
        startGuard: { starts: guard.starts, outside: guard.outside, inside: guard.inside },
      };
    });
  } finally {
    fit.dispose();
  }
}

/** The degree choice's numbers as the records keep them (networkDegreeChoice.ts). */
function degreeChoiceRecord(c: DegreeChoice): NonNullable<FitRecord['degreeChoice']> {
  return {
    chosen: c.chosen, degrees: [...c.degrees], relativeError: [...c.relativeError], difference: c.difference, standardError: c.standardError,
    runsScored: c.runsScored, notCompared: c.notCompared,
  };
}

/** Set-up plus loop time at the first iterate after which every iterate's J stays within `share` of the truth; null if none. */
function secondsToWithin(fit: NetworkFit, truth: number, share: number): number | null {
  const h = fit.history, last = h[h.length - 1];
  if (!last) return null;
  let k = h.length;
  while (k > 0 && Math.abs(h[k - 1].policyValue - truth) <= share * Math.abs(truth)) k--;
  if (k === h.length) return null;
  const setUp = Math.max(0, fit.work.seconds - last.elapsedSeconds);
  return setUp + h[k].elapsedSeconds;
}

export async function runBatteryBench(args: string[]): Promise<void> {
  const o = parseOptions(args);
  const all = o.holdout ? holdoutPlants() : batteryPlants(), plants = all.filter((p) => !o.plants || o.plants.includes(p.name));
  if (plants.length === 0) throw new Error(`battery bench: no plant matches ${o.plants?.join(', ')}; have ${all.map((p) => p.name).join(', ')}`);
  console.log(`battery sweep: ${plants.length} plants, ${o.seeds} seeds, ${o.transitions.toLocaleString('en-US')} transitions, settings ${JSON.stringify(o.settings)}, method ${JSON.stringify(o.method)}`);
  const records: FitRecord[] = [], failed: { plant: string; candidate: string; seed: number; runStarts: string; message: string }[] = [];
  const choseDefault: { plant: string; candidate: string; seed: number; runStarts: string; degreeChoice: NonNullable<FitRecord['degreeChoice']> }[] = [];
  const folder = fileURLToPath(new URL('../test-artifacts/', import.meta.url));
  mkdirSync(folder, { recursive: true });
  const file = o.out ?? `${folder}battery-${new Date().toISOString().replace(/[:.]/g, '-')}.json`;
  const save = () => writeFileSync(file, JSON.stringify({ options: o, records, failed, choseDefault }, null, 1));
  for (const plant of plants) {
    const candidates = o.candidates === 'first' ? [0] : plant.candidates.map((_, i) => i);
    for (const candidate of candidates) {
      for (const runStarts of o.runStarts) for (let seed = 1; seed <= o.seeds; seed++) {
        if (o.skipDefaultChoice) {
          const data = plant.simulate({ transitions: o.transitions, seed, runStarts });
          const choice = chooseLinearPartDegree({ data, discount: plant.discount, seed: seed + o.fitSeedOffset });
          if (choice.chosen === LINEAR_PART_DEGREE) {
            choseDefault.push({ plant: plant.name, candidate: plant.candidates[candidate].name, seed, runStarts, degreeChoice: degreeChoiceRecord(choice) });
            console.log(`  ${plant.name} ${plant.candidates[candidate].name} seed ${seed} (runs logged ${runStarts}): degree ${choice.chosen} chosen, the default fit (not refitted)`);
            save();
            continue;
          }
        }
        let fitted: FitRecord[];
        try {
          fitted = await fitOne(plant, candidate, seed, runStarts, o);
        } catch (error) {
          // A fit that stops with no value is a row of the sweep, not the end of it (the user would read the same message).
          if (!(error instanceof NetworkDivergedError)) throw error;
          failed.push({ plant: plant.name, candidate: plant.candidates[candidate].name, seed, runStarts, message: error.message });
          console.log(`  ${plant.name} ${plant.candidates[candidate].name} seed ${seed} (runs logged ${runStarts}): NO VALUE — ${error.message}`);
          save();
          continue;
        }
        records.push(...fitted);
        save();
        const f = fitted[0], err = (x: number) => `${(100 * (x - f.truth.value) / Math.abs(f.truth.value)).toFixed(2)} %`;
        const degree = f.degreeChoice ? `, degree ${f.degreeChoice.chosen} chosen` : '';
        console.log(`  ${plant.name} ${f.candidate} seed ${seed}: network ${err(f.network.value)}, linear ${err(f.linear.value)} (${f.startSet}; runs logged ${runStarts}), ${f.status} after ${f.iterations}, ${f.seconds.toFixed(1)} s${degree}`);
      }
    }
  }
  printBatteryTable(records, COMPARATOR_DEGREE);
  if (failed.length > 0) console.log(`\n${failed.length} fit${failed.length === 1 ? '' : 's'} stopped with no value (not in the table above): ${failed.map((f) => `${f.plant} ${f.candidate} seed ${f.seed} (${f.runStarts})`).join('; ')}`);
  printAllowanceTable(records);
  save();
  console.log(`\nrecords written to ${file}`);
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  await runBatteryBench(process.argv.slice(2));
}
