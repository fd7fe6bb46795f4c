/**
 * `npm run bench`: throughput figures, printed, never asserted. Each measurement runs in its own
 * child process so that peak memory (getrusage maxRSS) belongs to that measurement alone.
 *   npm run bench                 all benchmarks
 *   npm run bench -- linear       only the linear FQE sizes
 *   npm run bench -- bootstrap    only the bootstrap resampling rates
 *   npm run bench -- retune       only the retune map
 *   npm run bench -- memory       the plant-memory check's cost beside the whole evaluate (bench/plantMemoryBench.ts)
 *   npm run bench -- peer         the whole evaluate beside the numerical-Python peer script (the built CLI when out/cli/main.js is there)
 *   npm run bench -- cli-start    start-up of the command line: sources through tsx beside the built one (npm run build:cli)
 *   npm run bench -- app-thread   the app's assessment in Chromium with one thread and with its helper worker, 1,000,000 transitions
 *   npm run bench -- block-products   the data pass's block cross products, SIMD and scalar, beside the plain route (CPU time)
 *   npm run bench -- growth       slopes of evaluate time in transitions and in quadrature nodes
 *   npm run bench -- radial       the whole evaluate with radial-basis features, d = 343, 100,000 transitions
 *   npm run bench -- build-pairs <before/main.js> [pairs]   two builds of the CLI in alternating pairs beside the peer,
 *                                 1,000,000 transitions, wall and CPU (bench/buildPairsBench.ts)
 *   npm run bench -- import-pairs <before folder> [pairs]   two copies of the import's sources in alternating pairs:
 *                                 the tank log (beside numpy.loadtxt) and the peer's open, 1,000,000 rows (bench/importPairsBench.ts)
 *   npm run bench -- inspect-pairs <before folder> [pairs] [csv]   two copies of the app worker's first look at a data
 *                                 file (setData) in alternating pairs, the peer's 1,000,000-row log (bench/inspectionPairsBench.ts)
 *   npm run bench -- battery [options]   the battery sweep of the network and linear estimators
 *                                 (bench/batteryBench.ts; long: run it under `nice`)
 *   npm run bench -- battery-table f.json …   the network interval without and with the class-error
 *                                 allowance, from records the battery sweep wrote (bench/batteryAllowanceTable.ts)
 */
import { execFileSync } from 'node:child_process';
import { resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

type Job = { name: string; group: string; run: () => Promise<Record<string, number | string>> };

const jobs: Job[] = [
  ...[100_000, 1_000_000].map((n) => ({
    name: `linear FQE, ${n.toLocaleString('en-US')} transitions`, group: 'linear',
    run: async () => (await import('./linearBench')).runLinearBench(n),
  })),
  {
    name: 'network FQE, 100,000 transitions, default network (src/core/fqe/networkSettings.ts)', group: 'network',
    run: async () => (await import('./networkBench')).runNetworkBench(),
  },
  {
    name: 'bootstrap resamples, 100,000 transitions', group: 'bootstrap',
    run: async () => (await import('./bootstrapBench')).runBootstrapBench(),
  },
  {
    name: 'retune map, 100,000 transitions, 10×10 PI gain × integral time (heating-loop sample)', group: 'retune',
    run: async () => (await import('./retuneBench')).runRetuneBench(),
  },
  ...[100_000, 1_000_000].map((n) => ({
    name: `whole evaluate beside the numerical-Python peer, ${n.toLocaleString('en-US')} transitions`, group: 'peer',
    run: async () => (await import('./peerBench')).runPeerBench(n),
  })),
  {
    name: 'the app’s open, fit and assessment in Chromium, one thread beside the helper worker, 1,000,000 transitions (peer plant)', group: 'app-thread',
    run: async () => (await import('./appThreadBench')).runAppThreadBench(1_000_000),
  },
  {
    name: 'whole evaluate with radial-basis features, 7 centres per input (d = 343), 100,000 transitions, two runs', group: 'radial',
    run: async () => (await import('./radialBench')).runRadialBench(),
  },
  {
    name: 'growth of the whole evaluate in transitions and in quadrature nodes (log–log slopes)', group: 'growth',
    run: async () => (await import('./growthBench')).runGrowthBench(),
  },
  {
    name: 'command-line start-up: sources through tsx beside the built CLI (out/cli/main.js), fresh processes, medians', group: 'cli-start',
    run: async () => (await import('./cliStartBench')).runCliStartBench(),
  },
  {
    name: 'the plant-memory check beside the whole evaluate, 1,000,000 transitions (peer plant)', group: 'memory',
    run: async () => (await import('./plantMemoryBench')).runPlantMemoryBench(),
  },
  {
    name: 'the data pass\'s block cross products: the SIMD kernel and the scalar tiles beside one dot product per entry (CPU time)', group: 'block-products',
    run: async () => (await import('./blockProductsBench')).runBlockProductsBench(),
  },
  ...[1_000_000].map((n) => ({
    name: `CSV import, ${n.toLocaleString('en-US')} rows × 10 columns`, group: 'import',
    run: async () => ({ ...(await (await import('./importBench')).runImportBench(n)) }),
  })),
];

function format(value: number | string): string {
  if (typeof value === 'string') return value;
  if (Number.isInteger(value)) return value.toLocaleString('en-US');
  return Math.abs(value) >= 100 ? Math.round(value).toLocaleString('en-US') : value.toPrecision(4);
}

async function child(index: number): Promise<void> {
  process.stdout.write(JSON.stringify(await jobs[index].run()));
}

function parent(groups: string[]): void {
  const self = fileURLToPath(import.meta.url);
  jobs.forEach((job, index) => {
    if (groups.length && !groups.includes(job.group)) return;
    const out = execFileSync(process.execPath, ['--import', 'tsx', self, '--child', String(index)], { encoding: 'utf8', maxBuffer: 1 << 26 });
    const figures = JSON.parse(out) as Record<string, number | string>;
    console.log(`\n${job.name}`);
    for (const [key, value] of Object.entries(figures)) console.log(`  ${key.padEnd(28)} ${format(value)}`);
  });
}

const args = process.argv.slice(2);
if (args[0] === '--child') await child(Number(args[1]));
else if (args[0] === 'battery') await (await import('./batteryBench')).runBatteryBench(args.slice(1));
else if (args[0] === 'build-pairs') {
  const figures = (await import('./buildPairsBench')).runBuildPairsBench(resolve(args[1] ?? ''), args[2] ? Number(args[2]) : undefined);
  for (const [key, value] of Object.entries(figures)) console.log(`  ${key.padEnd(28)} ${format(value)}`);
} else if (args[0] === 'import-pairs') {
  const figures = (await import('./importPairsBench')).runImportPairsBench(resolve(args[1] ?? ''), args[2] ? Number(args[2]) : undefined);
  for (const [key, value] of Object.entries(figures)) console.log(`  ${key.padEnd(52)} ${format(value)}`);
} else if (args[0] === 'inspect-pairs') {
  const figures = (await import('./inspectionPairsBench')).runInspectionPairsBench(resolve(args[1] ?? ''), args[2] ? Number(args[2]) : undefined, args[3]);
  for (const [key, value] of Object.entries(figures)) console.log(`  ${key.padEnd(44)} ${format(value)}`);
} else if (args[0] === 'battery-table') (await import('./batteryAllowanceTable')).printAllowanceTableOf(args.slice(1));
else parent(args);
