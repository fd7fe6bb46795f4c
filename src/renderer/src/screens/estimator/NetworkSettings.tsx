/** Settings of the neural-network approximator (the project schema's network settings). */
import { useEffect, useState } from 'react';
import { NumberField } from '../../components/NumberField';
import { SelectField } from '../../components/SelectField';
import { problemAt, type FieldProblem } from '../../document/projectProblems';
import type { ApproximatorSettings } from '../../../../project/approximatorSchema';
import { ACTIVATION_NAMES } from '../../../../pipeline/plan/approximatorLabel';
import { POLYNOMIAL_PART_CHOSEN, POLYNOMIAL_PART_VALUES, type PolynomialPartSetting } from '../../../../core/fqe/polynomialPartSetting';
import { NETWORK_ACTIVATIONS, NETWORK_BACKENDS, type NetworkBackendPreference } from '../../../../core/fqe/networkSettings';
import { useWorkspace } from '../../WorkspaceContext';
import { formatHiddenLayers, parseHiddenLayers } from './hiddenLayers';
import { SETTING_HELP } from './settingHelp';

type Network = Extract<ApproximatorSettings, { kind: 'network' }>;
type NumericKey = 'learningRate' | 'batchSize' | 'stepsPerIteration' | 'outerIterations' | 'patience' | 'tolerance' | 'averageLast' | 'heldOutFraction';

const NUMERIC: { key: NumericKey; label: string; help: string }[] = [
  { key: 'learningRate', label: 'Learning rate', help: SETTING_HELP.learningRate }, { key: 'batchSize', label: 'Batch size', help: SETTING_HELP.batchSize },
  { key: 'stepsPerIteration', label: 'Gradient steps per outer iteration', help: SETTING_HELP.stepsPerIteration },
  { key: 'outerIterations', label: 'Most outer iterations', help: SETTING_HELP.outerIterations },
  { key: 'patience', label: 'Stopping window (outer iterations)', help: SETTING_HELP.patience },
  { key: 'tolerance', label: 'Stopping tolerance (share of the value)', help: SETTING_HELP.networkTolerance },
  { key: 'averageLast', label: 'Outer iterations averaged at the end', help: SETTING_HELP.averageLast },
  { key: 'heldOutFraction', label: 'Share of runs held out', help: SETTING_HELP.heldOutFraction },
];

/** "Chosen from the log", "Degree 4" (the help line under the control says between which degrees). */
function polynomialDegreeOptionText(value: PolynomialPartSetting): string {
  return value === POLYNOMIAL_PART_CHOSEN ? 'Chosen from the log' : `Degree ${value}`;
}

/** How each TensorFlow.js backend choice reads in the select. */
const BACKEND_NAMES: Readonly<Record<NetworkBackendPreference, string>> = { auto: 'Automatic', wasm: 'WebAssembly', cpu: 'Plain JavaScript' };

export function NetworkSettings({ settings, problems }: { settings: Network; problems: readonly FieldProblem[] }) {
  const { documents } = useWorkspace();
  const set = (label: string, change: Partial<Network>, key: string): void =>
    documents.edit(label, (d) => (d.approximator.kind === 'network' ? { ...d, approximator: { ...d.approximator, ...change } } : d), `approximator.${key}`);
  const at = (path: string) => problemAt(problems, `approximator.${path}`);
  const [layersText, setLayersText] = useState(formatHiddenLayers(settings.hiddenLayers));
  useEffect(() => setLayersText((t) => (parseHiddenLayers(t)?.join() === settings.hiddenLayers.join() ? t : formatHiddenLayers(settings.hiddenLayers))), [settings.hiddenLayers]);
  const layers = parseHiddenLayers(layersText);
  return (
    <>
      <div className="row">
        <div className="field">
          <label htmlFor="hidden-layers">Hidden layers</label>
          <input id="hidden-layers" value={layersText} aria-invalid={layers === null || Boolean(at('hiddenLayers'))} onBlur={documents.closeStep}
            onChange={(e) => {
              setLayersText(e.target.value);
              const parsed = parseHiddenLayers(e.target.value);
              if (parsed) set('set the hidden layers', { hiddenLayers: parsed }, 'hiddenLayers');
            }} />
          <span className="help">{SETTING_HELP.hiddenLayers}</span>
          {(layers === null || at('hiddenLayers')) && <span className="message">{layers === null ? 'expected whole numbers separated by commas, e.g. 64, 64' : at('hiddenLayers')}</span>}
        </div>
        <SelectField label="Activation" value={settings.activation} help={SETTING_HELP.activation}
          options={NETWORK_ACTIVATIONS.map((value) => ({ value, label: ACTIVATION_NAMES[value] }))}
          onChange={(activation) => set('change the activation', { activation }, 'activation')} />
        <SelectField label="Polynomial part" value={String(settings.polynomialDegree)} help={SETTING_HELP.polynomialDegree} message={at('polynomialDegree')} testId="polynomial-degree"
          options={POLYNOMIAL_PART_VALUES.map((value) => ({ value: String(value), label: polynomialDegreeOptionText(value) }))}
          onChange={(text) => {
            const polynomialDegree = POLYNOMIAL_PART_VALUES.find((value) => String(value) === text);
            if (polynomialDegree !== undefined) set('change the polynomial part', { polynomialDegree }, 'polynomialDegree');
          }} />
      </div>
      <div className="row">
        {NUMERIC.map(({ key, label, help }) => (
          <NumberField key={key} label={label} value={settings[key]} help={help} message={at(key)} onBlur={documents.closeStep}
            onCommit={(v) => v !== null && set(`set the ${label.toLowerCase()}`, { [key]: v }, key)} />
        ))}
      </div>
      {/* Last: a closed disclosure between two rows of fields read as if the fields below were its contents. */}
      <details className="details-section">
        <summary>Computation details</summary>
        <SelectField label="Computed with" value={settings.backend} help={SETTING_HELP.backend}
          options={NETWORK_BACKENDS.map((value) => ({ value, label: BACKEND_NAMES[value] }))}
          onChange={(backend) => set('change how the network is computed', { backend }, 'backend')} />
      </details>
    </>
  );
}
