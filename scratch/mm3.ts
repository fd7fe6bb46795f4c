import * as tf from '@tensorflow/tfjs';
import { loadBackend } from '../src/core/fqe/tfBackend';
import { fileURLToPath } from 'node:url';
const wasmPath = fileURLToPath(new URL('../node_modules/@tensorflow/tfjs-backend-wasm/dist/', import.meta.url));
await loadBackend('wasm', wasmPath);
const cpu = () => { const u = process.cpuUsage(); return (u.user + u.system) / 1e6; };
const n = 98304;
for (const d of [85, 53]) {
  const w = 2 * d + 1;
  const F = tf.randomNormal([n, d]), R = tf.randomNormal([n, w]);
  for (const bk of [2048, 8192, 32768]) {
    const t = cpu();
    for (let rep = 0; rep < 3; rep++) {
      const g = tf.tidy(() => tf.sum(tf.matMul(tf.reshape(F, [n / bk, bk, d]), tf.reshape(R, [n / bk, bk, w]), true, false), 0));
      g.dataSync(); g.dispose();
    }
    console.log('d', d, 'batched transposeA, block', bk, ((cpu() - t) / 3 * 1000).toFixed(0), 'ms per full Gram');
  }
  const t = cpu();
  for (let rep = 0; rep < 3; rep++) { const g = tf.matMul(F, R, true, false); g.dataSync(); g.dispose(); }
  console.log('d', d, 'one matMul transposeA over all n', ((cpu() - t) / 3 * 1000).toFixed(0), 'ms');
  const t2 = cpu();
  for (let rep = 0; rep < 3; rep++) { const g = tf.tidy(() => tf.matMul(tf.transpose(F), R)); g.dataSync(); g.dispose(); }
  console.log('d', d, 'transpose + one matMul over all n', ((cpu() - t2) / 3 * 1000).toFixed(0), 'ms');
  tf.dispose([F, R]);
}
