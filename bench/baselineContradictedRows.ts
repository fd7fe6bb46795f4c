/**
 * A contradicted baseline judged by the rule written for it before any measurement (issue 9, task
 * baseline33: /work/notes/rule-baseline-contradicted.md), on the rows bench/holdoutCliRows.ts wrote
 * with --out: the candidate rows (`rows.json`) and the present controller's rows beside them
 * (`rows.baseline.json`, one per log):
 *
 *   npx tsx bench/baselineContradictedRows.ts /work/runs/baseline33-*.json
 *
 * (files ending .cli.json are skipped; .baseline.json files are the baseline rows, the rest candidate rows.)
 *
 * The proposal: where the present controller's confirmation is "contradicted", a serious whole-log
 * warning, so every candidate row of that log turns cautious. Adopt only if, on the linear rows,
 *  (a) it turns at most 10 % of the candidate rows that are "confident & right" today into cautious ones; and
 *  (b) where it fires, the present controller's J misses the truth of the plant's logging policy by more
 *      than 2 % of it, or its interval misses it by more than 2 of the truth's standard errors, on at
 *      least half of those logs.
 * Network rows are judged the same way and printed apart. Prints per plant: logs, logs where it fires,
 * confident & right candidate rows today and how many would turn cautious, confident & wrong rows that
 * would turn cautious, and where it fires whether the baseline's J misses its truth; then the details.
 */
import { rolloutTruthPlantNames } from '../test/battery/rolloutTruthPlants';
import { holdoutRowFiles, openTable, pct } from './holdoutRowFiles';

const PLANTS = rolloutTruthPlantNames();
const RULE = { maxTurned: 0.1, relative: 0.02, truthStandardErrors: 2, missShare: 0.5 } as const;

interface CandidateRow { plant: string; approximator: string; seed: number; candidate: string; kind: string }
interface BaselineRow {
  plant: string; approximator: string; seed: number;
  truth: { value: number; standardError: number }; j: number; err: number; interval: [number, number] | null;
  confirmation: { status: string; text: string };
  crossChecks: { label: string; agreement: string; note: string; value: number | null }[];
}

/** Does the baseline's J miss its truth by the rule: more than 2 % of it, or its interval by more than 2 of the truth's standard errors? */
function misses(b: BaselineRow): { relative: boolean; interval: boolean } {
  const t = b.truth.value, relative = Math.abs(b.j - t) / Math.abs(t) > RULE.relative;
  const gap = b.interval ? Math.max(b.interval[0] - t, t - b.interval[1], 0) : Infinity;
  return { relative, interval: gap > RULE.truthStandardErrors * b.truth.standardError };
}


function table(approximator: string, rows: CandidateRow[], baselines: BaselineRow[]): void {
  const mineB = baselines.filter((b) => b.approximator === approximator);
  if (!openTable(approximator, mineB.length, ['plant', 'logs', 'fires', 'confident & right rows', 'of them turned cautious', 'confident & wrong turned cautious',
    'fires and J misses truth (> 2 % / interval > 2 SE)', 'baseline status per seed'])) return;
  let logs = 0, fired = 0, right = 0, turned = 0, wrongTurned = 0, missed = 0, missRel = 0, missInt = 0;
  const details: string[] = [];
  for (const plant of PLANTS) {
    const bs = mineB.filter((b) => b.plant === plant).sort((a, b) => a.seed - b.seed);
    if (bs.length === 0) continue;
    let f = 0, r = 0, t = 0, w = 0, m = 0, mr = 0, mi = 0;
    for (const b of bs) {
      const cands = rows.filter((c) => c.plant === plant && c.approximator === approximator && c.seed === b.seed);
      const fires = b.confirmation.status === 'contradicted', miss = misses(b);
      r += cands.filter((c) => c.kind === 'confident & right').length;
      if (fires) {
        f++;
        t += cands.filter((c) => c.kind === 'confident & right').length;
        w += cands.filter((c) => c.kind === 'confident & wrong').length;
        if (miss.relative || miss.interval) m++;
        if (miss.relative) mr++;
        if (miss.interval) mi++;
      }
      const ivl = b.interval ? `${b.interval[0].toFixed(4)}..${b.interval[1].toFixed(4)}` : '-';
      details.push(`${plant}\tseed ${b.seed}\t${b.confirmation.status}\ttruth ${b.truth.value.toFixed(4)} ± ${b.truth.standardError.toFixed(4)}\tJ ${b.j.toFixed(4)} (${b.err.toFixed(2)} %)\t` +
        `interval ${ivl}\tmisses: >2 % ${miss.relative}, interval ${miss.interval}\t${b.crossChecks.filter((x) => x.agreement === 'disagrees').map((x) => `${x.label} ${x.value?.toFixed(4)}`).join('; ')}`);
    }
    logs += bs.length; fired += f; right += r; turned += t; wrongTurned += w; missed += m; missRel += mr; missInt += mi;
    console.log(`| \`${plant}\` | ${bs.length} | ${f} | ${r} | ${t} | ${w} | ${f ? `${m} (${mr} / ${mi})` : '-'} | ${bs.map((b) => b.confirmation.status).join(', ')} |`);
  }
  console.log(`| **total** | ${logs} | ${fired} | ${right} | ${turned} (${pct(turned, right)}) | ${wrongTurned} | ${fired ? `${missed} (${missRel} / ${missInt}) = ${pct(missed, fired)}` : '-'} | |`);
  console.log('');
  console.log(details.map((d) => `  ${d}`).join('\n'));
  const a = turned <= RULE.maxTurned * right, b = fired > 0 && missed >= RULE.missShare * fired;
  console.log('');
  console.log(`(a) confident & right rows turned cautious: ${turned}/${right} (at most ${100 * RULE.maxTurned} %): ${a ? 'PASS' : 'FAIL'}`);
  console.log(`(b) where it fires, the baseline's J misses its truth: ${missed}/${fired} (at least ${100 * RULE.missShare} %): ${fired === 0 ? 'NO EVIDENCE (it never fired)' : b ? 'PASS' : 'FAIL'}`);
  const missing = PLANTS.filter((p) => !mineB.some((x) => x.plant === p));
  console.log(`plants run: ${PLANTS.length - missing.length} of ${PLANTS.length}${missing.length ? `; not run: ${missing.join(', ')}` : ''}`);
  if (approximator === 'linear') {
    const verdict = fired === 0 ? (a ? 'ADOPT ON THE PRINCIPLE ONLY (it never fired: the evidence is empty)' : 'DO NOT ADOPT') : a && b ? 'ADOPT' : 'DO NOT ADOPT';
    console.log(`verdict (linear rows decide; every plant must have been run): ${missing.length ? 'INCOMPLETE: ' : ''}${verdict}`);
  }
}

function main() {
  const { rows, baselines } = holdoutRowFiles<CandidateRow, BaselineRow>(process.argv.slice(2), 'npx tsx bench/baselineContradictedRows.ts rows.json rows.baseline.json [more …]');
  for (const approximator of ['linear', 'network']) table(approximator, rows, baselines);
}
main();
