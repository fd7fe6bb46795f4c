/**
 * The nested-class pointer (src/core/diagnostics/nestedClassPointer.ts) judged by the rule written for
 * it before any measurement (issue 9, task nested32), on the rows bench/holdoutCliRows.ts wrote with
 * --out (linear, degree 2 projects; each row carries its classes' values and intervals and the pairs
 * the class rule compared):
 *
 *   npx tsx bench/nestedClassRows.ts /work/runs/nested32-*.json
 *
 * The rule: adopt the sentence only if, where the pointer fires,
 *  (a) the hull of degrees 3 and 4's intervals holds the truth (within 2 of the truth's standard
 *      errors) on >= 90 % of the rows, and on every plant where it fires at least once on at least
 *      one row in two (half of that plant's firing rows, rounded up); and
 *  (b) degree 4's |error| is below degree 2's on >= 90 % of the rows where it fires.
 * Prints per plant: rows, rows where it fires, rows where the hull holds the truth, rows where
 * |err4| < |err2|; the totals against (a) and (b); and which plants have no rows (not run).
 */
import { readFileSync } from 'node:fs';
import { rolloutTruthPlantNames } from '../test/battery/rolloutTruthPlants';
import { detectable, disagrees, type ClassGap } from '../src/core/diagnostics/functionClassRange';
import { CROSS_CHECK_RULE } from '../src/core/offPolicy/crossCheckVerdict';
import { nestedClassesPoint } from '../src/core/diagnostics/nestedClassPointer';
import { NESTED_CLASS_LABELS as LABELS } from '../src/pipeline/plan/approximatorLabel';

/** Every plant bench/holdoutCliRows.ts can take the truth of: the one list (test/battery/rolloutTruthPlants.ts). */
const PLANTS = rolloutTruthPlantNames();
const RULE = { truthStandardErrors: 2, share: 0.9, perPlant: 0.5 } as const;

interface Row {
  plant: string; approximator: string; seed: number; candidate: string;
  truth: { value: number; standardError: number };
  settled: boolean | null;
  classes: { label: string; value: number; interval: [number, number] | null }[] | null;
  classPairs: (Omit<ClassGap, 'standardErrors' | 'relativeStandardError'> & { standardErrors: number | null; relativeStandardError: number | null })[] | null;
}

interface Judged { why: Why; fires: boolean; hullHolds: boolean; closer: boolean; err2: number; err4: number; hull: [number, number] | null }

/** Why a row's pointer did not fire, the first condition that failed in the rule's order (for the table only). */
type Why = 'fires' | 'settled' | 'not all of 2-4' | '3-4 disagree' | '3-4 cannot see 10 %' | '2 agrees with 3 or 4';
const WHYS: Why[] = ['settled', 'not all of 2-4', '3-4 disagree', '3-4 cannot see 10 %', '2 agrees with 3 or 4'];

function whyNot(settled: boolean, gaps: ClassGap[]): Why {
  if (settled) return 'settled';
  const pair = (a: string, b: string) => gaps.find((g) => (g.first === a && g.second === b) || (g.first === b && g.second === a));
  const upper = pair(LABELS.middle, LABELS.top), low = [pair(LABELS.own, LABELS.middle), pair(LABELS.own, LABELS.top)];
  if (!upper || !low[0] || !low[1]) return 'not all of 2-4';
  if (!upper.paired || disagrees(upper)) return '3-4 disagree';
  if (detectable(upper) > CROSS_CHECK_RULE.detectableGap) return '3-4 cannot see 10 %';
  return '2 agrees with 3 or 4';
}

function judge(row: Row): Judged {
  const none = (why: Why) => ({ why, fires: false, hullHolds: false, closer: false, err2: NaN, err4: NaN, hull: null });
  if (row.approximator !== 'linear' || !row.classes || row.classes[0]?.label !== LABELS.own) return none(row.settled === true ? 'settled' : 'not all of 2-4');
  // JSON writes Infinity as null: a pair with no finite standard error.
  const gaps: ClassGap[] = (row.classPairs ?? []).map((g) => ({ ...g, standardErrors: g.standardErrors ?? Infinity, relativeStandardError: g.relativeStandardError ?? Infinity }));
  if (!nestedClassesPoint({ settled: row.settled === true, gaps }, LABELS)) return none(whyNot(row.settled === true, gaps));
  const byLabel = (label: string) => row.classes!.find((k) => k.label === label)!;
  const two = byLabel(LABELS.own), three = byLabel(LABELS.middle), four = byLabel(LABELS.top);
  if (!three.interval || !four.interval) throw new Error(`${row.plant} seed ${row.seed} ${row.candidate}: a compared class without an interval`);
  const hull: [number, number] = [Math.min(three.interval[0], four.interval[0]), Math.max(three.interval[1], four.interval[1])];
  const t = row.truth.value, miss = Math.max(hull[0] - t, t - hull[1], 0);
  const err2 = Math.abs(two.value - t), err4 = Math.abs(four.value - t);
  return { why: 'fires', fires: true, hullHolds: miss <= RULE.truthStandardErrors * row.truth.standardError, closer: err4 < err2, err2, err4, hull };
}

const pct = (n: number, d: number) => (d === 0 ? '-' : `${((100 * n) / d).toFixed(0)} %`);
const rel = (e: number, t: number) => `${((100 * e) / Math.abs(t)).toFixed(1)} %`;

function main() {
  const files = process.argv.slice(2);
  if (files.length === 0) throw new Error('usage: npx tsx bench/nestedClassRows.ts rows.json [more.json …]');
  const rows: Row[] = files.flatMap((f) => JSON.parse(readFileSync(f, 'utf8')) as Row[]);
  console.log(`| plant | rows | fires | hull holds truth | \\|err4\\| < \\|err2\\| | plant passes (a) | not fired: ${WHYS.join(' / ')} |`);
  console.log('|---|---|---|---|---|---|---|');
  let all = 0, fired = 0, held = 0, closer = 0;
  const plantsFailing: string[] = [], notFired = WHYS.map(() => 0);
  const details: string[] = [];
  for (const plant of PLANTS) {
    const mine = rows.filter((r) => r.plant === plant && r.approximator === 'linear');
    if (mine.length === 0) continue;
    const judged = mine.map((r) => ({ r, j: judge(r) })), fires = judged.filter((x) => x.j.fires);
    const h = fires.filter((x) => x.j.hullHolds).length, c = fires.filter((x) => x.j.closer).length;
    const passes = fires.length === 0 ? 'n/a' : h >= Math.ceil(RULE.perPlant * fires.length) ? 'yes' : 'NO';
    if (passes === 'NO') plantsFailing.push(plant);
    all += mine.length; fired += fires.length; held += h; closer += c;
    const whys = WHYS.map((w) => judged.filter((x) => x.j.why === w).length);
    WHYS.forEach((_, i) => (notFired[i] += whys[i]));
    console.log(`| \`${plant}\` | ${mine.length} | ${fires.length} | ${h} | ${c} | ${passes} | ${whys.join(' / ')} |`);
    for (const { r, j } of fires) {
      details.push(`${plant}\tseed ${r.seed}\t${r.candidate}\ttruth ${r.truth.value.toFixed(4)} ± ${r.truth.standardError.toFixed(4)}\thull ${j.hull![0].toFixed(4)}..${j.hull![1].toFixed(4)}\t` +
        `holds ${j.hullHolds}\t|err2| ${rel(j.err2, r.truth.value)}\t|err4| ${rel(j.err4, r.truth.value)}`);
    }
  }
  console.log(`| **total** | ${all} | ${fired} | ${held} (${pct(held, fired)}) | ${closer} (${pct(closer, fired)}) | ${plantsFailing.length === 0 ? 'every plant' : `fails: ${plantsFailing.join(', ')}`} | ${notFired.join(' / ')} |`);
  const missing = PLANTS.filter((p) => !rows.some((r) => r.plant === p && r.approximator === 'linear'));
  const ran = PLANTS.length - missing.length;
  const a = fired > 0 && held >= RULE.share * fired && plantsFailing.length === 0, b = fired > 0 && closer >= RULE.share * fired;
  console.log('');
  console.log(details.map((d) => `  ${d}`).join('\n'));
  console.log('');
  console.log(`(a) hull holds the truth on ${held}/${fired} firing rows (needs >= ${100 * RULE.share} %) and on every firing plant: ${a ? 'PASS' : 'FAIL'}`);
  console.log(`(b) |err4| < |err2| on ${closer}/${fired} firing rows (needs >= ${100 * RULE.share} %): ${b ? 'PASS' : 'FAIL'}`);
  console.log(`plants run: ${ran} of ${PLANTS.length}${missing.length ? `; not run: ${missing.join(', ')}` : ''}${ran < 10 ? ' (fewer than 10: not adopted whatever (a) and (b) say)' : ''}`);
  console.log(`verdict: ${a && b && ran >= 10 ? 'ADOPT' : 'DO NOT ADOPT'}${fired === 0 ? ' (it never fired)' : ''}`);
}
main();
