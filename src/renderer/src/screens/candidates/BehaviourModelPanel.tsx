/**
 * The behaviour model fitted to the log (a = c + G·s + e): what today's controller looks like, each
 * coefficient ± its standard error, one column per action, and the actuator limits the log shows
 * with how it shows each (a repeated extreme, or a value at a declared bound).
 */
import type { BehaviourFit } from '../../../../shared/workerMessages';
import type { ProjectDocument } from '../../../../project/schema';
import { meanActionAtMeanState } from '../../../../core/behaviourModel';
import { ditherDependenceText } from '../../../../core/ditherDependence';
import { formatNumber } from '../../format/numberFormat';
import { valueWithError } from '../../../../figures/parts/uncertainNumber';
import { loggedLimitText } from '../../../../core/loggedLimitWords';
import { actionCoefficientUnits, gainUnits } from './behaviourUnits';

export function BehaviourModelPanel({ doc, behaviour, onStart }: { doc: ProjectDocument; behaviour: BehaviourFit; onStart: () => void }) {
  if (!behaviour.ok) {
    return (
      <section className="panel" aria-labelledby="behaviour-heading">
        <h3 id="behaviour-heading">Present controller, as fitted to the log</h3>
        <p className="error-text">It could not be fitted: {behaviour.message}</p>
      </section>
    );
  }
  const m = behaviour.model;
  const { states, actions } = doc.columns;
  const dependence = m.ditherDependence ? ditherDependenceText(m.ditherDependence, actions.map((a) => a.column)) : null;
  // The error to two significant digits and the coefficient to the same place ("−21.6 ± 2.0", not "−21.57 ± 2").
  const pm = (value: number, se: number) => {
    const t = valueWithError(value, se);
    return `${t.value} ± ${t.error}`;
  };
  // Every coefficient with its unit (the action's; the action's per the state's for a gain), as the candidate editor labels them.
  const own = actionCoefficientUnits(actions), centre = meanActionAtMeanState(m);
  const rows: { label: string; cell: (j: number) => string }[] = [
    { label: `Offset${own.label}`, cell: (j) => `${pm(m.offset[j], m.offsetStandardError[j])}${own.cell(j)}` },
    ...states.map((s, p) => {
      const per = gainUnits(actions, s);
      return { label: `Gain on ${s.column}${per.label}`, cell: (j: number) => `${pm(m.gain[j][p], m.gainStandardError[j][p])}${per.cell(j)}` };
    }),
    // Where the law sits in the logs: the offset alone is its mean at the state 0, often far outside them (core/behaviourModel.ts).
    { label: `Mean action at the mean logged state${m.bounds ? ', before the limits' : ''}${own.label}`, cell: (j) => `${formatNumber(centre[j])}${own.cell(j)}` },
    { label: `Dither, standard deviation${own.label}`, cell: (j) => `${formatNumber(m.std[j])}${own.cell(j)}` },
    { label: 'Share of action variance explained (R²)', cell: (j) => formatNumber(m.rSquared[j], 3) },
    // Each limit with how the log showed it: a repeated extreme, or one value at a bound a candidate declares (core/loggedActionLimits.ts).
    { label: 'Actuator limits read from the log', cell: (j) => loggedLimitText(m.limits.lo[j], m.limits.hi[j], { lo: m.limits.evidence.lo[j], hi: m.limits.evidence.hi[j] }, actions[j]?.unit ?? '', (v) => formatNumber(v)) },
  ];
  return (
    <section className="panel" aria-labelledby="behaviour-heading" data-testid="behaviour-model">
      <h3 id="behaviour-heading">Present controller, as fitted to the log</h3>
      <p className="small muted">
        A straight-line fit of the logged actions on the states over {m.count.toLocaleString('en-US')} logged steps ({m.bounds
          ? 'clipped at the actuator limits the log shows and fitted there by censored regression, so the steps at a limit count as what they are'
          : 'least squares'}):
        roughly what the present controller does, and how much its action wanders around that (the dither). Values ± one standard error.
      </p>
      {behaviour.heldRowsLeftOut > 0 && (
        <p className="small" data-testid="behaviour-held-rows">{heldRowsSentence(behaviour.heldRowsLeftOut)}</p>
      )}
      <table>
        <thead><tr><th scope="col">Coefficient</th>{actions.map((a) => <th scope="col" className="number" key={a.column}>{a.column}</th>)}</tr></thead>
        <tbody>
          {rows.map((row) => (
            <tr key={row.label}><th scope="row">{row.label}</th>{actions.map((a, j) => <td className="number" key={a.column}>{row.cell(j)}</td>)}</tr>
          ))}
        </tbody>
      </table>
      {dependence && <p className="problems warning" data-testid="dither-dependence">{dependence}</p>}
      <p><button onClick={onStart} data-testid="candidate-from-behaviour">Start a candidate from the present controller</button></p>
    </section>
  );
}

/** Why the fit's step count is short of the log's: the held rows it leaves out, as the evaluation does (Coverage says more). */
export function heldRowsSentence(rows: number): string {
  return `The ${rows.toLocaleString('en-US')} steps whose action repeats the step before exactly (held by hand, or a frozen signal) are left out of this fit, as the evaluation leaves them out of the present controller’s law; Coverage has the finding.`;
}
