/** Shared by the network FQE tests: where the wasm binaries are. */
import { fileURLToPath } from 'node:url';

/** The wasm backend's binaries in this checkout (tests run in Node). */
export const wasmDirectory = fileURLToPath(new URL('../../../node_modules/@tensorflow/tfjs-backend-wasm/dist/', import.meta.url));
