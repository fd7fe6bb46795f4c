/**
 * The width sweep's points at their iteration limit, measured for the rule of
 * /work/notes/sweep36-width-rule.md (test/battery/README.md, "Width points stopped at their limit"):
 * per battery plant and seed, the network fitted at the project's width ([32, 32], the defaults)
 * and at every hidden layer halved and doubled (assessSensitivity.ts sweptWidths), each with its
 * status, its last-window drift Δ (lastWindowDrift below), the project fit's interval
 * half-width h on the same log, and its error against the battery's truth.
 *
 *   nice -n 10 npx tsx bench/widthLimitRows.ts [--plants a,b] [--seeds 1,2,3] [--candidate firmer] [--transitions 100000] [--out file]
 *
 * Prints one line per fit as it ends and a table at the close; records go to test-artifacts/.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { fitNetworkFqe } from '../src/core/fqe/networkFqe';
import { defaultNetworkSettings } from '../src/core/fqe/networkSettings';
import { createGaussianPolicy } from '../src/core/policy';
import { sweptWidths } from '../src/pipeline/assessSensitivity';
import { batteryPlant } from '../test/battery/catalogue';

const wasmPath = fileURLToPath(new URL('../node_modules/@tensorflow/tfjs-backend-wasm/dist/', import.meta.url));

interface Row { plant: string; seed: number; layers: number[]; status: string; iterations: number; value: number; truth: number; drift: number | null; halfWidth: number; cpuSeconds: number }

function option(args: string[], name: string, fallback: string): string {
  const i = args.indexOf(name);
  return i >= 0 && i + 1 < args.length ? args[i + 1] : fallback;
}

async function main(args: string[]): Promise<void> {
  const plants = option(args, '--plants', 'pendulum-saturating-g0.97,greenhouse-clipped-g0.95').split(',');
  const seeds = option(args, '--seeds', '1,2,3').split(',').map(Number), candidateName = option(args, '--candidate', 'firmer');
  const transitions = Number(option(args, '--transitions', '100000'));
  const folder = fileURLToPath(new URL('../test-artifacts/', import.meta.url));
  mkdirSync(folder, { recursive: true });
  const file = option(args, '--out', `${folder}width-limit-${new Date().toISOString().replace(/[:.]/g, '-')}.json`);
  const rows: Row[] = [];
  const widths = sweptWidths(defaultNetworkSettings.hiddenLayers).sort((a, b) => Math.abs(a.factor - 1) - Math.abs(b.factor - 1)); // the project's own first: it gives h
  for (const name of plants) {
    const plant = batteryPlant(name), c = plant.candidates.find((x) => x.name === candidateName) ?? plant.candidates[0], sets = plant.startSets();
    const truth = plant.truth(c.name, sets[0].name).value;
    for (const seed of seeds) {
      const data = plant.simulate({ transitions, seed, runStarts: 'steady' });
      let halfWidth = NaN;
      for (const { hiddenLayers } of widths) {
        const cpu = process.cpuUsage();
        const fit = await fitNetworkFqe({
          data, policy: createGaussianPolicy(c.spec, plant.stateDim), discount: plant.discount, quadratureNodes: 10, seed, wasmPath,
          startStates: sets[0].states, settings: { ...defaultNetworkSettings, hiddenLayers },
        });
        try {
          const e = fit.estimate(sets[0].states, { startsFollowEpisodes: false });
          if (hiddenLayers.join() === defaultNetworkSettings.hiddenLayers.join()) halfWidth = (e.interval.upper - e.interval.lower) / 2;
          const used = process.cpuUsage(cpu);
          const row: Row = {
            plant: name, seed, layers: hiddenLayers, status: fit.status, iterations: fit.history.length, value: e.value, truth,
            drift: lastWindowDrift(fit.history.map((h) => h.policyValue), fit.convergence.rule.window), halfWidth, cpuSeconds: (used.user + used.system) / 1e6,
          };
          rows.push(row);
          writeFileSync(file, JSON.stringify(rows, null, 1));
          console.log(`  ${line(row)}`);
        } finally {
          fit.dispose();
        }
      }
    }
  }
  console.log('\n| plant | seed | layers | status (iterations) | J − truth | Δ | h | Δ ≤ h (rule draws) | \\|e\\| ≤ 2h (right enough) |\n|---|---|---|---|---|---|---|---|---|');
  for (const r of rows) console.log(`| ${r.plant} | ${r.seed} | ${r.layers.join('×')} | ${r.status} (${r.iterations}) | ${fmt(r.value - r.truth)} | ${r.drift === null ? '—' : fmt(r.drift)} | ${fmt(r.halfWidth)} | ${r.status === 'maxIterations' ? (r.drift !== null && r.drift <= r.halfWidth ? 'drawn' : 'gap') : '(converged: drawn)'} | ${Math.abs(r.value - r.truth) <= 2 * r.halfWidth ? 'yes' : 'no'} |`);
  console.log(`\nrecords written to ${file}`);
}

/**
 * How far J still moved at the end of a network fit, in reward units: the mean J of the last W outer
 * iterations against the mean of the W before them — the two windows the stopping rule compares
 * (core/fqe/networkConvergence.ts, W = the settings' `patience`), J only and not relative. Null where
 * there is no window (W = 0) or fewer than 2W iterates.
 */
function lastWindowDrift(policyValues: readonly number[], window: number): number | null {
  const k = policyValues.length;
  if (!(window > 0) || k < 2 * window) return null;
  let recent = 0, earlier = 0;
  for (let i = k - window; i < k; i++) recent += policyValues[i] / window;
  for (let i = k - 2 * window; i < k - window; i++) earlier += policyValues[i] / window;
  return Math.abs(recent - earlier);
}

function line(r: Row): string {
  return `${r.plant} seed ${r.seed} ${r.layers.join('×')}: ${r.status} after ${r.iterations}, J ${fmt(r.value)} (truth ${fmt(r.truth)}), Δ ${r.drift === null ? '—' : fmt(r.drift)}, h ${fmt(r.halfWidth)}, ${r.cpuSeconds.toFixed(0)} s CPU`;
}

function fmt(x: number): string {
  return Math.abs(x) >= 0.01 || x === 0 ? x.toFixed(4) : x.toExponential(2);
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) await main(process.argv.slice(2));
