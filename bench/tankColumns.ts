/** The column roles of the tank-levels CSV (sample-projects/tank-levels), as the benchmarks import it. */
export const TANK_COLUMNS = {
  states: [{ column: 'level_upper_m', unit: 'm' }, { column: 'level_lower_m', unit: 'm' }],
  actions: [{ column: 'inflow_valve_pct', unit: '%' }],
  reward: { kind: 'column' as const, column: 'cost', sense: 'cost' as const },
  nextState: { kind: 'nextRow' as const },
  episode: { kind: 'column' as const, column: 'run' },
};
