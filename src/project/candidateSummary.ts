/**
 * A candidate described in the trade's words, with units, for the CLI, the report and the app:
 * "PI, reverse acting, on 21 °C − zone_temp_c: bias 82.7 %, K_c 25 % per °C, T_i 600 s".
 * Pure text from the document; no numbers are computed beyond K_i = K_c/T_i.
 *
 * Each number is held to its unit by the no-break space core/shareText.ts puts before a share's "%"
 * (SI Brochure §5.4.3: a space between a number and its unit), so a line in the report never ends at
 * "25" with "% per °C" on the next; the command line writes it as a plain space (cli/terminal.ts).
 */
import type { CandidateSpec, ColumnRoles } from './schema';
import { exponentText, NO_BREAK_SPACE, TRUE_MINUS, type Minus } from '../core/exponentText';

export interface CandidateSummary {
  /** One line per action: how its mean depends on the states. */
  readonly mean: string[];
  /** The dither (Gaussian spread) per action, with units. */
  readonly dither: string;
  /** Position limits and rate limit, or "none". */
  readonly limits: string;
}

type Feedback = {
  measurement: string; setpoint: number | string; proportionalGain: number; action: 'reverse' | 'direct';
  integralTimeSeconds?: number; integralGain?: number; integralState?: string;
};

/** A number's sign in `minus`: typeset text's U+2212, the terminal's hyphen-minus (core/exponentText.ts). */
const numberWith = (minus: Minus) => (v: number): string => {
  if (!Number.isFinite(v)) return String(v);
  const a = Math.abs(v);
  return a !== 0 && (a >= 1e6 || a < 1e-3) ? exponentText(v, 3, minus, true) : Number(v.toPrecision(5)).toString().replace('-', minus);
};

/** "25 % per °C": the number held to its unit (a bare number where there is none). */
const withUnitIn = (minus: Minus) => {
  const num = numberWith(minus);
  return (v: number, unit: string): string => (unit ? `${num(v)}${NO_BREAK_SPACE}${unit}` : num(v));
};

const actionUnitIn = (columns: ColumnRoles) => (j: number): string => columns.actions[j]?.unit ?? '';
const actionNameIn = (columns: ColumnRoles) => (j: number): string => columns.actions[j]?.column ?? `action ${j + 1}`;

/**
 * minus: the sign of each number, U+2212 for the app and the report, ASCII for the command line, where
 * every other number is ASCII and a user searches for "-10" as typed. The "−" between a setpoint and
 * its measurement is an operator between names, not a number's sign, and stays as written.
 */
export function summariseCandidate(c: CandidateSpec, columns: ColumnRoles, minus: Minus = TRUE_MINUS): CandidateSummary {
  const withUnit = withUnitIn(minus), actionUnit = actionUnitIn(columns), actionName = actionNameIn(columns);
  const unitOf = (name: string): string => columns.states.find((s) => s.column === name)?.unit ?? '';
  const per = (j: number, state: string): string => `${actionUnit(j) || 'unit'} per ${unitOf(state) || 'unit'}`;
  const feedback = (loop: Feedback, j: number): string => {
    const setpoint = typeof loop.setpoint === 'number' ? withUnit(loop.setpoint, unitOf(loop.measurement)) : loop.setpoint;
    const integral = loop.integralTimeSeconds !== undefined ? `, T_i ${withUnit(loop.integralTimeSeconds, 's')}`
      : loop.integralGain ? `, K_i ${withUnit(loop.integralGain, `${per(j, loop.measurement)}·s`)}` : '';
    const kind = integral ? 'PI' : 'P';
    const state = integral && loop.integralState ? ` (integral state ${loop.integralState})` : '';
    return `${kind}, ${loop.action} acting, on ${setpoint} − ${loop.measurement}: K_c ${withUnit(loop.proportionalGain, per(j, loop.measurement))}${integral}${state}`;
  };
  const form = c.form;
  let mean: string[];
  if (form.kind === 'affine') {
    mean = form.offset.map((o, j) => `${actionName(j)} = ${withUnit(o, actionUnit(j))}${(form.gain[j] ?? []).map((g, k) => {
      const state = columns.states[k]?.column ?? `state ${k + 1}`;
      return ` + (${withUnit(g, per(j, state))})·${state}`;
    }).join('')}`);
  } else if (form.kind === 'pi') {
    mean = form.loops.map((loop, j) => `${actionName(j)}: ${feedback(loop, j)}; bias ${withUnit(loop.bias, actionUnit(j))}`);
  } else {
    mean = form.loops.map((loop, j) => {
      const table = loop.breakpoints.map((b, k) => `${withUnit(b, unitOf(loop.input))} → ${withUnit(loop.values[k], actionUnit(j))}`).join(', ');
      return `${actionName(j)}: schedule on ${loop.input} (${table}; held beyond the ends)${loop.feedback ? `, plus ${feedback(loop.feedback, j)}` : ''}`;
    });
  }
  const dither = `dither ${c.dither.map((d, j) => withUnit(d, actionUnit(j))).join(', ')} (standard deviation)`;
  return { mean, dither, limits: limitsText(c, columns, minus) };
}

/** Position limits and rate limit in words, each number's sign in `minus`; "none" where there are neither. */
function limitsText(c: CandidateSpec, columns: ColumnRoles, minus: Minus): string {
  const num = numberWith(minus), withUnit = withUnitIn(minus), actionUnit = actionUnitIn(columns), actionName = actionNameIn(columns);
  const parts: string[] = [];
  if (c.bounds) {
    const b = c.bounds;
    const range = b.lo.map((lo, j) => `${lo === null ? `${minus}∞` : num(lo)} … ${b.hi[j] === null || b.hi[j] === undefined ? '∞' : num(b.hi[j]!)}${actionUnit(j) ? `${NO_BREAK_SPACE}${actionUnit(j)}` : ''}`);
    parts.push(`${b.mode === 'clip' ? 'clipped' : 'truncated'} to ${range.join('; ')}`);
  }
  c.rateLimit?.maxStep.forEach((step, j) => {
    if (step !== null) parts.push(`${actionName(j)} moves at most ${withUnit(step, actionUnit(j))} per step from ${c.rateLimit!.previousAction[j] ?? 'its previous value'}`);
  });
  return parts.length ? parts.join('; ') : 'none';
}
