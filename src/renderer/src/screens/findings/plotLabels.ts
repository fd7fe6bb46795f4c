/** Words on the plots and in export captions: axes with units, what V means, the settings in a line. */
import type { Evaluation } from '../../../../pipeline/estimates';
import type { ProjectDocument } from '../../../../project/schema';
import { discountWithHorizon } from '../estimator/discountHorizon';
import { keepUnitGroups } from '../../../../core/unitGroups';
import { policyLabel } from '../../../../pipeline/policyNames';
import { valueUnitText } from '../../../../pipeline/valueUnitWords';
import { valueAxisTitle } from '../../../../figures/parts/valueAxisTitle';

export function stateLabel(doc: ProjectDocument, index: number): string {
  const s = doc.columns.states[index];
  return s ? (s.unit ? `${s.column} (${s.unit})` : s.column) : `state ${index + 1}`;
}

export function actionLabel(doc: ProjectDocument, index: number): string {
  const a = doc.columns.actions[index];
  return a ? (a.unit ? `${a.column} (${a.unit})` : a.column) : `action ${index + 1}`;
}

/** The cost's or reward's own unit from the project, '' when none is given. */
export function valueUnit(doc: ProjectDocument): string {
  return valueUnitText(doc.columns.reward.unit);
}

/** What the plotted values are, as rich text for an axis: "V^{π}(s), discounted cost (€)". */
export function valueLabel(sense: 'reward' | 'cost', symbol: 'V' | 'Q', unit = ''): string {
  return valueAxisTitle(symbol, sense, unit);
}

/** J's axis title: "J, discounted cost (€)". */
export function policyValueLabel(sense: 'reward' | 'cost', unit = ''): string {
  return valueAxisTitle('J', sense, unit);
}

/** The settings behind the numbers, for captions: "γ = 0.95 (horizon about 20 steps); linear …; 10 nodes; seed 1; 19,960 transitions". */
export function settingsLine(evaluation: Evaluation): string {
  const s = evaluation.settings;
  return `γ = ${discountWithHorizon(s.discount, null)}; ${s.approximator}; ${s.quadratureNodes} quadrature nodes; seed ${s.seed}; ${s.transitions.toLocaleString('en-US')} transitions in ${s.episodes} runs`;
}

/** "2024-05-01 14:03 UTC" from an ISO time stamp. */
export function captionDate(iso: string): string {
  const d = new Date(iso);
  return Number.isNaN(d.getTime()) ? iso : `${d.toISOString().slice(0, 16).replace('T', ' ')} UTC`;
}

/** The held values of the states not on the axes, as "level_lower_m = 0.8 m". */
export function heldLabel(doc: ProjectDocument, held: readonly number[], axes: readonly number[], format: (x: number) => string): string {
  const parts = doc.columns.states.flatMap((s, i) => (axes.includes(i) ? [] : [`${s.column} = ${format(held[i])}${s.unit ? ` ${s.unit}` : ''}`]));
  return parts.length === 0 ? '' : `Other states held at ${parts.join(', ')}`;
}

/**
 * The state a slice is drawn at, each state named with its unit, two to a line (a line wider than the
 * plot is squeezed, not wrapped): ["at zone_temp_c = 21.07 °C, outdoor_temp_c = −1.904 °C", "zone_error_integral = …"].
 * The export's line under the title said "at state (21.07, −1.904, −796.3, 81.2)", numbers with no name or unit.
 */
export function sliceStateLines(doc: ProjectDocument, state: readonly number[], format: (x: number) => string): string[] {
  const parts = state.map((v, i) => {
    const s = doc.columns.states[i];
    return `${s?.column ?? `state ${i + 1}`} = ${format(v)}${s?.unit ? ` ${s.unit}` : ''}`;
  });
  const lines: string[] = [];
  for (let i = 0; i < parts.length; i += 2) lines.push(parts.slice(i, i + 2).join(', '));
  if (lines.length) lines[0] = `at ${lines[0]}`;
  return lines;
}

/** A policy's name as shown (the present controller's and the logged return's read as their one label). */
export { policyLabel as displayName } from '../../../../pipeline/policyNames';

/** A policy's name where a Findings card lists names (the answer and comparison tables' narrow name columns, the ranking): its label, each number held to its unit, so it wraps between groups (core/unitGroups.ts). */
export function columnName(name: string): string {
  return keepUnitGroups(policyLabel(name));
}

/**
 * The action-value slice's one-line explanation, as rich-text markup (V^{π} set as a superscript).
 * With one action the nodes' weighted mean of Q is V^π(s); with several, V^π(s) averages Q over the tensor grid of every action's nodes
 * (E_{a,b}[Q(s, a, b)]), and the slice holds the other actions at one value (the candidate's median
 * action there), so its nodes' mean is not V^π(s) unless Q is linear in the other actions.
 */
export function sliceExplanation(actionCount: number): string {
  if (actionCount <= 1) return 'Q(s, a) along the action at one state, the policy’s action density beneath, and the quadrature nodes whose weighted mean is V^{π}(s).';
  return 'Q(s, a) along one action at one state, the other actions held at the policy’s median action there; the policy’s density of this action beneath, and its quadrature nodes. V^{π}(s) averages Q over the nodes of every action together, so the weighted mean along this one slice is not V^{π}(s).';
}
