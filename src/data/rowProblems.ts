/**
 * Problems found in data rows, collected across the import stages (reading cells, timestamps,
 * the reward expression) so that a failed import lists all of them in file order, and an import
 * that excludes rows can say exactly why each row went.
 */
import type { ImportProblemKind } from './importProblem';

export interface RowProblem {
  /** 0-based data record (the header is not a record). */
  readonly record: number;
  readonly kind: ImportProblemKind;
  readonly column?: string;
  readonly reason: string;
}

/** Problems kept in full; beyond this only the count grows, so a garbage file cannot exhaust memory. */
const STORED_LIMIT = 100_000;

export class RowProblems {
  private readonly stored: RowProblem[] = [];
  private readonly firstByRecord = new Map<number, RowProblem>();
  private readonly countByRecord = new Map<number, number>();
  private total = 0;
  private readonly forgotten = new Set<number>();

  add(record: number, column: string | undefined, kind: ImportProblemKind, reason: string): void {
    const problem: RowProblem = column === undefined ? { record, kind, reason } : { record, kind, column, reason };
    this.total++;
    if (this.stored.length < STORED_LIMIT) this.stored.push(problem);
    if (!this.firstByRecord.has(record)) this.firstByRecord.set(record, problem);
    this.countByRecord.set(record, (this.countByRecord.get(record) ?? 0) + 1);
  }

  get count(): number {
    return this.total;
  }

  /** Forget every problem of a record the project leaves out anyway (a row in a time window left out). */
  forget(record: number): void {
    const count = this.countByRecord.get(record);
    if (count === undefined) return;
    this.total -= count;
    this.firstByRecord.delete(record);
    this.countByRecord.delete(record);
    this.forgotten.add(record);
  }

  isBad(record: number): boolean {
    return this.firstByRecord.has(record);
  }

  /** Records with at least one problem, ascending. */
  badRecords(): number[] {
    return [...this.firstByRecord.keys()].sort((a, b) => a - b);
  }

  /** The first problem found on a record and how many it has in all. */
  firstProblem(record: number): { problem: RowProblem; count: number } | undefined {
    const problem = this.firstByRecord.get(record);
    return problem && { problem, count: this.countByRecord.get(record) ?? 1 };
  }

  /** Stored problems in file order (record, then the order they were found). */
  inFileOrder(): RowProblem[] {
    const stored = this.forgotten.size === 0 ? this.stored : this.stored.filter((p) => !this.forgotten.has(p.record));
    return stored.map((p, i) => ({ p, i })).sort((a, b) => a.p.record - b.p.record || a.i - b.i).map(({ p }) => p);
  }
}
