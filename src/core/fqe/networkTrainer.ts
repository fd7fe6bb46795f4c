/**
 * The inner loop of network FQE: Adam steps (Kingma & Ba, "Adam: a method for stochastic
 * optimization", 2015; TF.js's tf.train.adam) on one frozen regression target, checking between
 * steps for cancellation, a switched backend, and a non-finite or exploding loss. The loss is
 * read back every step (a scalar; cheap on the CPU backends), so a bad step is caught before its
 * update is applied.
 */
import * as tf from '@tensorflow/tfjs';
import { throwIfCancelled, type CancellationCheck } from './cancellation';
import type { MinibatchStream } from './networkMinibatches';
import { lossAndGradient } from './networkGradient';
import type { NetworkLayout } from './networkParameters';
import type { NetworkActivation } from './networkSettings';

export interface TrainableNetwork {
  readonly theta: tf.Variable<tf.Rank.R1>;
  readonly layout: NetworkLayout;
  readonly activation: NetworkActivation;
  readonly optimizer: tf.Optimizer;
}

export interface TrainingGuard {
  /** A minibatch loss above this (network units²) counts as exploding. */
  readonly lossLimit: number;
  readonly cancel?: CancellationCheck;
  /** Throws when the TF.js backend is no longer the fit's. */
  readonly checkBackend: () => void;
  /** Lets the event loop run now and then (so a cancel message can arrive). */
  readonly pace: () => Promise<void>;
}

export type TrainingOutcome =
  | { readonly kind: 'completed'; readonly meanLoss: number } // network units²
  | { readonly kind: 'nonFinite' | 'exploded'; readonly step: number; readonly loss: number };

/** Runs `steps` Adam steps; throws FqeCancelledError when cancelled between steps. */
export async function trainSteps(net: TrainableNetwork, batches: MinibatchStream, steps: number, guard: TrainingGuard): Promise<TrainingOutcome> {
  let total = 0;
  for (let step = 1; step <= steps; step++) {
    throwIfCancelled(guard.cancel);
    guard.checkBackend();
    const loss = tf.tidy(() => {
      const batch = batches.next();
      const { loss: batchLoss, gradient } = lossAndGradient(net.theta, net.layout, net.activation, batch.inputs, batch.targets);
      const value = batchLoss.dataSync()[0];
      if (Number.isFinite(value) && value <= guard.lossLimit) net.optimizer.applyGradients({ [net.theta.name]: gradient });
      return value;
    });
    if (!Number.isFinite(loss)) return { kind: 'nonFinite', step, loss };
    if (loss > guard.lossLimit) return { kind: 'exploded', step, loss };
    total += loss;
    await guard.pace();
  }
  return { kind: 'completed', meanLoss: total / steps };
}

/** A pace() that yields to the event loop once at least intervalMs have passed since the last yield. */
export function createPacer(intervalMs: number): () => Promise<void> {
  let last = performance.now();
  return async () => {
    if (performance.now() - last < intervalMs) return;
    await new Promise<void>((resolve) => setTimeout(resolve, 0));
    last = performance.now();
  };
}
