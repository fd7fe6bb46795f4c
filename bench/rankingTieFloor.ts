/**
 * The measurement behind the sweep ranking's tie scale (src/core/rankingTie.ts): on every battery plant
 * (and the hold-outs, for information), the floor RANKING_TIE_RELATIVE · S that the rule adds, S the
 * logged rewards' mean magnitude over 1/(1 − γ), against the logged return's standard error over runs at
 * the plant's discount. The rule is adopted when the floor is at most 1e-4 of that standard error on every
 * battery plant (test/battery/README.md, "The sweep ranking's tie scale").
 * Run: nice -n 10 npx tsx bench/rankingTieFloor.ts [transitions]
 */
import { loggedDiscountedReturn } from '../src/core/loggedReturn';
import { RANKING_TIE_RELATIVE } from '../src/core/limits';
import { rewardTermScale } from '../src/core/rankingTie';
import { batteryPlants } from '../test/battery/catalogue';
import { holdoutPlants } from '../test/battery/holdout/levelValvePlant';
import type { BatteryPlant } from '../test/battery/batteryPlant';

const LIMIT = 1e-4;
const transitions = Number(process.argv[2] ?? 100_000);

function row(plant: BatteryPlant): number {
  const data = plant.simulate({ transitions, seed: 1 });
  const scale = rewardTermScale(data.rewards, plant.discount), floor = RANKING_TIE_RELATIVE * scale;
  const logged = loggedDiscountedReturn(data, plant.discount), ratio = floor / logged.standardError;
  console.log(`| ${plant.name} | ${plant.discount} | ${logged.value.toPrecision(4)} | ${logged.standardError.toPrecision(3)} | ${scale.toPrecision(4)} | ${floor.toExponential(2)} | ${ratio.toExponential(2)} |`);
  return ratio;
}

console.log(`${transitions} transitions, seed 1, runs logged at the steady state\n`);
console.log('| plant | γ | logged J | its standard error | S = mean abs(r)/(1 − γ) | floor 1e-9·S | floor / standard error |');
console.log('|---|---|---|---|---|---|---|');
const battery = batteryPlants().map(row);
console.log('| *hold-outs (information only)* | | | | | | |');
holdoutPlants().forEach(row);
const worst = Math.max(...battery);
console.log(`\nbattery: largest floor / standard error ${worst.toExponential(2)}; rule ≤ ${LIMIT}: ${worst <= LIMIT ? 'holds (adopt)' : 'fails (drop)'}`);
