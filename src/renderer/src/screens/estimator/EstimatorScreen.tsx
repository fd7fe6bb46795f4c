/** Step 3, the estimator: discount, the approximator of Q, quadrature, seed and the bootstrap, each with a line saying what it does. */
import { NumberField } from '../../components/NumberField';
import { defaultApproximator } from '../../document/newProject';
import { problemAt } from '../../document/projectProblems';
import { useDocument, useProblems, useSession } from '../../hooks';
import { discountHelp } from './discountHorizon';
import { useWorkspace } from '../../WorkspaceContext';
import { BootstrapSettings } from './BootstrapSettings';
import { LinearSettings } from './LinearSettings';
import { NetworkSettings } from './NetworkSettings';
import { SETTING_HELP } from './settingHelp';

export function EstimatorScreen(props: { onNext: () => void }) {
  const { documents } = useWorkspace();
  const doc = useDocument();
  const problems = useProblems();
  const period = useSession().importState;
  const periodSeconds = period.status === 'done' ? period.result.summary.samplingPeriodSeconds : null;
  const number = (label: string, key: 'discount' | 'quadratureNodes' | 'seed', help: string = SETTING_HELP[key]) => (
    <NumberField label={label} value={doc[key]} help={help} message={problemAt(problems, key)} onBlur={documents.closeStep}
      onCommit={(v) => v !== null && documents.edit(`set the ${label.toLowerCase()}`, (d) => ({ ...d, [key]: v }), key)} />
  );
  const kind = doc.approximator.kind;
  return (
    <>
      <header>
        <h2>Method</h2>
        <p>How the value of each candidate is estimated from the log (by fitted Q-evaluation; see Help for the terms). The defaults suit most plants; change them when a fit reports trouble.</p>
      </header>
      <section className="panel" aria-labelledby="basics-heading">
        <h3 id="basics-heading">Discount and averaging</h3>
        <div className="row">
          {number('Discount factor γ', 'discount', discountHelp(doc.discount, periodSeconds))}
          {number('Gauss–Hermite nodes', 'quadratureNodes')}
          {number('Random seed', 'seed')}
        </div>
        <p className="small muted">
          {doc.startStates.kind === 'episodeStarts' ? SETTING_HELP.startStates : `J averages V over ${doc.startStates.states.length} start state${doc.startStates.states.length === 1 ? '' : 's'} given in the project file.`}
        </p>
      </section>
      <section className="panel" aria-labelledby="approximator-heading">
        <h3 id="approximator-heading">Approximator of Q(s, a)</h3>
        <p className="small muted">{SETTING_HELP.approximator}</p>
        <div className="row" role="radiogroup" aria-label="Approximator">
          <label className="choice"><input type="radio" name="approximator" checked={kind === 'linear'} onChange={() => documents.edit('use linear features', (d) => ({ ...d, approximator: defaultApproximator('linear') }))} /> Linear in features</label>
          <label className="choice"><input type="radio" name="approximator" checked={kind === 'network'} onChange={() => documents.edit('use a neural network', (d) => ({ ...d, approximator: defaultApproximator('network') }))} /> Neural network</label>
        </div>
        {doc.approximator.kind === 'linear' ? <LinearSettings settings={doc.approximator} problems={problems} /> : <NetworkSettings settings={doc.approximator} problems={problems} />}
      </section>
      <BootstrapSettings doc={doc} problems={problems} />
      <button className="primary" onClick={props.onNext} data-testid="next-run">Next: run</button>
    </>
  );
}
