/**
 * Backend selection and the wasm-vs-cpu training-step check. The check's reference is TF.js's
 * plain-JavaScript cpu backend; to show the check can fail, a copy of the cpu backend with one
 * deliberately wrong kernel (and one with a kernel missing) must be flagged.
 */
import { afterAll, describe, expect, it } from 'vitest';
import * as tf from '@tensorflow/tfjs';
import { requireActiveBackend, selectBackend } from '../../../src/core/fqe/tfBackend';
import { BACKEND_CHECK_TOLERANCE, relativeDifference, verifyBackend } from '../../../src/core/fqe/tfBackendCheck';
import { TfBackendError } from '../../../src/core/fqe/networkErrors';
import { wasmDirectory } from './networkTestEnvironment';

/** Register a backend that is TF.js cpu with its kernels copied, then altered by `change`. */
function cpuVariant(name: string, change: (name: string) => void): void {
  tf.registerBackend(name, tf.findBackendFactory('cpu')!);
  for (const kernel of tf.getKernelsForBackend('cpu')) tf.registerKernel({ ...kernel, backendName: name });
  change(name);
}

afterAll(() => {
  for (const name of ['cpu-wrong-step', 'cpu-no-tanh']) if (tf.findBackendFactory(name)) tf.removeBackend(name);
});

describe('selectBackend', () => {
  it('starts wasm (SIMD, one thread in Node) when auto and the check passes', async () => {
    const selection = await selectBackend('auto', wasmDirectory);
    expect(selection.backend).toBe('wasm');
    expect(tf.getBackend()).toBe('wasm');
    expect(selection.note).toMatch(/wasm backend \(SIMD, 1 thread/);
    expect(selection.note).toMatch(/agrees with cpu/);
  });

  it('takes cpu when asked', async () => {
    expect(await selectBackend('cpu')).toEqual({ backend: 'cpu', fallbackReason: null, note: 'TensorFlow.js cpu backend, as requested' });
    expect(tf.getBackend()).toBe('cpu');
  });

  it('requireActiveBackend names both backends when they differ', async () => {
    await tf.setBackend('cpu');
    expect(() => requireActiveBackend('wasm', 'network action-value function')).toThrow(TfBackendError);
    expect(() => requireActiveBackend('wasm', 'network action-value function')).toThrow(/lives on the TensorFlow.js wasm backend, but cpu is active/);
  });
});

describe('verifyBackend', () => {
  it('wasm agrees with cpu on loss, gradient and outputs of one training step, and restores the active backend', async () => {
    await tf.setBackend('cpu');
    const check = await verifyBackend('wasm');
    expect(check).toMatchObject({ backend: 'wasm', agrees: true, reason: '', tolerance: BACKEND_CHECK_TOLERANCE });
    // Rounding differences only: far inside the tolerance derived in tfBackendCheck.ts.
    expect(check.largestDifference).toBeLessThan(BACKEND_CHECK_TOLERANCE / 100);
    expect(tf.getBackend()).toBe('cpu');
  });

  it('flags a backend whose Step kernel is wrong (the relu slope becomes 1 everywhere)', async () => {
    cpuVariant('cpu-wrong-step', (name) => {
      const step = tf.getKernel('Step', 'cpu')!;
      tf.unregisterKernel('Step', name);
      tf.registerKernel({ kernelName: 'Step', backendName: name, kernelFunc: (args) => step.kernelFunc({ ...args, attrs: { ...args.attrs, alpha: 1 } }) });
    });
    const check = await verifyBackend('cpu-wrong-step');
    expect(check.agrees).toBe(false);
    expect(check.reason).toMatch(/the gradient of a relu network differs from cpu/);
    expect(check.largestDifference).toBeGreaterThan(BACKEND_CHECK_TOLERANCE);
  });

  it('flags a backend that lacks a kernel the training step needs', async () => {
    cpuVariant('cpu-no-tanh', (name) => tf.unregisterKernel('Tanh', name));
    const check = await verifyBackend('cpu-no-tanh');
    expect(check.agrees).toBe(false);
    expect(check.reason).toMatch(/the training step failed on cpu-no-tanh: .*Tanh/);
  });
});

describe('relativeDifference', () => {
  it('is max|a − b| / max|b| and Infinity for non-finite values or a length mismatch', () => {
    expect(relativeDifference(Float32Array.of(1, 2.5, -4), Float32Array.of(1, 2, -4))).toBeCloseTo(0.5 / 4, 7);
    expect(relativeDifference(Float32Array.of(0, 0), Float32Array.of(0, 0))).toBe(0);
    expect(relativeDifference(Float32Array.of(NaN), Float32Array.of(1))).toBe(Infinity);
    expect(relativeDifference(Float32Array.of(1), Float32Array.of(1, 2))).toBe(Infinity);
  });
});
