/** A made-up sensitivity curve for plot and export tests: two candidates and the behaviour over the discount. */
import type { SensitivityCurve } from '../../src/pipeline/assessment';

export function discountSweep(): SensitivityCurve {
  const settings = [0.9, 0.93, 0.95, 0.97, 0.99];
  return {
    parameter: 'discount', label: 'discount γ', settings, projectIndex: 2, rankingStable: true,
    series: [
      { name: 'gentle gain', values: settings.map((g) => 2 / (1 - g)), status: settings.map(() => 'converged') },
      { name: 'sharp gain', values: [24, 33, null, 80, 230], status: ['converged', 'converged', 'diverged', 'converged', 'converged'] },
      { name: 'logged return', values: settings.map((g) => 2.5 / (1 - g)), status: settings.map(() => 'logged'), reference: true },
    ],
  };
}
