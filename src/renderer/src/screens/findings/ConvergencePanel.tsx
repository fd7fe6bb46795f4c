/** How each candidate's fit converged: weight change and Bellman residual (or loss) per iteration. */
import { useState } from 'react';
import { FIT_STATUS_WORDS } from '../../../../core/fqe/fitStatus';
import { ConvergencePlot } from '../../plots';
import { SelectField } from '../../components/SelectField';
import type { Evaluation } from '../../../../pipeline/estimates';
import type { Theme } from '../../theme';
import { ExportPanel } from './ExportPanel';
import { FoldPanel } from './FoldPanel';

export function ConvergencePanel({ evaluation, theme }: { evaluation: Evaluation; theme: Theme }) {
  const [candidate, setCandidate] = useState(0);
  const estimate = evaluation.policies[candidate];
  if (!estimate) return null;
  const title = `Convergence of ${estimate.name}`;
  return (
    <FoldPanel section="convergence" testId="panel-convergence" gist={evaluation.policies.map((p) => `${p.name}: ${FIT_STATUS_WORDS[p.status]}`).join('; ')}>
      <div className="row">
        <SelectField label="Candidate" value={String(candidate)} onChange={(v) => setCandidate(Number(v))} testId="convergence-candidate" className="fit-field"
          options={evaluation.policies.map((p, i) => ({ value: String(i), label: p.name }))} />
      </div>
      <p className="small">{estimate.message}</p>
      <ConvergencePlot history={estimate.history} title={title} theme={theme} />
      <ExportPanel kind="convergence" evaluation={evaluation} defaultTitle={title} policy={estimate.name} fileBase={`convergence-${estimate.name}`}
        makeSpec={(t) => ({ kind: 'convergence', props: { history: estimate.history, title: t, theme } })} />
    </FoldPanel>
  );
}
