/** Settings of the linear approximator: the feature map and the iteration's ridge, tolerance and cap. */
import { NumberField } from '../../components/NumberField';
import { SelectField } from '../../components/SelectField';
import { problemAt, type FieldProblem } from '../../document/projectProblems';
import type { ApproximatorSettings } from '../../../../project/approximatorSchema';
import { useWorkspace } from '../../WorkspaceContext';
import { SETTING_HELP } from './settingHelp';

type Linear = Extract<ApproximatorSettings, { kind: 'linear' }>;

export function LinearSettings({ settings, problems }: { settings: Linear; problems: readonly FieldProblem[] }) {
  const { documents } = useWorkspace();
  const set = (label: string, change: Partial<Linear>, key: string): void =>
    documents.edit(label, (d) => (d.approximator.kind === 'linear' ? { ...d, approximator: { ...d.approximator, ...change } } : d), `approximator.${key}`);
  const f = settings.features;
  const at = (path: string) => problemAt(problems, `approximator.${path}`);
  const number = (label: string, key: 'ridge' | 'tolerance' | 'maxIterations', help: string) => (
    <NumberField label={label} value={settings[key]} help={help} message={at(key)} onBlur={documents.closeStep}
      onCommit={(v) => v !== null && set(`set the ${label.toLowerCase()}`, { [key]: v }, key)} />
  );
  return (
    <>
      <div className="row">
        <SelectField
          label="Features" value={f.kind} help={SETTING_HELP.featureKind}
          options={[{ value: 'polynomial', label: 'Polynomial' }, { value: 'radialBasis', label: 'Radial basis' }]}
          onChange={(kind) => set('change the features', { features: kind === 'polynomial' ? { kind, degree: 2 } : { kind, centresPerInput: 5, widthScale: 1 } }, 'features.kind')}
        />
        {f.kind === 'polynomial' && (
          <NumberField label="Polynomial degree" value={f.degree} help={SETTING_HELP.degree} message={at('features.degree')} onBlur={documents.closeStep}
            onCommit={(v) => v !== null && set('set the degree', { features: { ...f, degree: v } }, 'features.degree')} />
        )}
        {f.kind === 'radialBasis' && (
          <>
            <NumberField label="Centres per input" value={f.centresPerInput} help={SETTING_HELP.centresPerInput} message={at('features.centresPerInput')} onBlur={documents.closeStep}
              onCommit={(v) => v !== null && set('set the centres', { features: { ...f, centresPerInput: v } }, 'features.centresPerInput')} />
            <NumberField label="Width scale" value={f.widthScale} help={SETTING_HELP.widthScale} message={at('features.widthScale')} onBlur={documents.closeStep}
              onCommit={(v) => v !== null && set('set the width', { features: { ...f, widthScale: v } }, 'features.widthScale')} />
          </>
        )}
      </div>
      <div className="row">
        {number('Weight penalty (ridge)', 'ridge', SETTING_HELP.ridge)}
        {number('Tolerance', 'tolerance', SETTING_HELP.tolerance)}
        {number('Maximum iterations', 'maxIterations', SETTING_HELP.maxIterations)}
      </div>
    </>
  );
}
