/**
 * Two battery sweeps over the same logs compared row by row (plant × candidate × way of logging ×
 * start set), paired by seed: `npx tsx bench/batteryPairedTable.ts base.json variant.json`
 * (record files written by `npm run bench -- battery`, test-artifacts/battery-*.json).
 * Per row and per sweep: mean (signed) and largest |error| of the network's J in % of |truth|;
 * coverage of the 90 % interval without → with the class-error allowance (batteryAllowanceTable.ts);
 * how many seeds the agreement rule marked "disagree"; the converged share; median CPU seconds per fit;
 * confident and wrong: the interval as a user reads it (with the allowance) missing the truth with no
 * "disagree" mark; with the per-project degree choice (networkDegreeChoice.ts), how many seeds chose degree 4. Δ|err|: mean over seeds of |err variant| − |err base| ± its standard error
 * (sample standard deviation / √seeds); a row is "worse" when Δ|err| > 2 standard errors above 0
 * (the pre-stated rule of test/battery/README.md). Only seeds present in both files are paired.
 */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { allowancePair } from './batteryAllowanceTable';
import type { Estimate, FitRecord } from './batteryTable';

const holds = (e: Estimate, truth: number) => e.lower <= truth && truth <= e.upper;
const error = (r: FitRecord) => (100 * (r.network.value - r.truth.value)) / Math.abs(r.truth.value);
const key = (r: FitRecord) => `${r.plant.replace(/-g0\.\d+$/, '')} / ${r.candidate} / logged ${r.runStarts ?? 'steady'} / J over ${r.startSet}`;
const confidentWrong = (r: FitRecord) => !holds(allowancePair(r).after, r.truth.value) && r.agreement !== 'disagree';

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b), n = s.length;
  return n % 2 ? s[(n - 1) / 2] : (s[n / 2 - 1] + s[n / 2]) / 2;
}

function summary(rs: FitRecord[]): string {
  const e = rs.map(error), n = rs.length;
  const mean = e.reduce((a, b) => a + b, 0) / n, largest = Math.max(...e.map(Math.abs));
  const before = rs.filter((r) => holds(allowancePair(r).before, r.truth.value)).length, after = rs.filter((r) => holds(allowancePair(r).after, r.truth.value)).length;
  const disagree = rs.filter((r) => r.agreement === 'disagree').length, converged = rs.filter((r) => r.status === 'converged').length;
  const wrong = rs.filter(confidentWrong).length;
  const chosen = rs.some((r) => r.degreeChoice) ? ` | degree 4 chosen ${rs.filter((r) => r.degreeChoice?.chosen === 4).length}/${n}` : '';
  return `${mean.toFixed(2).padStart(6)} / ${largest.toFixed(2).padStart(5)} | ${before}→${after} | ${disagree} | ${converged}/${n} | ${median(rs.map((r) => r.cpuSeconds)).toFixed(1).padStart(5)} | ${wrong}${chosen}`;
}

export function printPairedTable(baseFile: string, variantFile: string): void {
  const read = (f: string) => (JSON.parse(readFileSync(f, 'utf8')) as { records: FitRecord[] }).records;
  const base = read(baseFile), variant = read(variantFile);
  const groups = new Map<string, { base: FitRecord[]; variant: FitRecord[] }>();
  for (const r of variant) {
    const b = base.find((x) => key(x) === key(r) && x.seed === r.seed);
    if (!b) continue;
    const g = groups.get(key(r)) ?? { base: [], variant: [] };
    g.base.push(b);
    g.variant.push(r);
    groups.set(key(r), g);
  }
  console.log(`base ${baseFile}\nvariant ${variantFile}`);
  console.log(`${'row'.padEnd(58)} | base: mean / largest | cover | disagree | converged | CPU s | conf&wrong || variant: same || Δ|err| ± SE`);
  for (const [k, g] of groups) {
    const d = g.variant.map((r, i) => Math.abs(error(r)) - Math.abs(error(g.base[i]))), n = d.length;
    const mean = d.reduce((a, b) => a + b, 0) / n, sd = Math.sqrt(d.reduce((a, x) => a + (x - mean) ** 2, 0) / Math.max(1, n - 1)), se = sd / Math.sqrt(n);
    const flag = mean > 2 * se ? '  WORSE' : mean < -2 * se ? '  better' : '';
    console.log(`${k.padEnd(58)} | ${summary(g.base)} || ${summary(g.variant)} || ${mean >= 0 ? '+' : ''}${mean.toFixed(2)} ± ${se.toFixed(2)} (${n})${flag}`);
  }
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) printPairedTable(process.argv[2], process.argv[3]);
