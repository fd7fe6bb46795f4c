/**
 * Hold-out logs whose present controller acts on a signal the logged states leave out (probe42; defined before
 * any estimator ran on them: /work/notes/probe42-rule.md). The cold store of coldStoreRetunedPlant.ts with a third
 * heat input: warm product wheeled in at the dock, w (deviation from the nominal delivery, in q's load unit),
 * weighed at the dock and fed forward by today's controller, an AR(1) with coefficient ρ:
 *   T' = T + 0.02·(25 − T) + 0.5·q + 0.5·w − 1.8·u + 0.1·ε₁,   q' = 0.95·q + 0.1·ε₂,   w' = ρ·w + 0.4·√(1 − ρ²)·ε₃
 * (w's stationary spread 0.4 for either ρ: the AR(1) variance σ²/(1 − ρ²), common practice); cost, limits, γ 0.97
 * and runs of 400 steps as the cold store's. Today's law u = 0.5 + 0.3·(T + 20) + 0.25·w, dither 0.05, clipped to
 * [0, 1]: the probe37 retune plus a feedforward sized to cancel 90 % of the delivery's heat (0.25·1.8 = 0.45 of
 * 0.5), whose spread 0.25·0.4 = 0.1 is twice the dither. Two ρ: 0 (each delivery independent: the logged (T, q)
 * stays Markov) and 0.9 (deliveries bunch over some ten steps). Invented scenario; not in the battery.
 *
 * Two logs per ρ from the same trajectories (same seed, same numbers): "unlogged", w not exported (the break), and
 * "logged", w written as a third state column (the control). The candidates are the cold store's three, which read
 * no w (gain 0 on it in the control); each law's truth is rolled out on the three-state plant from the log's TRUE run
 * starts (w included), so both variants share their truths.
 * `nice -n 10 npx tsx bench/holdoutCliRows.ts --plants holdout-cold-store-delivery-unlogged-white-g0.97`.
 */
import type { GaussianPolicySpec } from '../../../src/core/policy';
import type { TransitionSet } from '../../../src/core/transitions';
import type { PlantDynamics } from '../episodeLog';
import { nonlinearBatteryPlant } from '../nonlinearPlant';
import { logBrokenRuns, steadyRun, type BrokenLogPlant } from './brokenLog';
import { SETPOINT_C, coldStoreDynamics, coldStoreRetunedPlant } from './coldStoreRetunedPlant';

/** w's stationary standard deviation, its weight in T', and today's feedforward on it (per unit load). */
export const DELIVERY_SD = 0.4, DELIVERY_HEAT = 0.5, DELIVERY_FEEDFORWARD = 0.25;
/** The two AR(1) coefficients measured: each delivery independent, and deliveries that bunch. */
export const DELIVERY_MEMORY = { white: 0, slow: 0.9 } as const;
const BURN_IN = 200;

/** The store with the delivery load as a third state: the cold store's step on (T, q), plus w's heat and its AR(1). */
export function deliveryDynamics(rho: number): PlantDynamics {
  const innovation = DELIVERY_SD * Math.sqrt(1 - rho * rho), twoStates = new Float64Array(2), twoNext = new Float64Array(2);
  return {
    stateDim: 3, actionDim: 1,
    step(s, a, rng, next) {
      twoStates[0] = s[0]; twoStates[1] = s[1];
      const cost = coldStoreDynamics.step(twoStates, a, rng, twoNext);
      next[0] = twoNext[0] + DELIVERY_HEAT * s[2];
      next[1] = twoNext[1];
      next[2] = rho * s[2] + innovation * rng.normal();
      return cost;
    },
  };
}

/** u = 0.5 + K·(T + 20) + F·q + D·w, clipped to [0, 1], on the three states (T, q, w). */
export function deliveryLaw(k: number, loadFeedforward: number, deliveryFeedforward: number, std: number): GaussianPolicySpec {
  return { offset: [0.5 - k * SETPOINT_C], gain: [[k, loadFeedforward, deliveryFeedforward]], std: [std], bounds: { lo: [0], hi: [1], mode: 'clip' } };
}

/** Today's law (with its feedforward on the weighed delivery) and the same law without it. */
export const TODAY = deliveryLaw(0.3, 0, DELIVERY_FEEDFORWARD, 0.05), TODAY_WITHOUT_FEEDFORWARD = deliveryLaw(0.3, 0, 0, 0.05);

/** A law on (T, q) as it acts on (T, q, w): gain 0 on w. A three-state law is returned as it is. */
export function onThreeStates(spec: GaussianPolicySpec): GaussianPolicySpec {
  return spec.gain[0].length === 3 ? spec : { ...spec, gain: spec.gain.map((row) => [...row, 0]) };
}

/** The log without the delivery column: states and next states cut to (T, q); the TRUE start states (T, q, w) kept for the truth. */
export function withoutDelivery(data: TransitionSet): TransitionSet {
  const cut = (x: Float64Array) => Float64Array.from({ length: data.count * 2 }, (_, k) => x[3 * (k >> 1) + (k & 1)]);
  return { ...data, stateDim: 2, stateNames: data.stateNames.slice(0, 2), states: cut(data.states), nextStates: cut(data.nextStates) };
}

/** holdout-cold-store-delivery-<unlogged|logged>-<white|slow>-g0.97. */
export function coldStoreDeliveryPlant(memory: keyof typeof DELIVERY_MEMORY, logged: boolean): BrokenLogPlant {
  const rho = DELIVERY_MEMORY[memory], dynamics = deliveryDynamics(rho), store = coldStoreRetunedPlant(true);
  const name = `holdout-cold-store-delivery-${logged ? 'logged' : 'unlogged'}-${memory}-g0.97`;
  const stateNames = logged ? [...store.stateNames, 'delivery_load'] : [...store.stateNames];
  const plant = nonlinearBatteryPlant({
    name, stateNames, actionNames: store.actionNames, discount: 0.97, stepsPerEpisode: 400,
    description: `cold store, today's law feeds forward a weighed delivery load (AR(1), ρ ${rho}) ${logged ? 'logged as a third state (the control)' : 'that the log leaves out'}, measured heat load, compressor clipped at 0 and 1, γ 0.97 (hold-out; truth: today's law with its feedforward)`,
    dynamics, operatingState: [SETPOINT_C, 0, 0], burnIn: BURN_IN, behaviour: TODAY, rolloutsPerStart: 200,
    candidates: store.candidates.map((c) => ({ ...c, spec: logged ? onThreeStates(c.spec) : c.spec })),
  });
  const run = steadyRun(dynamics, TODAY, [SETPOINT_C, 0, 0], BURN_IN);
  return {
    ...plant, stateDim: stateNames.length, dynamics, truthPolicy: onThreeStates,
    breaks: logged ? 'none (the control: the fed-forward delivery load is a state column)' : `an unlogged feedforward: today's law acts on a delivery load (ρ ${rho}) the log leaves out`,
    simulate: (o) => {
      if (o.runStarts === 'wide') throw new Error(`${name}: its logs start runs at the logged steady state only`);
      const steps = o.stepsPerEpisode ?? plant.stepsPerEpisode;
      const data = logBrokenRuns({ episodes: Math.ceil(o.transitions / steps), stepsPerEpisode: steps, seed: o.seed,
        stateNames: [...store.stateNames, 'delivery_load'], actionNames: plant.actionNames, runConditions: () => run });
      return logged ? data : withoutDelivery(data);
    },
  };
}

/** probe42: the two unlogged logs, then their controls. */
export function deliveryFeedforwardPlants(): BrokenLogPlant[] {
  return [coldStoreDeliveryPlant('white', false), coldStoreDeliveryPlant('slow', false), coldStoreDeliveryPlant('white', true), coldStoreDeliveryPlant('slow', true)];
}
