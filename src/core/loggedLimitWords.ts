/**
 * A logged actuator limit named with how the log showed it (loggedActionLimits.ts): "lower 0 %
 * (repeated extreme), upper 100 % (at a declared bound)". A reviewer can then tell a limit the log
 * itself shows (at least max(2, 0.1 % of the rows) logged values at the extreme) from one taken on
 * the word of a bound a candidate declares (one logged value there suffices). One wording for the app,
 * the report and the command line; the number style is the caller's.
 */
import type { LimitEvidence } from './loggedActionLimits';

/** How each kind of evidence reads beside a limit. */
export const LIMIT_EVIDENCE_WORDS: Record<Exclude<LimitEvidence, 'none'>, string> = {
  repeated: 'repeated extreme',
  declared: 'at a declared bound',
};

/**
 * One action's limits: "lower 0 % (repeated extreme), upper 100 % (at a declared bound)"; "none
 * seen" without either. `lo`/`hi` null (or infinite) where no limit was read; `evidence` absent in
 * results saved before it was kept, then the limit is named without it.
 */
export function loggedLimitText(
  lo: number | null, hi: number | null, evidence: { lo: LimitEvidence; hi: LimitEvidence } | undefined, unit: string, number: (v: number) => string,
): string {
  const part = (side: 'lower' | 'upper', v: number | null, e: LimitEvidence | undefined): string | null => {
    if (v === null || !Number.isFinite(v)) return null;
    const how = e && e !== 'none' ? ` (${LIMIT_EVIDENCE_WORDS[e]})` : '';
    return `${side} ${number(v)}${unit ? ` ${unit}` : ''}${how}`;
  };
  const parts = [part('lower', lo, evidence?.lo), part('upper', hi, evidence?.hi)].filter((p): p is string => p !== null);
  return parts.length ? parts.join(', ') : 'none seen';
}
