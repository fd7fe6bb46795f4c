/** Every plot kind with fixed synthetic data (test/figures/syntheticSpecs.ts), per theme. */
export { ALL_PLOT_KINDS as PLOT_KINDS, syntheticSpec as plotSpec, type PlotKind } from '../../figures/syntheticSpecs';
