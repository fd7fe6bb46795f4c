/**
 * The present controller in the compared function classes judged by the rule written for it before
 * any measurement (issue 9, task baseline35: /work/notes/rule-baseline-classes.md), on the rows
 * bench/holdoutCliRows.ts wrote with --out (candidate rows `rows.json`, the present controller's rows
 * `rows.baseline.json`, one per log, with its class verdict, range to report and the truth of the
 * plant's logging policy):
 *
 *   npx tsx bench/baselineClassRows.ts /work/runs/baseline35-*.json
 *
 * (files ending .cli.json are skipped.) Per log: the baseline MISSES its truth when its J is off by more
 * than 2 % of |truth| or its interval misses the truth by more than 2 of the truth's standard errors
 * (as bench/baselineContradictedRows.ts); the check FIRES when its verdict is "not settled"; a miss is
 * CAUGHT when it fires or the range to report holds the truth within 2 truth standard errors.
 * Adopt only if (a) at least half of the misses are caught, (b) it fires on at most 25 % of the logs
 * where the baseline is right, (c) at most 10 % of the candidate rows that are "confident & right"
 * without the new whole-log warning turn cautious with it. Linear rows decide; network rows apart.
 */
import { rolloutTruthPlantNames } from '../test/battery/rolloutTruthPlants';
import { holdoutRowFiles, openTable, pct } from './holdoutRowFiles';

const PLANTS = rolloutTruthPlantNames();
const RULE = { relative: 0.02, truthStandardErrors: 2, caughtShare: 0.5, maxFiresRight: 0.25, maxTurned: 0.1 } as const;
/** The new whole-log caution's topic (src/pipeline/baselineClassWarning.ts). */
const NEW_TOPIC = 'baselineNotSettled';

type Warning = { severity: string; topic: string; candidate?: string };
interface CandidateRow { plant: string; approximator: string; seed: number; candidate: string; kind: string; settled: boolean | null; holds: boolean; warnings: Warning[] }
interface BaselineRow {
  plant: string; approximator: string; seed: number; truth: { value: number; standardError: number }; j: number; err: number;
  interval: [number, number] | null; settled?: boolean | null; range?: [number, number] | null; rangeHolds?: boolean | null; reason?: string | null;
}

function misses(b: BaselineRow): boolean {
  const t = b.truth.value, relative = Math.abs(b.j - t) / Math.abs(t) > RULE.relative;
  const gap = b.interval ? Math.max(b.interval[0] - t, t - b.interval[1], 0) : Infinity;
  return relative || gap > RULE.truthStandardErrors * b.truth.standardError;
}

/** A candidate row's kind as bench/holdoutCliRows.ts gives it, with or without the new whole-log warning. */
function kindOf(c: CandidateRow, withNew: boolean): string {
  const serious = c.warnings.some((w) => w.severity === 'serious' && (withNew || w.topic !== NEW_TOPIC));
  return !serious && c.settled !== false ? (c.holds ? 'confident & right' : 'confident & wrong') : c.holds ? 'cautious & right' : 'cautious & wrong';
}

const word = (s: boolean | null | undefined) => (s === undefined ? '?' : s === null ? 'one class' : s ? 'settled' : 'not settled');

function table(approximator: string, rows: CandidateRow[], baselines: BaselineRow[]): void {
  const mine = baselines.filter((b) => b.approximator === approximator);
  if (!openTable(approximator, mine.length, ['plant', 'logs', 'baseline error (seeds)', 'interval holds', 'new verdict', 'range holds', 'misses', 'caught',
    'of them: not settled / range holds where the interval missed / interval held already', 'fires where right', 'confident & right rows', 'turned cautious'])) return;
  let logs = 0, missed = 0, caught = 0, right = 0, firesRight = 0, confident = 0, turned = 0;
  const howAll = [0, 0, 0];
  for (const plant of PLANTS) {
    const bs = mine.filter((b) => b.plant === plant).sort((a, b) => a.seed - b.seed);
    if (bs.length === 0) continue;
    let m = 0, c = 0, r = 0, f = 0, cr = 0, t = 0;
    const how = [0, 0, 0];
    for (const b of bs) {
      const fires = b.settled === false, miss = misses(b);
      if (miss) {
        m++;
        if (fires || b.rangeHolds === true) c++;
        // How it was caught: by the verdict, else by a range that holds what the interval missed, else the interval already held it (a miss by > 2 % only).
        if (fires) how[0]++; else if (b.rangeHolds === true) how[b.interval && intervalHolds(b) ? 2 : 1]++;
      } else { r++; if (fires) f++; }
      const cands = rows.filter((x) => x.plant === plant && x.approximator === approximator && x.seed === b.seed && kindOf(x, false) === 'confident & right');
      cr += cands.length;
      t += cands.filter((x) => kindOf(x, true) !== 'confident & right').length;
    }
    howAll.forEach((_, k) => (howAll[k] += how[k]));
    logs += bs.length; missed += m; caught += c; right += r; firesRight += f; confident += cr; turned += t;
    console.log(`| \`${plant}\` | ${bs.length} | ${bs.map((b) => `${b.err.toFixed(2)} %`).join(', ')} | ${bs.map((b) => (b.interval ? (intervalHolds(b) ? 'yes' : 'no') : '-')).join(', ')} | ` +
      `${bs.map((b) => word(b.settled)).join(', ')} | ${bs.map((b) => (b.rangeHolds === undefined || b.rangeHolds === null ? '-' : b.rangeHolds ? 'yes' : 'no')).join(', ')} | ${m} | ${m ? c : '-'} | ${m ? how.join(' / ') : '-'} | ${r ? `${f} of ${r}` : '-'} | ${cr} | ${t} |`);
  }
  console.log(`| **total** | ${logs} | | | | | ${missed} | ${caught} (${pct(caught, missed)}) | ${howAll.join(' / ')} | ${firesRight} of ${right} (${pct(firesRight, right)}) | ${confident} | ${turned} (${pct(turned, confident)}) |`);
  const a = missed > 0 && caught >= RULE.caughtShare * missed, b = firesRight <= RULE.maxFiresRight * right, c = turned <= RULE.maxTurned * confident;
  console.log('');
  console.log(`(a) misses caught (not settled, or the range holds the truth): ${caught}/${missed} (at least ${100 * RULE.caughtShare} %): ${missed === 0 ? 'NO EVIDENCE' : a ? 'PASS' : 'FAIL'}`);
  console.log(`(b) fires where the baseline is right: ${firesRight}/${right} (at most ${100 * RULE.maxFiresRight} %): ${b ? 'PASS' : 'FAIL'}`);
  console.log(`(c) confident & right candidate rows turned cautious: ${turned}/${confident} (at most ${100 * RULE.maxTurned} %): ${c ? 'PASS' : 'FAIL'}`);
  const missing = PLANTS.filter((p) => !mine.some((x) => x.plant === p));
  console.log(`plants run: ${PLANTS.length - missing.length} of ${PLANTS.length}${missing.length ? `; not run: ${missing.join(', ')}` : ''}`);
  if (approximator === 'linear') {
    const verdict = missed === 0 ? (b && c ? 'ADOPT ON THE PRINCIPLE ONLY (no miss: (a) has no evidence)' : 'DO NOT ADOPT') : a && b && c ? 'ADOPT' : 'DO NOT ADOPT';
    console.log(`verdict (linear rows decide): ${missing.length ? 'PROVISIONAL (not every plant ran): ' : ''}${verdict}`);
  }
}

/** The baseline's sampling interval holds the truth within 2 of the truth's standard errors. */
function intervalHolds(b: BaselineRow): boolean {
  const t = b.truth.value, gap = Math.max(b.interval![0] - t, t - b.interval![1], 0);
  return gap <= RULE.truthStandardErrors * b.truth.standardError;
}

function main() {
  const { rows, baselines } = holdoutRowFiles<CandidateRow, BaselineRow>(process.argv.slice(2), 'npx tsx bench/baselineClassRows.ts rows.json rows.baseline.json [more …]');
  for (const approximator of ['linear', 'network']) table(approximator, rows, baselines);
}
main();
