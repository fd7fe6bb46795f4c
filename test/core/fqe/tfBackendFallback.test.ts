/**
 * Fallback to cpu when the wasm binaries cannot be loaded. Its own file, because a failed wasm
 * start cannot be retried within one process (TF.js keeps that state), and vitest runs each test
 * file in a fresh process.
 */
import { describe, expect, it } from 'vitest';
import * as tf from '@tensorflow/tfjs';
import { selectBackend } from '../../../src/core/fqe/tfBackend';

describe('selectBackend when wasm cannot load', () => {
  it('falls back to cpu and says why', async () => {
    const selection = await selectBackend('wasm', '/no/such/directory/');
    expect(selection.backend).toBe('cpu');
    expect(tf.getBackend()).toBe('cpu');
    expect(selection.note).toMatch(/^TensorFlow.js cpu backend: wasm was requested, but .*could not start the wasm backend/);
    expect(selection.fallbackReason).toMatch(/could not start the wasm backend/);
  });

  it('stays on cpu for auto, and says the earlier failure cannot be retried', async () => {
    const selection = await selectBackend('auto', '/no/such/directory/');
    expect(selection.backend).toBe('cpu');
    expect(selection.note).toMatch(/auto preferred wasm, but/);
  });
});
