/**
 * Tick values for an axis or colour bar: steps of 1, 2 or 5 × 10^k, after Heckbert, "Nice numbers
 * for graph labels", Graphics Gems (1990). We keep only the ticks inside [min, max] (the colour bar
 * has hard ends), and report the number of decimals that shows the step exactly.
 */
export interface TickSet {
  readonly step: number;
  readonly values: number[];
  /** Digits after the decimal point needed to tell neighbouring ticks apart (Heckbert's nfrac). */
  readonly fractionDigits: number;
}

export class TickRangeError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'TickRangeError';
  }
}

/** Heckbert's nicenum: a 1, 2, 5 or 10 × 10^k close to x (rounded) or not below x (ceiling). */
export function niceNumber(x: number, round: boolean): number {
  const exponent = Math.floor(Math.log10(x));
  const fraction = x / 10 ** exponent;
  let nice: number;
  if (round) nice = fraction < 1.5 ? 1 : fraction < 3 ? 2 : fraction < 7 ? 5 : 10;
  else nice = fraction <= 1 ? 1 : fraction <= 2 ? 2 : fraction <= 5 ? 5 : 10;
  return nice * 10 ** exponent;
}

/** About `target` ticks (≥ 2) inside [min, max]; min < max, both finite. */
export function niceTicks(min: number, max: number, target = 5): TickSet {
  if (!Number.isFinite(min) || !Number.isFinite(max) || !(min < max)) {
    throw new TickRangeError(`tick range: expected finite min < max, got [${min}, ${max}]`);
  }
  const range = niceNumber(max - min, false);
  let step = niceNumber(range / Math.max(1, target - 1), true);
  let values = ticksInside(min, max, step);
  // A range just over one step can hold a single tick; refine 1-2-5 until two fit (a colour bar needs two).
  while (values.length < 2) {
    step = finerStep(step);
    values = ticksInside(min, max, step);
  }
  return { step, values, fractionDigits: Math.max(0, -Math.floor(Math.log10(step) + 1e-9)) };
}

function ticksInside(min: number, max: number, step: number): number[] {
  const first = Math.ceil(min / step - 1e-9), last = Math.floor(max / step + 1e-9), values: number[] = [];
  // Multiply rather than accumulate, then round to the step's own digits: 3 × 0.1 reads 0.3, not 0.30000000000000004.
  const digits = Math.min(100, Math.max(0, -Math.floor(Math.log10(step) + 1e-9)) + 1);
  for (let k = first; k <= last; k++) values.push(cleanZero(Number((k * step).toFixed(digits))));
  return values;
}

/** The next smaller step of the 1-2-5 sequence. */
function finerStep(step: number): number {
  const exponent = Math.floor(Math.log10(step) + 1e-9), mantissa = Math.round(step / 10 ** exponent);
  return mantissa === 1 ? 0.5 * 10 ** exponent : mantissa === 2 ? 10 ** exponent : 2 * 10 ** exponent;
}

function cleanZero(v: number): number {
  return v === 0 ? 0 : v;
}
