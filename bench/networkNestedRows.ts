/**
 * The nested-class pointer for NETWORK projects (issue 9, task netnest32) judged by the rule written
 * for it before any measurement (/work/notes/rule-network-nested.md, quoted in test/battery/README.md),
 * on the rows bench/holdoutCliRows.ts wrote with --approximator network --out:
 *
 *   npx tsx bench/networkNestedRows.ts /work/runs/netnest32-*.json
 *
 * A network project's class list is the network's own class, then polynomial degrees 2, 3 and 4. The
 * class verdict compares the polynomial classes among themselves (paired on shared resamples; the
 * pairs are in the row as classPairs); the network is checked against degree 2 by its own agreement
 * rule and has no pair with degrees 3 and 4 there, so its pairs are formed here by the class rule,
 * unpaired: √(se_net² + se_k²) from each class's standard error (unpairedGap, functionClassRange.ts).
 *
 * Fires where: not settled; the network and degrees 2, 3, 4 all fitted and converged (the network's
 * status 'converged'; an unconverged polynomial class is absent from the list); every pair among
 * {network, 3, 4} agrees (CLASS_AGREEMENT) and could have seen a 10 % gap; degree 2 disagrees with each
 * of the three. Then, as the rule asks:
 *  (a) the hull of the network's, degree 3's and degree 4's intervals holds the truth (within 2 truth
 *      standard errors) on >= 90 % of firing rows, and on every firing plant on at least half its
 *      firing rows (rounded up);
 *  (b) the network's |error| is below degree 2's on >= 90 % of firing rows;
 * with at least 10 plants run. Prints the table per plant and in total, the firing rows, and which
 * plants did not run.
 */
import { readFileSync } from 'node:fs';
import { rolloutTruthPlantNames } from '../test/battery/rolloutTruthPlants';
import { detectable, disagrees, unpairedGap, type ClassGap } from '../src/core/diagnostics/functionClassRange';
import { CROSS_CHECK_RULE } from '../src/core/offPolicy/crossCheckVerdict';
import { networkNestedClassesPoint } from '../src/core/diagnostics/nestedClassPointer';
import { NESTED_CLASS_LABELS } from '../src/pipeline/plan/approximatorLabel';

/** Every plant bench/holdoutCliRows.ts can take the truth of: the one list (test/battery/rolloutTruthPlants.ts). */
const PLANTS = rolloutTruthPlantNames();
const RULE = { truthStandardErrors: 2, share: 0.9, perPlant: 0.5, plants: 10 } as const;

interface ClassRow { label: string; value: number; interval: [number, number] | null; standardError?: number | null }
interface Row {
  plant: string; approximator: string; seed: number; candidate: string;
  truth: { value: number; standardError: number };
  j: number;
  /** The network fit's outcome (the CLI's policies[].status): 'converged', 'maxIterations', 'diverged'. */
  status: string;
  settled: boolean | null;
  classes: ClassRow[] | null;
  classPairs: (Omit<ClassGap, 'standardErrors' | 'relativeStandardError'> & { standardErrors: number | null; relativeStandardError: number | null })[] | null;
}

/** Why a row's pointer did not fire: the first condition that failed, in the rule's order. */
type Why = 'fires' | 'settled' | 'not all of net,2-4 converged' | 'net/3/4 disagree' | 'net/3/4 cannot see 10 %' | '2 agrees with net, 3 or 4';
const WHYS: Why[] = ['settled', 'not all of net,2-4 converged', 'net/3/4 disagree', 'net/3/4 cannot see 10 %', '2 agrees with net, 3 or 4'];

interface Judged { why: Why; hullHolds: boolean; closer: boolean; errNet: number; err2: number; err3: number; err4: number; hull: [number, number] | null }

function judge(row: Row): Judged {
  const classes = row.classes ?? [], network = classes[0];
  const byLabel = (label: string) => classes.find((k) => k.label === label);
  const d2 = byLabel(NESTED_CLASS_LABELS.own), d3 = byLabel(NESTED_CLASS_LABELS.middle), d4 = byLabel(NESTED_CLASS_LABELS.top);
  const t = row.truth.value, err = (k: ClassRow | undefined) => (k ? Math.abs(k.value - t) : NaN);
  const base = { hullHolds: false, closer: false, errNet: err(network), err2: err(d2), err3: err(d3), err4: err(d4), hull: null };
  const settled = row.settled !== false;
  if (settled) return { why: 'settled', ...base };
  const se = (k: ClassRow | undefined) => (k && typeof k.standardError === 'number' && Number.isFinite(k.standardError) ? k.standardError : null);
  // A polynomial class that did not converge is not in the class list; the network's own outcome is the row's status.
  const fitted = network?.label.startsWith('network') && row.status === 'converged' && d2 && d3 && d4 && se(network) !== null && [d2, d3, d4].every((k) => se(k) !== null);
  if (!fitted || !network || !d2 || !d3 || !d4) return { why: 'not all of net,2-4 converged', ...base };
  // JSON writes Infinity as null: a pair with no finite standard error.
  const linear: ClassGap[] = (row.classPairs ?? []).map((g) => ({ ...g, standardErrors: g.standardErrors ?? Infinity, relativeStandardError: g.relativeStandardError ?? Infinity }));
  const net = { label: network.label, value: network.value, standardError: se(network)! };
  const gaps = [...linear, ...[d2, d3, d4].map((k) => unpairedGap(net, { label: k.label, value: k.value, standardError: se(k)! }))];
  const pair = (a: string, b: string) => gaps.find((g) => (g.first === a && g.second === b) || (g.first === b && g.second === a));
  const L = { network: network.label, ...NESTED_CLASS_LABELS };
  const agreeing = [pair(L.network, L.middle), pair(L.network, L.top), pair(L.middle, L.top)], apart = [pair(L.own, L.network), pair(L.own, L.middle), pair(L.own, L.top)];
  let why: Why = 'fires';
  if (![...agreeing, ...apart].every(Boolean)) why = 'not all of net,2-4 converged';
  else if (agreeing.some((g) => disagrees(g!))) why = 'net/3/4 disagree';
  else if (agreeing.some((g) => detectable(g!) > CROSS_CHECK_RULE.detectableGap)) why = 'net/3/4 cannot see 10 %';
  else if (!apart.every((g) => disagrees(g!))) why = '2 agrees with net, 3 or 4';
  // The bench's reading of the rule and the predicate must say the same.
  if ((why === 'fires') !== networkNestedClassesPoint({ settled, gaps }, L)) throw new Error(`${row.plant} seed ${row.seed} ${row.candidate}: the bench and the predicate differ`);
  if (why !== 'fires') return { why, ...base };
  if (!network.interval || !d3.interval || !d4.interval) throw new Error(`${row.plant} seed ${row.seed} ${row.candidate}: a compared class without an interval`);
  const hull: [number, number] = [Math.min(network.interval[0], d3.interval[0], d4.interval[0]), Math.max(network.interval[1], d3.interval[1], d4.interval[1])];
  const miss = Math.max(hull[0] - t, t - hull[1], 0);
  return { ...base, why, hull, hullHolds: miss <= RULE.truthStandardErrors * row.truth.standardError, closer: base.errNet < base.err2 };
}

const pct = (n: number, d: number) => (d === 0 ? '-' : `${((100 * n) / d).toFixed(0)} %`);
const rel = (e: number, t: number) => (Number.isFinite(e) ? `${((100 * e) / Math.abs(t)).toFixed(1)} %` : '-');
const median = (xs: number[]) => { const s = xs.filter(Number.isFinite).sort((a, b) => a - b); return s.length ? s[Math.floor((s.length - 1) / 2)] : NaN; };

function main() {
  const files = process.argv.slice(2);
  if (files.length === 0) throw new Error('usage: npx tsx bench/networkNestedRows.ts rows.json [more.json …]');
  const rows: Row[] = files.flatMap((f) => JSON.parse(readFileSync(f, 'utf8')) as Row[]).filter((r) => r.approximator === 'network');
  console.log(`| plant | rows | not settled | fires | hull holds truth | \\|err net\\| < \\|err2\\| | plant passes (a) | median \\|err\\| net / 2 / 3 / 4 | not fired: ${WHYS.join(' / ')} |`);
  console.log('|---|---|---|---|---|---|---|---|---|');
  let all = 0, unsettled = 0, fired = 0, held = 0, closer = 0;
  const plantsFailing: string[] = [], notFired = WHYS.map(() => 0), details: string[] = [];
  for (const plant of PLANTS) {
    const mine = rows.filter((r) => r.plant === plant);
    if (mine.length === 0) continue;
    const judged = mine.map((r) => ({ r, j: judge(r) })), fires = judged.filter((x) => x.j.why === 'fires');
    const h = fires.filter((x) => x.j.hullHolds).length, c = fires.filter((x) => x.j.closer).length, u = mine.filter((r) => r.settled === false).length;
    const passes = fires.length === 0 ? 'n/a' : h >= Math.ceil(RULE.perPlant * fires.length) ? 'yes' : 'NO';
    if (passes === 'NO') plantsFailing.push(plant);
    all += mine.length; unsettled += u; fired += fires.length; held += h; closer += c;
    const whys = WHYS.map((w) => judged.filter((x) => x.j.why === w).length);
    WHYS.forEach((_, i) => (notFired[i] += whys[i]));
    const t = mine[0].truth.value, med = (k: 'errNet' | 'err2' | 'err3' | 'err4') => median(judged.map((x) => x.j[k] / Math.abs(x.r.truth.value)));
    const meds = (['errNet', 'err2', 'err3', 'err4'] as const).map((k) => rel(med(k) * Math.abs(t), t)).join(' / ');
    console.log(`| \`${plant}\` | ${mine.length} | ${u} | ${fires.length} | ${h} | ${c} | ${passes} | ${meds} | ${whys.join(' / ')} |`);
    for (const { r, j } of fires) {
      details.push(`| ${plant}, ${r.seed}, \`${r.candidate}\` | ${r.truth.value.toFixed(4)} ± ${r.truth.standardError.toFixed(4)} | ${j.hull![0].toFixed(3)} to ${j.hull![1].toFixed(3)} | ${j.hullHolds} | ` +
        `${rel(j.errNet, r.truth.value)} | ${rel(j.err2, r.truth.value)} | ${rel(j.err3, r.truth.value)} | ${rel(j.err4, r.truth.value)} |`);
    }
  }
  console.log(`| **total** | ${all} | ${unsettled} | ${fired} | ${held} (${pct(held, fired)}) | ${closer} (${pct(closer, fired)}) | ${plantsFailing.length === 0 ? 'every plant' : `fails: ${plantsFailing.join(', ')}`} | | ${notFired.join(' / ')} |`);
  const missing = PLANTS.filter((p) => !rows.some((r) => r.plant === p)), ran = PLANTS.length - missing.length;
  const a = fired > 0 && held >= RULE.share * fired && plantsFailing.length === 0, b = fired > 0 && closer >= RULE.share * fired;
  if (details.length) {
    console.log('');
    console.log('| plant, seed, candidate | truth | hull of network, 3, 4 | holds | \\|err net\\| | \\|err2\\| | \\|err3\\| | \\|err4\\| |');
    console.log('|---|---|---|---|---|---|---|---|');
    console.log(details.join('\n'));
  }
  console.log('');
  console.log(`(a) hull holds the truth on ${held}/${fired} firing rows (needs >= ${100 * RULE.share} %) and on every firing plant: ${a ? 'PASS' : 'FAIL'}`);
  console.log(`(b) |err net| < |err2| on ${closer}/${fired} firing rows (needs >= ${100 * RULE.share} %): ${b ? 'PASS' : 'FAIL'}`);
  console.log(`plants run: ${ran} of ${PLANTS.length}${missing.length ? `; not run: ${missing.join(', ')}` : ''}${ran < RULE.plants ? ` (fewer than ${RULE.plants}: not adopted whatever (a) and (b) say)` : ''}`);
  console.log(`verdict: ${a && b && ran >= RULE.plants ? 'ADOPT' : 'DO NOT ADOPT'}${fired === 0 ? ' (it never fired)' : ''}`);
}
main();
