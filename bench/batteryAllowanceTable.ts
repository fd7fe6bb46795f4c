/**
 * The network interval before and after the class-error allowance (src/core/fqe/classErrorAllowance.ts),
 * side by side per plant, start set and way of logging: how often each held the truth and its
 * median width relative to |truth|. "Before" is the interval less the allowance the record carries;
 * a record written before the allowance existed carries none, and its "after" is the rule applied
 * to its paired difference's interval (the same formula the fit applies).
 *
 * `npm run bench -- battery-table file.json [file.json …]` prints it for records already written.
 */
import { readFileSync } from 'node:fs';
import { classErrorAllowance } from '../src/core/fqe/classErrorAllowance';
import type { Estimate, FitRecord } from './batteryTable';

interface Pair {
  readonly before: Estimate;
  readonly after: Estimate;
}

/** The record's network interval without and with the allowance. */
export function allowancePair(r: FitRecord): Pair {
  const recorded = r.networkParts?.classErrorAllowance;
  if (recorded === undefined) {
    const a = classErrorAllowance(r.difference);
    return { before: r.network, after: { ...r.network, lower: r.network.lower - a, upper: r.network.upper + a } };
  }
  const a = recorded * Math.abs(r.network.value);
  return { before: { ...r.network, lower: r.network.lower + a, upper: r.network.upper - a }, after: r.network };
}

const holds = (e: Estimate, truth: number) => e.lower <= truth && truth <= e.upper;

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b), n = s.length;
  return n % 2 ? s[(n - 1) / 2] : (s[n / 2 - 1] + s[n / 2]) / 2;
}

export function printAllowanceTable(records: FitRecord[]): void {
  const groups = new Map<string, FitRecord[]>();
  for (const r of records) {
    const key = `${r.plant} / ${r.candidate} / J over ${r.startSet} / runs logged ${r.runStarts ?? 'steady'}`;
    groups.set(key, [...(groups.get(key) ?? []), r]);
  }
  console.log('\nnetwork 90 % interval without → with the class-error allowance (classErrorAllowance.ts)');
  console.log(`${'plant / candidate / start set / logging'.padEnd(78)} cover before  after | median width/|J| % before  after | median allowance/|J| %`);
  for (const [key, rs] of groups) {
    const pairs = rs.map((r) => ({ r, ...allowancePair(r) })), n = rs.length;
    const cover = (pick: (p: Pair) => Estimate) => `${pairs.filter((p) => holds(pick(p), p.r.truth.value)).length}/${n}`;
    const width = (pick: (p: Pair) => Estimate) => median(pairs.map((p) => (100 * (pick(p).upper - pick(p).lower)) / Math.abs(p.r.truth.value))).toFixed(1);
    const allowance = median(pairs.map((p) => (100 * (p.before.lower - p.after.lower)) / Math.abs(p.r.truth.value))).toFixed(2);
    console.log(`${key.padEnd(78)} ${cover((p) => p.before).padStart(12)} ${cover((p) => p.after).padStart(6)} | ${width((p) => p.before).padStart(24)} ${width((p) => p.after).padStart(6)} | ${allowance.padStart(22)}`);
  }
}

/** `battery-table` command: the table for records already written by the battery bench. */
export function printAllowanceTableOf(files: string[]): void {
  const records = files.flatMap((f) => (JSON.parse(readFileSync(f, 'utf8')) as { records: FitRecord[] }).records);
  printAllowanceTable(records);
}
