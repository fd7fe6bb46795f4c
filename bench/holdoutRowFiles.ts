/**
 * The rows bench/holdoutCliRows.ts wrote with --out, read back for the benches that judge them
 * (bench/baselineContradictedRows.ts, bench/baselineClassRows.ts): files ending .cli.json are the command
 * line's own answers and skipped, .baseline.json files the present controller's rows, the rest candidate rows.
 */
import { readFileSync } from 'node:fs';

export function holdoutRowFiles<C, B>(files: readonly string[], usage: string): { rows: C[]; baselines: B[] } {
  const kept = files.filter((f) => !f.endsWith('.cli.json'));
  if (kept.length === 0) throw new Error(`usage: ${usage}`);
  const read = (f: string) => JSON.parse(readFileSync(f, 'utf8')) as unknown[];
  return {
    baselines: kept.filter((f) => f.endsWith('.baseline.json')).flatMap((f) => read(f) as B[]),
    rows: kept.filter((f) => !f.endsWith('.baseline.json')).flatMap((f) => read(f) as C[]),
  };
}

/** n of d as a whole percent, '-' for none. */
export const pct = (n: number, d: number): string => (d === 0 ? '-' : `${((100 * n) / d).toFixed(0)} %`);

/** Prints a table's heading and head row for the approximator's rows; false (and says so) where it has none. */
export function openTable(approximator: string, count: number, columns: readonly string[]): boolean {
  if (count === 0) {
    console.log(`\n## ${approximator}: no baseline rows`);
    return false;
  }
  console.log(`\n## ${approximator}`);
  console.log(`| ${columns.join(' | ')} |`);
  console.log(`|${columns.map(() => '---|').join('')}`);
  return true;
}
