/**
 * Completes a `--skip-default-choice` sweep (bench/batteryBench.ts) from a default sweep over the same
 * logs: `npx tsx bench/batteryChoiceMerge.ts default.json choose.json out.json`. A log whose chosen
 * degree is the default was fitted with exactly the default method, data and seed, so its records
 * are the default sweep's, with the choice's numbers added. Logs missing from the default sweep are
 * listed and left out.
 */
import { readFileSync, writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import type { FitRecord } from './batteryTable';

interface SweepFile {
  options: unknown;
  records: FitRecord[];
  failed: unknown[];
  choseDefault?: { plant: string; candidate: string; seed: number; runStarts: string; degreeChoice: NonNullable<FitRecord['degreeChoice']> }[];
}

export function mergeChoice(defaultFile: string, chooseFile: string, outFile: string): void {
  const base = JSON.parse(readFileSync(defaultFile, 'utf8')) as SweepFile, choose = JSON.parse(readFileSync(chooseFile, 'utf8')) as SweepFile;
  const records = [...choose.records], missing: string[] = [];
  for (const c of choose.choseDefault ?? []) {
    const same = base.records.filter((r) => r.plant === c.plant && r.candidate === c.candidate && r.seed === c.seed && (r.runStarts ?? 'steady') === c.runStarts);
    if (same.length === 0) missing.push(`${c.plant} ${c.candidate} seed ${c.seed} (${c.runStarts})`);
    records.push(...same.map((r) => ({ ...r, degreeChoice: c.degreeChoice })));
  }
  writeFileSync(outFile, JSON.stringify({ options: choose.options, records, failed: choose.failed, mergedFrom: [defaultFile, chooseFile] }, null, 1));
  console.log(`${records.length} records written to ${outFile}${missing.length ? `; not in the default sweep: ${missing.join('; ')}` : ''}`);
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) mergeChoice(process.argv[2], process.argv[3], process.argv[4]);
