/**
 * The held-actions check (src/core/diagnostics/heldActions.ts) on the manual-stretch logs in-process, no evaluation:
 * per log the held rows, stretches, longest, the effect E, and with --rollouts the J of the pooled fitted law
 * (core/behaviourModel.ts on every row, rolled out on the plant from the log's run starts) beside the automatic law's.
 *
 *   nice -n 10 npx tsx bench/heldActionsProbe.ts --plant tower|store --shares 0,0.03,0.1 --seeds 1,2,3 [--rollouts 20]
 */
import { fitBehaviourModel, behaviourPolicySpec } from '../src/core/behaviourModel';
import { heldActionEffect, heldRowMask, heldStretches } from '../src/core/diagnostics/heldActions';
import { loggedActionLimits } from '../src/core/loggedActionLimits';
import { rolloutTruth } from '../test/battery/rolloutTruth';
import { coldStoreManualPlant, coolingTowerManualPlant } from '../test/battery/holdout/manualStretchPlants';

function option(name: string, fallback: string): string {
  const at = process.argv.indexOf(`--${name}`);
  return at >= 0 ? process.argv[at + 1] : fallback;
}

const tower = option('plant', 'tower') === 'tower', rollouts = Number(option('rollouts', '0'));
console.log('plant | share | seed | held rows | share | stretches | longest | E | J pooled law | J automatic law | J off');
for (const share of option('shares', '0.1').split(',').map(Number)) {
  for (const seed of option('seeds', '1').split(',').map(Number)) {
    const plant = tower ? coolingTowerManualPlant(share) : coldStoreManualPlant(share);
    const data = plant.simulate({ transitions: 100_000, seed });
    const limits = loggedActionLimits(data.actions, data.count, data.actionDim);
    const held = heldRowMask(data, limits), s = heldStretches(held), e = heldActionEffect(data, limits, held);
    let jText = '—';
    if (rollouts > 0) {
      const pooled = fitBehaviourModel(Float64Array.from(data.states), Float64Array.from(data.actions), data.count, data.stateDim, data.actionDim);
      const starts = { name: 'runStarts', description: 'run starts', states: data.startStates, count: data.episodeCount };
      const o = { rolloutsPerStart: rollouts, seed: 1 };
      const jp = rolloutTruth(plant.dynamics, behaviourPolicySpec(pooled), plant.discount, starts, o), ja = rolloutTruth(plant.dynamics, plant.behaviour, plant.discount, starts, o);
      jText = `${jp.value.toFixed(2)} ± ${jp.standardError.toFixed(2)} | ${ja.value.toFixed(2)} ± ${ja.standardError.toFixed(2)} | ${(100 * (jp.value / ja.value - 1)).toFixed(1)} %`;
    }
    console.log([tower ? 'tower' : 'store', share, seed, s.rows, (100 * s.share).toFixed(2) + ' %', s.stretches, s.longest, 'reason' in e ? e.reason : e.effect.toFixed(3), jText].join(' | '));
  }
}
