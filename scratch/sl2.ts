import * as tf from '@tensorflow/tfjs';
import { loadBackend } from '../src/core/fqe/tfBackend';
import { fileURLToPath } from 'node:url';
const wasmPath = fileURLToPath(new URL('../node_modules/@tensorflow/tfjs-backend-wasm/dist/', import.meta.url));
await loadBackend('wasm', wasmPath);
const cpu = () => { const u = process.cpuUsage(); return (u.user + u.system) / 1e6; };
const n = 98304, d = 85;
const F = tf.tensor2d(new Float32Array(n * d).map(() => Math.random()), [n, d]);
const R = tf.tensor2d(new Float32Array(n * 171).map(() => Math.random()), [n, 171]);
let t = cpu();
for (let i = 0; i < 12; i++) { const x = tf.slice(F, [i * 8192, 0], [8192, -1]); x.dataSync(); x.dispose(); }
console.log('slice rows x12 no tidy', (cpu() - t).toFixed(3)); t = cpu();
for (let i = 0; i < 12; i++) { const x = tf.tidy(() => tf.slice(F, [i * 8192, 0], [8192, -1])); x.dataSync(); x.dispose(); }
console.log('slice rows x12 tidy tensor', (cpu() - t).toFixed(3)); t = cpu();
for (let i = 0; i < 12; i++) { const x = tf.tidy(() => tf.matMul(tf.transpose(tf.slice(F, [i * 8192, 0], [8192, -1])), tf.slice(R, [i * 8192, 0], [8192, -1]))); x.dataSync(); x.dispose(); }
console.log('gram blocks x12', (cpu() - t).toFixed(3)); t = cpu();
for (let i = 0; i < 12; i++) { const x = tf.tidy(() => tf.transpose(tf.slice(F, [i * 8192, 0], [8192, -1]))); x.dataSync(); x.dispose(); }
console.log('slice+T x12', (cpu() - t).toFixed(3)); t = cpu();
for (let i = 0; i < 12; i++) { const x = tf.tidy(() => tf.matMul(tf.slice(F, [i * 8192, 0], [8192, -1]), tf.slice(R, [i * 8192, 0], [8192, -1]), true, false)); x.dataSync(); x.dispose(); }
console.log('gram blocks transposeA x12', (cpu() - t).toFixed(3)); t = cpu();
