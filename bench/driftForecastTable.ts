/**
 * bench/driftForecastRows.ts's rows read by the rule written before measuring (/work/notes/drift40-rule.md):
 * per plant, the rows whose interval holds the end-of-log truth and the mean |error| of the whole log, the
 * latest third and the forecast; the median width ratio forecast ÷ whole log; the trials; then the four
 * adoption criteria, each met or not; beside them (drift41's rule), the present controller's forecast holding per drifting log.
 *
 *   npx tsx bench/driftForecastTable.ts rows.jsonl [more.jsonl …]
 */
import { readFileSync } from 'node:fs';

interface Estimate { j: number; err: number; interval: [number, number]; holds: boolean }
interface Row { group: string; plant: string; seed: number; who: string; truth: number; whole: Estimate; third: Estimate; forecast: Estimate; widthRatio: number; k: number }
interface TrialRow { group: string; plant: string; seed: number; trial: { named: string | null; verdict: string } }

const lines = process.argv.slice(2).flatMap((f) => readFileSync(f, 'utf8').split('\n').filter(Boolean).map((l) => JSON.parse(l) as Row | TrialRow));
const rows = lines.filter((l): l is Row => 'who' in l), trials = lines.filter((l): l is TrialRow => 'trial' in l);

const meanAbs = (xs: Row[], pick: (r: Row) => Estimate) => xs.reduce((a, r) => a + Math.abs(pick(r).err), 0) / xs.length;
const count = (xs: Row[], pick: (r: Row) => Estimate) => `${xs.filter((r) => pick(r).holds).length} of ${xs.length}`;
const median = (xs: number[]) => { const s = [...xs].sort((a, b) => a - b), m = s.length >> 1; return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2; };

console.log('| group | plant | rows | whole log: holds, mean abs error | latest third: holds, mean abs error | forecast: holds, mean abs error | median width ÷ whole | trials (forecast) |');
console.log('|---|---|---|---|---|---|---|---|');
const plants = [...new Set(rows.map((r) => r.plant))];
for (const plant of plants) {
  const xs = rows.filter((r) => r.plant === plant), ts = trials.filter((t) => t.plant === plant);
  const trialWords = ts.map((t) => (t.trial.named === null ? t.trial.verdict : `${t.trial.named} ${t.trial.verdict}`)).join('; ');
  console.log(`| ${xs[0].group} | ${plant} | ${xs.length} | ${count(xs, (r) => r.whole)}, ${meanAbs(xs, (r) => r.whole).toFixed(1)} % | ${count(xs, (r) => r.third)}, ${meanAbs(xs, (r) => r.third).toFixed(1)} % | `
    + `${count(xs, (r) => r.forecast)}, ${meanAbs(xs, (r) => r.forecast).toFixed(1)} % | ${median(xs.map((r) => r.widthRatio)).toFixed(2)} | ${trialWords} |`);
}

const drifting = rows.filter((r) => r.group === 'drifting'), stationary = rows.filter((r) => r.group === 'stationary');
const share = (xs: Row[]) => xs.filter((r) => r.forecast.holds).length / xs.length;
const errorsBelow = [...new Set(drifting.map((r) => r.plant))].map((p) => {
  const xs = drifting.filter((r) => r.plant === p), f = meanAbs(xs, (r) => r.forecast);
  return { p, ok: f < meanAbs(xs, (r) => r.whole) && f < meanAbs(xs, (r) => r.third) };
});
const wrong = trials.filter((t) => t.trial.verdict === 'WRONG');
console.log(`\n1. drifting, forecast interval holds: ${drifting.filter((r) => r.forecast.holds).length} of ${drifting.length} (${(100 * share(drifting)).toFixed(0)} %; need ≥ 80 %): ${share(drifting) >= 0.8 ? 'met' : 'NOT met'}`);
console.log(`2. forecast mean |error| below the whole log's and the latest third's on every drifting plant: ${errorsBelow.every((e) => e.ok) ? 'met' : `NOT met (${errorsBelow.filter((e) => !e.ok).map((e) => e.p).join(', ')})`}`);
console.log(`3. stationary, forecast interval holds: ${stationary.filter((r) => r.forecast.holds).length} of ${stationary.length} (${stationary.length ? (100 * share(stationary)).toFixed(0) : '-'} %; need ≥ 80 %): ${stationary.length && share(stationary) >= 0.8 ? 'met' : 'NOT met'}`);
console.log(`4. no wrong trial from the forecast differences: ${wrong.length === 0 ? 'met' : `NOT met (${wrong.map((t) => `${t.plant} s${t.seed} ${t.trial.named}`).join(', ')})`} (${trials.length} logs)`);

// Reported beside, not a criterion (drift41's rule): the present controller's forecast interval holding its end-of-log truth, per drifting log.
const presentRows = drifting.filter((r) => r.who === 'present controller');
const presentWords = [...new Set(presentRows.map((r) => r.plant))].map((p) => {
  const xs = presentRows.filter((r) => r.plant === p), worst = Math.max(...xs.map((r) => Math.abs(r.forecast.err)));
  return `${p} ${xs.filter((r) => r.forecast.holds).length} of ${xs.length} (|error| ≤ ${worst.toFixed(1)} %)`;
});
console.log(`\nBeside: the present controller's forecast interval holds on ${presentRows.filter((r) => r.forecast.holds).length} of ${presentRows.length} drifting logs — ${presentWords.join('; ')}`);
