/** The project's `bootstrap` block: how many episode resamples the intervals use, and at what level. */
import { NumberField } from '../../components/NumberField';
import { problemAt, type FieldProblem } from '../../document/projectProblems';
import { DEFAULT_LEVEL, DEFAULT_RESAMPLES } from '../../../../pipeline/assessSettings';
import type { BootstrapSettings as Bootstrap, ProjectDocument } from '../../../../project/schema';
import { useWorkspace } from '../../WorkspaceContext';
import { SETTING_HELP } from './settingHelp';

export function BootstrapSettings({ doc, problems }: { doc: ProjectDocument; problems: readonly FieldProblem[] }) {
  const { documents } = useWorkspace();
  const current: Bootstrap = { resamples: doc.bootstrap?.resamples ?? DEFAULT_RESAMPLES, level: doc.bootstrap?.level ?? DEFAULT_LEVEL };
  const set = (label: string, key: keyof Bootstrap, value: number): void =>
    documents.edit(label, (d) => ({ ...d, bootstrap: { resamples: d.bootstrap?.resamples ?? DEFAULT_RESAMPLES, level: d.bootstrap?.level ?? DEFAULT_LEVEL, [key]: value } }), `bootstrap.${key}`);
  return (
    <section className="panel" aria-labelledby="bootstrap-heading">
      <h3 id="bootstrap-heading">Intervals</h3>
      <p className="small muted">{SETTING_HELP.bootstrap}</p>
      <div className="row">
        <NumberField label="Bootstrap resamples" value={current.resamples} help={SETTING_HELP.resamples} message={problemAt(problems, 'bootstrap.resamples')}
          onBlur={documents.closeStep} onCommit={(v) => v !== null && set('set the bootstrap resamples', 'resamples', v)} />
        <NumberField label="Confidence level" value={current.level} help={SETTING_HELP.level} message={problemAt(problems, 'bootstrap.level')}
          onBlur={documents.closeStep} onCommit={(v) => v !== null && set('set the confidence level', 'level', v)} />
      </div>
    </section>
  );
}
