/** The value-surface and slice sections: the fitted values behind each J, drawn where the logs are. */
import { actionSliceChart } from '../../figures/charts/actionSlice';
import { valueSurfaceChart } from '../../figures/charts/valueSurface';
import { inlineSvg } from '../../figures/writers/inlineSvg';
import type { ActionSlice } from '../assessment';
import { CAUTION_SHORT } from '../cautions';
import { formatNumber, html, raw, type Html } from './htmlText';
import { senseWords, valueAxisLabel, type FigureCounter, type ReportInput } from './reportInput';

const SURFACE_SIZE = { widthPx: 640, heightPx: 460 }, SLICE_SIZE = { widthPx: 420, heightPx: 330 };

export function surfacesSection(input: ReportInput, figures: FigureCounter): Html {
  const words = senseWords(input), units = stateUnits(input);
  const surfaces = input.evaluation.policies.filter((p) => p.surface);
  if (!surfaces.length) return html`<section id="surfaces"><h2>Value surfaces</h2><p>No surface: the project has fewer than two states.</p></section>`;
  return html`<section id="surfaces"><h2>Value surfaces</h2>
    <p>${raw('V<sup>π</sup>(s) = E<sub>a~π</sub>[Q<sup>π</sup>(s, a)]')}, the expected discounted ${words.short} from state s on under each candidate, over two states; the others held at their logged means. Hatched cells have no logged state nearest them: there the value is extrapolated.</p>
    ${surfaces.map((p, i) => {
      const s = p.surface!, n = figures.next();
      const names = input.project.columns.states.map((x) => x.column);
      const others = s.heldState.map((v, c) => ({ name: names[c], v })).filter((h) => h.name !== s.xState && h.name !== s.yState);
      const held = others.length ? `other states held at ${others.map((h) => `${h.name} = ${formatNumber(h.v, 4)}${units.get(h.name) ? ` ${units.get(h.name)}` : ''}`).join(', ')}` : 'no other states';
      const svg = inlineSvg((look) => valueSurfaceChart({
        surface: s, xLabel: label(s.xState, units), yLabel: label(s.yState, units), valueLabel: valueAxisLabel(input, 'V'), title: '', theme: 'light',
      }, look) as never, { ...SURFACE_SIZE, id: `surface-${i}`, label: `Value surface of ${p.name}` });
      return html`<figure id="fig-surface-${i}">${raw(svg)}<figcaption>Figure ${n}. ${p.name}: ${raw('V<sup>π</sup>(s)')} (${words.value}, ${words.better}) over ${s.xState} and ${s.yState};
        ${held}. Hatched: no logged state nearest the cell. ${CAUTION_SHORT}</figcaption></figure>`;
    })}</section>`;
}

export function slicesSection(input: ReportInput, figures: FigureCounter): Html {
  const a = input.assessment, words = senseWords(input);
  if (!a) return html`<section id="slices"><h2>Slices</h2><p>Not computed (the assessment did not run).</p></section>`;
  const actions = input.project.columns.actions, units = new Map(actions.map((x) => [x.column, x.unit]));
  return html`<section id="slices"><h2>Slices</h2>
    <p>${raw('Q<sup>π</sup>(s, a)')} of each candidate along its action at three states. The dotted line is the candidate’s mean action there, the shaded band the range of actions logged near that state: where the band does not cover the candidate’s actions, Q is extrapolated.</p>
    ${a.candidates.map((c, ci) => {
      const n = figures.next();
      const charts = c.slices.map((s, si) => inlineSvg((look) => actionSliceChart({
        slice: { actions: Float64Array.from(s.actions), actionValues: Float64Array.from(s.values), density: normalDensity(s.actions, s.candidateMean, s.candidateStd),
          nodes: { points: new Float64Array(0), weights: new Float64Array(0) }, state: s.state, policyName: c.name },
        actionLabel: label(actions[s.actionIndex].column, units), valueLabel: valueAxisLabel(input, 'Q'), title: '', subtitle: s.label, theme: 'light',
        loggedRange: s.loggedRange, meanAction: s.candidateMean,
      }, look) as never, { ...SLICE_SIZE, id: `slice-${ci}-${si}`, label: `${c.name}: Q along the action at ${s.label}` }));
      return html`<figure id="fig-slices-${n}"><div class="grid2">${charts.map((svg) => raw(svg))}</div>
        <figcaption>Figure ${n}. ${c.name}: ${raw('Q<sup>π</sup>(s, a)')} along ${actions.length > 1 ? `each action (${actions.map((x) => x.column).join(', ')})` : 'the action'} (${words.value}, ${words.better}) at ${sliceStatesText(c.slices)};
        shaded: actions logged near the state; dotted: the candidate’s mean action (${sliceDitherText(c.slices, actions)})${actions.length > 1 ? '; the other actions held at the candidate’s median action there' : ''}. ${CAUTION_SHORT}</figcaption></figure>`;
    })}</section>`;
}

/** The states the slices are taken at, each once: with several actions each state has a slice per action, and the caption named it once per slice. */
export function sliceStatesText(slices: readonly Pick<ActionSlice, 'label'>[]): string {
  return [...new Set(slices.map((s) => s.label))].join('; ');
}

/**
 * The dither the caption states: one action's with its unit, or with several actions each one's,
 * named, from that action's own slices (they may differ, as may their units). Plain text: `html` escapes it.
 */
export function sliceDitherText(slices: readonly ActionSlice[], actions: readonly { column: string; unit?: string }[]): string {
  const one = (j: number): string => {
    const std = slices.find((s) => s.actionIndex === j)?.candidateStd, unit = actions[j]?.unit;
    return `${formatNumber(std, 3)}${unit ? ` ${unit}` : ''}`;
  };
  if (actions.length <= 1) return `dither ${one(0)}`;
  return `dither ${actions.map((a, j) => `${one(j)} on ${a.column}`).join(', ')}`;
}

/** The candidate's Gaussian action density along the slice (before any limits): the shading under Q. */
function normalDensity(actions: readonly number[], mean: number, std: number): Float64Array {
  return Float64Array.from(actions, (x) => (std > 0 ? Math.exp(-0.5 * ((x - mean) / std) ** 2) / (std * Math.sqrt(2 * Math.PI)) : 0));
}

function stateUnits(input: ReportInput): Map<string, string> {
  return new Map(input.project.columns.states.map((s) => [s.column, s.unit]));
}

function label(name: string, units: Map<string, string | undefined>): string {
  const unit = units.get(name);
  return unit ? `${name} (${unit})` : name;
}

