/** The value-surface and slice sections: the fitted values behind each J, drawn where the logs are. */
import { uncoveredGridPoints } from '../../core/diagnostics/unvisitedRegion';
import { CAUTION_SHORT } from '../cautions';
import { formatNumber, html, raw, type Html } from './htmlText';
import { senseWords, type FigureCounter, type ReportInput } from './reportInput';
import { svgHeatMap } from './svgHeatMap';
import { svgLineChart } from './svgLineChart';

export function surfacesSection(input: ReportInput, figures: FigureCounter): Html {
  const words = senseWords(input), units = stateUnits(input);
  const surfaces = input.evaluation.policies.filter((p) => p.surface);
  if (!surfaces.length) return html`<section id="surfaces"><h2>Value surfaces</h2><p>No surface: the project has fewer than two states.</p></section>`;
  return html`<section id="surfaces"><h2>Value surfaces</h2>
    <p>${raw('V<sup>π</sup>(s) = E<sub>a~π</sub>[Q(s, a)]')} of each candidate over two states, the others held at their logged means. Hatched grid points have no logged state within one grid step: there the value is extrapolated.</p>
    ${surfaces.map((p, i) => {
      const s = p.surface!, n = figures.next();
      const names = input.project.columns.states.map((x) => x.column);
      const others = s.heldState.map((v, c) => ({ name: names[c], v })).filter((h) => h.name !== s.xState && h.name !== s.yState);
      const held = others.length ? `other states held at ${others.map((h) => `${h.name} = ${formatNumber(h.v, 4)}`).join(', ')}` : 'no other states';
      const svg = svgHeatMap({
        id: `surface-${i}`, x: s.x, y: s.y, values: s.values, uncovered: uncoveredGridPoints(s.visits, s.x.length, s.y.length),
        xLabel: label(s.xState, units), yLabel: label(s.yState, units), valueLabel: `V — ${words.value}`,
      });
      return html`<figure id="fig-surface-${i}">${raw(svg)}<figcaption>Figure ${n}. ${p.name}: ${raw('V<sup>π</sup>')} (${words.value}, ${words.better}) over ${s.xState} and ${s.yState};
        ${held}. Hatched: no logged state within one grid step. ${CAUTION_SHORT}</figcaption></figure>`;
    })}</section>`;
}

export function slicesSection(input: ReportInput, figures: FigureCounter): Html {
  const a = input.assessment, words = senseWords(input);
  if (!a) return html`<section id="slices"><h2>Slices</h2><p>Not computed (the assessment did not run).</p></section>`;
  const actions = input.project.columns.actions;
  return html`<section id="slices"><h2>Slices</h2>
    <p>Q(s, a) of each candidate along its action at three states. The dotted line is the candidate’s mean action there, the shaded band the range of actions logged at the nearest logged states: where the band does not cover the candidate’s actions, Q is extrapolated.</p>
    ${a.candidates.map((c) => {
      const n = figures.next();
      const charts = c.slices.map((s) => svgLineChart({
        width: 292, title: s.label, series: [{ name: 'Q(s, a) along the action', x: s.actions, y: s.values }],
        xLabel: label(actions[s.actionIndex].column, new Map(actions.map((x) => [x.column, x.unit]))), yLabel: `Q — ${words.short}`,
        bands: [{ x0: s.loggedRange[0], x1: s.loggedRange[1], label: 'actions logged near this state' }],
        markers: [{ x: s.candidateMean, label: `candidate mean ${formatNumber(s.candidateMean, 4)}` }],
      }));
      return html`<figure id="fig-slices-${n}"><div class="grid2">${charts.map((svg) => raw(svg))}</div>
        <figcaption>Figure ${n}. ${c.name}: Q(s, a) along the action (${words.value}, ${words.better}) at ${c.slices.map((s) => s.label).join('; ')};
        shaded: actions logged near the state; dotted: the candidate’s mean action (std ${formatNumber(c.slices[0]?.candidateStd, 3)}). ${CAUTION_SHORT}</figcaption></figure>`;
    })}</section>`;
}

function stateUnits(input: ReportInput): Map<string, string> {
  return new Map(input.project.columns.states.map((s) => [s.column, s.unit]));
}

function label(name: string, units: Map<string, string>): string {
  const unit = units.get(name);
  return unit ? `${name} [${unit}]` : name;
}
