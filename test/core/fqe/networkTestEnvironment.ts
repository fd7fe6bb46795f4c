/** Shared by the network FQE tests: where the wasm binaries are, and the settings of the accuracy tests. */
import { fileURLToPath } from 'node:url';
import { defaultNetworkSettings, type NetworkFqeSettings } from '../../../src/core/fqe/networkSettings';

/** The wasm backend's binaries in this checkout (tests run in Node). */
export const wasmDirectory = fileURLToPath(new URL('../../../node_modules/@tensorflow/tfjs-backend-wasm/dist/', import.meta.url));

/**
 * Affordable settings for 100,000 transitions at γ = 0.95 (about 25–45 s per fit on one core):
 * see networkLinearQuadratic.test.ts for why and what they achieve.
 */
export const affordableSettings: NetworkFqeSettings = {
  ...defaultNetworkSettings,
  hiddenLayers: [32, 32], learningRate: 3e-3, batchSize: 1024, stepsPerIteration: 60, outerIterations: 100,
  heldOutFraction: 0.1, patience: 0, averageLast: 20,
};
