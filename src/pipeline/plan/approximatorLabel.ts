/**
 * The approximator in words, written once for the class list (the function classes compared in the
 * assessment), the run screen, the report, the evaluation's JSON settings and the command line. A
 * network reads as what it is — "network, one hidden layer of 8 units" — not as "network 8 (relu)",
 * which only a reader of the settings file could decode (the screen review).
 */
import { POLYNOMIAL_PART_CHOSEN, type PolynomialPartSetting } from '../../core/fqe/polynomialPartSetting';
import type { ApproximatorSettings } from '../../project/approximatorSchema';

type Network = Extract<ApproximatorSettings, { kind: 'network' }>;
type Linear = Extract<ApproximatorSettings, { kind: 'linear' }>;

/** The activation as the network settings' list names it ("ReLU", "tanh", "ELU"). */
export const ACTIVATION_NAMES: Readonly<Record<Network['activation'], string>> = { relu: 'ReLU', tanh: 'tanh', elu: 'ELU' };

const COUNT_WORDS = ['no', 'one', 'two', 'three', 'four', 'five', 'six', 'seven', 'eight', 'nine'];

/** "one hidden layer of 8 units", "two hidden layers of 16 units each", "two hidden layers, of 32 and 16 units". */
export function hiddenLayersText(hiddenLayers: readonly number[]): string {
  const n = hiddenLayers.length, count = COUNT_WORDS[n] ?? String(n);
  if (n === 1) return `one hidden layer of ${hiddenLayers[0]} unit${hiddenLayers[0] === 1 ? '' : 's'}`;
  if (hiddenLayers.every((u) => u === hiddenLayers[0])) return `${count} hidden layers of ${hiddenLayers[0]} units each`;
  return `${count} hidden layers, of ${hiddenLayers.slice(0, -1).join(', ')} and ${hiddenLayers[n - 1]} units`;
}

/** A polynomial function class in the class list: "polynomial, degree 3". */
export function polynomialClassLabel(degree: number): string {
  return `polynomial, degree ${degree}`;
}

/** The three nested polynomial classes the class verdict's pointer reads (src/core/diagnostics/nestedClassPointer.ts): a project's own degree 2, and 3 and 4. */
export const NESTED_CLASS_LABELS = { own: polynomialClassLabel(2), middle: polynomialClassLabel(3), top: polynomialClassLabel(4) } as const;

/** The function class the approximator fits, as the class list names it: "network, one hidden layer of 8 units", "polynomial, degree 2". */
export function approximatorClassLabel(a: Pick<Network, 'kind' | 'hiddenLayers'> | Pick<Linear, 'kind' | 'features'>): string {
  if (a.kind === 'network') return `network, ${hiddenLayersText(a.hiddenLayers)}`;
  return a.features.kind === 'polynomial' ? polynomialClassLabel(a.features.degree) : `radial basis, ${a.features.centresPerInput} centres per input`;
}

/** The polynomial part's setting in words: "polynomial part’s degree chosen from the log", "polynomial part of degree 4, fixed". */
export function polynomialDegreeSettingText(setting: PolynomialPartSetting): string {
  return setting === POLYNOMIAL_PART_CHOSEN ? 'polynomial part’s degree chosen from the log' : `polynomial part of degree ${setting}, fixed`;
}

/**
 * The approximator among the run's settings: the class and how it is fitted ("network, one hidden layer of 8 units, ReLU
 * activation, polynomial part’s degree chosen from the log").
 */
export function describeApproximator(settings: ApproximatorSettings): string {
  if (settings.kind === 'network') return `${approximatorClassLabel(settings)}, ${ACTIVATION_NAMES[settings.activation]} activation, ${polynomialDegreeSettingText(settings.polynomialDegree)}`;
  const f = settings.features;
  return f.kind === 'polynomial' ? `linear, polynomial features of degree ${f.degree}` : `linear, radial basis (${f.centresPerInput} centres per input)`;
}
