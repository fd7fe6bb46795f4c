/**
 * One import in a fresh process, for bench/importPairsBench.ts: the tank log (bench/tankLog.ts) as
 * `npm run bench -- import` reads it, or the peer's project opened as `evaluate` opens it (the data
 * file in pieces, Node's SHA-256 for its fingerprint), with the import modules of the `src` folder
 * given, so that an earlier copy of the sources runs beside this one. Prints one JSON line: wall and
 * CPU seconds of the import (modules loaded before the clock starts), peak RSS and minor page faults.
 *   node --import tsx bench/importOnce.ts <src folder> tank|peer <file>
 */
import { readFile } from 'node:fs/promises';
import { dirname, join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { TANK_ROLES } from './tankLog';

const [srcFolder, which, file] = process.argv.slice(2);
const module = async (path: string) => import(pathToFileURL(join(resolve(srcFolder), path)).href);

const { importDataset } = await module('data/importDataset.ts');
const { openProject } = await module('pipeline/openProject.ts');
const { MAX_DATA_BYTES, openRegularFile } = await module('host/regularFile.ts');
const { STREAMED_FILE_BYTES } = await module('core/limits.ts');
const { nativeSha256 } = await module('cli/nativeSha256.ts');

/** As the command line opens a data file (cli/evaluateProjectFile.ts): in pieces from STREAMED_FILE_BYTES on, else whole. */
async function dataFile(path: string) {
  const opened = await openRegularFile(path, { maxBytes: MAX_DATA_BYTES, what: 'data file' });
  if (opened.byteLength >= STREAMED_FILE_BYTES) return opened;
  try {
    return { bytes: await opened.readAll() };
  } finally {
    await opened.close();
  }
}

async function importTank(): Promise<number> {
  const source = await dataFile(file);
  const result = importDataset(source, 'bench.csv', { delimiter: 'auto', decimalMark: 'auto', badRows: 'stop' }, TANK_ROLES);
  if ('close' in source) await source.close();
  if (!result.ok) throw new Error(JSON.stringify(result.problems[0]));
  return result.value.transitions.count;
}

async function openPeer(): Promise<number> {
  const opened = await openProject(await readFile(file, 'utf8'), 'peer.spcritic', (p: string) => dataFile(join(dirname(file), p)), { sha256: nativeSha256 });
  if (!opened.ok) throw new Error(JSON.stringify(opened.problems[0]));
  return opened.value.dataset.count;
}

const faults = process.resourceUsage().minorPageFault, wall = performance.now(), cpu = process.cpuUsage();
const transitions = which === 'peer' ? await openPeer() : await importTank();
const used = process.cpuUsage(cpu), usage = process.resourceUsage();
console.log(JSON.stringify({
  wallSeconds: (performance.now() - wall) / 1000, cpuSeconds: (used.user + used.system) / 1e6,
  peakRssMiB: usage.maxRSS / 1024, minorFaults: usage.minorPageFault - faults, transitions,
}));
