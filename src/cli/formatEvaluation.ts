/** The readable table `evaluate` prints by default. */
import { truncationSentence } from '../core/loggedReturn';
import type { Evaluation } from '../pipeline/estimates';
import { LOGGED_RETURN, PRESENT_CONTROLLER } from '../figures/parts/plotTheme';
import { significant, textTable as table } from './textTable';

const number = (v: number | null): string => significant(v, 6);

const STATUS_WORDS = { converged: 'converged', maxIterations: 'NOT CONVERGED', diverged: 'DIVERGED' } as const;


/** "offset 1.2" with one action; with several, each value named by its action's column: "offset 0.3 on hot_valve, 0.7 on cold_valve". */
export function perAction(label: string, values: readonly number[], actions: readonly string[] | undefined): string {
  if (values.length <= 1 || !actions || actions.length !== values.length) return `${label} ${values.map(number).join(', ')}`;
  return `${label} ${values.map((v, j) => `${number(v)} on ${actions[j]}`).join(', ')}`;
}

export function formatEvaluation(e: Evaluation, projectFile: string): string {
  const sense = e.valueSense === 'cost' ? 'expected discounted cost (lower is better)' : 'expected discounted reward (higher is better)';
  const s = e.settings;
  const rows: string[][] = [['policy', 'value J', '± s.e.', 'fixed point', 'fit']];
  // A fit that did not meet its convergence rule has no value to report: the table says so and its message says why.
  for (const p of e.policies) {
    const settled = p.status === 'converged';
    rows.push([p.name, settled ? number(p.policyValue) : 'not settled', settled ? number(p.standardError) : '', number(p.fixedPointValue), settled ? `converged (${p.iterations} it.)` : STATUS_WORDS[p.status]]);
  }
  const pc = e.presentController, truncation = truncationSentence(e.behaviour);
  if (pc) {
    const x = pc.estimate, settled = x.status === 'converged';
    rows.push([`${PRESENT_CONTROLLER} [baseline]`, settled ? number(x.policyValue) : 'not settled', settled ? number(x.standardError) : '', number(x.fixedPointValue), settled ? `converged (${x.iterations} it.)` : STATUS_WORDS[x.status]]);
    rows.push([`${LOGGED_RETURN}, completed past time limits (check)`, number(pc.completedReturn.value), number(pc.completedReturn.standardError), '', `${e.behaviour.episodes} runs`]);
  }
  rows.push([pc ? `${LOGGED_RETURN} (check; cut short at time limits)` : `${LOGGED_RETURN} [baseline]`, number(e.behaviour.value), number(e.behaviour.standardError), '', `${e.behaviour.episodes} runs`]);
  const lines = [
    `Setpoint Critic — ${e.project} (${projectFile})`,
    `Values are the ${sense}, discount ${s.discount}.`,
    `${s.transitions.toLocaleString('en-US')} transitions in ${s.episodes} runs; J averaged over ${s.startStates} start states; ${s.approximator}; ${s.quadratureNodes} quadrature nodes; seed ${s.seed}.`,
    '',
    table(rows),
    '',
    '± s.e. covers start-state sampling only; it is not a confidence interval for the fit.',
    ...e.policies.filter((p) => p.status !== 'converged').map((p) => `SERIOUS — ${p.name}: its fit did not converge, so no value is reported for it. ${p.message}`),
    ...e.policies.flatMap((p) => (p.network ? [networkLine(p.name, p.network)] : [])),
    `Computed by ${[...new Set(e.policies.map((p) => p.backend))].join('; ')}.`,
    pc ? `Baseline: the present controller as modelled from the log (${perAction('offset', pc.model.offset, pc.model.actions)}; ${perAction('dither', pc.model.std, pc.model.actions)}) and evaluated like the candidates.`
      : `Baseline: the logged return, because ${e.presentControllerReason}.`,
    ...(truncation ? [`${truncation}${pc ? '; compare with the baseline above' : ''}.`] : []),
    ...(e.warnings.length ? ['', 'Warnings:', ...e.warnings.map((w) => `  - ${w}`)] : []),
    '',
  ];
  return lines.join('\n');
}

function networkLine(name: string, n: NonNullable<Evaluation['policies'][number]['network']>): string {
  const iv = (i: [number, number]) => `[${number(i[0])}, ${number(i[1])}]`, level = `${Math.round(100 * n.level)} %`;
  return `${name}: network J ${level} interval ${iv(n.interval)} (${n.covers}); degree-2 linear J ${number(n.linear.value)} ${iv(n.linear.interval)}; ` +
    `network − linear ${number(n.difference.value)} ${iv(n.difference.interval)}. ${n.agreement.verdict === 'disagree' ? 'SERIOUS — ' : ''}${n.agreement.message}`;
}

/** The cautions, printed last so they are the final thing a reader sees. */
export function formatCautions(e: Evaluation): string {
  return ['', 'Cautions:', ...e.cautions.map((c) => `  - ${c}`), ''].join('\n');
}
