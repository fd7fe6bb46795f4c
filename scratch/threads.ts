import * as tf from '@tensorflow/tfjs';
import { getThreadsCount, setWasmPaths } from '@tensorflow/tfjs-backend-wasm';
import { fileURLToPath } from 'node:url';
const wasmPath = fileURLToPath(new URL('../node_modules/@tensorflow/tfjs-backend-wasm/dist/', import.meta.url));
setWasmPaths(wasmPath);
if (process.argv[2] === 'threads') tf.env().set('WASM_HAS_MULTITHREAD_SUPPORT', true);
try {
  const ok = await Promise.race([tf.setBackend('wasm'), new Promise((r) => setTimeout(() => r('timeout'), 20000))]);
  console.log('setBackend', ok, 'threads', getThreadsCount());
  const a = tf.randomNormal([2048, 2048]);
  const t = performance.now();
  for (let i = 0; i < 5; i++) tf.matMul(a, a).dataSync();
  console.log('GFLOP/s', (5 * 2 * 2048 ** 3) / ((performance.now() - t) / 1000) / 1e9);
} catch (e) { console.log('failed', e); }
process.exit(0);
