/**
 * Hold-out plants whose logs hold stretches in MANUAL, no mode flag (probe40; the logs: manualStretchLog.ts;
 * defined before any estimator ran on them: /work/notes/probe40-rule.md and its addendum). Each is a hold-out
 * plant whose log is otherwise its own (share 0 gives that log bit for bit), with the same candidates and truth:
 * - the cold store (coldStoreRetunedPlant.ts, the one-tuning control's law u = 0.5 + 0.3·(T + 20), dither 0.05):
 *   integrating in effect (pole 0.98 per step, the compressor worth 1.8 K per step), so a held compressor drives
 *   the store far off — a harsh case;
 * - the cooling tower (coolingTowerPlant.ts, u = 0.5 + 0.3·(T − 28), dither 0.1): self-regulating (pole 0.9 per
 *   two-minute step), so a held fan command leaves an offset of about 1.5 K per speed step — a mild case.
 * The truth for "today" is the automatic law (a candidate replaces the controller; operators would take manual
 * under either); the logged return is the months as logged, automatic and manual mixed.
 * `nice -n 10 npx tsx bench/holdoutCliRows.ts --plants holdout-cold-store-manual-30-g0.97`.
 */
import type { BatteryPlant } from '../batteryPlant';
import { episodesFor } from '../episodeLog';
import type { BrokenLogPlant } from './brokenLog';
import { SETPOINT_C as STORE_SETPOINT_C, coldStoreRetunedPlant } from './coldStoreRetunedPlant';
import { SETPOINT_C as WATER_SETPOINT_C, coolingTowerPlant } from './coolingTowerPlant';
import { logManualRuns, type ManualLogPlant } from './manualStretchLog';

/** `plant` (a plant with a steady burn-in log of its own) with `share` of its rows in manual stretches, named `<stem>-manual-<percent>-g<γ>`. */
export function withManualStretches(plant: BatteryPlant, stem: string, start: Pick<ManualLogPlant, 'operatingState' | 'burnIn'>, share: number): BrokenLogPlant {
  if (!plant.dynamics) throw new Error(`${plant.name}: a plant with manual stretches needs its dynamics for the log and the truth`);
  const percent = Math.round(100 * share), name = `${stem}-manual-${percent}-g${plant.discount}`;
  const logged: ManualLogPlant = { dynamics: plant.dynamics, behaviour: plant.behaviour, stateNames: plant.stateNames, actionNames: plant.actionNames, ...start };
  return {
    ...plant, dynamics: plant.dynamics, name,
    description: `${plant.description}; ${percent} % of the rows in manual stretches of 10–40 steps (the action held at its value when manual began), no mode flag (the log breaks: two ways of acting in one log; truth: the automatic law)`,
    breaks: `manual stretches: ${percent} % of the rows hold the action at its value when manual began, scattered through the log, unflagged`,
    simulate: (o) => {
      if (o.runStarts === 'wide') throw new Error(`${name}: its logs start runs at the logged steady state only`);
      const steps = o.stepsPerEpisode ?? plant.stepsPerEpisode;
      return logManualRuns(logged, episodesFor(o.transitions, steps), steps, share, o.seed).data;
    },
  };
}

export const coldStoreManualPlant = (share: number) => withManualStretches(coldStoreRetunedPlant(true), 'holdout-cold-store', { operatingState: [STORE_SETPOINT_C, 0], burnIn: 200 }, share);
export const coolingTowerManualPlant = (share: number) => withManualStretches(coolingTowerPlant(), 'holdout-cooling-tower', { operatingState: [WATER_SETPOINT_C, 0], burnIn: 200 }, share);

/** probe40: 10 % and 30 % of the rows in manual (their controls: the one-tuning cold store, the cooling tower itself). */
export function manualStretchPlants(): BrokenLogPlant[] {
  return [coldStoreManualPlant(0.1), coldStoreManualPlant(0.3), coolingTowerManualPlant(0.1), coolingTowerManualPlant(0.3)];
}
