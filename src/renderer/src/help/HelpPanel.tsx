/**
 * Help, reachable from the toolbar and F1: how to go through the steps, the sample projects to try
 * the app on, and the glossary of every term the screens and the report use.
 */
import { Cautions } from '../components/Cautions';
import { RichText } from '../components/RichText';
import { useWorkspace } from '../WorkspaceContext';
import { GLOSSARY } from './glossary';
import { SAMPLE_PROJECTS } from './sampleProjects';

export function HelpPanel({ onClose }: { onClose: () => void }) {
  const { files } = useWorkspace();
  return (
    <aside className="help-panel" role="dialog" aria-labelledby="help-heading" data-testid="help-panel">
      <div className="notice-head">
        <h2 id="help-heading">Help</h2>
        <button onClick={onClose} data-testid="close-help">Close</button>
      </div>
      <h3>Getting started</h3>
      <ol className="small">
        <li><strong>Plant log:</strong> choose the CSV logged under the present controller and give its columns roles and units.</li>
        <li><strong>Candidates:</strong> define the retunes to judge: mean action, dither, actuator limits.</li>
        <li><strong>Method:</strong> the discount factor (see its time horizon) and how Q is fitted; the defaults suit most plants.</li>
        <li><strong>Run</strong>, then read the <strong>Findings</strong>: J of each candidate beside the present controller, with intervals and checks.</li>
      </ol>
      <h3>Sample projects</h3>
      <p className="small muted">Invented plants with logs made by their own simulators; they open as new, unsaved projects.</p>
      <ul className="small">
        {SAMPLE_PROJECTS.map((s) => (
          <li key={s.id}>
            <button className="link" onClick={() => { onClose(); void files.openSample(s.id); }} data-testid={`sample-${s.id}`}>{s.title}</button> — {s.summary}
          </li>
        ))}
      </ul>
      <h3>Glossary</h3>
      <dl data-testid="glossary">
        {GLOSSARY.map((g) => (
          <div key={g.term}>
            <dt><RichText text={g.term} />{g.aka ? <span className="muted"> ({g.aka})</span> : null}</dt>
            <dd><RichText text={g.meaning} /></dd>
          </div>
        ))}
      </dl>
      <Cautions />
    </aside>
  );
}
