/**
 * Units of the present controller's fitted coefficients (a = c + G·s + e): the offset and the
 * dither in the action's unit, a gain in the action's unit per the state's unit — as the candidate
 * editor labels the same quantities ("Gain on tank_temp_c (% per °C)"). Where every action shares
 * one unit it goes in the row's label once; where they differ, after each cell. A column without a
 * unit reads "unit", as in the editor.
 */
export interface CoefficientUnits {
  /** Row label suffix, e.g. " (% per °C)"; empty when the units go in the cells. */
  readonly label: string;
  /** Cell suffix for action j, e.g. " % per °C"; empty when the unit is in the label. */
  cell(j: number): string;
}

type Column = { readonly column: string; readonly unit: string };

function unitsOf(perAction: string[]): CoefficientUnits {
  const shared = perAction.every((u) => u === perAction[0]);
  return shared
    ? { label: perAction[0] ? ` (${perAction[0]})` : '', cell: () => '' }
    : { label: '', cell: (j) => (perAction[j] ? ` ${perAction[j]}` : '') };
}

/** Units of the offset and the dither: the action's own. */
export function actionCoefficientUnits(actions: readonly Column[]): CoefficientUnits {
  return unitsOf(actions.map((a) => a.unit));
}

/** Units of the gain on one state: the action's unit per the state's. */
export function gainUnits(actions: readonly Column[], state: Column): CoefficientUnits {
  return unitsOf(actions.map((a) => `${a.unit || 'unit'} per ${state.unit || 'unit'}`));
}
