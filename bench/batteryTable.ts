/**
 * The battery sweep's table: one row per plant, candidate and start set, linear (degree 2) and
 * network side by side. Errors are relative to |truth|; coverage is the share of seeds whose 90 %
 * interval held the truth (a rollout truth's own standard error is small against these intervals:
 * see the truth column). Time: wall-clock and CPU seconds per fit. Throughput per CPU second (the
 * machine is shared, so wall-clock rates say more about the other load than about the fit): Adam
 * steps/s (training wall time scaled by the fit's CPU/wall ratio) and GFLOP/s of the counted
 * matrix products over the whole fit (networkWork.ts).
 */
import type { BatteryTruth } from '../test/battery/batteryPlant';

export interface Estimate {
  value: number;
  lower: number;
  upper: number;
}

export interface FitRecord {
  plant: string;
  candidate: string;
  startSet: string;
  /** Where the logged runs started (SimulationOptions.runStarts). */
  runStarts?: 'steady' | 'wide';
  seed: number;
  truth: BatteryTruth;
  network: Estimate;
  /** classErrorAllowance: relative to |network J| (classErrorAllowance.ts); absent in older records. */
  networkParts?: { percentile: number[]; basic: number[]; bootstrapStandardError: number; iterateSpread: number; classErrorAllowance?: number };
  linear: Estimate;
  difference: Estimate;
  /** The network/linear agreement verdict the app shows (approximatorAgreement.ts); absent in older records. */
  agreement?: 'agree' | 'inconclusive' | 'disagree';
  status: string;
  /** The per-project choice of the polynomial part's degree (networkDegreeChoice.ts), when the method asked for it. */
  degreeChoice?: {
    chosen: number; degrees: number[]; relativeError: number[]; difference: number | null; standardError: number | null; runsScored: number; notCompared: string | null;
  };
  /**
   * The start guard of the degree choice (src/core/fqe/degreeChoiceStartGuard.ts) for this record's start
   * set over this log: starts scored outside the logs and whether a degree above the default may be kept.
   * The bench fits once for both start sets; bench/batteryChoicePairedTable.ts composes the guarded
   * choice per start set from the default and the chosen fit. Absent in older records.
   */
  startGuard?: { starts: number; outside: number; inside: boolean };
  iterations: number;
  seconds: number;
  cpuSeconds: number;
  /**
   * Wall-clock seconds until the iterates' J over the fit's start set (the steady set) came within
   * 3 % of its truth and stayed there (fit set-up included); null if it never did. Only on the
   * fit's start set's record.
   */
  secondsToWithin3?: number | null;
  adamSteps: number;
  stepSeconds: number;
  flop: number;
  backend: string;
}

interface Summary {
  mean: number;
  largest: number;
  coverage: number;
}

function summarise(records: FitRecord[], pick: (r: FitRecord) => Estimate): Summary {
  const errors = records.map((r) => (pick(r).value - r.truth.value) / Math.abs(r.truth.value));
  const covered = records.filter((r) => pick(r).lower <= r.truth.value && r.truth.value <= pick(r).upper).length;
  return {
    mean: errors.reduce((a, b) => a + b, 0) / errors.length,
    largest: errors.reduce((a, b) => Math.max(a, Math.abs(b)), 0),
    coverage: covered / records.length,
  };
}

const pct = (x: number) => `${(100 * x).toFixed(2)}`.padStart(7);
const mean = (xs: number[]) => xs.reduce((a, b) => a + b, 0) / xs.length;

/**
 * Share of seeds whose range holds the truth: the network's interval, widened to the linear
 * estimate's interval where the two disagree (the app then says "not settled" and its range to
 * report spans both and the polynomial classes of degree 3 and 4 as well, so the app's range holds
 * the truth at least this often).
 */
function rangeCoverage(rs: FitRecord[]): number {
  return rs.filter((r) => {
    const lo = r.agreement === 'disagree' ? Math.min(r.network.lower, r.linear.lower) : r.network.lower;
    const hi = r.agreement === 'disagree' ? Math.max(r.network.upper, r.linear.upper) : r.network.upper;
    return lo <= r.truth.value && r.truth.value <= hi;
  }).length / rs.length;
}

/** Mean seconds to within 3 % over the seeds that got there, with how many did ('—' where not measured). */
function toWithin3(rs: FitRecord[]): string {
  const measured = rs.filter((r) => r.secondsToWithin3 !== undefined);
  if (measured.length === 0) return '—';
  const reached = measured.flatMap((r) => (r.secondsToWithin3 == null ? [] : [r.secondsToWithin3]));
  if (reached.length === 0) return 'never';
  const text = mean(reached).toFixed(1);
  return reached.length === measured.length ? text : `${text} (${reached.length}/${measured.length})`;
}

/** `linearDegree`: the degree of the comparator (src/core/fqe/networkComparator.ts), whose estimate the linear columns show. */
export function printBatteryTable(records: FitRecord[], linearDegree: number): void {
  const groups = new Map<string, FitRecord[]>();
  for (const r of records) {
    const key = `${r.plant}|${r.candidate}|${r.startSet}${r.runStarts === 'wide' ? ' (runs logged wide)' : ''}`;
    groups.set(key, [...(groups.get(key) ?? []), r]);
  }
  console.log(`\nplant / candidate / start set                    truth (±SE)        | linear deg ${linearDegree}: mean%  |max|%  cover | network: mean%  |max|%  cover  disagr  range  conv  iters  s/fit  cpu s  s to 3%  steps/s  GFLOP/s`);
  for (const [key, rs] of groups) {
    const [plant, candidate, startSet] = key.split('|');
    const t = rs[0].truth, lin = summarise(rs, (r) => r.linear), net = summarise(rs, (r) => r.network);
    const converged = rs.filter((r) => r.status === 'converged').length / rs.length;
    const disagreeing = rs.filter((r) => r.agreement === 'disagree').length / rs.length;
    const stepsPerSecond = mean(rs.map((r) => r.adamSteps / Math.max(r.stepSeconds * (r.cpuSeconds / r.seconds), 1e-9)));
    const gflops = mean(rs.map((r) => r.flop / r.cpuSeconds / 1e9));
    const truth = `${t.value.toPrecision(5)}${t.standardError > 0 ? ` ±${t.standardError.toPrecision(2)}` : ' exact'}`;
    console.log(
      `${`${plant} / ${candidate} / ${startSet}`.padEnd(48)} ${truth.padEnd(18)} | ${pct(lin.mean)} ${pct(lin.largest)} ${pct(lin.coverage).slice(1)} |` +
      ` ${pct(net.mean)} ${pct(net.largest)} ${pct(net.coverage).slice(1)} ${pct(disagreeing).slice(1)} ${pct(rangeCoverage(rs)).slice(1)} ${pct(converged).slice(1)} ${mean(rs.map((r) => r.iterations)).toFixed(1).padStart(5)}` +
      ` ${mean(rs.map((r) => r.seconds)).toFixed(1).padStart(6)} ${mean(rs.map((r) => r.cpuSeconds)).toFixed(1).padStart(6)} ${toWithin3(rs).padStart(8)} ${stepsPerSecond.toFixed(0).padStart(8)} ${gflops.toFixed(2).padStart(8)}`,
    );
  }
  console.log(`(${records.length / 2} fits; errors in % of |truth|; cover = share of seeds whose 90 % interval holds the truth; disagr = share where network and linear disagree (the app says "not settled"); range = share whose network interval, widened to the linear one where they disagree, holds the truth; s to 3% = wall seconds until the iterates' J on the steady set came and stayed within 3 % (set-up included); conv = share with status "converged"; backend ${records[0]?.backend})`);
}
