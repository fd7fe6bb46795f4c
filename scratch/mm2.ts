import * as tf from '@tensorflow/tfjs';
import { loadBackend } from '../src/core/fqe/tfBackend';
import { fileURLToPath } from 'node:url';
const wasmPath = fileURLToPath(new URL('../node_modules/@tensorflow/tfjs-backend-wasm/dist/', import.meta.url));
await loadBackend('wasm', wasmPath);
const cpu = () => { const u = process.cpuUsage(); return (u.user + u.system) / 1e6; };
const c = 8192;
const A = tf.randomNormal([85, c]), B = tf.randomNormal([c, 171]);
const run = (name: string, f: () => tf.Tensor, reps = 12) => { const t = cpu(); for (let i = 0; i < reps; i++) { const x = f(); x.dataSync(); x.dispose(); } console.log(name.padEnd(40), ((cpu() - t) / reps * 1000).toFixed(1), 'ms/call'); };
run('fixed a, fixed b', () => tf.matMul(A, B));
run('fixed a, fresh b', () => tf.tidy(() => tf.matMul(A, tf.add(B, 0))));
run('fresh a, fixed b', () => tf.tidy(() => tf.matMul(tf.add(A, 0), B)));
run('add only (b)', () => tf.add(B, 0));
const Bt = tf.randomNormal([171, c]);
run('fixed, b transposed flag', () => tf.matMul(A, Bt, false, true));
// JS float64 kernel
const n = 98304, d = 85, w = 171;
const F = new Float64Array(n * d).map(() => Math.random()), R = new Float64Array(n * w).map(() => Math.random());
let t = cpu();
const out = new Float64Array(d * w);
const blk = 256, fb = new Float64Array(d * blk), rb = new Float64Array(w * blk);
for (let s = 0; s < n; s += blk) {
  for (let t2 = 0; t2 < blk; t2++) { for (let a = 0; a < d; a++) fb[a * blk + t2] = F[(s + t2) * d + a]; for (let b = 0; b < w; b++) rb[b * blk + t2] = R[(s + t2) * w + b]; }
  for (let a = 0; a < d; a++) { const oa = a * blk; for (let b = 0; b < w; b++) { const ob = b * blk; let g = 0; for (let k = 0; k < blk; k++) g += fb[oa + k] * rb[ob + k]; out[a * w + b] += g; } }
}
console.log('JS float64 full n', (cpu() - t).toFixed(2), 's');
