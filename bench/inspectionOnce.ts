/**
 * The app worker's first look at a data file (`setData`: inspectData) in a fresh process, for
 * bench/inspectionPairsBench.ts, with the inspection module of the `src` folder given, so that an
 * earlier copy of the sources runs beside this one. The file's bytes are read and the module loaded
 * before the clock starts, as the worker holds the bytes when the request arrives. Prints one JSON
 * line: CPU seconds of the look, the peak RSS it added above what the process held before it, and
 * the V8 heap in use right after it (before any collection is asked for).
 *   node --import tsx bench/inspectionOnce.ts <src folder> <csv file>
 */
import { readFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';

const [srcFolder, file] = process.argv.slice(2);
const { inspectData } = await import(pathToFileURL(join(resolve(srcFolder), 'renderer/src/worker/dataInspection.ts')).href);
const bytes = new Uint8Array(readFileSync(file));
const csv = { delimiter: 'auto', decimalMark: 'auto', badRows: 'stop' };

const rssBeforeMiB = Math.max(process.memoryUsage().rss, process.resourceUsage().maxRSS * 1024) / 2 ** 20;
const heapBeforeMiB = process.memoryUsage().heapUsed / 2 ** 20;
const cpu = process.cpuUsage();
const result = inspectData(bytes, 'log.csv', csv);
const used = process.cpuUsage(cpu);
const heapAfterMiB = process.memoryUsage().heapUsed / 2 ** 20;
if (!result.ok) throw new Error(JSON.stringify(result.problems[0]));
console.log(JSON.stringify({
  cpuSeconds: (used.user + used.system) / 1e6,
  peakRssAddedMiB: process.resourceUsage().maxRSS / 1024 - rssBeforeMiB,
  heapAddedMiB: heapAfterMiB - heapBeforeMiB,
  columns: result.value.header.length,
}));
