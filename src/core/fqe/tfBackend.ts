/**
 * Choosing and starting the TensorFlow.js backend the network runs on: `wasm` (XNNPACK kernels,
 * SIMD where the runtime has it) first, `cpu` (plain JavaScript kernels) as the fallback.
 *
 * TensorFlow.js keeps one active backend per JavaScript realm — its engine is global, not ours to
 * hide — so a fit switches it at the start and checks it is still active between steps; run one
 * fit at a time per thread (the app runs fits in one worker, one after another).
 *
 * Threads: the wasm backend uses a thread pool only where SharedArrayBuffer is usable, i.e. in a
 * cross-origin-isolated page or worker; in Node and in an ordinary renderer it runs on one thread
 * (in Node TF.js turns threads off itself, and its threaded build cannot start its workers there).
 */
import * as tf from '@tensorflow/tfjs';
import { getThreadsCount, setWasmPaths } from '@tensorflow/tfjs-backend-wasm';
import type { NetworkBackendPreference } from './networkSettings';
import { TfBackendError } from './networkErrors';
import { verifyBackend } from './tfBackendCheck';

export type TfBackendName = 'wasm' | 'cpu';

export interface BackendSelection {
  readonly backend: TfBackendName;
  /** One sentence for the technical details: what runs, and why, including any fallback. */
  readonly note: string;
  /** Why WebAssembly was not used although it was preferred (plain words); null when it was used or not asked for. */
  readonly fallbackReason: string | null;
}

/**
 * Make `name` the active backend. wasmPath: directory (or URL prefix) holding the backend's .wasm
 * files, e.g. node_modules/@tensorflow/tfjs-backend-wasm/dist/ in Node; it only has an effect
 * before the wasm backend is first started. Returns null on success, else the reason it failed.
 */
export async function loadBackend(name: TfBackendName, wasmPath?: string): Promise<string | null> {
  if (name === 'wasm' && wasmPath !== undefined) {
    try {
      setWasmPaths(wasmPath.endsWith('/') ? wasmPath : `${wasmPath}/`);
    } catch (error) {
      return `the wasm backend failed to start earlier in this session and cannot be retried (${messageOf(error)})`;
    }
  }
  try {
    if (await tf.setBackend(name)) return null;
    return `TensorFlow.js could not start the ${name} backend${name === 'wasm' ? ' (are its .wasm files at the given path?)' : ''}`;
  } catch (error) {
    return `starting the ${name} backend threw: ${messageOf(error)}`;
  }
}

/**
 * The backend to fit on. 'cpu' is taken as asked. 'wasm' and 'auto' both try wasm and fall back
 * to cpu, saying why, when wasm does not load, lacks a kernel, or disagrees with cpu on one
 * training step of a small fixed network (verifyBackend). Leaves the chosen backend active.
 */
export async function selectBackend(preference: NetworkBackendPreference, wasmPath?: string): Promise<BackendSelection> {
  if (preference !== 'cpu') {
    const failure = await loadBackend('wasm', wasmPath);
    if (failure === null) {
      const check = await verifyBackend('wasm');
      if (check.agrees) {
        await requireLoaded('wasm');
        return { backend: 'wasm', fallbackReason: null, note: `${await describeWasm()}; agrees with cpu on a training step (largest relative difference ${check.largestDifference.toExponential(1)}, tolerance ${check.tolerance.toExponential(0)})` };
      }
      return fallBack(preference, `it disagreed with cpu on a training step: ${check.reason}`);
    }
    return fallBack(preference, failure);
  }
  await requireLoaded('cpu');
  return { backend: 'cpu', fallbackReason: null, note: 'TensorFlow.js cpu backend, as requested' };
}

/** Throws TfBackendError unless `name` is the active backend (what: who needs it, for the message). */
export function requireActiveBackend(name: TfBackendName, what: string): void {
  const active = tf.getBackend();
  if (active !== name) {
    throw new TfBackendError(`${what}: lives on the TensorFlow.js ${name} backend, but ${active} is active (other code switched it); switch back with tf.setBackend('${name}') or fit again`);
  }
}

async function fallBack(preference: NetworkBackendPreference, reason: string): Promise<BackendSelection> {
  await requireLoaded('cpu');
  const asked = preference === 'wasm' ? 'wasm was requested' : 'auto preferred wasm';
  return { backend: 'cpu', fallbackReason: reason, note: `TensorFlow.js cpu backend: ${asked}, but ${reason}; cpu is much slower` };
}

async function requireLoaded(name: TfBackendName): Promise<void> {
  const failure = await loadBackend(name);
  if (failure !== null) throw new TfBackendError(`backend: ${failure}`);
}

async function describeWasm(): Promise<string> {
  const simd = await tf.env().getAsync('WASM_HAS_SIMD_SUPPORT');
  const threads = getThreadsCount();
  const threadNote = threads > 1 ? `${threads} threads` : `1 thread (${await singleThreadReason()})`;
  return `TensorFlow.js wasm backend (${simd ? 'SIMD' : 'no SIMD'}, ${threadNote})`;
}

/** Why the backend runs on one thread: the host turned threads off, or the page cannot share memory. */
async function singleThreadReason(): Promise<string> {
  // Measured with TF.js 4.22: in Node it reports no thread support by design, and forcing the
  // threaded build fails (ERR_WORKER_PATH) because its pthreads start from blob: URLs.
  if (tf.env().getBool('IS_NODE')) return 'Node: TensorFlow.js runs its single-threaded build there';
  const isolated = (globalThis as { crossOriginIsolated?: boolean }).crossOriginIsolated === true;
  if (!isolated) return 'not cross-origin isolated, so no shared memory for a thread pool';
  const threadsAllowed = await tf.env().getAsync('WASM_HAS_MULTITHREAD_SUPPORT');
  return threadsAllowed ? 'one core available' : 'the host runs the single-threaded build';
}

function messageOf(error: unknown): string {
  if (error instanceof Error) return error.message;
  if (error && typeof error === 'object' && 'message' in error) return String((error as { message: unknown }).message);
  return String(error);
}
