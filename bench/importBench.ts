/**
 * Import throughput, side by side with a plain numerical-Python read of the same file: a rows × 10
 * CSV (a logged two-tank plant: time, six levels and flows, two valve moves, a cost; semicolons and
 * decimal commas) is written once to a temp file by a separate process, then this process reads its
 * bytes as the command line does and imports them into a TransitionSet (dialect, header, cells,
 * timestamps, episodes, transitions, summary), and bench/importReference.py reads the same file
 * with numpy.loadtxt and with the csv module. Prints MB/s and rows/s (wall and CPU), peak memory and
 * the ratios of our time to the Python reads' (below 1: faster); never asserts. Peak memory is this
 * process's (getrusage maxRSS), so it includes Node itself, the TypeScript loader and whatever of the
 * file's bytes the import holds (a file of STREAMED_FILE_BYTES or more is read in pieces, as the
 * command line reads it: src/cli/evaluateProjectFile.ts), in MiB and in MB (10⁶ bytes, the unit of
 * issue 11's limit). `--whole` reads the file whole and hands the bytes over instead, for comparison.
 *   npm run bench -- import        or        npx tsx bench/importBench.ts 1000000
 */
import { execFileSync } from 'node:child_process';
import { statSync, writeFileSync } from 'node:fs';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { importDataset } from '../src/data/importDataset';
import { MAX_DATA_BYTES, openRegularFile } from '../src/host/regularFile';
import { STREAMED_FILE_BYTES } from '../src/core/limits';
import { synthesiseTankLog, TANK_ROLES, tankLogFile } from './tankLog';

interface Reference {
  numpyLoadtxt: { wallSeconds: number; cpuSeconds: number };
  csvModule: { wallSeconds: number; cpuSeconds: number };
  peakRssMiB: number;
  numpy: string;
}

function pythonReference(path: string): Reference | null {
  try {
    const script = fileURLToPath(new URL('./importReference.py', import.meta.url));
    return JSON.parse(execFileSync('python3', [script, path], { encoding: 'utf8', maxBuffer: 1 << 20 })) as Reference;
  } catch {
    return null;
  }
}

export async function runImportBench(rows: number, whole = false): Promise<Record<string, number | string>> {
  const path = tankLogFile(rows);
  const megabytes = statSync(path).size / 1e6;
  const wall = performance.now(), cpu = process.cpuUsage();
  // As the command line reads it (cli/evaluateProjectFile.ts): a large file in pieces; a small one (or --whole) read whole and handed over.
  const file = await openRegularFile(path, { maxBytes: MAX_DATA_BYTES, what: 'data file' });
  const streamed = !whole && file.byteLength >= STREAMED_FILE_BYTES;
  const source = streamed ? file : { bytes: await file.readAll() };
  const result = importDataset(source, 'bench.csv', { delimiter: 'auto', decimalMark: 'auto', badRows: 'stop' }, TANK_ROLES);
  await file.close();
  const seconds = (performance.now() - wall) / 1000, used = process.cpuUsage(cpu), cpuSeconds = (used.user + used.system) / 1e6;
  if (!result.ok) throw new Error(`benchmark import failed: ${result.problems[0].where}: ${result.problems[0].message}`);
  const peakRssBytes = process.resourceUsage().maxRSS * 1024;
  const reference = pythonReference(path);
  const rowsRead = result.value.rowCount;
  const figures: Record<string, number | string> = {
    'file MB': megabytes, 'file read': streamed ? 'in pieces' : 'whole, handed over', 'rows read': rowsRead, transitions: result.value.transitions.count,
    'read + import s (wall)': seconds, 'read + import s (CPU)': cpuSeconds,
    'MB/s (wall)': megabytes / seconds, 'MB/s (CPU)': megabytes / cpuSeconds,
    'rows/s (wall)': rowsRead / seconds, 'rows/s (CPU)': rowsRead / cpuSeconds,
    'peak RSS MiB': peakRssBytes / 2 ** 20, 'peak RSS MB (10^6 B)': peakRssBytes / 1e6,
  };
  if (!reference) return { ...figures, 'numerical Python': 'python3 with numpy not available' };
  const { numpyLoadtxt: loadtxt, csvModule } = reference;
  return {
    ...figures,
    'numpy.loadtxt s (wall)': loadtxt.wallSeconds, 'numpy.loadtxt s (CPU)': loadtxt.cpuSeconds, 'numpy.loadtxt MB/s (CPU)': megabytes / loadtxt.cpuSeconds,
    'csv module s (CPU)': csvModule.cpuSeconds,
    'ratio to loadtxt (wall)': seconds / loadtxt.wallSeconds, 'ratio to loadtxt (CPU)': cpuSeconds / loadtxt.cpuSeconds,
    'ratio to csv module (CPU)': cpuSeconds / csvModule.cpuSeconds,
    'Python peak RSS MiB': reference.peakRssMiB, numpy: reference.numpy,
  };
}

if (process.argv[2] === '--write') {
  writeFileSync(process.argv[4], synthesiseTankLog(Number(process.argv[3])));
} else if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  const figures = await runImportBench(Number(process.argv[2] ?? 1_000_000), process.argv.includes('--whole'));
  for (const [key, value] of Object.entries(figures)) console.log(`${key.padEnd(28)} ${typeof value === 'number' ? +value.toPrecision(4) : value}`);
}
