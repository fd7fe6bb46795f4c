/**
 * The controller the valve hold-out plants share (level loop, steam exchanger, neutralisation tank,
 * surge drum; a negative K for a valve that acts with the measured variable, as the drum's outlet):
 * proportional on the measured variable s₀ around its setpoint plus feedforward of a measured
 * disturbance s₁,
 *   valve = bias + K·(setpoint − s₀) + F·s₁,
 * written as the Gaussian policy form offset + G·s with dither std; `clipped`: the policy clips the
 * command to [0, 1] (otherwise a valve saturating inside the plant clips it). F is signed: negative
 * where the disturbance adds to what the valve supplies.
 */
export interface ValveLaw {
  readonly bias: number;
  readonly setpoint: number;
  readonly gain: number;
  readonly feedforward: number;
  readonly std: number;
  readonly clipped: boolean;
}

const VALVE_RANGE = { lo: [0], hi: [1], mode: 'clip' as const };

export function valveLaw(v: ValveLaw) {
  const law = { offset: [v.bias + v.gain * v.setpoint], gain: [[-v.gain, v.feedforward]], std: [v.std] };
  return v.clipped ? { ...law, bounds: VALVE_RANGE } : law;
}

/**
 * A direct-acting P law around a valve at half open, clipped to [0, 1]: the command rises as the measured
 * variable rises above its setpoint, u = 0.5 + K·(s₀ − setpoint) + F·s₁ (the surge drum's outlet, the
 * reactor's coolant, the cooling tower's fan, the rinse bath's fresh water).
 */
export function directActingLaw(k: number, setpoint: number, feedforward: number, std: number) {
  return valveLaw({ bias: 0.5, setpoint, gain: -k, feedforward, std, clipped: true });
}
