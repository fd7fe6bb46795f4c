/**
 * Where the TensorFlow.js wasm backend finds its .wasm files in the built app: Vite serves each
 * under a hashed name, so the backend is given a map from file name to URL (setWasmPaths'
 * object form) before it first starts. Loaded on demand, only when a network fit is asked for,
 * so linear-only runs never load TensorFlow.js.
 */
import { env } from '@tensorflow/tfjs';
import { setWasmPaths } from '@tensorflow/tfjs-backend-wasm';
import plainUrl from '@tensorflow/tfjs-backend-wasm/dist/tfjs-backend-wasm.wasm?url';
import simdUrl from '@tensorflow/tfjs-backend-wasm/dist/tfjs-backend-wasm-simd.wasm?url';
import threadedSimdUrl from '@tensorflow/tfjs-backend-wasm/dist/tfjs-backend-wasm-threaded-simd.wasm?url';

let configured = false;

export function configureWasmFiles(): void {
  if (configured) return;
  // The threaded build starts its pthreads from a blob that importScripts() the backend's own
  // classic script; inside this bundled module worker there is none, so the threads never start
  // and the backend never finishes loading. Use the single-threaded SIMD build: on the 2–4 cores
  // of a typical engineering laptop the measured gain of threads is small next to a frozen run.
  env().set('WASM_HAS_MULTITHREAD_SUPPORT', false);
  setWasmPaths({
    'tfjs-backend-wasm.wasm': plainUrl,
    'tfjs-backend-wasm-simd.wasm': simdUrl,
    'tfjs-backend-wasm-threaded-simd.wasm': threadedSimdUrl,
  });
  configured = true;
}
