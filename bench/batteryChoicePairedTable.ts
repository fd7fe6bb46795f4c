/**
 * The paired table of a per-project degree choice over ALL the logs it was run on:
 * `npx tsx bench/batteryChoicePairedTable.ts default.json choose.json`, both written with
 * `--skip-default-choice` (bench/batteryBench.ts), the first with the default method, the second with
 * `{"linearPartDegree":"choose"}`. A log where the default degree was chosen gets exactly the default
 * fit (networkFqe.test.ts checks it to the bit), so its change of |J error| is 0; a log where degree 4
 * was chosen is paired with its default fit. Per row (plant × way of logging × start set): seeds
 * counted (logs where 4 was chosen and both fits exist, plus logs where 2 was chosen); for the logs
 * where 4 was chosen, mean (signed) and largest |error| in % of |truth| at degree 2 and as chosen;
 * confident and wrong (the interval a user reads, allowance included, missing the truth with no
 * "disagree" mark) default → chosen; Δ|err| over all seeds counted ± standard error (sd/√n), "worse"
 * when above 0 by more than 2 standard errors (the rule of test/battery/README.md).
 *
 * `--guarded` (third argument): the choice guarded by where J's starts lie
 * (src/core/fqe/degreeChoiceStartGuard.ts), composed per start set from the same two fits. The bench
 * fits once for both start sets; a chosen record whose start set fails the guard over its log
 * (record.startGuard.inside false) is what the guarded choice would have fitted at the default degree —
 * the default fit, with its change 0 — and a record that passes is the chosen fit. Exact, because the
 * guard changes only the degree, and the fit at each degree is the same to the bit whether the
 * criterion or the method asked for it (networkFqe.test.ts). The column "kept 2" counts the logs where
 * degree 4 was chosen and the guard kept 2.
 */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import type { FitRecord } from './batteryTable';

interface SweepFile { records: FitRecord[]; choseDefault?: { plant: string; candidate: string; seed: number; runStarts: string }[] }

const error = (r: FitRecord) => (100 * (r.network.value - r.truth.value)) / Math.abs(r.truth.value);
const confidentWrong = (r: FitRecord) => !(r.network.lower <= r.truth.value && r.truth.value <= r.network.upper) && r.agreement !== 'disagree';

export function printChoicePairedTable(defaultFile: string, chooseFile: string, guarded = false): void {
  const base = (JSON.parse(readFileSync(defaultFile, 'utf8')) as SweepFile).records, choose = JSON.parse(readFileSync(chooseFile, 'utf8')) as SweepFile;
  const rows = new Map<string, { zeros: number[]; pairs: [FitRecord, FitRecord][]; kept: number }>();
  const row = (k: string) => rows.get(k) ?? rows.set(k, { zeros: [], pairs: [], kept: 0 }).get(k)!;
  const startSets = [...new Set([...base, ...choose.records].map((r) => r.startSet))];
  for (const c of choose.choseDefault ?? []) for (const set of startSets) row(`${c.plant} / ${c.candidate} / logged ${c.runStarts} / J over ${set}`).zeros.push(c.seed);
  for (const r of choose.records) {
    const b = base.find((x) => x.plant === r.plant && x.candidate === r.candidate && x.startSet === r.startSet && x.seed === r.seed && x.runStarts === r.runStarts);
    const g = row(`${r.plant} / ${r.candidate} / logged ${r.runStarts} / J over ${r.startSet}`);
    if (guarded && r.degreeChoice && r.degreeChoice.chosen !== r.degreeChoice.degrees[0]) {
      if (!r.startGuard) throw new Error(`--guarded: a record of ${r.plant} seed ${r.seed} has no startGuard (a sweep from before the guard)`);
      if (!r.startGuard.inside) {
        g.zeros.push(r.seed);
        g.kept++;
        continue;
      }
    }
    if (b) g.pairs.push([b, r]);
  }
  console.log(`default ${defaultFile}\nchoose ${chooseFile}${guarded ? '\nguarded by where J’s starts lie' : ''}`);
  console.log(`row | seeds (4 used)${guarded ? ' | kept 2' : ''} | degree 2 where 4 used: mean / largest | chosen: mean / largest | conf&wrong 2 → chosen | Δ|err| ± SE over all seeds`);
  for (const [k, g] of [...rows].sort(([a], [b]) => a.localeCompare(b))) {
    const d = [...g.zeros.map(() => 0), ...g.pairs.map(([b, c]) => Math.abs(error(c)) - Math.abs(error(b)))], n = d.length;
    const mean = d.reduce((a, x) => a + x, 0) / n, se = Math.sqrt(d.reduce((a, x) => a + (x - mean) ** 2, 0) / Math.max(1, n - 1)) / Math.sqrt(n);
    const summary = (rs: FitRecord[]) => rs.length === 0 ? '—' : `${(rs.map(error).reduce((a, x) => a + x, 0) / rs.length).toFixed(2)} / ${Math.max(...rs.map((r) => Math.abs(error(r)))).toFixed(2)}`;
    const flag = mean > 2 * se ? '  WORSE' : mean < -2 * se ? '  better' : '';
    const wrong = (rs: FitRecord[]) => rs.filter(confidentWrong).length;
    console.log(`${k} | ${n} (${g.pairs.length})${guarded ? ` | ${g.kept}` : ''} | ${summary(g.pairs.map((p) => p[0]))} | ${summary(g.pairs.map((p) => p[1]))} | ${wrong(g.pairs.map((p) => p[0]))} → ${wrong(g.pairs.map((p) => p[1]))} | ${mean >= 0 ? '+' : ''}${mean.toFixed(2)} ± ${se.toFixed(2)}${flag}`);
  }
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) printChoicePairedTable(process.argv[2], process.argv[3], process.argv[4] === '--guarded');
