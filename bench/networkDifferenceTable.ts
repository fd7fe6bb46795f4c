/**
 * Reads bench/networkDifferenceRows.ts's lines and scores three intervals of each network difference
 * candidate − present controller against its truth, by the rule in /work/notes/netdiff37-rule.md:
 * the assessment's present one (per-J training-noise draws and per-J allowances summed), "paired"
 * (src/core/fqe/networkPairedDifference.ts) and "paired, per-J drift" (the same, with the two fits'
 * own drift allowances summed). A row holds when the interval misses the truth by at most
 * 2·√(SE_c² + SE_p²) (0 for the closed form). Per plant and overall: rows holding, median width /
 * |true difference|, median width / the present width; the trial rule (trialChoice.ts: interval wholly
 * better, no serious warning, not contradicted, best J named) recomputed with each interval.
 * Lines written with SAME=1 add "same iteration" (/work/notes/netdiff38-rule.md: the paired construction
 * with both fits at W* = max of the two stops) and, per log, the fit time a warm continuation would add
 * against the network run's wall time.
 *   npx tsx bench/networkDifferenceTable.ts rows.jsonl [more.jsonl …] [--rows]
 */
import { readFileSync } from 'node:fs';
import { bootstrapInterval } from '../src/core/bootstrap/bootstrapInterval';
import { classErrorAllowance } from '../src/core/fqe/classErrorAllowance';
import { networkValueInterval } from '../src/core/fqe/networkValueEstimate';
import { resampleSeed } from '../src/core/bootstrap/episodeMultiplicities';
import { createRandom } from '../src/core/random';
import { pairedNetworkDifference, trainingSpread, type PairedFit, type PairedNetworkDifference, type PairingRule } from '../src/core/fqe/networkPairedDifference';

type Truth = { value: number; standardError: number };
type Fit = {
  status: string; J: number; iterates: number[]; linear: number | null; replicates: (number | null)[] | null; linearReplicates: (number | null)[] | null;
  convergence: { tolerance: number; window: number; discount: number; fullStepIterations?: number } | null;
  parts: { driftAllowance: number; iterateSpread: number; classErrorAllowance: number } | null;
};
type Line = {
  plant: string; seed: number; sign: number; present: { truth: Truth; fit: Fit };
  candidates: { name: string; truth: Truth; fit: Fit; assessed: { percentile: [number, number] | null } | null; serious: number; contradicted: boolean; same?: Same | null }[];
  seconds: number; presentAddedSeconds?: number;
};
type RanOn = { at: number; ownStop: number; repeatError: number; addedSeconds: number; fit: Fit };
type Same = { W: number; candidate: RanOn | null; present: RanOn | null };
type Interval = readonly [number, number];
/** The last is a diagnostic, not a construction the rule judges: the paired run resamples alone, no training spread, no allowance. */
const METHODS = ['present', 'paired', 'paired, per-J drift', 'sampling only', 'same iteration'] as const;

function pairedFit(f: Fit): PairedFit | null {
  if (f.status !== 'converged' || !f.replicates || !f.linearReplicates || !f.convergence || !f.parts || f.linear === null) return null;
  return { value: f.J, linearValue: f.linear, iterates: f.iterates, fullStepIterations: f.convergence.fullStepIterations ?? f.iterates.length, replicates: f.replicates, linearReplicates: f.linearReplicates, driftAllowance: f.parts.driftAllowance };
}

/** The fallback of the rule: the paired construction with each fit's own drift allowance summed. */
function perFitDrift(a: PairedFit, b: PairedFit, rule: PairingRule): Interval | null {
  const d = a.replicates.flatMap((x, i) => (x === null || b.replicates[i] === null ? [] : [x - (b.replicates[i] as number)]));
  if (d.length < 2) return null;
  const value = a.value - b.value, spread = trainingSpread(a, b, rule.window), drift = a.driftAllowance * Math.abs(a.value) + b.driftAllowance * Math.abs(b.value);
  const x = a.replicates.flatMap((v, i) => {
    const w = b.replicates[i], la = a.linearReplicates[i], lb = b.linearReplicates[i];
    return v === null || w === null || la === null || lb === null ? [] : [v - w - (la - lb)];
  });
  const cls = classErrorAllowance(networkValueInterval(bootstrapInterval(value - (a.linearValue - b.linearValue), x, rule.level), spread, drift));
  const own = networkValueInterval(bootstrapInterval(value, d, rule.level), spread, drift);
  return [own.lower - cls, own.upper + cls];
}

/**
 * The construction of main at d2a78b0 (networkRunResamples.ts, assessIntervals.ts), recomputed from the raw parts: each fit's
 * replicates with its own training-noise draws (the same stream and index as there), the percentile interval of the paired
 * differences, both fits' drift and class-error allowances added at each end. Rows assessed by that code must match it.
 */
function perFitConstruction(a: Fit, indexA: number, p: Fit, indexP: number, seed: number): Interval | null {
  const noisy = (f: Fit, index: number) => {
    const noise = createRandom(resampleSeed(seed ^ 0x6e6f6973, index)), sd = f.parts!.iterateSpread * Math.abs(f.J);
    return f.replicates!.map((v) => (v === null ? null : v + sd * noise.normal()));
  };
  const x = noisy(a, indexA), y = noisy(p, indexP), d = x.flatMap((v, i) => (v === null || y[i] === null ? [] : [v - (y[i] as number)]));
  if (d.length < 2) return null;
  const pct = bootstrapInterval(a.J - p.J, d, 0.9).percentile;
  const allowance = (f: Fit) => (f.parts!.driftAllowance + f.parts!.classErrorAllowance) * Math.abs(f.J);
  return [pct[0] - allowance(a) - allowance(p), pct[1] + allowance(a) + allowance(p)];
}

function samplingOnly(a: PairedFit, b: PairedFit): Interval | null {
  const d = a.replicates.flatMap((x, i) => (x === null || b.replicates[i] === null ? [] : [x - (b.replicates[i] as number)]));
  return d.length < 2 ? null : bootstrapInterval(a.value - b.value, d, 0.9).percentile;
}

/** How far the truth lies from D in units of the present interval's half-width on the truth's side (≤ 1: held). */
function reach(r: Row): number {
  const iv = r.intervals[0]!, d = r.D;
  return Math.max(0, Math.abs(r.truth - d) - r.margin) / (r.truth >= d ? iv[1] - d : d - iv[0]);
}

function median(xs: number[]): number {
  const s = [...xs].sort((p, q) => p - q);
  return s.length ? (s.length % 2 ? s[(s.length - 1) / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2) : NaN;
}

interface Row { parts: string; D: number; same: boolean; plant: string; seed: number; candidate: string; truth: number; margin: number; intervals: (Interval | null)[]; eligible: boolean; J: number }

function rowsOf(line: Line): Row[] {
  const p = pairedFit(line.present.fit);
  return line.candidates.flatMap((c, j) => {
    const a = pairedFit(c.fit);
    if (!a || !p || !c.assessed?.percentile) return [];
    const conv = c.fit.convergence!, rule: PairingRule = { discount: conv.discount, window: conv.window, tolerance: conv.tolerance, level: 0.9 };
    const pct = c.assessed.percentile, assessed: Interval = line.sign > 0 ? pct : [-pct[1], -pct[0]]; // back to reward terms
    const present = perFitConstruction(c.fit, j, line.present.fit, line.candidates.length, line.seed)!;
    const same = Math.abs(present[0] - assessed[0]) + Math.abs(present[1] - assessed[1]) <= 1e-9 * (1 + Math.abs(assessed[0]) + Math.abs(assessed[1]));
    const paired = pairedNetworkDifference(a, p, rule), atW = sameIteration(c.fit, line.present.fit, c.same, rule);
    const parts = atW ? `W*=${c.same!.W} drift ${atW.driftAllowance.toPrecision(2)} class ${atW.classErrorAllowance.toPrecision(2)} s_D ${atW.trainingSpread.toPrecision(2)}` : '';
    return [{ parts,
      D: c.fit.J - line.present.fit.J, plant: line.plant, seed: line.seed, candidate: c.name, truth: c.truth.value - line.present.truth.value, J: c.fit.J,
      margin: 2 * Math.hypot(c.truth.standardError, line.present.truth.standardError),
      same, intervals: [present, paired ? [paired.interval.lower, paired.interval.upper] : null, perFitDrift(a, p, rule), samplingOnly(a, p), atW ? [atW.interval.lower, atW.interval.upper] : null],
      eligible: c.serious === 0 && !c.contradicted,
    }];
  });
}

/** netdiff38: the paired construction on both fits at W* (the one that stopped first run on to it). */
function sameIteration(c: Fit, p: Fit, same: Same | null | undefined, rule: PairingRule): PairedNetworkDifference | null {
  if (!same) return null;
  const a = pairedFit(same.candidate?.fit ?? c), b = pairedFit(same.present?.fit ?? p);
  return a && b ? pairedNetworkDifference(a, b, rule) : null;
}

/** Per log: the seconds a warm continuation would add (every candidate run on, the present controller once to its furthest W*) ÷ the run's wall time. */
function costs(lines: Line[]): string[] {
  return lines.filter((l) => l.presentAddedSeconds !== undefined).map((l) => {
    const added = l.presentAddedSeconds! + l.candidates.reduce((t, c) => t + (c.same?.candidate?.addedSeconds ?? 0), 0);
    const repeat = Math.max(0, ...l.candidates.flatMap((c) => [c.same?.candidate?.repeatError ?? 0, c.same?.present?.repeatError ?? 0]));
    return `${l.plant} s${l.seed}: +${added.toFixed(1)} s of ${l.seconds.toFixed(0)} s = ${(added / l.seconds).toFixed(3)} (largest |J_k| repeat difference ${repeat})`;
  });
}

const holds = (r: Row, iv: Interval | null) => iv !== null && Math.max(iv[0] - r.truth, r.truth - iv[1], 0) <= r.margin;
/** Confident and wrong: the interval wholly on one side of 0, the truth beyond the margin on the other. */
const wrongSide = (r: Row, iv: Interval | null) => iv !== null && ((iv[0] > 0 && r.truth < -r.margin) || (iv[1] < 0 && r.truth > r.margin));

function trials(rows: Row[], m: number): string[] {
  const logs = new Map<string, Row[]>();
  for (const r of rows) logs.set(`${r.plant} s${r.seed}`, [...(logs.get(`${r.plant} s${r.seed}`) ?? []), r]);
  return [...logs].map(([log, rs]) => {
    const named = rs.filter((r) => r.eligible && r.intervals[m] !== null && r.intervals[m]![0] > 0).sort((x, y) => y.J - x.J)[0];
    return `${log}: ${named ? `${named.candidate} ${named.truth > named.margin ? 'right' : 'WRONG'}` : 'none'}`;
  });
}

function main() {
  const args = process.argv.slice(2), files = args.filter((a) => !a.startsWith('--'));
  const lines = files.flatMap((f) => readFileSync(f, 'utf8').split('\n').filter((l) => l.trim().startsWith('{')).map((l) => JSON.parse(l) as Line));
  const rows = lines.flatMap(rowsOf);
  if (args.includes('--rows')) {
    for (const r of rows) console.log([r.plant, r.seed, r.candidate, r.truth.toPrecision(4), r.margin.toPrecision(2), ...r.intervals.map((iv) => (iv ? `${iv[0].toPrecision(4)}..${iv[1].toPrecision(4)} ${holds(r, iv) ? 'holds' : 'MISS'}` : '-')), r.parts].join('\t'));
  }
  const plants = [...new Set(rows.map((r) => r.plant))];
  console.log(['plant', 'rows', ...METHODS.map((m) => `${m}: holds`), ...METHODS.map((m) => `${m}: median width/|diff|`), ...METHODS.slice(1).map((m) => `${m}: median width/present`), 'confident & wrong (per method)', 'truth\'s reach in present half-widths: median, largest'].join('\t'));
  for (const group of [...plants.map((p) => rows.filter((r) => r.plant === p)), rows]) {
    const name = group === rows ? 'all' : group[0].plant;
    const width = (r: Row, m: number) => (r.intervals[m] ? r.intervals[m]![1] - r.intervals[m]![0] : NaN);
    console.log([name, group.length, ...METHODS.map((_, m) => group.filter((r) => holds(r, r.intervals[m])).length),
      ...METHODS.map((_, m) => median(group.map((r) => width(r, m) / Math.abs(r.truth))).toFixed(2)),
      ...METHODS.slice(1).map((_, k) => median(group.map((r) => width(r, k + 1) / width(r, 0))).toFixed(2)),
      METHODS.map((_, m) => group.filter((r) => wrongSide(r, r.intervals[m])).length).join('/'),
      `${median(group.map(reach)).toFixed(2)}, ${Math.max(...group.map(reach)).toFixed(2)}`].join('\t'));
  }
  console.log(`# present construction recomputed from the raw parts equals the assessed interval on ${rows.filter((r) => r.same).length} of ${rows.length} rows (rows assessed after the change hold the paired one)`);
  METHODS.forEach((m, i) => console.log(`# trials, ${m}: ${trials(rows, i).join('; ')}`));
  const cost = costs(lines);
  if (cost.length) console.log(`# added fit time ÷ run wall time, per log: ${cost.join('; ')}`);
}
main();
