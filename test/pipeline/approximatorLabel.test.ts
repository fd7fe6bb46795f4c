/** The approximator in words: one writer for the class list, the run screen, the report, the JSON settings and the command line. */
import { describe, expect, it } from 'vitest';
import { approximatorClassLabel, describeApproximator, hiddenLayersText } from '../../src/pipeline/plan/approximatorLabel';
import { defaultNetworkSettings } from '../../src/core/fqe/networkSettings';

describe('approximator labels', () => {
  it('says what a network is in plain words, never "network 8 (relu)"', () => {
    expect(hiddenLayersText([8])).toBe('one hidden layer of 8 units');
    expect(hiddenLayersText([16, 16])).toBe('two hidden layers of 16 units each');
    expect(hiddenLayersText([32, 16, 8])).toBe('three hidden layers, of 32, 16 and 8 units');
    const network = { ...defaultNetworkSettings, kind: 'network' as const, hiddenLayers: [8], activation: 'relu' as const };
    expect(approximatorClassLabel(network)).toBe('network, one hidden layer of 8 units');
    expect(describeApproximator(network as never)).toBe('network, one hidden layer of 8 units, ReLU activation, polynomial part’s degree chosen from the log');
    expect(describeApproximator({ ...network, polynomialDegree: 4 } as never)).toBe('network, one hidden layer of 8 units, ReLU activation, polynomial part of degree 4, fixed');
    expect(describeApproximator(network as never)).not.toMatch(/\(relu\)|network \d/);
  });

  it('names the linear classes as the class list does', () => {
    expect(approximatorClassLabel({ kind: 'linear', features: { kind: 'polynomial', degree: 3 } } as never)).toBe('polynomial, degree 3');
    expect(approximatorClassLabel({ kind: 'linear', features: { kind: 'radialBasis', centresPerInput: 7 } } as never)).toBe('radial basis, 7 centres per input');
  });
});
