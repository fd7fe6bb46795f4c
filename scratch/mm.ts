import * as tf from '@tensorflow/tfjs';
import { loadBackend } from '../src/core/fqe/tfBackend';
import { fileURLToPath } from 'node:url';
const wasmPath = fileURLToPath(new URL('../node_modules/@tensorflow/tfjs-backend-wasm/dist/', import.meta.url));
await loadBackend('wasm', wasmPath);
const cpu = () => { const u = process.cpuUsage(); return (u.user + u.system) / 1e6; };
const n = 98304, d = 85;
const F = tf.randomNormal([n, d]) as tf.Tensor2D, R = tf.randomNormal([n, 2 * d + 1]) as tf.Tensor2D;
for (const c of [1024, 8192, 32768]) {
  let t = cpu();
  for (let s = 0; s < n; s += c) tf.tidy(() => tf.matMul(tf.transpose(tf.slice(F, [s, 0], [c, -1])), tf.slice(R, [s, 0], [c, -1])).dataSync());
  const a = cpu() - t; t = cpu();
  for (let s = 0; s < n; s += c) tf.tidy(() => tf.matMul(tf.slice(F, [s, 0], [c, -1]), tf.slice(R, [s, 0], [c, -1]), true, false).dataSync());
  const b = cpu() - t; t = cpu();
  const FT = tf.transpose(F);
  for (let s = 0; s < n; s += c) tf.tidy(() => tf.matMul(tf.slice(FT, [0, s], [-1, c]), tf.slice(R, [s, 0], [c, -1])).dataSync());
  const e = cpu() - t; FT.dispose(); t = cpu();
  for (let s = 0; s < n; s += c) tf.tidy(() => tf.transpose(tf.slice(F, [s, 0], [c, -1])).dataSync());
  const tr = cpu() - t;
  console.log(c, 'explicit T', a.toFixed(2), 'transposeA', b.toFixed(2), 'pre-T', e.toFixed(2), 'transpose only', tr.toFixed(2), 'GFLOP', (2 * n * d * (2 * d + 1) / 1e9).toFixed(2));
}
