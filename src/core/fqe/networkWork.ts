/**
 * What a network fit computed, for throughput figures (steps/s, GFLOP/s) in the bench and the
 * report's details. FLOPs count only the dense matrix products (biases, activations and
 * element-wise work add a few per cent): forward 2·rows·M per pass with M the multiply-adds per
 * row; an Adam step forward 2·B·M plus backward 2·B·M (weight gradients) and 2·B·(M − p·h₁)
 * (gradients passed down; none into the input); the last-layer sums 2n·(d1·2dh + dh·(2dh + d1 + 1)).
 */
import type { NetworkLayout } from './networkParameters';

export interface NetworkWork {
  /** Wall-clock seconds of the fit, from backend selection to the kept network. */
  seconds: number;
  adamSteps: number;
  /** Wall-clock seconds spent in Adam steps. */
  stepSeconds: number;
  /** Floating-point operations of the matrix products. */
  flop: number;
}

export function newWork(): NetworkWork {
  return { seconds: 0, adamSteps: 0, stepSeconds: 0, flop: 0 };
}

/** Multiply-adds per row up to the last hidden layer (the features), and of the whole network. */
function multiplyAdds(layout: NetworkLayout, throughOutput: boolean): number {
  const layers = throughOutput ? layout.layers : layout.layers.slice(0, -1);
  return layers.reduce((sum, l) => sum + l.inputs * l.units, 0);
}

export function adamStepFlop(layout: NetworkLayout, batch: number): number {
  const m = multiplyAdds(layout, true), first = layout.layers[0];
  return 2 * batch * m + 2 * batch * m + 2 * batch * (m - first.inputs * first.units);
}

export function featurePassFlop(layout: NetworkLayout, rows: number): number {
  return 2 * rows * multiplyAdds(layout, false);
}

export function lastLayerSumsFlop(rows: number, d1: number, dh: number): number {
  return 2 * rows * (d1 * 2 * dh + dh * (2 * dh + d1 + 1));
}
